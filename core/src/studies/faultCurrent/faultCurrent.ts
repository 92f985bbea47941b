import type { Conductor, EquipmentNode, NodeOfKind } from '../../model/schema';
import { racewayColumn, table9ROhmPerKft, table9XOhmPerKft } from '../../tables/chapter9Table9';
import {
  TYPICAL_GENERATOR_XDPP_PU,
  TYPICAL_GENERATOR_X_OVER_R,
  TYPICAL_UTILITY_X_OVER_R,
  typicalTransformerXOverR,
} from '../../tables/sourceImpedance';
import { edgeFrom, KIND, type Graph } from '../../topology/graph';
import { settleTables } from '../lazyTable';
import { studyColumns, type StudyColumns } from '../columns';

const UTILITY = KIND.utility;
const GENERATOR = KIND.generator;
const TRANSFORMER = KIND.transformer;
const LOAD = KIND.load;

/**
 * Available short-circuit current at every node: the ohmic method with
 * complex impedances (IEEE Std 141 / IEEE Std 551), one pass in supply-to-load
 * order, so linear in the size of the drawing.
 *
 * Each node keeps the impedance from its source to itself, R + jX in ohms at
 * the node's own voltage: on a three-phase system the impedance of one phase
 * (I = V_LL / (√3·|Z|)), on a single-phase system the loop out and back
 * (I = V / |Z|). Crossing a transformer refers the primary impedance to the
 * secondary by (Vs/Vp)²; a single-phase transformer or load on a three-phase
 * system sees the line-to-line loop, twice the phase impedance.
 *
 * - Utility: Z = V_LL / (√3·I_sc) at the given X/R, or an infinite bus (Z = 0)
 *   when the drawing gives no available fault current, which the working says.
 * - Transformer: Z = %Z/100 · Vs²/S, split by its X/R (or a typical X/R by kVA).
 * - Generator: X = X″d · V²/S (or a typical X″d), R = X / (X/R).
 * - Conductor: Chapter 9 Table 9 R and X per 1000 ft for its material, size and
 *   raceway, × length / 1000 / parallel sets. Conductors at 75 °C as tabulated.
 *   A conductor without a length or a Table 9 value counts as zero impedance,
 *   so everything below it is an upper bound, marked as such.
 * - Motor contribution: loads with `faultContributionXFlc` add that multiple of
 *   their full-load current at every node behind the same transformer or
 *   source, undiminished by the conductors between (conservative, stated).
 *
 * The result is the three-phase bolted fault on three-phase systems and the
 * line-to-line bolted fault on single-phase systems.
 */
export interface FaultStudy {
  /** Symmetrical RMS fault current, kA, including motor contribution; NaN when unknown. */
  kA: Float64Array;
  /** X/R at the point; NaN when unknown, Infinity for a purely reactive source path. */
  xOverR: Float64Array;
  /** R and X from the source to the node, ohms at the node's voltage (phase or loop, see `loop`). */
  r: Float64Array;
  x: Float64Array;
  /** 1 where R, X are a single-phase loop impedance; 0 for a three-phase phase impedance. */
  loop: Uint8Array;
  voltsLL: Float64Array;
  /** Motor contribution included in kA, kA. */
  motorKA: Float64Array;
  /** Line-to-ground (line-to-neutral) bolted fault, kA, where the data allows; NaN elsewhere. */
  lineToGroundKA: Float64Array;
  /** 1 when an impedance below the source was missing and taken as zero: kA is an upper bound. */
  upperBound: Uint8Array;
  /** Why kA is unknown at a node; '' when known. */
  unknownWhy: string[];
  /** The node supplying each node (-1 for a source or an unreachable node) and the edge between. */
  parent: Int32Array;
  parentEdge: Int32Array;
  /** The element added at each node: R and X in ohms at the node's voltage (the working text is built on demand). */
  stepR: Float64Array;
  stepX: Float64Array;
  /** The source or transformer whose zone the node lies in (-1 when none). */
  zone: Int32Array;
  /** Motor contribution of each source or transformer zone (indexed by its node), A: summed once, added everywhere in the zone. */
  zoneMotorA: Float64Array;
  /** Per conductor that supplies a node: Chapter 9 Table 9 R and X of one conductor, Ω/1000 ft; NaN when not read or not known. */
  rOhmPerKft: Float64Array;
  xOhmPerKft: Float64Array;
  /** Statements of method and defaults used, once each. */
  notes: string[];
}

const SQRT3 = Math.sqrt(3);

/** The notes of a conductor counted as zero impedance: without a size, and without a length or a Table 9 value. */
const NO_SIZE_NOTE = 'A conductor without a size has no known impedance and counts as zero: the fault current below it is an upper bound ("at most"); enter the size for the value.';
const NO_IMPEDANCE_NOTE = 'A conductor without a length or a Chapter 9 Table 9 value counts as zero impedance: the fault current below it is an upper bound ("at most").';

/** The three-phase (or single-phase line-to-line) bolted fault at every node; see FaultStudy. `cols` are what it reads of the nodes and conductors. */
export function studyFaultCurrent(g: Graph, order: Int32Array, count: number, cols: StudyColumns = studyColumns(g)): FaultStudy {
  const n = g.nodes.length;
  const r = new Float64Array(n).fill(Number.NaN);
  const x = new Float64Array(n).fill(Number.NaN);
  const loop = new Uint8Array(n);
  const voltsLL = new Float64Array(n).fill(Number.NaN);
  const upperBound = new Uint8Array(n);
  // 1 while the path runs from an infinite bus without a transformer yet to limit it.
  const infinite = new Uint8Array(n);
  // 1 at a transformer and at what bus links alone connect to it (its terminals).
  const atTerminals = new Uint8Array(n);
  const unknownWhy: string[] = new Array<string>(n).fill('');
  const parent = new Int32Array(n).fill(-1);
  const parentEdge = new Int32Array(n).fill(0);
  const stepR = new Float64Array(n);
  const stepX = new Float64Array(n);
  const zone = new Int32Array(n).fill(-1);
  const rOhmPerKft = new Float64Array(g.conductors.length).fill(Number.NaN);
  const xOhmPerKft = new Float64Array(g.conductors.length).fill(Number.NaN);
  const notes = new Set<string>();
  const steps: Impedances = { r, x, loop, stepR, stepX, rOhmPerKft, xOhmPerKft };

  for (let k = 0; k < count; k++) {
    const v = order[k]!;
    const kind = g.nodeKind[v]!;
    if (kind === UTILITY || kind === GENERATOR) {
      const node = g.nodes[v] as NodeOfKind<'utility' | 'generator'>;
      const s = sourceImpedance(node);
      voltsLL[v] = node.voltsLL;
      loop[v] = node.phases === 1 ? 1 : 0;
      zone[v] = v;
      r[v] = stepR[v] = s.r;
      x[v] = stepX[v] = s.x;
      if (node.kind === 'utility') {
        if (node.availableFaultKA === undefined) infinite[v] = 1;
        else if (node.xOverR === undefined) notes.add(`Utility X/R not given: ${TYPICAL_UTILITY_X_OVER_R} used (common practice).`);
      } else {
        if (node.subtransientReactancePu === undefined) notes.add(`Generator X″d not given: ${TYPICAL_GENERATOR_XDPP_PU} per unit used (common practice, low end of the typical 0.10–0.25).`);
        if (node.xOverR === undefined) notes.add(`Generator X/R not given: ${TYPICAL_GENERATOR_X_OVER_R} used (common practice).`);
      }
      continue;
    }
    const ins = g.inEdges[v]!;
    if (ins.length !== 1) {
      const id = g.nodes[v]!.id;
      unknownWhy[v] = ins.length === 0 ? `nothing supplies ${id}` : `${id} is fed from ${ins.length} supplies`;
      continue;
    }
    const e = ins[0]!;
    const u = edgeFrom(g, e);
    if (u < 0) continue;
    parent[v] = u;
    parentEdge[v] = e;
    zone[v] = zone[u]!;
    upperBound[v] = upperBound[u]!;
    infinite[v] = infinite[u]!;
    unknownWhy[v] = unknownWhy[u]!;
    atTerminals[v] = e < 0 ? atTerminals[u]! : 0;
    // Only a single-phase transformer or load starts a single-phase loop.
    const isLoop = (kind === TRANSFORMER || kind === LOAD) && cols.singlePhase[v] === 1 ? 1 : loop[u]!;
    loop[v] = isLoop;
    voltsLL[v] = voltsLL[u]!;
    let known = true;
    if (e >= 0) {
      // Its Table 9 values; without them or a length it counts as zero impedance.
      xOhmPerKft[e] = cols.xOhmPerKft[e]!;
      if (Number.isNaN((rOhmPerKft[e] = cols.rOhmPerKft[e]!)) || cols.noLength[e] === 1) {
        known = false;
        upperBound[v] = 1;
        notes.add(cols.noSize[e] === 1 ? NO_SIZE_NOTE : NO_IMPEDANCE_NOTE);
      }
    }
    const t = impedanceAt(g, steps, v, u, e, known, known ? cols.lengthFt[e]! : 0, known ? cols.parallelSets[e]! : 1);
    if (kind === TRANSFORMER) {
      const node = g.nodes[v] as NodeOfKind<'transformer'>;
      voltsLL[v] = node.secondaryVoltsLL;
      zone[v] = v;
      atTerminals[v] = 1;
      if (!t) {
        unknownWhy[v] = `transformer ${node.id} has no impedance %Z`;
      } else {
        if (node.xOverR === undefined) notes.add('Transformer X/R not given: a typical value by kVA used (common practice, IEEE Std 141 typical values).');
        if (infinite[v]) notes.add('A utility without an available fault current is taken as an infinite bus: the transformer impedance alone limits the fault (conservative).');
        infinite[v] = 0;
      }
    }
  }

  // Motor contribution by zone: summed once, then added everywhere in the zone.
  const zoneMotorA = new Float64Array(n);
  for (let v = 0; v < n; v++) {
    // Only a load's node object is read here.
    if (g.nodeKind[v] !== LOAD || zone[v]! < 0 || cols.motorGiven[v] !== 1) continue;
    const node = g.nodes[v] as NodeOfKind<'load'>;
    if (node.faultContributionXFlc === undefined) continue;
    const flc = loadFullLoadA(node, voltsLL[v]!, loop[v] ? 1 : 3);
    if (!Number.isFinite(flc)) continue;
    zoneMotorA[zone[v]!] = zoneMotorA[zone[v]!]! + node.faultContributionXFlc * flc;
    notes.add("Motor contribution: the stated multiple of each marked load's full-load current, added at every point behind the same transformer or source without reduction by the conductors between (conservative).");
  }

  const kA = new Float64Array(n).fill(Number.NaN);
  const xOverR = new Float64Array(n).fill(Number.NaN);
  const motorKA = new Float64Array(n);
  const lineToGroundKA = new Float64Array(n).fill(Number.NaN);
  const study: FaultStudy = { kA, xOverR, r, x, loop, voltsLL, motorKA, lineToGroundKA, upperBound, unknownWhy, parent, parentEdge, stepR, stepX, zone, zoneMotorA, rOhmPerKft, xOhmPerKft, notes: [] };
  for (let v = 0; v < n; v++) {
    if (!unknownWhy[v] && infinite[v]) unknownWhy[v] = infiniteBusWhy(g.nodes[v]!.id);
    if (!unknownWhy[v] && Number.isNaN(r[v]!)) unknownWhy[v] = notReachedWhy(g.nodes[v]!.id);
    if (!unknownWhy[v]) figuresAt(g, study, v, atTerminals[v] === 1);
  }
  let lineToGround = false;
  for (let v = 0; v < n && !lineToGround; v++) lineToGround = !Number.isNaN(lineToGroundKA[v]!);
  if (lineToGround)
    notes.add('Line-to-ground: computed only at the terminals of a grounded-wye transformer secondary (delta primary: zero-sequence impedance taken equal to positive-sequence, so I_LG = I_3φ) and of a center-tapped single-phase secondary (line to neutral about 1.5 × line to line), common practice; elsewhere the return path is not in the drawing.');
  study.notes = [...notes];
  return study;
}

/** Why the fault current at node `id` is unknown: an infinite bus ahead with no transformer; no source reached. */
const infiniteBusWhy = (id: string) => `the source ahead of ${id} has no available fault current (infinite bus) and no transformer limits it; enter availableFaultKA`;
const notReachedWhy = (id: string) => `${id} is not reached from a source`;

/** kA, X/R, motor contribution and (at a transformer's terminals) line-to-ground at node `v`, from its R and X. */
function figuresAt(g: Graph, f: FaultStudy, v: number, atTerminals: boolean): void {
  const zone = f.zone[v]!;
  const z = magnitude(f.r[v]!, f.x[v]!);
  const sym = f.voltsLL[v]! / ((f.loop[v] ? 1 : SQRT3) * z);
  const m = zone >= 0 ? f.zoneMotorA[zone]! : 0;
  f.motorKA[v] = m / 1000;
  f.kA[v] = (sym + m) / 1000;
  f.xOverR[v] = f.r[v]! > 0 ? f.x[v]! / f.r[v]! : Number.POSITIVE_INFINITY;
  if (atTerminals && zone >= 0) {
    const t = g.nodes[zone]!;
    const lg = t.kind !== 'transformer' ? 0 : t.connection === 'delta-wye' ? 1 : t.connection === 'single-phase-3w' ? 1.5 : 0;
    if (lg > 0) f.lineToGroundKA[v] = (lg * sym) / 1000;
  }
}

/**
 * |R + jX| = √(R² + X²), each part scaled by the larger, in the steps of the compensated (Kahan) sum
 * V8's Math.hypot uses, which for two terms is one plain addition (the first term leaves no
 * compensation): so the same value to the last bit as Math.hypot of the V8 engine the CLI and the editor
 * run on (checked against it on random pairs from 1e-20 to 1e20, test/core/studies/faultCurrent.test.ts),
 * without the argument list Math.hypot builds on every call, at every node of a large drawing.
 */
export function magnitude(r: number, x: number): number {
  const a = Math.abs(r);
  const b = Math.abs(x);
  if (a === Number.POSITIVE_INFINITY || b === Number.POSITIVE_INFINITY) return Number.POSITIVE_INFINITY;
  if (Number.isNaN(a) || Number.isNaN(b)) return Number.NaN;
  const max = a > b ? a : b;
  if (max === 0) return 0;
  const na = a / max;
  const nb = b / max;
  return Math.sqrt(na * na + nb * nb) * max;
}

/** The supply side's R or X as a node sees it: doubled where a single-phase loop starts on a three-phase system. */
function seenFrom(ohms: number, isLoop: number, parentLoop: number): number {
  return isLoop && !parentLoop ? ohms * 2 : ohms;
}

/** Reads conductor `e`'s Table 9 R and X into the study; true when it has them and a length (else it counts as zero impedance). */
function readConductor(c: Conductor, e: number, rOhmPerKft: Float64Array, xOhmPerKft: Float64Array): boolean {
  const column = racewayColumn(c.wiring);
  // No size: no Table 9 row, like a size the table lacks (NaN); the voltage-drop study reads the same NaN as unknown.
  const rc = (rOhmPerKft[e] = c.size === undefined ? Number.NaN : table9ROhmPerKft(c.material, c.size, column));
  xOhmPerKft[e] = c.size === undefined ? Number.NaN : table9XOhmPerKft(c.size, column);
  return !Number.isNaN(rc) && c.lengthFt !== undefined;
}

/** True when a conductor has a length and a Chapter 9 Table 9 value (one without counts as zero impedance and adds a note). */
export function hasImpedance(c: Conductor): boolean {
  return c.lengthFt !== undefined && c.size !== undefined && !Number.isNaN(table9ROhmPerKft(c.material, c.size, racewayColumn(c.wiring)));
}

/** What the step from a node's supply to the node reads and writes: R and X so far, the loop flag, the steps, the conductors' Table 9 values. */
type Impedances = Pick<FaultStudy, 'r' | 'x' | 'loop' | 'stepR' | 'stepX' | 'rOhmPerKft' | 'xOhmPerKft'>;

/**
 * R and X at node `v` (its loop flag set) from its supply `u` through edge `e`: the supply side as
 * `v` sees it, plus the conductor when `conductorKnown` (its Table 9 values read; its length and
 * parallel sets given: the length, twice for a single-phase loop, over the sets multiplies the
 * per-1000 ft impedance), referred to the
 * secondary with the rest of the primary side at a transformer, whose own impedance is then the
 * step. Returns that transformer impedance at a transformer (null without %Z: nothing added).
 */
function impedanceAt(g: Graph, f: Impedances, v: number, u: number, e: number, conductorKnown: boolean, lengthFt: number, parallelSets: number): ReturnType<typeof transformerImpedance> | undefined {
  const isLoop = f.loop[v]!;
  let ru = seenFrom(f.r[u]!, isLoop, f.loop[u]!);
  let xu = seenFrom(f.x[u]!, isLoop, f.loop[u]!);
  let dr = 0;
  let dx = 0;
  if (e >= 0 && conductorKnown) {
    const factor = ((isLoop ? 2 : 1) * lengthFt) / 1000 / parallelSets;
    dr = f.rOhmPerKft[e]! * factor;
    dx = f.xOhmPerKft[e]! * factor;
  }
  let t: ReturnType<typeof transformerImpedance> | undefined;
  if (g.nodeKind[v] === TRANSFORMER) {
    const node = g.nodes[v] as NodeOfKind<'transformer'>;
    const ratio = node.secondaryVoltsLL / node.primaryVoltsLL;
    ru = (ru + dr) * ratio * ratio;
    xu = (xu + dx) * ratio * ratio;
    t = transformerImpedance(node);
    dr = t ? t.r : 0;
    dx = t ? t.x : 0;
  }
  f.r[v] = ru + dr;
  f.x[v] = xu + dx;
  f.stepR[v] = dr;
  f.stepX[v] = dx;
  return t;
}

/**
 * The nodes `below` again after conductor `c` changed (length, size, material, sets or wiring, with
 * an impedance before and after; see analyze/incremental.ts): its Table 9 values, then each node's R,
 * X and figures from its supply. `below` lists the nodes supplied through `c` on the supply tree,
 * each after its supply, the end of `c` first. The tree, the loops, voltages, zones, motor
 * contributions and what is unknown or an upper bound stay as they were.
 */
export function restepBelow(g: Graph, f: FaultStudy, c: number, below: readonly number[]): void {
  settleTables(f);
  readConductor(g.conductors[c]!, c, f.rOhmPerKft, f.xOhmPerKft);
  for (const v of below) {
    const e = f.parentEdge[v]!;
    const c = e >= 0 ? g.conductors[e]! : undefined;
    const known = c !== undefined && !Number.isNaN(f.rOhmPerKft[e]!) && c.lengthFt !== undefined;
    impedanceAt(g, f, v, f.parent[v]!, e, known, known ? c.lengthFt! : 0, known ? c.parallelSets : 1);
    if (!f.unknownWhy[v]) figuresAt(g, f, v, atTransformerTerminals(g, f, v));
  }
}

/**
 * Node `v` added to the drawing below node `u` (its one supply, through edge `e`; see
 * analyze/incremental.ts): its place on the supply tree, R, X and figures, or why they are unknown,
 * as the whole study finds them. `v` is neither a source nor a transformer and supplies nothing, so
 * nothing else moves; the arrays are the study's own, one longer. Returns the note the study then
 * makes (a conductor counted as zero impedance), or null.
 */
export function stepAppended(g: Graph, f: FaultStudy, v: number, u: number, e: number): string | null {
  f.parent[v] = u;
  f.parentEdge[v] = e;
  f.zone[v] = f.zone[u]!;
  f.upperBound[v] = f.upperBound[u]!;
  // What is unknown above is unknown here: an infinite bus or no source named for this node, any other reason as it stands.
  const whyU = f.unknownWhy[u]!;
  const id = g.nodes[u]!.id;
  f.unknownWhy[v] = whyU === infiniteBusWhy(id) ? infiniteBusWhy(g.nodes[v]!.id) : whyU === notReachedWhy(id) ? notReachedWhy(g.nodes[v]!.id) : whyU;
  const node = g.nodes[v]!;
  // Only a single-phase transformer or load starts a single-phase loop.
  f.loop[v] = node.kind === 'load' && node.phases === 1 ? 1 : f.loop[u]!;
  f.voltsLL[v] = f.voltsLL[u]!;
  const c = e >= 0 ? g.conductors[e]! : undefined;
  const known = c === undefined || readConductor(c, e, f.rOhmPerKft, f.xOhmPerKft);
  if (!known) f.upperBound[v] = 1;
  impedanceAt(g, f, v, u, e, known, known && c ? c.lengthFt! : 0, known && c ? c.parallelSets : 1);
  if (!f.unknownWhy[v]) figuresAt(g, f, v, atTransformerTerminals(g, f, v));
  return known ? null : c!.size === undefined ? NO_SIZE_NOTE : NO_IMPEDANCE_NOTE;
}

/** A transformer, or equipment bus-linked alone to one (where the line-to-ground figure is given). */
function atTransformerTerminals(g: Graph, f: FaultStudy, v: number): boolean {
  let w = v;
  for (let steps = 0; g.nodeKind[w] !== TRANSFORMER && f.parent[w]! >= 0 && f.parentEdge[w]! < 0 && steps <= g.nodes.length; steps++) w = f.parent[w]!;
  return g.nodeKind[w] === TRANSFORMER;
}

/** Transformer R and X on the secondary, ohms (phase or single-phase loop), or null without %Z. */
export function transformerImpedance(node: Extract<EquipmentNode, { kind: 'transformer' }>): { r: number; x: number; z: number; xOverR: number } | null {
  if (node.impedancePct === undefined) return null;
  const xr = node.xOverR ?? typicalTransformerXOverR(node.kva);
  const z = ((node.impedancePct / 100) * node.secondaryVoltsLL * node.secondaryVoltsLL) / (node.kva * 1000);
  const r = z / Math.sqrt(1 + xr * xr);
  return { r, x: r * xr, z, xOverR: xr };
}

/** Source R and X, ohms: a utility from its available fault current, a generator from X″d; zero for an infinite bus. */
export function sourceImpedance(node: Extract<EquipmentNode, { kind: 'utility' | 'generator' }>): { r: number; x: number; xOverR: number } {
  if (node.kind === 'utility') {
    if (node.availableFaultKA === undefined) return { r: 0, x: 0, xOverR: Number.NaN };
    const xr = node.xOverR ?? TYPICAL_UTILITY_X_OVER_R;
    const z = node.voltsLL / ((node.phases === 3 ? SQRT3 : 1) * node.availableFaultKA * 1000);
    const rs = z / Math.sqrt(1 + xr * xr);
    return { r: rs, x: rs * xr, xOverR: xr };
  }
  const pu = node.subtransientReactancePu ?? TYPICAL_GENERATOR_XDPP_PU;
  const xr = node.xOverR ?? TYPICAL_GENERATOR_X_OVER_R;
  const xs = (pu * node.voltsLL * node.voltsLL) / (node.kva * 1000);
  return { r: xs / xr, x: xs, xOverR: xr };
}

/** Full-load current of a load, A, from its current or kVA. */
export function loadFullLoadA(node: Extract<EquipmentNode, { kind: 'load' }>, systemVoltsLL: number, systemPhases: 1 | 3): number {
  if (node.currentA !== undefined) return node.currentA;
  if (node.kva === undefined || !(systemVoltsLL > 0)) return Number.NaN;
  const ph = node.phases ?? systemPhases;
  return (node.kva * 1000) / (ph === 3 ? SQRT3 * systemVoltsLL : systemVoltsLL);
}
