import type { AnalysisReport } from '../analyze/types';
import { VERDICT_WORDS, citationText, sizeText } from './format';
import { spreadsheetCell } from './safeText';

/**
 * RFC 4180 field: quoted when it holds a comma, quote, CR or LF; quotes doubled. Text a spreadsheet could
 * take as a formula is neutralised first (spreadsheetCell); numbers stay numbers.
 */
export function csvField(value: string | number | null): string {
  const cell = spreadsheetCell(value);
  const s = cell === null ? '' : String(cell);
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export const SCHEDULE_COLUMNS = [
  'id', 'label', 'from', 'to', 'role', 'parallel_sets', 'size', 'material', 'length_ft',
  'ampacity_a', 'ampacity_governed_by', 'upstream_device', 'upstream_rating_a', 'tap_length_ft',
  'calculated_load_a', 'verdict', 'verdict_text', 'rule', 'citation', 'finding_ids',
  'fault_ka_at_supply', 'vd_pct', 'vd_circuit_pct', 'vd_total_pct',
] as const;

/** The conductor schedule as RFC 4180 CSV: a header row, then one row per conductor, CRLF line breaks. */
export function toConductorScheduleCsv(report: AnalysisReport): string {
  const rows: (string | number | null)[][] = [[...SCHEDULE_COLUMNS]];
  const fault = new Map((report.studies?.faults ?? []).map((f) => [f.nodeId as string, f.kA]));
  const r2 = (x: number | null | undefined) => (x === null || x === undefined ? null : Math.round(x * 100) / 100);
  report.conductors.forEach((c, i) => {
    const vd = report.studies?.voltageDrop.conductors[i];
    rows.push([
      c.id,
      c.label,
      c.from,
      c.to,
      c.role,
      c.parallelSets,
      sizeText(c.size),
      c.material,
      c.lengthFt,
      c.ampacity ? c.ampacity.ampacityA : null,
      c.ampacity ? c.ampacity.governedBy : null,
      c.upstreamDevice ? c.upstreamDevice.label || c.upstreamDevice.id : null,
      c.upstreamDevice ? c.upstreamDevice.ratingA : null,
      c.tapLengthFt,
      c.load ? c.load.calculatedA : null,
      c.verdict,
      VERDICT_WORDS[c.verdict],
      c.rule,
      citationText(c.cites),
      c.findingIds.join(' '),
      r2(fault.get(c.from)),
      r2(vd?.pct),
      r2(vd?.circuitPct),
      r2(vd?.totalPct),
    ]);
  });
  return rows.map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}
