import type { NodeOfKind } from '../model/schema';
import { KIND, type Graph } from './graph';

/**
 * A run is one conductor, or several joined end to end at pass-through
 * joints: a splice or a tap box with exactly one conductor in and one out,
 * of the same material, size and number of sets. The rules judge a run as
 * one conductor whose length is the sum of its parts. Where the size changes
 * at such a joint (3/0 spliced to 4/0) the classifier decides: on a tap or a
 * secondary the two are one run judged on the weakest segment (see
 * `isJoint`); on a protected feeder the smaller conductor is a tap made there.
 * An unfused disconnect is equipment, not a splice: a tap that passes through
 * one ends there, and what leaves it is supplied from the tap (a tap from a tap).
 */
export interface Runs {
  /** Conductor indices of each run, supply end first. */
  members: number[][];
  /** Run index of each conductor. */
  runOf: Int32Array;
}

/** A splice or tap box with one conductor in and one out and nothing else: no branch, whatever the sizes. */
export function isJoint(g: Graph, node: number): boolean {
  if (node < 0) return false;
  // The kind code first: most conductors end at a device or a load, whose node object is then not read.
  const kind = g.nodeKind[node]!;
  if (kind !== KIND.splice && !(kind === KIND.bus && (g.nodes[node] as NodeOfKind<'bus'>).busType === 'tap-box')) return false;
  const ins = g.inEdges[node]!;
  const outs = g.outEdges[node]!;
  // Conductors only: a bus link out of a tap box feeds equipment in it, which is a branch.
  return ins.length === 1 && outs.length === 1 && ins[0]! >= 0 && outs[0]! >= 0;
}

/** A joint where nothing about the conductor changes: the two are one run from the start. */
export function isPassThroughJoint(g: Graph, node: number): boolean {
  if (!isJoint(g, node)) return false;
  const a = g.conductors[g.inEdges[node]![0]!]!;
  const b = g.conductors[g.outEdges[node]![0]!]!;
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
  for (let c = 0; c < n; c++) if (!hasPrev[c]) collect(members, runOf, next, c);
  // Whatever is left lies on a ring of pass-through joints: a cycle, reported elsewhere.
  for (let c = 0; c < n; c++) if (runOf[c] === -1) collect(members, runOf, next, c);
  return { members, runOf };
}

/** Appends the run that starts at conductor `start` and follows `next`; most runs are one conductor, a list of exactly one. */
function collect(members: number[][], runOf: Int32Array, next: Int32Array, start: number): void {
  const id = members.length;
  const run = [start];
  runOf[start] = id;
  for (let c = next[start]!; c >= 0 && runOf[c] === -1; c = next[c]!) {
    runOf[c] = id;
    run.push(c);
  }
  members.push(run);
}
