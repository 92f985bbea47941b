import type { NodeOfKind } from '../model/schema';
import { racewayColumn, table9ROhmPerKft, table9XOhmPerKft } from '../tables/chapter9Table9';
import { KIND, type Graph } from '../topology/graph';

/**
 * What the fault-current and voltage-drop studies read of each node and conductor, read in one
 * pass over each list, so a study that walks the network reads arrays and each element's object
 * is read once, not once per study. Built for a whole analysis (studyNetwork); the re-checks of
 * one element (analyze/incremental.ts) read the element itself.
 */
export interface StudyColumns {
  /** Per node: 1 at a single-phase transformer or load ("phases": 1). */
  singlePhase: Uint8Array;
  /** Per node: a load's power factor (NaN elsewhere). */
  powerFactor: Float64Array;
  /** Per node: 1 at a load with a motor contribution ("faultContributionXFlc"). */
  motorGiven: Uint8Array;
  /** Per conductor: its length, ft, and parallel sets as written (NaN where absent). */
  lengthFt: Float64Array;
  parallelSets: Float64Array;
  /** Per conductor: 1 without a length, 1 without a size. */
  noLength: Uint8Array;
  noSize: Uint8Array;
  /** Per conductor: Chapter 9 Table 9 R and X of one conductor, Ω/1000 ft (NaN without a size or a value in the table). */
  rOhmPerKft: Float64Array;
  xOhmPerKft: Float64Array;
}

export function studyColumns(g: Graph): StudyColumns {
  const n = g.nodes.length;
  const singlePhase = new Uint8Array(n);
  const powerFactor = new Float64Array(n).fill(Number.NaN);
  const motorGiven = new Uint8Array(n);
  for (let v = 0; v < n; v++) {
    const kind = g.nodeKind[v]!;
    if (kind === KIND.load) {
      const node = g.nodes[v] as NodeOfKind<'load'>;
      if (node.phases === 1) singlePhase[v] = 1;
      powerFactor[v] = node.powerFactor;
      if (node.faultContributionXFlc !== undefined) motorGiven[v] = 1;
    } else if (kind === KIND.transformer && (g.nodes[v] as NodeOfKind<'transformer'>).phases === 1) singlePhase[v] = 1;
  }
  const m = g.conductors.length;
  const lengthFt = new Float64Array(m);
  const parallelSets = new Float64Array(m);
  const noLength = new Uint8Array(m);
  const noSize = new Uint8Array(m);
  const rOhmPerKft = new Float64Array(m).fill(Number.NaN);
  const xOhmPerKft = new Float64Array(m).fill(Number.NaN);
  for (let e = 0; e < m; e++) {
    const c = g.conductors[e]!;
    if (c.lengthFt === undefined) {
      noLength[e] = 1;
      lengthFt[e] = Number.NaN;
    } else lengthFt[e] = c.lengthFt;
    parallelSets[e] = c.parallelSets;
    if (c.size === undefined) {
      noSize[e] = 1;
      continue;
    }
    const column = racewayColumn(c.wiring);
    rOhmPerKft[e] = table9ROhmPerKft(c.material, c.size, column);
    xOhmPerKft[e] = table9XOhmPerKft(c.size, column);
  }
  return { singlePhase, powerFactor, motorGiven, lengthFt, parallelSets, noLength, noSize, rOhmPerKft, xOhmPerKft };
}
