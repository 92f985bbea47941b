import type { Conductor, EquipmentKind, EquipmentNode, Project } from '@linewright/core';
import { plain } from '../words';

/** Port names by direction. Supply comes in at the top, load leaves at the bottom. */
export interface PortSpec {
  /** Port a conductor arrives at (supply side), or null for a source. */
  in: 'line' | 'primary' | null;
  /** Port a conductor leaves from (load side), or null for utilization equipment. */
  out: 'load' | 'secondary' | null;
}

export interface KindSpec {
  kind: EquipmentKind;
  /** Details title and tooltip. */
  title: string;
  /** Palette caption. */
  short: string;
  /** Prefix for new labels: CB-1, F-2… */
  labelPrefix: string;
  ports: PortSpec;
  /** Node box in drawing units; fixed so layout and culling need no measuring. */
  width: number;
  height: number;
  /** x of the wire through the symbol, where both ports sit. */
  wireX: number;
  /** y of the bar of a bus, whose outgoing connections leave from the bar itself. */
  barY?: number;
  /** Fields of a new node; parsed by the core schema before it enters the document. */
  defaults: () => { kind: EquipmentKind } & Record<string, unknown>;
}

const std = { width: 200, height: 72, wireX: 40 } as const;

export const KIND_SPECS = {
  utility: {
    kind: 'utility', short: 'Utility', title: 'Utility source', labelPrefix: 'UTIL', ports: { in: null, out: 'load' }, ...std,
    defaults: () => ({ kind: 'utility', voltsLL: 480, phases: 3 }),
  },
  generator: {
    kind: 'generator', short: 'Generator', title: 'Generator', labelPrefix: 'GEN', ports: { in: null, out: 'load' }, ...std,
    defaults: () => ({ kind: 'generator', voltsLL: 480, phases: 3, kva: 250, overloadPreventedByDesign: false }),
  },
  bus: {
    kind: 'bus', short: 'Bus', title: 'Bus (switchboard, panelboard)', labelPrefix: 'PNL', ports: { in: 'line', out: 'load' },
    width: 260, height: 60, wireX: 40, barY: 50,
    defaults: () => ({ kind: 'bus', busType: 'panelboard', busRatingA: 225 }),
  },
  breaker: {
    kind: 'breaker', short: 'Breaker', title: 'Circuit breaker', labelPrefix: 'CB', ports: { in: 'line', out: 'load' }, ...std,
    defaults: () => ({ kind: 'breaker', ratingA: 100, arrangement: 'single', atDisconnectingMeans: false }),
  },
  fuse: {
    kind: 'fuse', short: 'Fuse', title: 'Fuse', labelPrefix: 'FU', ports: { in: 'line', out: 'load' }, ...std,
    defaults: () => ({ kind: 'fuse', ratingA: 100, arrangement: 'single', atDisconnectingMeans: false, currentLimiting: false }),
  },
  disconnect: {
    kind: 'disconnect', short: 'Disconnect', title: 'Disconnect switch (unfused)', labelPrefix: 'DS', ports: { in: 'line', out: 'load' }, ...std,
    defaults: () => ({ kind: 'disconnect', ratingA: 100 }),
  },
  splice: {
    kind: 'splice', short: 'Splice / tap', title: 'Splice or tap point', labelPrefix: 'SP', ports: { in: 'line', out: 'load' },
    width: 180, height: 44, wireX: 40,
    defaults: () => ({ kind: 'splice' }),
  },
  transformer: {
    kind: 'transformer', short: 'Transformer', title: 'Transformer', labelPrefix: 'T', ports: { in: 'primary', out: 'secondary' },
    width: 200, height: 88, wireX: 40,
    defaults: () => ({ kind: 'transformer', kva: 75, primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3, impedancePct: 5, connection: 'delta-wye' }),
  },
  load: {
    kind: 'load', short: 'Load', title: 'Load', labelPrefix: 'LD', ports: { in: 'line', out: null }, ...std,
    defaults: () => ({ kind: 'load', kva: 10, powerFactor: 0.9, continuous: false }),
  },
} as const satisfies Record<EquipmentKind, KindSpec>;

export function kindSpec(kind: EquipmentKind): KindSpec {
  return KIND_SPECS[kind] as KindSpec;
}

/**
 * Defaults for a conductor drawn port to port. Length, size and whether it leaves the
 * enclosure stay unstated so the check asks for them instead of taking a guess.
 */
export function newConductorFields(): Omit<Conductor, 'id' | 'from' | 'to'> {
  return {
    material: 'cu',
    parallelSets: 1,
    insulation: 'THHN',
    wiring: 'steel-conduit',
    ambientC: 30,
    currentCarrying: 3,
    extendsBeyondEquipment: false,
    outdoors: false,
    damageProtection: 'raceway',
    multioutletCordAndPlug: false,
  };
}

/** A fresh id not used by any node, conductor or bus link of the project. */
export function freshId(p: Project, prefix: string, taken?: Set<string>): string {
  const used = taken ?? allIds(p);
  let n = used.size + 1;
  let id = `${prefix}${n}`;
  while (used.has(id)) id = `${prefix}${++n}`;
  used.add(id);
  return id;
}

export function allIds(p: Project): Set<string> {
  const s = new Set<string>();
  for (const x of p.nodes) s.add(x.id);
  for (const x of p.conductors) s.add(x.id);
  for (const x of p.busLinks) s.add(x.id);
  return s;
}

/** Next free label for a kind: CB-1, CB-2… */
export function freshLabel(p: Project, kind: EquipmentKind, taken?: Set<string>): string {
  const prefix = kindSpec(kind).labelPrefix;
  const used = taken ?? new Set(p.nodes.map((n) => n.label ?? ''));
  let n = 1;
  while (used.has(`${prefix}-${n}`)) n++;
  const label = `${prefix}-${n}`;
  used.add(label);
  return label;
}

export function nodeTitle(n: EquipmentNode): string {
  return n.label?.trim() || n.id;
}

const MAT: Record<Conductor['material'], string> = { cu: 'Cu', al: 'Al', 'cu-clad-al': 'CCA' };
export function materialShort(m: Conductor['material']): string {
  return MAT[m];
}

/** Trade shorthand for a size: '3/0', '500 kcmil', '12 AWG' for AWG numbers; 'size?' when none is entered yet. */
export function sizeShort(size: Conductor['size'] | null): string {
  if (size === undefined || size === null) return 'size?';
  if (size.includes('/')) return size;
  return Number(size) >= 250 ? `${size} kcmil` : `#${size}`;
}

/** The text on a conductor: sets × size, material, length. */
export function conductorLine(c: Pick<Conductor, 'parallelSets' | 'size' | 'material' | 'lengthFt'>): string {
  const len = c.lengthFt === undefined ? 'length ?' : `${formatNum(c.lengthFt)} ft`;
  return `${c.parallelSets}× ${sizeShort(c.size)} ${materialShort(c.material)} · ${len}`;
}

export function formatNum(x: number): string {
  return Number.isInteger(x) ? String(x) : String(Math.round(x * 10) / 10);
}

/** One line under the symbol: the rating or size facts a reader looks for first. */
export function nodeFacts(n: EquipmentNode): string {
  switch (n.kind) {
    case 'utility':
      return `${n.voltsLL} V ${n.phases}ϕ${n.availableFaultKA ? ` · ${n.availableFaultKA} kA` : ''}`;
    case 'generator':
      return `${n.kva} kVA · ${n.voltsLL} V ${n.phases}ϕ`;
    case 'bus':
      return `${plain(n.busType)}${n.busRatingA ? ` · ${n.busRatingA} A bus` : ''}`;
    case 'breaker':
      return n.ratingA ? `${n.ratingA} A breaker${n.adjustableTrip ? ' (adj.)' : ''}` : 'rating ?';
    case 'fuse':
      return n.ratingA ? `${n.ratingA} A fuses` : 'rating ?';
    case 'disconnect':
      return n.ratingA ? `${n.ratingA} A switch, no fuses` : 'switch, no fuses';
    case 'splice':
      return 'splice';
    case 'transformer':
      return `${n.kva} kVA · ${n.primaryVoltsLL}–${n.secondaryVoltsLL} V`;
    case 'load':
      return n.currentA ? `${n.currentA} A${n.continuous ? ' cont.' : ''}` : n.kva ? `${n.kva} kVA${n.continuous ? ' cont.' : ''}` : 'load ?';
  }
}
