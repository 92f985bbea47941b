import type { Graph } from './graph';

/**
 * A run is one conductor, or several joined end to end at pass-through
 * joints: a splice with exactly one conductor in and one out of the same
 * material, size and number of sets. The rules judge a run as one conductor
 * whose length is the sum of its parts. An unfused disconnect is equipment,
 * not a splice: a tap that passes through one ends there, and what leaves it
 * is supplied from the tap (a tap from a tap).
 */
export interface Runs {
  /** Conductor indices of each run, supply end first. */
  members: number[][];
  /** Run index of each conductor. */
  runOf: Int32Array;
}

export function isPassThroughJoint(g: Graph, node: number): boolean {
  if (node < 0) return false;
  if (g.nodes[node]!.kind !== 'splice') return false;
  const ins = g.inEdges[node]!;
  const outs = g.outEdges[node]!;
  if (ins.length !== 1 || outs.length !== 1) return false;
  const p = ins[0]!;
  const c = outs[0]!;
  if (p < 0 || c < 0) return false;
  const a = g.conductors[p]!;
  const b = g.conductors[c]!;
  return a.material === b.material && a.size === b.size && a.parallelSets === b.parallelSets;
}

export function buildRuns(g: Graph): Runs {
  const n = g.conductors.length;
  const next = new Int32Array(n).fill(-1);
  const hasPrev = new Uint8Array(n);
  for (let c = 0; c < n; c++) {
    const to = g.conductorTo[c]!;
    if (isPassThroughJoint(g, to)) {
      const following = g.outEdges[to]![0]!;
      next[c] = following;
      hasPrev[following] = 1;
    }
  }
  const runOf = new Int32Array(n).fill(-1);
  const members: number[][] = [];
  const collect = (start: number) => {
    const run: number[] = [];
    const id = members.length;
    for (let c = start; c >= 0 && runOf[c] === -1; c = next[c]!) {
      runOf[c] = id;
      run.push(c);
    }
    members.push(run);
  };
  for (let c = 0; c < n; c++) if (!hasPrev[c]) collect(c);
  // Whatever is left lies on a ring of pass-through joints: a cycle, reported elsewhere.
  for (let c = 0; c < n; c++) if (runOf[c] === -1) collect(c);
  return { members, runOf };
}
