import { takeoffTables, type TakeoffCell, type TakeoffTable } from '../takeoff/tables';
import { takeoffTotals } from '../takeoff/totals';
import type { Takeoff } from '../takeoff/types';
import { inertText } from './safeText';
import { wrap } from './text';

/** Columns of the run schedule the text report shows (the spreadsheet has them all). */
const RUN_COLUMNS = ['id', 'sets', 'phaseConductors', 'size', 'material', 'insulation', 'neutralConductors', 'neutralSize', 'egcCount', 'egcSize', 'racewayKind', 'tradeSize', 'raceways', 'fillPct', 'lengthFt', 'phaseFt', 'neutralFt', 'egcFt'];

function cellText(v: TakeoffCell): string {
  if (v === null) return '';
  // Labels and ids are the user's text: inert on a terminal.
  return typeof v === 'number' ? String(v) : inertText(v);
}

function renderTable(t: TakeoffTable, keys?: readonly string[]): string[] {
  const idx = keys ? keys.map((k) => t.columns.findIndex((c) => c.key === k)).filter((i) => i >= 0) : t.columns.map((_, i) => i);
  const cols = idx.map((i) => t.columns[i]!);
  const rows = t.rows.map((r) => idx.map((i) => cellText(r[i]!)));
  if (t.totals) rows.push(idx.map((i) => cellText(t.totals![i]!)));
  const widths = cols.map((c, j) => Math.max(c.header.length, ...rows.map((r) => r[j]!.length)));
  const line = (r: string[]) => r.map((s, j) => (cols[j]!.type === 'number' ? s.padStart(widths[j]!) : s.padEnd(widths[j]!))).join('  ').trimEnd();
  const out = [t.title.toUpperCase(), line(cols.map((c) => c.header)), widths.map((w) => '-'.repeat(w)).join('  ')];
  if (t.rows.length === 0) out.push('  (none)');
  const body = rows.map(line);
  if (t.totals) body.splice(body.length - 1, 0, widths.map((w) => '-'.repeat(w)).join('  '));
  if (t.rows.length > 0 || !t.totals) out.push(...body);
  return out;
}

/** The takeoff as a fixed-width plain-text report: totals, the run schedule, what to resolve, assumptions, caution. */
export function renderTakeoffText(takeoff: Takeoff, width = 100): string {
  const totals = takeoffTotals(takeoff);
  const tables = takeoffTables(takeoff, totals);
  const byId = new Map(tables.map((t) => [t.id, t]));
  const out: string[] = [`Linewright takeoff: ${inertText(takeoff.projectName)}`, `NEC ${takeoff.edition} · ${takeoff.runs.length} run${takeoff.runs.length === 1 ? '' : 's'} · makeup ${takeoff.makeupFtPerTermination} ft per termination · ${totals.flaggedRuns} run${totals.flaggedRuns === 1 ? '' : 's'} to resolve`, ''];
  for (const id of ['wire', 'raceway', 'devices', 'buses', 'transformers', 'disconnects', 'terminations'] as const) {
    out.push(...renderTable(byId.get(id)!), '');
  }
  out.push(...renderTable(byId.get('runs')!, RUN_COLUMNS), '');
  out.push('TO RESOLVE BEFORE PRICING');
  const flagged = takeoff.runs.filter((r) => r.flags.length > 0);
  if (flagged.length === 0) out.push('  none');
  for (const r of flagged) for (const f of r.flags) out.push(...wrap(`${r.conductorId}: ${f}`, width, '  ', '    '));
  out.push('', 'EGC BASIS');
  for (const r of takeoff.runs) out.push(...wrap(`${r.conductorId}: ${r.egc.reason}`, width, '  ', '    '));
  out.push('', 'ASSUMPTIONS');
  for (const a of takeoff.assumptions) out.push(...wrap(`- ${a}`, width, '  ', '  '));
  out.push('', ...wrap(`Caution: ${takeoff.caution}`, width), '');
  return out.join('\n');
}
