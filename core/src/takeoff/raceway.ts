import type { Conductor, ConductorSize, Insulation, RacewayKind } from '../model/schema';
import { maxFillFraction } from '../tables/chapter9Table1';
import { allowedFillIn2, CHAPTER9_TABLE4, tradeSizeLabel } from '../tables/chapter9Table4';
import { insulatedAreaIn2 } from '../tables/chapter9Table5';
import { bareAreaIn2 } from '../tables/conductorProperties';
import { sizeLabel } from '../tables/sizes';
import type { RacewayFill } from './types';

/** The raceway kind a run is sized in: stated on the run, or taken from its wiring method (common practice). */
export function racewayKindOf(c: Pick<Conductor, 'raceway' | 'wiring'>): RacewayKind | null {
  if (c.raceway) return c.raceway;
  switch (c.wiring) {
    case 'steel-conduit':
      return 'EMT';
    case 'aluminum-conduit':
      return 'RMC';
    case 'pvc-conduit':
      return 'PVC-40';
    default:
      return null;
  }
}

/** One conductor of a raceway's contents: its size, insulation ('bare' for a bare EGC) and how many. */
export interface RacewayContent {
  /** Null when the drawing gives no size: the raceway cannot be sized. */
  size: ConductorSize | null;
  insulation: Insulation | 'bare';
  count: number;
}

/**
 * Chapter 9 raceway sizing for one raceway's contents: the Table 5 areas
 * summed (Note 6; EGCs count, Note 3; a bare one at its Table 8 area, Note 8), the Table 1 percentage for the number
 * of conductors, and the smallest Table 4 trade size of that kind whose
 * allowed area holds them. Flags contents that need more than the largest
 * transcribed trade size.
 */
export function sizeRaceway(kind: RacewayKind | null, contents: readonly RacewayContent[], raceways: number): RacewayFill {
  const conductors = contents.reduce((n, x) => n + x.count, 0);
  const empty: RacewayFill = {
    kind,
    tradeSize: null,
    count: 0,
    conductorsPerRaceway: conductors,
    conductorAreaIn2: null,
    maxFillFraction: null,
    allowedAreaIn2: null,
    fillPct: null,
    problem: null,
  };
  if (kind === null) return empty;
  let area = 0;
  for (const x of contents) {
    if (x.size === null) return { ...empty, count: raceways, problem: 'conductor size unknown: raceway not sized' };
    // Note 8: a bare conductor counts at its Table 8 area.
    const a = x.insulation === 'bare' ? bareAreaIn2(x.size) : insulatedAreaIn2(x.insulation, x.size);
    if (a === null) {
      return { ...empty, count: raceways, problem: `Chapter 9 Table 5 has no area transcribed for ${sizeLabel(x.size)} ${x.insulation}: raceway not sized` };
    }
    area += a * x.count;
  }
  area = Math.round(area * 10_000) / 10_000;
  const fraction = maxFillFraction(conductors);
  for (const row of CHAPTER9_TABLE4[kind]) {
    const allowed = allowedFillIn2(row, fraction);
    if (area <= allowed) {
      return {
        ...empty,
        tradeSize: row.tradeSize,
        count: raceways,
        conductorAreaIn2: area,
        maxFillFraction: fraction,
        allowedAreaIn2: Math.round(allowed * 1000) / 1000,
        fillPct: Math.round((area / row.areaIn2) * 1000) / 10,
      };
    }
  }
  const rows = CHAPTER9_TABLE4[kind];
  const largest = rows[rows.length - 1]!;
  return {
    ...empty,
    count: raceways,
    conductorAreaIn2: area,
    maxFillFraction: fraction,
    problem: `fill ${area} in² exceeds the ${Math.round(fraction * 100)} % allowed in ${tradeSizeLabel(largest.tradeSize)} ${kind} (${Math.round(allowedFillIn2(largest, fraction) * 1000) / 1000} in², the largest trade size of that kind): use more parallel sets or another raceway`,
  };
}
