import type { EquipmentNode } from '../model/schema';
import { edgeTo, type Graph } from '../topology/graph';
import type { SystemAt } from './types';

/**
 * The system every node is supplied from (voltage, phases, whether a neutral
 * is there) and what each node serves downstream, in one pass each way over
 * the supply-to-load order. A transformer starts a new system and hides its
 * secondary loads from the primary side.
 */
export interface NetworkSystems {
  at: SystemAt[];
  /** What is served at and below each node (transformers count as one load of their own phases). */
  serves: Serves[];
}

export interface Serves {
  singlePhaseLoads: boolean;
  threePhaseLoads: boolean;
  /** Panelboards, switchboards, switchgear, busways, tap boxes. */
  distribution: boolean;
}

const SINGLE = 1;
const THREE = 2;
const DISTRIBUTION = 4;

const UNKNOWN: SystemAt = Object.freeze({ voltsLL: null, phases: null, arrangement: 'unknown', basis: 'no source is drawn upstream' });

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

export function networkSystems(g: Graph, order: Int32Array, count: number): NetworkSystems {
  const n = g.nodes.length;
  const at: SystemAt[] = new Array(n).fill(UNKNOWN);
  for (let k = 0; k < count; k++) {
    const v = order[k]!;
    const own = sourceSystem(g.nodes[v]!);
    if (own) {
      at[v] = own;
      continue;
    }
    const ins = g.inEdges[v]!;
    if (ins.length !== 1) continue;
    const e = ins[0]!;
    const u = e >= 0 ? g.conductorFrom[e]! : g.linkFrom[-e - 1]!;
    if (u >= 0) at[v] = at[u]!;
  }
  // Bit flags, so a node reached along several paths is still counted once per kind.
  const bits = new Uint8Array(n);
  for (let k = count - 1; k >= 0; k--) {
    const v = order[k]!;
    const node = g.nodes[v]!;
    if (node.kind === 'load') bits[v]! |= (node.phases ?? at[v]!.phases) === 1 ? SINGLE : THREE;
    else if (node.kind === 'bus') bits[v]! |= DISTRIBUTION;
    // A transformer is one load of its own phases to the system ahead of it; what it serves is another system.
    if (node.kind === 'transformer') {
      bits[v] = node.phases === 1 ? SINGLE : THREE;
      continue;
    }
    for (const e of g.outEdges[v]!) {
      const w = edgeTo(g, e);
      if (w >= 0) bits[v]! |= bits[w]!;
    }
  }
  const serves: Serves[] = Array.from(bits, (b) => ({
    singlePhaseLoads: (b & SINGLE) !== 0,
    threePhaseLoads: (b & THREE) !== 0,
    distribution: (b & DISTRIBUTION) !== 0,
  }));
  return { at, serves };
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
