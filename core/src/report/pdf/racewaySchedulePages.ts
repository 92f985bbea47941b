import type { PdfContext } from './context';
import { buildTakeoff } from '../../takeoff/takeoff';
import { systemText } from '../../takeoff/system';
import type { TakeoffRun } from '../../takeoff/types';
import { tradeSizeLabel } from '../../tables/chapter9Table4';
import { materialLabel, sizeLabel } from '../../tables/sizes';
import { lengthText } from '../format';
import { M, type Sheet } from './sheet';
import { table, type TableColumn } from './table';

/** '-' when there are none; a count of conductors drawn without a size reads 'size unknown' (the EGC passes 0 when not sized). */
function conductors(count: number, size: TakeoffRun['size'] | null, material: TakeoffRun['material'], insulation: string): string {
  return count === 0 ? '-' : `${count} × ${sizeLabel(size)} ${materialLabel(material)} ${insulation}`;
}

/**
 * The conductor and raceway schedule of the permit set: for every run the phase conductors, the
 * neutral, the EGC with the rule that sized it (Table 250.122, 250.122(B), (F), (G)) and the raceway
 * trade size by Chapter 9, from the same takeoff the estimator downloads.
 */
export function racewaySchedulePages(sh: Sheet, { project, report }: PdfContext): void {
  if (report.conductors.length === 0) return;
  const takeoff = buildTakeoff(project, report);
  sh.newPage();
  sh.heading('Conductor and raceway schedule');
  const cols: TableColumn<TakeoffRun>[] = [
    { head: 'Run', width: 70, cell: (r) => r.conductorId, bold: () => true },
    { head: 'System', width: 95, cell: (r) => systemText(r.system) },
    { head: 'Phase conductors', width: 120, cell: (r) => conductors(r.phaseConductors, r.size, r.material, r.insulation) },
    { head: 'Neutral', width: 105, cell: (r) => conductors(r.neutralConductors, r.neutralSize, r.material, r.insulation) },
    { head: 'EGC', width: 95, cell: (r) => conductors(r.egc.size === null ? 0 : r.egc.count, r.egc.size, r.egc.material, r.insulation) },
    { head: 'EGC sized by', width: 95, cell: (r) => (r.egc.cites.length > 0 ? r.egc.cites.join(', ') : '-') },
    {
      head: 'Raceway',
      width: 105,
      cell: (r) => (r.raceway.kind === null ? 'none (cable or open)' : r.raceway.tradeSize === null ? `${r.raceway.kind}: not sized` : `${r.raceway.count} × ${tradeSizeLabel(r.raceway.tradeSize)} ${r.raceway.kind}`),
      bold: (r) => r.raceway.problem !== null,
    },
    { head: 'Fill', width: 40, cell: (r) => (r.raceway.fillPct === null ? '-' : `${r.raceway.fillPct} %`) },
    { head: 'CCC', width: 30, cell: (r) => String(r.currentCarrying.count) },
    { head: 'Length', width: 45, cell: (r) => lengthText(r.lengthFt) },
  ];
  const used = cols.reduce((a, c) => a + c.width, 0);
  cols.push({ head: 'Notes', width: sh.w - 2 * M - used, cell: (r) => [r.raceway.problem, r.egc.problem].filter((x) => x !== null).join('; ') || r.circuit.neutralReason });
  table(sh, cols, takeoff.runs, 7);
  sh.font(7.5, 'italic');
  const note = sh.split(
    'EGC: Table 250.122 from the OCPD ahead; increased by 250.122(B) where the phase conductors exceed the minimum the OCPD and load need; one in each raceway of a parallel set (250.122(F)). Raceway: Chapter 9 Tables 1, 4 and 5 with the EGC counted; one raceway per parallel set. CCC: current-carrying conductors per raceway, 310.15(E).',
    sh.w - 2 * M,
  );
  sh.text(note, M, sh.y + 8);
  sh.y += note.length * 9 + 8;
}
