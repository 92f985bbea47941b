import type { NodeOfKind } from '../../model/schema';
import { racewayColumn, table9Impedance } from '../../tables/chapter9Table9';
import { motorTableFlcA } from '../../tables/motor';
import { edgeTo, type Graph } from '../../topology/graph';

/**
 * Voltage drop per conductor and cumulative from the source to every load,
 * by the effective impedance of the Chapter 9 Table 9 notes:
 * Z_eff = R·cos θ + X·sin θ (θ the power-factor angle of the load served,
 * lagging), three-phase VD = √3·I·Z_eff·L/1000, single-phase VD =
 * 2·I·Z_eff·L/1000, R and X divided by the parallel sets, L one way; percent of
 * the circuit's own voltage. Linear: one pass load-to-source for the current
 * and power factor, one pass source-to-load for the sums.
 *
 * The current in a conductor is what flows to the loads below it (unfactored),
 * from the real and reactive power of each load, so a feeder serving loads of
 * several power factors carries their combined power factor. Transformer
 * losses and regulation are not included: the total counts from the last
 * source or transformer secondary (stated in the report). The circuit figure
 * counts from the last overcurrent device, so a feeder and a branch circuit
 * are judged separately and add up in the total.
 */
export interface VoltageDropStudy {
  /** Per conductor: current, A; NaN when unknown. */
  currentA: Float64Array;
  /** Per conductor: power factor of what it serves. */
  powerFactor: Float64Array;
  /** Per conductor: its own drop, % of the circuit voltage; NaN when unknown. */
  pct: Float64Array;
  /** Per conductor: 1 for a single-phase (two-wire or line-to-line) circuit. */
  singlePhase: Uint8Array;
  /** Per node: drop from the last source or transformer secondary, %. */
  totalPct: Float64Array;
  /** Per node: drop from the last overcurrent device, source or transformer, %. */
  circuitPct: Float64Array;
  notes: string[];
}

/** What the voltage-drop study needs from the network: voltages, phase arrangement and supply order. */
export interface VoltageDropInputs {
  order: Int32Array;
  count: number;
  /** Line-to-line voltage at each node. */
  voltsLL: Float64Array;
  /** 1 where the circuit arriving at the node is single phase (a single-phase system, load or transformer). */
  singlePhase: Uint8Array;
  /** Supplying node and edge of each node (-1 for none). */
  parent: Int32Array;
  parentEdge: Int32Array;
}

const SQRT3 = Math.sqrt(3);

/**
 * The line current a motor or HVAC load states on its own terms: the table full-load current of a
 * motor by horsepower (430.6(A), Tables 430.248/430.250) or its nameplate FLA, the nameplate MCA of
 * HVAC equipment (440.4(B)); null for other loads, which give amperes or kVA.
 */
function nameplateLineA(node: NodeOfKind<'load'>, volts: number, phases: 1 | 3): number | null {
  if (node.hvac) return node.hvac.mcaA;
  if (!node.motor) return null;
  const table = node.motor.hp === undefined ? null : motorTableFlcA(node.motor.hp, volts, phases);
  return table?.flcA ?? node.motor.fullLoadA ?? null;
}

export function studyVoltageDrop(g: Graph, inp: VoltageDropInputs): VoltageDropStudy {
  const n = g.nodes.length;
  const m = g.conductors.length;
  const { order, count, voltsLL } = inp;
  // Real and reactive power at and below each node.
  const p = new Float64Array(n);
  const q = new Float64Array(n);
  let unknownLoad = false;
  for (let k = count - 1; k >= 0; k--) {
    const v = order[k]!;
    const node = g.nodes[v]!;
    if (node.kind === 'load') {
      const phases = node.phases ?? (inp.singlePhase[v] ? 1 : 3);
      const lineA = nameplateLineA(node, voltsLL[v]!, phases) ?? node.currentA ?? 0;
      const va = node.kva !== undefined ? node.kva * 1000 : lineA * voltsLL[v]! * (phases === 3 ? SQRT3 : 1);
      if (Number.isFinite(va)) {
        p[v] = p[v]! + va * node.powerFactor;
        q[v] = q[v]! + va * Math.sqrt(1 - node.powerFactor * node.powerFactor);
      } else unknownLoad = true;
    }
    for (const e of g.outEdges[v]!) {
      const w = edgeTo(g, e);
      if (w < 0 || inp.parent[w] !== v) continue;
      p[v] = p[v]! + p[w]!;
      q[v] = q[v]! + q[w]!;
    }
  }

  const currentA = new Float64Array(m).fill(Number.NaN);
  const powerFactor = new Float64Array(m).fill(Number.NaN);
  const pct = new Float64Array(m).fill(Number.NaN);
  const singlePhase = new Uint8Array(m);
  for (let c = 0; c < m; c++) {
    const to = g.conductorTo[c]!;
    const from = g.conductorFrom[c]!;
    if (to < 0 || from < 0 || inp.parentEdge[to] !== c) continue;
    const cond = g.conductors[c]!;
    const volts = voltsLL[from]!;
    const one = inp.singlePhase[to]!;
    singlePhase[c] = one;
    const s = Math.hypot(p[to]!, q[to]!);
    if (!(volts > 0)) continue;
    const amps = s / ((one ? 1 : SQRT3) * volts);
    const pf = s > 0 ? p[to]! / s : 1;
    currentA[c] = amps;
    powerFactor[c] = pf;
    const z = table9Impedance(cond.material, cond.size, racewayColumn(cond.wiring));
    if (!z || cond.lengthFt === undefined) continue;
    const zEff = z.rOhmPerKft * pf + z.xOhmPerKft * Math.sqrt(1 - pf * pf);
    const vd = ((one ? 2 : SQRT3) * amps * zEff * cond.lengthFt) / 1000 / cond.parallelSets;
    pct[c] = (100 * vd) / volts;
  }

  const totalPct = new Float64Array(n).fill(Number.NaN);
  const circuitPct = new Float64Array(n).fill(Number.NaN);
  for (let k = 0; k < count; k++) {
    const v = order[k]!;
    const u = inp.parent[v]!;
    if (u < 0) {
      const kind = g.nodes[v]!.kind;
      if (kind === 'utility' || kind === 'generator') totalPct[v] = circuitPct[v] = 0;
      continue;
    }
    const e = inp.parentEdge[v]!;
    const d = e >= 0 ? pct[e]! : 0;
    // Values arrive at v; what leaves a source or transformer starts again, and a circuit also starts at a device.
    const up = g.nodes[u]!.kind;
    const newSystem = up === 'utility' || up === 'generator' || up === 'transformer';
    totalPct[v] = (newSystem ? 0 : totalPct[u]!) + d;
    circuitPct[v] = (newSystem || up === 'breaker' || up === 'fuse' ? 0 : circuitPct[u]!) + d;
  }
  const notes = [
    'Voltage drop: Chapter 9 Table 9 effective impedance R·cos θ + X·sin θ at the power factor of the loads served (lagging), conductors at 75 °C; three-phase √3·I·Z·L, single-phase 2·I·Z·L, over the circuit voltage. Totals count from the source or transformer secondary; transformer regulation is not included.',
  ];
  if (unknownLoad) notes.push('A load without a known voltage adds nothing to the currents above it.');
  return { currentA, powerFactor, pct, singlePhase, totalPct, circuitPct, notes };
}
