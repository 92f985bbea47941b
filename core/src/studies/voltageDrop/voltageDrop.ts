import type { ConductorCircuit } from '../../analyze/circuits';
import type { SystemLoads } from '../../analyze/loads';
import type { NodeOfKind } from '../../model/schema';
import { KIND, orderPositions, type Graph } from '../../topology/graph';
import { settleTables } from '../lazyTable';
import type { StudyColumns } from '../columns';

/**
 * Voltage drop per conductor and cumulative from the source to every load,
 * by the effective impedance of the Chapter 9 Table 9 notes:
 * Z_eff = R·cos θ + X·sin θ (θ the power-factor angle of the load served,
 * lagging), R and X divided by the parallel sets, L one way. Each conductor is
 * taken on its own circuit (analyze/circuits.ts, from the loads' own
 * connection, loads.ts `loadConnection`): three-phase VD = √3·I·Z_eff·L/1000
 * over V_LL; a single-phase 2-wire line-to-neutral circuit VD =
 * 2·I·Z_eff·L/1000 over V_LN; a line-to-line circuit 2·I·Z_eff·L/1000 over
 * V_LL (the approximate voltage-drop formula of IEEE Std 141, Chapter 3, with
 * the Table 9 note's Z_eff; from memory). Linear: one pass load-to-source for
 * the real and reactive power, one pass over the conductors, one pass
 * source-to-load for the sums.
 *
 * The current in a conductor is what flows to the loads below it (unfactored),
 * from the real and reactive power of each load (its own circuit's
 * volt-amperes, loads.ts), so a feeder serving loads of several power factors
 * carries their combined power factor. Transformer losses and regulation are
 * not included: the total counts from the last source or transformer
 * secondary (stated in the report). The circuit figure counts from the last
 * overcurrent device, so a feeder and a branch circuit are judged separately
 * and add up in the total (percentages of their own voltages).
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
  /** Per node: real and reactive power at and below it along the supply tree, W and var (what the currents come from). */
  p: Float64Array;
  q: Float64Array;
  notes: string[];
}

/** What the voltage-drop study needs from the network: voltages, each conductor's circuit, the loads and the supply order. */
export interface VoltageDropInputs {
  order: Int32Array;
  count: number;
  /** Line-to-line voltage at each node (NaN when unknown). */
  voltsLL: Float64Array;
  /** The loads: each load's own circuit (volt-amperes) and the line-to-neutral voltage at each node. */
  loads: Pick<SystemLoads, 'loadCircuits' | 'voltsLN'>;
  /** Each conductor's circuit (analyze/circuits.ts): three-phase, line to neutral, line to line. */
  circuits: readonly Pick<ConductorCircuit, 'makeup' | 'system'>[];
  /** Each conductor's Chapter 9 Table 9 R and X, Ω per 1000 ft of one conductor (NaN when not known), as the fault study read them. */
  rOhmPerKft: Float64Array;
  xOhmPerKft: Float64Array;
  /** Supplying node and edge of each node (-1 for none). */
  parent: Int32Array;
  parentEdge: Int32Array;
}

const SQRT3 = Math.sqrt(3);

/**
 * Each conductor on its own circuit: three-phase √3 over V_LL; a 2-wire line-to-neutral circuit 2 over V_LN
 * (the grounded conductor carries the return); a 2-wire system's circuit 2 over its voltage; a line-to-line
 * or 3-wire single-phase circuit 2 over V_LL (balanced: the neutral carries no current).
 */
export function isThreePhase(inp: Pick<VoltageDropInputs, 'circuits'>, c: number): boolean {
  const kind = inp.circuits[c]!.makeup.kind;
  return kind === 'three-phase-4w' || kind === 'three-phase-3w';
}

function circuitVolts(inp: Pick<VoltageDropInputs, 'circuits' | 'voltsLL' | 'loads'>, c: number, from: number, three: boolean): number {
  const circuit = inp.circuits[c]!;
  return three ? inp.voltsLL[from]! : circuit.makeup.kind === 'two-wire' && circuit.system.arrangement !== 'single-2w' ? inp.loads.voltsLN[from]! : inp.voltsLL[from]!;
}

/**
 * Conductor `c`'s own drop, % of its circuit's `volts`, carrying `amps` at power factor `pf`; NaN without a length or Table 9 value.
 * Its length and sets are read from `cols` when given (a whole study), else from the conductor.
 */
function dropPct(g: Graph, inp: Pick<VoltageDropInputs, 'rOhmPerKft' | 'xOhmPerKft'>, c: number, amps: number, pf: number, three: boolean, volts: number, cols?: StudyColumns): number {
  const r = inp.rOhmPerKft[c]!;
  if (Number.isNaN(r)) return Number.NaN;
  let lengthFt: number;
  let sets: number;
  if (cols) {
    if (cols.noLength[c] === 1) return Number.NaN;
    lengthFt = cols.lengthFt[c]!;
    sets = cols.parallelSets[c]!;
  } else {
    const conductor = g.conductors[c]!;
    if (conductor.lengthFt === undefined) return Number.NaN;
    lengthFt = conductor.lengthFt;
    sets = conductor.parallelSets;
  }
  const zEff = r * pf + inp.xOhmPerKft[c]! * Math.sqrt(1 - pf * pf);
  const vd = ((three ? SQRT3 : 2) * amps * zEff * lengthFt) / 1000 / sets;
  return (100 * vd) / volts;
}

/** The sums at node `v`: what arrives adds its drop; what leaves a source or transformer starts the total again, and a circuit also starts at a device. */
function arriveAt(g: Graph, inp: Pick<VoltageDropInputs, 'parent' | 'parentEdge'>, pct: Float64Array, totalPct: Float64Array, circuitPct: Float64Array, v: number): void {
  const u = inp.parent[v]!;
  if (u < 0) {
    const kind = g.nodeKind[v]!;
    if (kind === KIND.utility || kind === KIND.generator) totalPct[v] = circuitPct[v] = 0;
    return;
  }
  const e = inp.parentEdge[v]!;
  const d = e >= 0 ? pct[e]! : 0;
  const up = g.nodeKind[u]!;
  const newSystem = up === KIND.utility || up === KIND.generator || up === KIND.transformer;
  totalPct[v] = (newSystem ? 0 : totalPct[u]!) + d;
  circuitPct[v] = (newSystem || up === KIND.breaker || up === KIND.fuse ? 0 : circuitPct[u]!) + d;
}

/**
 * Conductor `c` again after its length, size, material, sets or wiring changed (its circuit and current
 * do not; see analyze/incremental.ts): its drop, then the sums at the nodes `below` it (the nodes
 * supplied through it on the supply tree, each after its supply, its end first). The fault study has
 * re-read its Table 9 values into `inp.rOhmPerKft`/`xOhmPerKft` first. Marks `c` in `conductorMoved`,
 * and each node whose sums changed in `nodeMoved` with the conductor into it.
 */
export function redropBelow(g: Graph, drop: VoltageDropStudy, inp: VoltageDropInputs, c: number, below: readonly number[], conductorMoved: Uint8Array, nodeMoved: Uint8Array): void {
  settleTables(drop);
  const three = drop.singlePhase[c] === 0;
  const volts = circuitVolts(inp, c, g.conductorFrom[c]!, three);
  conductorMoved[c] = 1;
  if (!(volts > 0)) return;
  drop.pct[c] = dropPct(g, inp, c, drop.currentA[c]!, drop.powerFactor[c]!, three, volts);
  const { totalPct, circuitPct } = drop;
  for (const v of below) {
    const t = totalPct[v]!;
    const cp = circuitPct[v]!;
    arriveAt(g, inp, drop.pct, totalPct, circuitPct, v);
    if (Object.is(t, totalPct[v]) && Object.is(cp, circuitPct[v])) continue;
    nodeMoved[v] = 1;
    if (inp.parentEdge[v]! >= 0) conductorMoved[inp.parentEdge[v]!] = 1;
  }
}

/** The study over the whole network; `cols`, when given, are what it reads of the nodes and conductors (else each is read itself). */
export function studyVoltageDrop(g: Graph, inp: VoltageDropInputs, cols?: StudyColumns): VoltageDropStudy {
  const n = g.nodes.length;
  const m = g.conductors.length;
  const { order, count, parent, parentEdge } = inp;
  const { loadCircuits } = inp.loads;
  // Real and reactive power at and below each node, one pass load to source along the supply tree.
  const p = new Float64Array(n);
  const q = new Float64Array(n);
  let unknownLoad = false;
  for (let k = count - 1; k >= 0; k--) {
    const v = order[k]!;
    if (!addOwnPower(g, loadCircuits, p, q, v, cols)) unknownLoad = true;
    const u = parent[v]!;
    if (u >= 0) {
      p[u] = p[u]! + p[v]!;
      q[u] = q[u]! + q[v]!;
    }
  }

  const currentA = new Float64Array(m).fill(Number.NaN);
  const powerFactor = new Float64Array(m).fill(Number.NaN);
  const pct = new Float64Array(m).fill(Number.NaN);
  const singlePhase = new Uint8Array(m);
  const study = { currentA, powerFactor, pct, singlePhase, totalPct: new Float64Array(n).fill(Number.NaN), circuitPct: new Float64Array(n).fill(Number.NaN), p, q, notes: [] as string[] };
  for (let c = 0; c < m; c++) {
    const to = g.conductorTo[c]!;
    if (to < 0 || g.conductorFrom[c]! < 0 || parentEdge[to] !== c) continue;
    // Each conductor on its own circuit: three-phase √3 over V_LL; a 2-wire line-to-neutral circuit 2 over V_LN
    // (the grounded conductor carries the return); a 2-wire system's circuit 2 over its voltage; a line-to-line
    // or 3-wire single-phase circuit 2 over V_LL (balanced: the neutral carries no current).
    singlePhase[c] = isThreePhase(inp, c) ? 0 : 1;
    dropOf(g, inp, study, c, cols);
  }

  const { totalPct, circuitPct } = study;
  for (let k = 0; k < count; k++) arriveAt(g, inp, pct, totalPct, circuitPct, order[k]!);
  const notes = [
    "Voltage drop: Chapter 9 Table 9 effective impedance R·cos θ + X·sin θ at the power factor of the loads served (lagging), conductors at 75 °C; each conductor on its own circuit: three-phase √3·I·Z·L/1000 over the line-to-line voltage, a line-to-neutral circuit 2·I·Z·L/1000 over the line-to-neutral voltage, a line-to-line or single-phase 3-wire circuit 2·I·Z·L/1000 over the line-to-line voltage (balanced). Totals count from the source or transformer secondary; transformer regulation is not included.",
  ];
  if (unknownLoad) notes.push('A load without a known voltage adds nothing to the currents above it.');
  study.notes = notes;
  return study;
}

/** A load node's own real and reactive power added at `v`; false for a load without a known circuit. Its power factor from `cols` when given. */
function addOwnPower(g: Graph, loadCircuits: VoltageDropInputs['loads']['loadCircuits'], p: Float64Array, q: Float64Array, v: number, cols?: StudyColumns): boolean {
  if (g.nodeKind[v] !== KIND.load) return true;
  const lc = loadCircuits[v];
  if (!lc) return false;
  const pf = cols ? cols.powerFactor[v]! : (g.nodes[v] as NodeOfKind<'load'>).powerFactor;
  p[v] = p[v]! + lc.va * pf;
  q[v] = q[v]! + lc.va * Math.sqrt(1 - pf * pf);
  return true;
}

/** Conductor `c` on the supply tree: its current and power factor from what its load end draws, and its own drop. */
function dropOf(g: Graph, inp: VoltageDropInputs, drop: VoltageDropStudy, c: number, cols?: StudyColumns): void {
  const three = drop.singlePhase[c] === 0;
  const volts = circuitVolts(inp, c, g.conductorFrom[c]!, three);
  if (!(volts > 0)) return;
  const to = g.conductorTo[c]!;
  const pt = drop.p[to]!;
  const qt = drop.q[to]!;
  const s = Math.sqrt(pt * pt + qt * qt);
  const amps = s / ((three ? SQRT3 : 1) * volts);
  const pf = s > 0 ? pt / s : 1;
  drop.currentA[c] = amps;
  drop.powerFactor[c] = pf;
  drop.pct[c] = dropPct(g, inp, c, amps, pf, three, volts, cols);
}

/**
 * The drops again after the loads at and below the nodes of `path` changed (a supply path, load end
 * first, every node on the supply tree; see analyze/incremental.ts): the power at each of its nodes
 * summed as the whole study sums it (what a node supplies in reverse supply-to-load order, then its
 * own load), the current and drop of the conductor into each, then the sums at every node below whose
 * figures moved. Marks in `conductorMoved` each conductor whose row changed and in `nodeMoved` each
 * node whose sums changed (and every node of the path); lists them in `marked` when given.
 */
export function redropPath(g: Graph, drop: VoltageDropStudy, inp: VoltageDropInputs, path: readonly number[], conductorMoved: Uint8Array, nodeMoved: Uint8Array, marked?: { conductors: number[]; nodes: number[] }): void {
  settleTables(drop);
  const { parent, parentEdge, order, count } = inp;
  const pos = orderPositions(order, count);
  const { p, q, totalPct, circuitPct } = drop;
  for (const v of path) {
    const below: number[] = [];
    for (const e of g.outEdges[v]!) {
      const w = e >= 0 ? g.conductorTo[e]! : g.linkTo[-e - 1]!;
      if (w >= 0 && parent[w] === v && parentEdge[w] === e) below.push(w);
    }
    if (below.length > 1) below.sort((a, b) => pos[b]! - pos[a]!);
    p[v] = q[v] = 0;
    for (const w of below) {
      p[v] = p[v]! + p[w]!;
      q[v] = q[v]! + q[w]!;
    }
    addOwnPower(g, inp.loads.loadCircuits, p, q, v);
    nodeMoved[v] = 1;
    marked?.nodes.push(v);
    const e = parentEdge[v]!;
    if (parent[v]! >= 0 && e >= 0) {
      dropOf(g, inp, drop, e);
      conductorMoved[e] = 1;
      marked?.conductors.push(e);
    }
  }
  // The sums from the top of the path down the supply tree, each node after its supply, only below a node whose sums moved.
  const stack = [path[path.length - 1]!];
  while (stack.length > 0) {
    const v = stack.pop()!;
    const u = parent[v]!;
    const onPath = nodeMoved[v] === 1;
    const t = totalPct[v]!;
    const cp = circuitPct[v]!;
    arriveAt(g, inp, drop.pct, totalPct, circuitPct, v);
    if (!onPath && Object.is(t, totalPct[v]) && Object.is(cp, circuitPct[v])) continue;
    if (!onPath) {
      nodeMoved[v] = 1;
      marked?.nodes.push(v);
      if (u >= 0 && parentEdge[v]! >= 0) {
        conductorMoved[parentEdge[v]!] = 1;
        marked?.conductors.push(parentEdge[v]!);
      }
    }
    for (const e of g.outEdges[v]!) {
      const w = e >= 0 ? g.conductorTo[e]! : g.linkTo[-e - 1]!;
      if (w >= 0 && parent[w] === v && parentEdge[w] === e) stack.push(w);
    }
  }
}
