import type { Conductor, EquipmentNode, NodeOfKind } from '../model/schema';
import { edgeTo, KIND, type Graph } from '../topology/graph';
import { loadConnection, type LoadConnection, type SystemLoads } from './loads';

/**
 * What each conductor's circuit is made of: the system it is supplied from,
 * what it serves, its ungrounded conductors and neutral, and the 310.15(E)
 * count of current-carrying conductors. Decided once, here: the ampacity
 * adjustment of Table 310.15(C)(1), the takeoff (wire, fill, EGC) and the
 * voltage-drop study all read the same result, so they cannot disagree.
 */

/** The electrical system at a point of the network. */
export interface SystemAt {
  voltsLL: number | null;
  phases: 1 | 3 | null;
  /** 'wye-4w' and 'single-3w' have a neutral; 'single-2w' has one grounded conductor and one ungrounded. */
  arrangement: 'wye-4w' | 'delta-3w' | 'high-leg-4w' | 'single-3w' | 'single-2w' | 'unknown';
  /** How the arrangement was decided, for the working. */
  basis: string;
}

/** What the conductors of one circuit are, decided once and used by fill, EGC, wire, voltage drop and the ampacity count. */
export interface CircuitMakeup {
  /** Ungrounded (phase) conductors in one parallel set. */
  ungroundedPerSet: number;
  /** A neutral (or grounded conductor) in each set. */
  hasNeutral: boolean;
  /** Why the neutral is or is not there. */
  neutralReason: string;
  /** The circuit's kind, which decides whether the neutral carries current of its own (310.15(E)). */
  kind: 'three-phase-4w' | 'three-phase-3w' | 'two-phase-and-neutral-of-wye' | 'single-phase-3w' | 'two-wire' | 'line-to-line-2w';
}

/** 310.15(E): how many current-carrying conductors one raceway (one parallel set) holds. */
export interface CurrentCarryingCount {
  /** This circuit's own current-carrying conductors in one raceway. */
  count: number;
  neutralCounts: boolean;
  /** The paragraph of 310.15(E) that decided the neutral, or null without a neutral. */
  section: '310.15(E)(1)' | '310.15(E)(2)' | '310.15(E)(3)' | '2-wire' | null;
  reason: string;
  /**
   * The count Table 310.15(C)(1) adjusts for: this circuit's count, or the run's stated
   * `currentCarrying` where that is larger (other circuits share the raceway).
   */
  adjustmentCount: number;
}

/** What is served at and below a node. */
export interface Serves {
  /** Single-phase loads connected line to neutral (their own connection, as the load calculation takes it). */
  lineToNeutralLoads: boolean;
  /** Single-phase loads connected line to line, and single-phase transformers. */
  lineToLineLoads: boolean;
  /** Three-phase loads and transformers. */
  threePhaseLoads: boolean;
  /** Panelboards, switchboards, switchgear, busways, tap boxes. */
  distribution: boolean;
}

export interface NetworkSystems {
  at: SystemAt[];
  /** What is served at and below each node (a transformer counts as one load of its own phases). */
  serves: Serves[];
  /** 1 where the node lies on service conductors: a utility, or a splice or disconnect reached from one without a device. */
  service: Uint8Array;
  /** Which system each node is on, as a small integer: 0 unknown, else one per source or transformer (the same SystemAt object in `at`). */
  systemId: Int32Array;
  /** `serves` as bit flags, per node. */
  servesBits: Uint8Array;
}

/** One conductor's circuit. */
export interface ConductorCircuit {
  system: SystemAt;
  serves: Serves;
  service: boolean;
  makeup: CircuitMakeup;
  currentCarrying: CurrentCarryingCount;
}

const LN = 1;
const LL = 2;
const THREE = 4;
const DISTRIBUTION = 8;

const UNKNOWN: SystemAt = Object.freeze({ voltsLL: null, phases: null, arrangement: 'unknown', basis: 'no source is drawn upstream' });
const SERVES_BY_BITS: readonly Serves[] = Array.from({ length: 16 }, (_, b) =>
  Object.freeze({ lineToNeutralLoads: (b & LN) !== 0, lineToLineLoads: (b & LL) !== 0, threePhaseLoads: (b & THREE) !== 0, distribution: (b & DISTRIBUTION) !== 0 }),
);

function sourceSystem(node: EquipmentNode): SystemAt | null {
  switch (node.kind) {
    case 'utility':
    case 'generator':
      // The drawing gives voltage and phases only; a 3-phase source is taken as a grounded 4-wire wye
      // (480Y/277 V, 208Y/120 V) and a single-phase one as 120/240 V 3-wire: common practice for buildings.
      return node.phases === 3
        ? { voltsLL: node.voltsLL, phases: 3, arrangement: 'wye-4w', basis: `${node.kind} ${node.id}: 3-phase source taken as a 4-wire wye (common practice)` }
        : { voltsLL: node.voltsLL, phases: 1, arrangement: 'single-3w', basis: `${node.kind} ${node.id}: single-phase source taken as 3-wire (common practice)` };
    case 'transformer': {
      const c = node.connection;
      const arrangement: SystemAt['arrangement'] =
        c === 'delta-wye' || c === 'wye-wye' ? 'wye-4w'
        : c === 'delta-delta-4w' ? 'high-leg-4w'
        : c === 'single-phase-3w' ? 'single-3w'
        : c === 'single-phase-2w' ? 'single-2w'
        : 'delta-3w';
      return { voltsLL: node.secondaryVoltsLL, phases: node.phases, arrangement, basis: `transformer ${node.id} secondary, ${c}` };
    }
    default:
      return null;
  }
}

/**
 * The system every node is supplied from and what each node serves
 * downstream, one pass each way over the supply-to-load order. A transformer
 * starts a new system and hides its secondary loads from the primary side.
 * A load's connection is its own (loads.ts `loadConnection`), so a load at
 * line-to-neutral voltage asks for a neutral and a line-to-line one does not.
 */
export function networkSystems(g: Graph, order: Int32Array, count: number, loads: Pick<SystemLoads, 'voltsLL' | 'phases' | 'voltsLN'> & Partial<Pick<SystemLoads, 'loadCircuits'>>): NetworkSystems {
  const n = g.nodes.length;
  const at: SystemAt[] = new Array<SystemAt>(n).fill(UNKNOWN);
  const service = new Uint8Array(n);
  const systemId = new Int32Array(n);
  let systems = 0;
  for (let k = 0; k < count; k++) {
    const v = order[k]!;
    const kind = g.nodeKind[v]!;
    if (kind === KIND.utility || kind === KIND.generator || kind === KIND.transformer) {
      at[v] = sourceSystem(g.nodes[v]!)!;
      systemId[v] = ++systems;
      service[v] = kind === KIND.utility ? 1 : 0;
      continue;
    }
    systemFromSupply(g, { at, service, systemId }, v);
  }
  // Bit flags, so a node reached along several paths is still counted once per kind.
  const bits = new Uint8Array(n);
  for (let k = count - 1; k >= 0; k--) bits[order[k]!] = servesBitsAt(g, loads, at, bits, order[k]!);
  const serves: Serves[] = new Array<Serves>(n);
  for (let v = 0; v < n; v++) serves[v] = SERVES_BY_BITS[bits[v]!]!;
  return { at, serves, service, systemId, servesBits: bits };
}

/** What node `v` serves as bit flags, from its own kind and the flags of what it supplies (theirs known). Also how incremental.ts updates a supply path. */
export function servesBitsAt(g: Graph, loads: Pick<SystemLoads, 'voltsLL' | 'phases' | 'voltsLN'> & Partial<Pick<SystemLoads, 'loadCircuits'>>, at: readonly SystemAt[], bits: Uint8Array, v: number): number {
  const kind = g.nodeKind[v]!;
  // A transformer is one load of its own phases to the system ahead of it; what it serves is another system.
  if (kind === KIND.transformer) return (g.nodes[v] as NodeOfKind<'transformer'>).phases === 1 ? LL : THREE;
  let own = 0;
  if (kind === KIND.load) {
    // The roll-up has already decided the connection of every load whose current it knows.
    const known = loads.loadCircuits?.[v];
    own = known ? connectionBits(known) : loadBits(g.nodes[v] as NodeOfKind<'load'>, loads.voltsLL[v]!, loads.phases[v]!, loads.voltsLN[v]!, at[v]!);
  } else if (kind === KIND.bus) own = DISTRIBUTION;
  const outs = g.outEdges[v]!;
  for (let i = 0; i < outs.length; i++) {
    const w = edgeTo(g, outs[i]!);
    if (w >= 0) own |= bits[w]!;
  }
  return own;
}

/** The flags `servesBits` holds, as the Serves object they stand for. */
export function servesOfBits(bits: number): Serves {
  return SERVES_BY_BITS[bits]!;
}

/**
 * Node `v` (not a source or transformer) on the system of its one supply, and on the service where it is a
 * splice or disconnect on service conductors; left unknown with no supply or several. Also how incremental.ts
 * places a node added below one already placed.
 */
export function systemFromSupply(g: Graph, systems: Pick<NetworkSystems, 'at' | 'service' | 'systemId'>, v: number): void {
  const ins = g.inEdges[v]!;
  if (ins.length !== 1) return;
  const e = ins[0]!;
  const u = e >= 0 ? g.conductorFrom[e]! : g.linkFrom[-e - 1]!;
  if (u < 0) return;
  const kind = g.nodeKind[v]!;
  systems.at[v] = systems.at[u]!;
  systems.systemId[v] = systems.systemId[u]!;
  systems.service[v] = kind === KIND.splice || kind === KIND.disconnect ? systems.service[u]! : 0;
}

function connectionBits(on: Pick<LoadConnection, 'connection'>): number {
  return on.connection === 'three-phase' ? THREE : on.connection === 'line-to-neutral' ? LN : LL;
}

function loadBits(node: Extract<EquipmentNode, { kind: 'load' }>, sysV: number, sysPhases: number, sysLN: number, system: SystemAt): number {
  const on = loadConnection(node, sysV, sysPhases, sysLN);
  if (on) return connectionBits(on);
  // The system cannot say (unknown voltage): the load's own fields as far as they go.
  if ((node.phases ?? system.phases) !== 1) return THREE;
  return node.connection === 'line-to-line' || !systemHasNeutral(system) ? LL : LN;
}

/** '480 V 3-phase 4-wire wye'. */
export function systemText(s: SystemAt): string {
  if (s.voltsLL === null) return 'system unknown';
  const words: Record<SystemAt['arrangement'], string> = {
    'wye-4w': '3-phase 4-wire wye',
    'delta-3w': '3-phase 3-wire delta',
    'high-leg-4w': '3-phase 4-wire delta (high leg)',
    'single-3w': 'single-phase 3-wire',
    'single-2w': 'single-phase 2-wire',
    unknown: 'arrangement unknown',
  };
  return `${s.voltsLL} V ${words[s.arrangement]}`;
}

/** True when the system offers a neutral (or, 2-wire, a grounded conductor). */
export function systemHasNeutral(s: SystemAt): boolean {
  return s.arrangement === 'wye-4w' || s.arrangement === 'high-leg-4w' || s.arrangement === 'single-3w' || s.arrangement === 'single-2w';
}

/**
 * The conductors of one circuit: how many ungrounded conductors per set and
 * whether a neutral rides along.
 *
 * 'auto' neutral (common practice, stated on the takeoff): where the supply
 * has a neutral, service conductors always bring it (250.24(C)); a run that
 * serves distribution equipment (panelboards, switchboards, tap boxes) or
 * any load connected line to neutral carries one; a run serving only
 * line-to-line and 3-phase loads (transformers included) does not. A run
 * serving only single-phase loads is taken as their own circuit: one line and
 * the neutral for line-to-neutral loads, two lines for line-to-line loads,
 * two lines and the neutral for both (on a 4-wire wye that is 310.15(E)(2)).
 */
export function circuitMakeup(c: Pick<Conductor, 'neutral'>, service: boolean, system: SystemAt, serves: Serves): CircuitMakeup {
  const available = systemHasNeutral(system);
  const singleLoads = serves.lineToNeutralLoads || serves.lineToLineLoads;
  const onlySinglePhase = singleLoads && !serves.threePhaseLoads && !serves.distribution;
  let hasNeutral: boolean;
  let neutralReason: string;
  const choice = c.neutral ?? 'auto';
  if (choice === 'yes') {
    hasNeutral = true;
    neutralReason = available ? 'neutral: stated on the run' : 'neutral: stated on the run, though the supply shows no neutral; check the system';
  } else if (choice === 'no') {
    hasNeutral = system.arrangement === 'single-2w';
    neutralReason = hasNeutral ? 'grounded conductor: a 2-wire system needs one' : 'no neutral: stated on the run';
  } else if (!available) {
    hasNeutral = false;
    neutralReason = system.arrangement === 'unknown' ? 'no neutral: the supply system is unknown' : 'no neutral: the supply has none (3-wire delta)';
  } else if (system.arrangement === 'single-2w') {
    hasNeutral = true;
    neutralReason = 'grounded conductor of a 2-wire system';
  } else if (service) {
    hasNeutral = true;
    neutralReason = 'neutral: the grounded conductor is brought to the service (250.24(C))';
  } else if (serves.distribution) {
    hasNeutral = true;
    neutralReason = 'neutral: serves distribution equipment on a system with a neutral (auto)';
  } else if (serves.lineToNeutralLoads) {
    hasNeutral = true;
    neutralReason = 'neutral: serves loads connected line to neutral (auto)';
  } else {
    hasNeutral = false;
    neutralReason = singleLoads || serves.threePhaseLoads ? 'no neutral: serves line-to-line and 3-phase loads only (auto)' : 'no neutral: serves nothing drawn (auto)';
  }

  if (system.arrangement === 'single-2w') return { ungroundedPerSet: 1, hasNeutral: true, neutralReason, kind: 'two-wire' };
  const threePhase = system.phases !== 1;
  // A circuit of single-phase loads only, other than the service, is their own circuit.
  if (onlySinglePhase && !service) {
    if (!hasNeutral) return { ungroundedPerSet: 2, hasNeutral, neutralReason, kind: 'line-to-line-2w' };
    if (!serves.lineToLineLoads) return { ungroundedPerSet: 1, hasNeutral, neutralReason, kind: 'two-wire' };
    if (threePhase) return { ungroundedPerSet: 2, hasNeutral, neutralReason, kind: system.arrangement === 'wye-4w' ? 'two-phase-and-neutral-of-wye' : 'single-phase-3w' };
  }
  if (!threePhase) return { ungroundedPerSet: 2, hasNeutral, neutralReason, kind: hasNeutral ? 'single-phase-3w' : 'line-to-line-2w' };
  return { ungroundedPerSet: 3, hasNeutral, neutralReason, kind: hasNeutral ? 'three-phase-4w' : 'three-phase-3w' };
}

/**
 * 310.15(E): the current-carrying conductors in one raceway holding one set
 * of this circuit; `stated` (the run's `currentCarrying`) raises the count the
 * adjustment uses where other circuits share the raceway.
 * - (E)(1): a neutral that carries only the unbalanced current of the same
 *   circuit does not count (3-phase 4-wire, single-phase 3-wire).
 * - (E)(2): the neutral of a 3-wire circuit taken from two phases of a 4-wire
 *   wye counts.
 * - (E)(3): on a 4-wire 3-phase wye circuit whose load is mainly nonlinear,
 *   the neutral counts.
 * - A 2-wire circuit's grounded conductor carries the whole current: it counts.
 */
export function countCurrentCarrying(makeup: Pick<CircuitMakeup, 'ungroundedPerSet' | 'hasNeutral' | 'kind'>, nonlinearLoad: boolean, stated = 1): CurrentCarryingCount {
  const own = ownCount(makeup, nonlinearLoad);
  if (stated <= own.count) return { ...own, adjustmentCount: own.count };
  return { ...own, adjustmentCount: stated, reason: `${own.reason}; ${stated} stated on the run (other circuits in the raceway) is used for the adjustment` };
}

function ownCount(makeup: Pick<CircuitMakeup, 'ungroundedPerSet' | 'hasNeutral' | 'kind'>, nonlinearLoad: boolean): Omit<CurrentCarryingCount, 'adjustmentCount'> {
  const n = makeup.ungroundedPerSet;
  if (!makeup.hasNeutral) return { count: n, neutralCounts: false, section: null, reason: `${n} ungrounded conductors; no neutral` };
  switch (makeup.kind) {
    case 'two-wire':
      return { count: n + 1, neutralCounts: true, section: '2-wire', reason: 'a 2-wire circuit: the grounded conductor carries the load current and counts' };
    case 'two-phase-and-neutral-of-wye':
      return { count: n + 1, neutralCounts: true, section: '310.15(E)(2)', reason: 'two phases and the neutral of a 4-wire wye: the neutral counts' };
    case 'three-phase-4w':
      return nonlinearLoad
        ? { count: n + 1, neutralCounts: true, section: '310.15(E)(3)', reason: 'a 4-wire wye circuit whose load is mainly nonlinear: the neutral counts' }
        : { count: n, neutralCounts: false, section: '310.15(E)(1)', reason: 'the neutral carries only the unbalanced current: it does not count' };
    default:
      return { count: n, neutralCounts: false, section: '310.15(E)(1)', reason: 'the neutral carries only the unbalanced current: it does not count' };
  }
}

/**
 * Stage: every conductor's circuit, by index. Equal circuits share one frozen
 * result: a riser repeats a handful of them thousands of times.
 */
export function conductorCircuits(g: Graph, systems: NetworkSystems): ConductorCircuit[] {
  const memo = new Map<number, ConductorCircuit>();
  const out: ConductorCircuit[] = new Array<ConductorCircuit>(g.conductors.length);
  for (let ci = 0; ci < g.conductors.length; ci++) out[ci] = conductorCircuit(g, systems, ci, memo);
  return out;
}

/** Conductor `ci`'s circuit; equal circuits share the one in `memo`. Also how incremental.ts makes the circuit of a conductor added to the drawing. */
export function conductorCircuit(g: Graph, systems: Pick<NetworkSystems, 'at' | 'service' | 'systemId' | 'servesBits'>, ci: number, memo: Map<number, ConductorCircuit>): ConductorCircuit {
  const c = g.conductors[ci]!;
  const from = g.conductorFrom[ci]!;
  const to = g.conductorTo[ci]!;
  const servesBits = to >= 0 ? systems.servesBits[to]! : 0;
  const service = from >= 0 && systems.service[from] === 1;
  const nonlinear = c.nonlinearLoad ?? false;
  // The system object is shared by every node of one source or transformer, so which one it is is part of the key.
  const key = circuitKey(from >= 0 ? systems.systemId[from]! : 0, servesBits, service, c.neutral, nonlinear, c.currentCarrying);
  let hit = memo.get(key);
  if (!hit) {
    const system = from >= 0 ? systems.at[from]! : UNKNOWN;
    const serves = SERVES_BY_BITS[servesBits]!;
    const makeup = circuitMakeup(c, service, system, serves);
    hit = Object.freeze({ system, serves, service, makeup: Object.freeze(makeup), currentCarrying: Object.freeze(countCurrentCarrying(makeup, nonlinear, c.currentCarrying)) });
    if (!Number.isNaN(key)) memo.set(key, hit);
  }
  return hit;
}

const NEUTRAL_INDEX: Readonly<Record<string, number>> = { auto: 0, yes: 1, no: 2 };

/**
 * What decides a conductor's circuit, packed into one small integer (mixed radix) so the memo
 * needs no string per conductor; NaN (no memo) for a value outside the packing.
 */
function circuitKey(system: number, servesBits: number, service: boolean, neutral: Conductor['neutral'], nonlinear: boolean, stated: number): number {
  const n = NEUTRAL_INDEX[neutral ?? 'auto'];
  if (n === undefined || !Number.isInteger(stated) || stated < 0 || stated > 255) return Number.NaN;
  return ((((system * 16 + servesBits) * 2 + (service ? 1 : 0)) * 3 + n) * 2 + (nonlinear ? 1 : 0)) * 256 + stated;
}
