import type { NodeFault } from '../../studies/types';
import { faultText, loadDropRows, pctText, type LoadDropRow } from '../studies';
import type { PdfContext } from './context';
import { M, type Sheet } from './sheet';
import { table, type TableColumn } from './table';

/**
 * The short-circuit table (node, kA, X/R, with each device's interrupting rating
 * or equipment's short-circuit rating beside it and the 110.24 marking) and the
 * voltage-drop table (load, % by segment, total), then the method notes.
 */
export function studyPages(sh: Sheet, { project, report }: PdfContext): void {
  const s = report.studies;
  if (!s || s.faults.length === 0) return;
  const nodes = new Map(project.nodes.map((n) => [n.id as string, n]));
  const service = new Map(s.serviceMarkings.map((m) => [m.nodeId as string, m]));
  const flagged = new Set(report.findings.filter((f) => (f.ruleId === 'interrupting-rating' || f.ruleId === 'equipment-sccr') && f.subject.kind === 'node').map((f) => (f.subject as { id: string }).id));
  sh.newPage();
  sh.heading('Available fault current (short-circuit study)');
  const rating = (f: NodeFault): string => {
    const n = nodes.get(f.nodeId);
    if (!n) return '';
    if (n.kind === 'breaker' || n.kind === 'fuse') return n.interruptingKA === undefined ? 'interrupting: not given' : `interrupting ${n.interruptingKA} kA`;
    if (n.kind === 'bus') return n.sccrKA === undefined ? '' : `SCCR ${n.sccrKA} kA`;
    return '';
  };
  const cols: TableColumn<NodeFault>[] = [
    { head: 'Node', width: 90, cell: (f) => f.nodeId, bold: () => true },
    { head: 'Label', width: 150, cell: (f) => nodes.get(f.nodeId)?.label ?? '' },
    { head: 'Kind', width: 60, cell: (f) => f.kind },
    { head: 'Volts', width: 45, cell: (f) => (f.voltsLL === null ? '?' : `${f.voltsLL} V`) },
    { head: 'Fault', width: 70, cell: (f) => faultText(f.kA, f.upperBound) },
    { head: 'X/R', width: 40, cell: (f) => (f.xOverR === null || !Number.isFinite(f.xOverR) ? '-' : f.xOverR.toFixed(1)) },
    { head: 'Line to ground', width: 70, cell: (f) => (f.lineToGroundKA === null ? '-' : faultText(f.lineToGroundKA, false)) },
    { head: 'Rating', width: 110, cell: (f) => `${rating(f)}${flagged.has(f.nodeId) ? ' - BELOW THE FAULT (violation)' : ''}`, bold: (f) => flagged.has(f.nodeId) },
  ];
  const used = cols.reduce((a, c) => a + c.width, 0);
  cols.push({
    head: 'Note',
    width: sh.w - 2 * M - used,
    cell: (f) => {
      const m = service.get(f.nodeId);
      return [m ? `110.24 marking: ${faultText(m.kA, m.upperBound)}, date ${m.date ?? 'not entered'}` : '', f.unknownWhy ?? '', f.motorKA > 0 ? `includes ${f.motorKA.toFixed(2)} kA motor contribution` : ''].filter(Boolean).join('; ');
    },
  });
  table(sh, cols, s.faults, 7);

  sh.need(60);
  sh.heading(`Voltage drop (limits ${s.voltageDrop.circuitLimitPct} % per circuit, ${s.voltageDrop.totalLimitPct} % total)`);
  const rows = loadDropRows(report);
  const vdCols: TableColumn<LoadDropRow>[] = [
    { head: 'Load', width: 110, cell: (r) => r.loadId, bold: (r) => (r.totalPct ?? 0) > s.voltageDrop.totalLimitPct },
    { head: 'Total', width: 60, cell: (r) => pctText(r.totalPct), bold: (r) => (r.totalPct ?? 0) > s.voltageDrop.totalLimitPct },
  ];
  vdCols.push({ head: 'By segment, source to load', width: sh.w - 2 * M - 170, cell: (r) => r.segments.map((g) => `${g.conductorId} ${pctText(g.pct)}`).join(' + ') });
  if (rows.length === 0) {
    sh.font(9, 'normal');
    sh.text('No load has a computed drop (lengths or loads missing).', M, sh.y + 9);
    sh.y += 20;
  } else table(sh, vdCols, rows, 7);

  sh.need(40);
  sh.heading('Study method and defaults');
  sh.font(8, 'normal');
  for (const n of s.notes) {
    const lines = sh.split(`- ${n}`, sh.w - 2 * M - 20);
    sh.need(lines.length * 10 + 2);
    sh.text(lines, M + 6, sh.y + 8);
    sh.y += lines.length * 10 + 2;
  }
}
