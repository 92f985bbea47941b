import { edgeFrom, edgeTo, type Graph } from '../topology/graph';

/**
 * System voltage at every node (from its source, changed by transformers) and
 * the load downstream of every node, as volt-amperes so that it adds up across
 * voltages. A transformer passes its load through unchanged (losses ignored),
 * so current scales by the voltage ratio.
 */
export interface SystemLoads {
  /** Line-to-line voltage available at the node's load side; NaN when no source is upstream. */
  voltsLL: Float64Array;
  phases: Uint8Array;
  /** Noncontinuous and continuous VA at and below each node. */
  vaNoncontinuous: Float64Array;
  vaContinuous: Float64Array;
}

export function rollUpLoads(g: Graph, order: Int32Array, count: number): SystemLoads {
  const n = g.nodes.length;
  const voltsLL = new Float64Array(n).fill(Number.NaN);
  const phases = new Uint8Array(n);
  for (let k = 0; k < count; k++) {
    const v = order[k]!;
    const node = g.nodes[v]!;
    if (node.kind === 'utility' || node.kind === 'generator') {
      voltsLL[v] = node.voltsLL;
      phases[v] = node.phases;
    } else if (node.kind === 'transformer') {
      voltsLL[v] = node.secondaryVoltsLL;
      phases[v] = node.phases;
    } else {
      const ins = g.inEdges[v]!;
      // With several supplies the voltage is not defined (the topology check reports it), whatever the file order.
      if (ins.length !== 1) continue;
      for (const e of ins) {
        const u = edgeFrom(g, e);
        if (u >= 0 && !Number.isNaN(voltsLL[u]!)) {
          voltsLL[v] = voltsLL[u]!;
          phases[v] = phases[u]!;
          break;
        }
      }
    }
  }
  const vaNoncontinuous = new Float64Array(n);
  const vaContinuous = new Float64Array(n);
  for (let k = count - 1; k >= 0; k--) {
    const v = order[k]!;
    const node = g.nodes[v]!;
    if (node.kind === 'load') {
      let va: number;
      if (node.kva !== undefined) va = node.kva * 1000;
      else {
        const ph = node.phases ?? phases[v]!;
        // A single-phase load on a three-phase system is taken as connected line to line.
        va = (node.currentA ?? 0) * voltsLL[v]! * (ph === 3 ? Math.sqrt(3) : 1);
      }
      if (node.continuous) vaContinuous[v] = vaContinuous[v]! + va;
      else vaNoncontinuous[v] = vaNoncontinuous[v]! + va;
    }
    for (const e of g.outEdges[v]!) {
      const w = edgeTo(g, e);
      vaNoncontinuous[v] = vaNoncontinuous[v]! + vaNoncontinuous[w]!;
      vaContinuous[v] = vaContinuous[v]! + vaContinuous[w]!;
    }
  }
  return { voltsLL, phases, vaNoncontinuous, vaContinuous };
}

/** Current in a conductor from `fromNode` into `toNode`, unfactored and per 215.2(A)(1). Null when the voltage is unknown. */
export function conductorLoadA(s: SystemLoads, fromNode: number, toNode: number): { flowingA: number; calculatedA: number } | null {
  const v = s.voltsLL[fromNode]!;
  if (!(v > 0)) return null;
  const k = s.phases[fromNode] === 3 ? Math.sqrt(3) * v : v;
  const non = s.vaNoncontinuous[toNode]!;
  const cont = s.vaContinuous[toNode]!;
  return { flowingA: round2((non + cont) / k), calculatedA: round2((non + 1.25 * cont) / k) };
}

function round2(x: number): number {
  return Math.round(x * 100) / 100;
}
