import { computeAmpacity } from '../ampacity/ampacity';
import { INSULATIONS, type CodeEdition, type Conductor } from '../model/schema';
import { materialIndexOf, sizeIndexOf } from '../tables/sizes';
import type { Graph } from '../topology/graph';
import type { AmpacityWorking } from './types';

export interface ConductorAmpacity {
  working: AmpacityWorking | null;
  /** Why there is no ampacity: the field and how to fix it. */
  problem: { field: string; message: string } | null;
}

/**
 * Ampacity of one conductor. A riser repeats a few dozen combinations of
 * size, material and conditions thousands of times, so equal inputs share one
 * frozen result; the working is read-only.
 */
const ampacityMemo = new Map<number, ConductorAmpacity>();
const MAX_MEMO = 8192;
const INSULATION_INDEX = new Map<string, number>(INSULATIONS.map((x, i) => [x, i]));

/**
 * The inputs packed into one exact integer (mixed radix, under 2^53), so the
 * memo needs no string per conductor; NaN when an input falls outside the
 * packing (an ambient with more than two decimals), which skips the memo.
 */
function ampacityKey(c: Conductor, edition: CodeEdition): number {
  const ambient = Math.round(c.ambientC * 100);
  if (ambient !== c.ambientC * 100) return Number.NaN;
  const term = c.terminalTempC === 60 ? 0 : c.terminalTempC === 75 ? 1 : 2;
  let k = materialIndexOf(c.material);
  k = k * 30 + sizeIndexOf(c.size);
  k = k * 14 + (INSULATION_INDEX.get(c.insulation) ?? 0);
  k = k * 21 + c.parallelSets;
  k = k * 13_001 + (ambient + 4000);
  k = k * 201 + c.currentCarrying;
  return (k * 3 + term) * 2 + (edition === 2020 ? 0 : 1);
}

export function conductorAmpacity(c: Conductor, edition: CodeEdition): ConductorAmpacity {
  const key = ampacityKey(c, edition);
  let hit = ampacityMemo.get(key);
  if (hit) return hit;
  const r = computeAmpacity({
    material: c.material,
    size: c.size,
    insulation: c.insulation,
    parallelSets: c.parallelSets,
    ambientC: c.ambientC,
    currentCarrying: c.currentCarrying,
    terminalTempC: c.terminalTempC,
    edition,
  });
  hit = Object.freeze(r.ok ? { working: deepFreeze(r.working), problem: null } : { working: null, problem: Object.freeze({ field: r.field, message: r.message }) });
  if (!Number.isNaN(key)) {
    if (ampacityMemo.size >= MAX_MEMO) ampacityMemo.clear();
    ampacityMemo.set(key, hit);
  }
  return hit;
}

function deepFreeze<T extends object>(o: T): T {
  for (const v of Object.values(o)) if (v && typeof v === 'object' && !Object.isFrozen(v)) deepFreeze(v as object);
  return Object.freeze(o);
}


/** Stage: the ampacity of every conductor of the graph, by index. */
export function conductorAmpacities(ctx: { graph: Graph; edition: CodeEdition }): ConductorAmpacity[] {
  return ctx.graph.conductors.map((c) => conductorAmpacity(c, ctx.edition));
}
