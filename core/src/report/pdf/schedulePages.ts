import type { PdfContext } from './context';
import type { ConductorReport } from '../../analyze/types';
import { ROLE_WORDS, ampsText, conductorText, deviceText, lengthText, showsViolation, verdictAlarmText } from '../format';
import { M, type Sheet } from './sheet';
import { table, type TableColumn } from './table';

export function schedulePages(sh: Sheet, { project, report }: PdfContext): void {
  const facts = new Map(project.conductors.map((c) => [c.id as string, c]));
  sh.newPage();
  sh.heading('Conductor schedule');
  if (report.conductors.length === 0) {
    sh.font(9, 'normal');
    sh.text('The project has no conductors.', M, sh.y + 9);
    sh.y += 20;
    return;
  }
  const cols: TableColumn<ConductorReport>[] = [
    { head: 'Conductor', width: 70, cell: (c) => c.id, bold: () => true },
    { head: 'Label', width: 110, cell: (c) => c.label },
    { head: 'From - to', width: 100, cell: (c) => `${c.from} - ${c.to}` },
    { head: 'Role', width: 70, cell: (c) => ROLE_WORDS[c.role] },
    { head: 'Size', width: 95, cell: (c) => conductorText(c) },
    {
      head: 'Insulation, terminals',
      width: 80,
      cell: (c) => {
        const f = facts.get(c.id);
        return f ? `${f.insulation}, ${c.ampacity ? `${c.ampacity.terminalTempC} °C` : 'unknown'} terminals${f.ambientC !== 30 ? `, ${f.ambientC} °C ambient` : ''}` : '?';
      },
    },
    { head: 'Length', width: 45, cell: (c) => lengthText(c.lengthFt) },
    { head: 'Ampacity', width: 95, cell: (c) => (c.ampacity ? `${ampsText(c.ampacity.ampacityA)} (${c.ampacity.governedBy.replace(/-/g, ' ')})` : '?') },
    { head: 'Upstream OCPD', width: 110, cell: (c) => deviceText(c.upstreamDevice) },
    { head: 'Tap length', width: 50, cell: (c) => (c.tapLengthFt === null ? '-' : lengthText(c.tapLengthFt)) },
    { head: 'Calc. load', width: 50, cell: (c) => (c.load ? ampsText(c.load.calculatedA) : '?') },
    { head: 'Verdict', width: 130, cell: (c) => verdictAlarmText(report, c), bold: (c) => showsViolation(report, c) },
  ];
  const used = cols.reduce((a, c) => a + c.width, 0);
  cols.push({ head: 'Why', width: sh.w - 2 * M - used, cell: (c) => c.summary });
  table(sh, cols, report.conductors, 7);
}
