import type { NodeOfKind } from '../model/schema';
import { motorTableFlcA, type MotorType } from '../tables/motor';
import { edgeFrom, edgeTo, KIND, type Graph } from '../topology/graph';

/**
 * System voltage at every node (from its source, changed by transformers) and
 * the load downstream of every node.
 *
 * Each load draws its current at its own voltage: a three-phase load
 * VA / (√3·V_LL), a single-phase load VA / V across its own terminals (line to
 * neutral: 277 V on 480Y/277, 120 V on 208Y/120 and 120/240; line to line:
 * the system's V_LL). Loads add up as volt-amperes so that they carry across
 * transformers (losses ignored). A feeder's current is its volt-amperes over
 * its own phases taken as balanced (√3·V_LL three-phase, V_LL single-phase),
 * and never less than the line current of the largest single load it serves
 * (a lone 277 V load puts all its current on one phase). A single-phase
 * transformer draws its primary current on its own phases: VA / V_primary.
 *
 * Unknown stays unknown: a node whose supplies disagree on voltage has none,
 * a load below it has no current, and every total above it is unknown (never
 * NaN, which would read as a failed comparison).
 */
export interface SystemLoads {
  /** Line-to-line voltage available at the node's load side; NaN when unknown. */
  voltsLL: Float64Array;
  phases: Uint8Array;
  /** Line-to-neutral voltage of the system at the node; NaN where the system has no neutral. */
  voltsLN: Float64Array;
  /** Noncontinuous and continuous VA at and below each node. */
  vaNoncontinuous: Float64Array;
  vaContinuous: Float64Array;
  /** VA of the largest motor at and below each node: 430.24 adds 25 % of its full-load current. */
  largestMotorVA: Float64Array;
  /** Line current of the largest single load at and below each node, in the supply-side system of the node (A), as it flows and as calculated. */
  singleA: Float64Array;
  singleCalcA: Float64Array;
  /** 1 where some load at or below the node has no known current: the totals there are unknown. */
  unknown: Uint8Array;
  /** The one load at or below each node when there is exactly one, else -1. */
  onlyLoad: Int32Array;
  /** Each load node's own circuit, or null (not a load, or its current is unknown). */
  loadCircuits: (LoadCircuit | null)[];
  /** 1 where the node's own circuit is a motor's or an HVAC unit's: what a run's facts read of it, without reaching the circuit of every other load. */
  ownArticle: Uint8Array;
}

/** One load's own circuit: the voltage across it, its line current, and how they were taken. */
export interface LoadCircuit {
  volts: number;
  phases: 1 | 3;
  connection: 'three-phase' | 'line-to-neutral' | 'line-to-line';
  va: number;
  /** Line current drawn, A (for a motor its table or nameplate full-load current; for HVAC its MCA). */
  lineA: number;
  continuous: boolean;
  motor: { fullLoadA: number; source: string; hp: number | null; motorType: MotorType } | null;
  hvac: { mcaA: number; mopA: number } | null;
  /** How the current was taken, for the working. */
  basis: string;
}

export function rollUpLoads(g: Graph, order: Int32Array, count: number): SystemLoads {
  const n = g.nodes.length;
  const voltsLL = new Float64Array(n).fill(Number.NaN);
  const voltsLN = new Float64Array(n).fill(Number.NaN);
  const phases = new Uint8Array(n);
  for (let k = 0; k < count; k++) {
    const v = order[k]!;
    const kind = g.nodeKind[v]!;
    if (kind === KIND.utility || kind === KIND.generator) {
      const node = g.nodes[v] as NodeOfKind<'utility' | 'generator'>;
      voltsLL[v] = node.voltsLL;
      phases[v] = node.phases;
      // A source is taken as having its neutral: 480Y/277, 208Y/120, 120/240 (common practice).
      voltsLN[v] = node.phases === 3 ? Math.round(node.voltsLL / Math.sqrt(3)) : node.voltsLL / 2;
    } else if (kind === KIND.transformer) {
      const node = g.nodes[v] as NodeOfKind<'transformer'>;
      voltsLL[v] = node.secondaryVoltsLL;
      phases[v] = node.phases;
      voltsLN[v] = secondaryNeutralV(node);
    } else systemFromSupplies(g, { voltsLL, phases, voltsLN }, v);
  }
  const vaNoncontinuous = new Float64Array(n);
  const vaContinuous = new Float64Array(n);
  const largestMotorVA = new Float64Array(n);
  const singleA = new Float64Array(n);
  const singleCalcA = new Float64Array(n);
  const unknown = new Uint8Array(n);
  const onlyLoad = new Int32Array(n).fill(-1);
  const loadCount = new Uint32Array(n);
  const loadCircuits: (LoadCircuit | null)[] = new Array(n).fill(null);
  const s: SystemLoads = { voltsLL, phases, voltsLN, vaNoncontinuous, vaContinuous, largestMotorVA, singleA, singleCalcA, unknown, onlyLoad, loadCircuits, ownArticle: new Uint8Array(n) };
  for (let k = count - 1; k >= 0; k--) {
    const v = order[k]!;
    if (g.nodeKind[v] === KIND.load) {
      loadCount[v] = 1;
      onlyLoad[v] = v;
    }
    const outs = g.outEdges[v]!;
    for (let i = 0; i < outs.length; i++) {
      const e = outs[i]!;
      const w = edgeTo(g, e);
      loadCount[v] = loadCount[v]! + loadCount[w]!;
      if (loadCount[w] === 1 && loadCount[v] === 1) onlyLoad[v] = onlyLoad[w]!;
    }
    if (loadCount[v] !== 1) onlyLoad[v] = -1;
    rollUpAt(g, s, v);
  }
  return s;
}

/**
 * The system at node `v` (not a source or transformer) from its supplies, theirs known: several that agree
 * give it, supplies that disagree leave it unknown (NaN). Also how incremental.ts places a node added to the drawing.
 */
export function systemFromSupplies(g: Graph, s: Pick<SystemLoads, 'voltsLL' | 'phases' | 'voltsLN'>, v: number): void {
  const { voltsLL, phases, voltsLN } = s;
  let first = true;
  const ins = g.inEdges[v]!;
  for (let i = 0; i < ins.length; i++) {
    const e = ins[i]!;
    const u = edgeFrom(g, e);
    const ok = u >= 0 && voltsLL[u]! > 0;
    if (first && ok) {
      voltsLL[v] = voltsLL[u]!;
      phases[v] = phases[u]!;
      voltsLN[v] = voltsLN[u]!;
    } else if (!ok || voltsLL[u] !== voltsLL[v] || phases[u] !== phases[v]) {
      voltsLL[v] = Number.NaN;
      voltsLN[v] = Number.NaN;
      phases[v] = 0;
      break;
    }
    first = false;
  }
}

/**
 * Node `v`'s totals from its own load and the totals of what it supplies (one step of the roll-up,
 * load to source; what `v` supplies is rolled up first). Also how an incremental re-check
 * (analyze/incremental.ts) re-rolls the supply path of an edited load: the same sums in the same order.
 */
export function rollUpAt(g: Graph, s: SystemLoads, v: number): void {
  const { vaNoncontinuous, vaContinuous, largestMotorVA, singleA, singleCalcA, unknown } = s;
  const kind = g.nodeKind[v]!;
  vaNoncontinuous[v] = vaContinuous[v] = largestMotorVA[v] = singleA[v] = singleCalcA[v] = 0;
  unknown[v] = 0;
  if (kind === KIND.load) {
    const c = loadCircuit(g.nodes[v] as NodeOfKind<'load'>, s.voltsLL[v]!, s.phases[v]!, s.voltsLN[v]!);
    s.loadCircuits[v] = c;
    s.ownArticle[v] = c !== null && (c.motor !== null || c.hvac !== null) ? 1 : 0;
    if (c === null) unknown[v] = 1;
    else {
      if (c.continuous) vaContinuous[v] = c.va;
      else vaNoncontinuous[v] = c.va;
      if (c.motor) largestMotorVA[v] = c.va;
      singleA[v] = c.lineA;
      singleCalcA[v] = c.lineA * (c.continuous || c.motor ? 1.25 : 1);
    }
  }
  const outs = g.outEdges[v]!;
  for (let i = 0; i < outs.length; i++) {
    const w = edgeTo(g, outs[i]!);
    vaNoncontinuous[v] = vaNoncontinuous[v]! + vaNoncontinuous[w]!;
    vaContinuous[v] = vaContinuous[v]! + vaContinuous[w]!;
    if (largestMotorVA[w]! > largestMotorVA[v]!) largestMotorVA[v] = largestMotorVA[w]!;
    if (singleA[w]! > singleA[v]!) singleA[v] = singleA[w]!;
    if (singleCalcA[w]! > singleCalcA[v]!) singleCalcA[v] = singleCalcA[w]!;
    unknown[v] = unknown[v]! | unknown[w]!;
  }
  if (kind === KIND.transformer) toPrimary(s, g.nodes[v] as NodeOfKind<'transformer'>, v);
}

/**
 * The largest-single-load currents at a transformer, seen from its primary.
 * A single-phase transformer is itself one load on its primary: VA / Vp.
 * Through a three-phase transformer a single-phase secondary load of S VA
 * draws at least S / Vp_LL on a primary line (a line-to-neutral load of a
 * delta-wye unit exactly that), so the secondary current scales by
 * Vs_LN / Vp_LL, taken as Vs / (√3·Vp): never more than flows.
 */
function toPrimary(s: SystemLoads, t: NodeOfKind<'transformer'>, v: number): void {
  const { vaNoncontinuous, vaContinuous, largestMotorVA, singleA, singleCalcA } = s;
  if (t.phases === 1) {
    singleA[v] = (vaNoncontinuous[v]! + vaContinuous[v]!) / t.primaryVoltsLL;
    singleCalcA[v] = (vaNoncontinuous[v]! + 1.25 * vaContinuous[v]! + 0.25 * largestMotorVA[v]!) / t.primaryVoltsLL;
  } else {
    const ratio = t.secondaryVoltsLL / (Math.sqrt(3) * t.primaryVoltsLL);
    singleA[v] = singleA[v]! * ratio;
    singleCalcA[v] = singleCalcA[v]! * ratio;
  }
}

/** Line-to-neutral voltage of a transformer's secondary, NaN where the connection has no neutral. */
function secondaryNeutralV(t: NodeOfKind<'transformer'>): number {
  switch (t.connection) {
    case 'delta-wye':
    case 'wye-wye':
      return Math.round(t.secondaryVoltsLL / Math.sqrt(3));
    case 'delta-delta-4w':
    case 'single-phase-3w':
      // 120/240 V: the centre tap; on a four-wire delta the two phases either side of it.
      return t.secondaryVoltsLL / 2;
    default:
      return Number.NaN;
  }
}

const round2 = (x: number): number => Math.round(x * 100) / 100;

/** How a load is connected to the system it sits on: the voltage across it and how that was decided. */
export interface LoadConnection {
  volts: number;
  phases: 1 | 3;
  connection: LoadCircuit['connection'];
  basis: string;
}

/**
 * The voltage across a load and its connection, or null when the system
 * cannot give it (no system voltage, a 3-phase load on a single-phase
 * system, a line-to-neutral load on a system without a neutral). The load
 * calculation, the neutral of the circuit and its voltage drop all read this.
 */
export function loadConnection(node: NodeOfKind<'load'>, sysV: number, sysPhases: number, sysLN: number): LoadConnection | null {
  const decided = decideConnection(node, sysV, sysPhases, sysLN);
  return decided === null ? null : new Connection(decided, node, sysV, sysLN);
}

/** How the connection was decided: as drawn, or (not stated) by what the load is given in. */
type Decided = LoadCircuit['connection'] | 'unstated-amperes' | 'unstated-kva';

/** A load decided line to neutral (drawn so, or a kVA load whose connection is not stated) sees sysLN; every other sees sysV. */
function isLineToNeutral(decided: Decided): boolean {
  return decided === 'line-to-neutral' || decided === 'unstated-kva';
}
function voltsAcross(decided: Decided, sysV: number, sysLN: number): number {
  return isLineToNeutral(decided) ? sysLN : sysV;
}

/** loadConnection's decision alone (nothing built): null when the system cannot give the voltage across the load. */
function decideConnection(node: NodeOfKind<'load'>, sysV: number, sysPhases: number, sysLN: number): Decided | null {
  if (!(sysV > 0)) return null;
  const ph: 1 | 3 = node.phases ?? (sysPhases === 1 ? 1 : 3);
  if (ph === 3 && sysPhases === 1) return null;
  if (ph === 3) return 'three-phase';
  if (node.connection === 'line-to-neutral') return sysLN > 0 ? 'line-to-neutral' : null;
  if (node.connection === 'line-to-line' || !(sysLN > 0)) return 'line-to-line';
  // Connection not stated: a load given in amperes counts its volt-amperes at the higher voltage,
  // a load given in kVA draws its current at the lower voltage.
  return node.currentA !== undefined ? 'unstated-amperes' : 'unstated-kva';
}

/**
 * A load's connection. Its `basis` (the working in words) is written on first read: the load
 * calculation and the circuit count each ask for every load's connection, and formatting the
 * numbers of every load of a campus cost more than the roll-up itself.
 */
class Connection implements LoadConnection {
  readonly volts: number;
  readonly phases: 1 | 3;
  readonly connection: LoadCircuit['connection'];
  readonly #decided: Decided;
  readonly #node: NodeOfKind<'load'>;
  readonly #sysV: number;
  readonly #sysLN: number;
  constructor(decided: Decided, node: NodeOfKind<'load'>, sysV: number, sysLN: number) {
    this.volts = voltsAcross(decided, sysV, sysLN);
    this.phases = decided === 'three-phase' ? 3 : 1;
    this.connection = decided === 'three-phase' ? 'three-phase' : isLineToNeutral(decided) ? 'line-to-neutral' : 'line-to-line';
    this.#decided = decided;
    this.#node = node;
    this.#sysV = sysV;
    this.#sysLN = sysLN;
  }
  get basis(): string {
    const sysV = this.#sysV;
    const sysLN = this.#sysLN;
    switch (this.#decided) {
      case 'three-phase':
        return `three-phase at ${sysV} V: VA / (√3 × ${sysV} V)`;
      case 'line-to-neutral':
        return `single-phase line to neutral at ${sysLN} V: VA / ${sysLN} V`;
      case 'line-to-line':
        return `single-phase line to line at ${sysV} V: VA / ${sysV} V`;
      case 'unstated-amperes':
        return `single-phase, connection not stated: ${this.#node.currentA} A taken at ${sysV} V line to line, the larger volt-amperes`;
      case 'unstated-kva':
        return `single-phase, connection not stated: taken line to neutral at ${sysLN} V, the larger current`;
    }
  }
}

/**
 * A load's own circuit on the system it sits on, or null when its current
 * cannot be known (no connection, see loadConnection, or a motor the tables
 * do not list and without a nameplate).
 */
export function loadCircuit(node: NodeOfKind<'load'>, sysV: number, sysPhases: number, sysLN: number): LoadCircuit | null {
  const decided = decideConnection(node, sysV, sysPhases, sysLN);
  if (decided === null) return null;
  const volts = voltsAcross(decided, sysV, sysLN);
  const phases = decided === 'three-phase' ? 3 : 1;
  const k = phases === 3 ? Math.sqrt(3) * volts : volts;
  if (node.hvac) {
    // The nameplate MCA already holds 125 % of the largest motor-compressor (440.33): counted as it stands, noncontinuous.
    const lineA = node.hvac.mcaA;
    return new Circuit(decided, node, sysV, sysLN, lineA * k, lineA, false, null, { ...node.hvac });
  }
  if (node.motor) {
    const m = node.motor;
    const table = m.hp === undefined ? null : motorTableFlcA(m.hp, volts, phases);
    let fullLoadA: number;
    let source: string;
    if (table) {
      fullLoadA = table.flcA;
      source = `${table.table}, ${formatHp(m.hp!)} hp, ${table.columnV} V column`;
    } else if (m.fullLoadA !== undefined) {
      fullLoadA = m.fullLoadA;
      source = m.hp === undefined ? 'nameplate full-load current' : `nameplate full-load current (${formatHp(m.hp)} hp at ${volts} V is not in the tables)`;
    } else return null;
    return new Circuit(decided, node, sysV, sysLN, fullLoadA * k, fullLoadA, false, { fullLoadA, source, hp: m.hp ?? null, motorType: m.motorType ?? 'induction' }, null);
  }
  if (node.kva !== undefined) {
    const va = node.kva * 1000;
    return new Circuit(decided, node, sysV, sysLN, va, round2(va / k), node.continuous, null, null);
  }
  if (node.currentA !== undefined) return new Circuit(decided, node, sysV, sysLN, node.currentA * k, node.currentA, node.continuous, null, null);
  return null;
}

/** A load's circuit: its connection (one object, not two) and its current; the `basis` text is written on first read. */
class Circuit extends Connection implements LoadCircuit {
  readonly va: number;
  readonly lineA: number;
  readonly continuous: boolean;
  readonly motor: LoadCircuit['motor'];
  readonly hvac: LoadCircuit['hvac'];
  readonly #node: NodeOfKind<'load'>;
  constructor(decided: Decided, node: NodeOfKind<'load'>, sysV: number, sysLN: number, va: number, lineA: number, continuous: boolean, motor: LoadCircuit['motor'], hvac: LoadCircuit['hvac']) {
    super(decided, node, sysV, sysLN);
    this.va = va;
    this.lineA = lineA;
    this.continuous = continuous;
    this.motor = motor;
    this.hvac = hvac;
    this.#node = node;
  }
  override get basis(): string {
    const basis = super.basis;
    if (this.hvac) return `${basis}; HVAC equipment at its nameplate MCA, ${this.lineA} A`;
    if (this.motor) return `${basis}; motor full-load current ${this.motor.fullLoadA} A from ${this.motor.source} (430.6(A))`;
    if (this.#node.kva === undefined && this.#node.currentA !== undefined) return `${this.#node.currentA} A; ${basis}`;
    return basis;
  }
}

function formatHp(hp: number): string {
  const fractions: Record<string, string> = { '0.1667': '1/6', '0.25': '1/4', '0.3333': '1/3', '0.5': '1/2', '0.75': '3/4', '1.5': '1-1/2', '7.5': '7-1/2' };
  return fractions[String(Math.round(hp * 10000) / 10000)] ?? String(hp);
}

/** The load a conductor from `fromNode` into `toNode` carries (written into `into` when given). Null when it cannot be known. */
export interface ConductorLoad {
  /** What flows: continuous plus noncontinuous, A. */
  flowingA: number;
  /** 1.25 × continuous + noncontinuous + 25 % of the largest motor (215.2(A)(1), 210.19(A)(1), 430.24), A. */
  calculatedA: number;
}

export function conductorLoadA(s: SystemLoads, fromNode: number, toNode: number, into?: ConductorLoad): ConductorLoad | null {
  const v = s.voltsLL[fromNode]!;
  if (!(v > 0) || toNode < 0 || s.unknown[toNode]) return null;
  const k = s.phases[fromNode] === 3 ? Math.sqrt(3) * v : v;
  const non = s.vaNoncontinuous[toNode]!;
  const cont = s.vaContinuous[toNode]!;
  const motor = s.largestMotorVA[toNode]!;
  const flowingA = Math.max((non + cont) / k, s.singleA[toNode]!);
  const calculatedA = Math.max((non + 1.25 * cont + 0.25 * motor) / k, s.singleCalcA[toNode]!);
  if (!Number.isFinite(flowingA) || !Number.isFinite(calculatedA)) return null;
  if (!into) return { flowingA: round2(flowingA), calculatedA: round2(calculatedA) };
  into.flowingA = round2(flowingA);
  into.calculatedA = round2(calculatedA);
  return into;
}
