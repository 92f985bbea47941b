import { computeAmpacity, NEEDS_SIZE_MESSAGE } from '../ampacity/ampacity';
import { INSULATIONS, type CodeEdition, type Conductor, type ConductorSize, type ProjectSettings } from '../model/schema';
import { materialIndexOf, SIZE_INDEX_1_0, sizeIndexOf } from '../tables/sizes';
import type { Graph } from '../topology/graph';
import type { ConductorCircuit } from './circuits';
import type { AmpacityWorking } from './types';

export type TerminationDefault = ProjectSettings['terminationDefault'];

/**
 * 110.14(C)(1): the termination rating a conductor is judged at. Its own when stated; else
 * the project's default: 75 °C where the equipment is listed for it, or the code's own rule,
 * 60 °C for 14 AWG to 1 AWG (terminals for circuits of 100 A or less) and 75 °C above. A
 * circuit of 100 A or less on 1/0 or larger would take 60 °C too, but the 60 °C ampacity of
 * 1/0 and larger (Cu 125 A, Al 100 A) already covers such a circuit, so size alone decides.
 */
export function terminalTempOf(c: Pick<Conductor, 'terminalTempC' | 'size'>, setting: TerminationDefault): 60 | 75 | 90 {
  if (c.terminalTempC !== undefined) return c.terminalTempC;
  if (setting === 'per-110.14(C)(1)' && c.size !== undefined && sizeIndexOf(c.size) < SIZE_INDEX_1_0) return 60;
  return 75;
}

/** What of a conductor its ampacity reads. */
export type AmpacityInputs = Pick<Conductor, 'size' | 'material' | 'insulation' | 'parallelSets' | 'ambientC' | 'terminalTempC' | 'currentCarrying'>;

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
function ampacityKey(c: AmpacityInputs, size: ConductorSize, edition: CodeEdition, terminalTempC: 60 | 75 | 90, currentCarrying: number): number {
  const ambient = Math.round(c.ambientC * 100);
  if (ambient !== c.ambientC * 100) return Number.NaN;
  const term = terminalTempC === 60 ? 0 : terminalTempC === 75 ? 1 : 2;
  let k = materialIndexOf(c.material);
  k = k * 30 + sizeIndexOf(size);
  k = k * 14 + (INSULATION_INDEX.get(c.insulation) ?? 0);
  k = k * 21 + c.parallelSets;
  k = k * 13_001 + (ambient + 4000);
  k = k * 201 + currentCarrying;
  return (k * 3 + term) * 2 + (edition === 2020 ? 0 : 1);
}

/** A conductor drawn without a size has no ampacity; the problem names the field and the fix. */
const NO_SIZE: ConductorAmpacity = Object.freeze({ working: null, problem: Object.freeze({ field: 'size', message: NEEDS_SIZE_MESSAGE }) });

/**
 * `currentCarrying` is the count Table 310.15(C)(1) adjusts for: the circuit's 310.15(E) count
 * from analyze/circuits.ts (the takeoff reports the same), or the run's stated count alone.
 */
export function conductorAmpacity(c: AmpacityInputs, edition: CodeEdition, terminationDefault: TerminationDefault = 'listed-75', currentCarrying = c.currentCarrying): ConductorAmpacity {
  if (c.size === undefined) return NO_SIZE;
  const terminalTempC = terminalTempOf(c, terminationDefault);
  const key = ampacityKey(c, c.size, edition, terminalTempC, currentCarrying);
  let hit = ampacityMemo.get(key);
  if (hit) return hit;
  const r = computeAmpacity({
    material: c.material,
    size: c.size,
    insulation: c.insulation,
    parallelSets: c.parallelSets,
    ambientC: c.ambientC,
    currentCarrying,
    terminalTempC,
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


/**
 * Stage: the ampacity of every conductor of the graph, by index, adjusted for the 310.15(E) count of
 * its circuit (the stated count where larger), the one the takeoff reports.
 */
export function conductorAmpacities(ctx: { graph: Graph; edition: CodeEdition; terminationDefault: TerminationDefault; circuits: readonly ConductorCircuit[] }): ConductorAmpacity[] {
  return ctx.graph.conductors.map((c, ci) => conductorAmpacity(c, ctx.edition, ctx.terminationDefault, ctx.circuits[ci]!.currentCarrying.adjustmentCount));
}
