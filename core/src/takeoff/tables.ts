import { materialLabel, sizeLabel } from '../tables/sizes';
import { CHAPTER9_TABLE1_SOURCE } from '../tables/chapter9Table1';
import { CHAPTER9_TABLE4_SOURCE, tradeSizeLabel } from '../tables/chapter9Table4';
import { CHAPTER9_TABLE5_SOURCE } from '../tables/chapter9Table5';
import { EGC_TABLE_SOURCE } from '../tables/egc250_122';
import { systemText } from './system';
import { takeoffTotals, type TakeoffTotals } from './totals';
import type { Takeoff } from './types';

/** A cell: text, a number (kept a number in every output), or empty. */
export type TakeoffCell = string | number | null;

export interface TakeoffColumn {
  key: string;
  header: string;
  type: 'text' | 'number';
  /** Summed in the totals row. */
  sum?: boolean;
}

/** One table of the takeoff, as the CLI, the spreadsheet, the PDF and the browser show it. */
export interface TakeoffTable {
  id: 'runs' | 'wire' | 'raceway' | 'devices' | 'buses' | 'transformers' | 'disconnects' | 'terminations' | 'notes';
  title: string;
  columns: TakeoffColumn[];
  rows: TakeoffCell[][];
  /** Sums of the columns marked `sum`, the others empty; null when the table has no total. */
  totals: TakeoffCell[] | null;
}

const text = (key: string, header: string): TakeoffColumn => ({ key, header, type: 'text' });
const number = (key: string, header: string, sum = false): TakeoffColumn => ({ key, header, type: 'number', sum });

function table(id: TakeoffTable['id'], title: string, columns: TakeoffColumn[], rows: TakeoffCell[][]): TakeoffTable {
  const hasSum = columns.some((c) => c.sum);
  const totals = hasSum
    ? columns.map((c, i) => {
        if (i === 0) return 'Total';
        if (!c.sum) return null;
        let s = 0;
        for (const r of rows) s += typeof r[i] === 'number' ? (r[i] as number) : 0;
        return Math.round(s * 100) / 100;
      })
    : null;
  return { id, title, columns, rows, totals };
}

const size = (s: Parameters<typeof sizeLabel>[0] | null): string | null => (s === null ? null : sizeLabel(s));

/** Every table of a takeoff, in the order an estimator reads them: totals first, then the run schedule, then notes. */
export function takeoffTables(t: Takeoff, totals: TakeoffTotals = takeoffTotals(t)): TakeoffTable[] {
  return [
    table(
      'wire',
      'Wire by size, material and insulation (ft)',
      [text('size', 'Size'), text('material', 'Material'), text('insulation', 'Insulation'), number('phaseFt', 'Phase ft', true), number('neutralFt', 'Neutral ft', true), number('egcFt', 'EGC ft', true), number('totalFt', 'Total ft', true)],
      totals.wire.map((w) => [sizeLabel(w.size), materialLabel(w.material), w.insulation, w.phaseFt, w.neutralFt, w.egcFt, w.totalFt]),
    ),
    table(
      'raceway',
      'Raceway by kind and trade size',
      [text('kind', 'Kind'), text('tradeSize', 'Trade size'), number('raceways', 'Raceways', true), number('feet', 'Feet', true)],
      totals.raceway.map((r) => [r.kind, tradeSizeLabel(r.tradeSize), r.raceways, r.feet]),
    ),
    table(
      'devices',
      'Overcurrent devices by kind, rating, poles and interrupting rating',
      [text('kind', 'Kind'), number('ratingA', 'Rating (A)'), number('poles', 'Poles'), number('interruptingKA', 'Interrupting (kA)'), number('count', 'Count', true)],
      totals.devices.map((d) => [d.kind, d.ratingA, d.poles, d.interruptingKA, d.count]),
    ),
    table(
      'buses',
      'Buses by kind and rating',
      [text('busType', 'Kind'), number('ratingA', 'Rating (A)'), text('system', 'System'), number('count', 'Count', true)],
      totals.buses.map((b) => [b.busType, b.ratingA, b.system, b.count]),
    ),
    table(
      'transformers',
      'Transformers by kVA and voltages',
      [number('kva', 'kVA'), number('primaryVoltsLL', 'Primary (V)'), number('secondaryVoltsLL', 'Secondary (V)'), number('phases', 'Phases'), text('connection', 'Connection'), number('count', 'Count', true)],
      totals.transformers.map((x) => [x.kva, x.primaryVoltsLL, x.secondaryVoltsLL, x.phases, x.connection, x.count]),
    ),
    table(
      'disconnects',
      'Disconnects by rating and poles',
      [number('ratingA', 'Rating (A)'), number('poles', 'Poles'), text('fused', 'Fused'), number('count', 'Count', true)],
      totals.disconnects.map((d) => [d.ratingA, d.poles, d.fused ? 'fused' : 'unfused', d.count]),
    ),
    table(
      'terminations',
      'Terminations (lugs) by conductor size',
      [text('size', 'Size'), text('material', 'Material'), number('terminations', 'Terminations', true)],
      totals.terminations.map((x) => [sizeLabel(x.size), materialLabel(x.material), x.terminations]),
    ),
    table(
      'runs',
      'Conductor and raceway schedule',
      [
        text('id', 'Run'), text('label', 'Label'), text('from', 'From'), text('to', 'To'), text('role', 'Role'), text('verdict', 'Verdict'),
        text('system', 'System'), number('sets', 'Sets'), number('phaseConductors', 'Phase cond.'), text('size', 'Size'), text('material', 'Material'),
        text('insulation', 'Insulation'), number('neutralConductors', 'Neutrals'), text('neutralSize', 'Neutral size'), number('egcCount', 'EGCs'),
        text('egcSize', 'EGC size'), text('egcBasis', 'EGC basis'), number('currentCarrying', 'CCC per raceway'), text('racewayKind', 'Raceway'),
        text('tradeSize', 'Trade size'), number('raceways', 'Raceways'), number('fillPct', 'Fill %'), number('lengthFt', 'Length ft'),
        number('phaseFt', 'Phase ft', true), number('neutralFt', 'Neutral ft', true), number('egcFt', 'EGC ft', true), number('racewayFt', 'Raceway ft', true),
        text('flags', 'To resolve'),
      ],
      t.runs.map((r) => [
        r.conductorId, r.label, r.from, r.to, r.role, r.verdict, systemText(r.system), r.parallelSets, r.phaseConductors, sizeLabel(r.size),
        materialLabel(r.material), r.insulation, r.neutralConductors, r.neutralConductors > 0 ? sizeLabel(r.neutralSize) : null, r.egc.count, size(r.egc.size), r.egc.reason,
        r.currentCarrying.count, r.raceway.kind, r.raceway.tradeSize === null ? null : tradeSizeLabel(r.raceway.tradeSize), r.raceway.count,
        r.raceway.fillPct, r.lengthFt, r.phaseFt, r.neutralFt, r.egcFt, r.racewayFt, r.flags.join('; ') || null,
      ]),
    ),
    table('notes', 'Assumptions, sources and caution', [text('kind', 'Kind'), text('text', 'Text')], [
      ...t.assumptions.map((a): TakeoffCell[] => ['assumption', a]),
      ...[EGC_TABLE_SOURCE, CHAPTER9_TABLE1_SOURCE, CHAPTER9_TABLE4_SOURCE, CHAPTER9_TABLE5_SOURCE].map((s): TakeoffCell[] => ['source', s]),
      ['edition', `NFPA 70 (NEC) ${t.edition}`],
      ['caution', t.caution],
    ]),
  ];
}
