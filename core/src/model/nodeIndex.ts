import type { EquipmentNode } from './schema';

/**
 * Node ids interned once. The load step's consistency check (model/load.ts) builds the index of
 * every node id to its position, and looks up both ends of every conductor and bus link in it; the
 * analysis's graph (topology/graph.ts) reuses both instead of hashing every id a second time, for
 * as long as the project's lists still hold the ids they were built from. An edit makes a new list
 * (immer) or changes an id in place; either way the checks below see it and the graph builds its own.
 */
interface Interned {
  readonly index: ReadonlyMap<string, number>;
  /** The ids in list order when the index was built. */
  readonly ids: readonly string[];
}

const interned = new WeakMap<readonly EquipmentNode[], Interned>();

/** Keeps `index` (each id of `nodes` to its position, every id unique) for `nodeIndexOf`. */
export function rememberNodeIndex(nodes: readonly EquipmentNode[], index: ReadonlyMap<string, number>): void {
  const ids = new Array<string>(nodes.length);
  for (let i = 0; i < nodes.length; i++) ids[i] = nodes[i]!.id;
  interned.set(nodes, { index, ids });
}

/** Each node id's position in `nodes` (the last one, should an id repeat). */
export function nodeIndexOf(nodes: readonly EquipmentNode[]): ReadonlyMap<string, number> {
  const kept = interned.get(nodes);
  if (kept && sameIds(nodes, kept.ids)) return kept.index;
  const index = new Map<string, number>();
  for (let i = 0; i < nodes.length; i++) index.set(nodes[i]!.id, i);
  return index;
}

/** One pass comparing string references (equal strings compare fast): no hashing. */
function sameIds(nodes: readonly EquipmentNode[], ids: readonly string[]): boolean {
  if (nodes.length !== ids.length) return false;
  for (let i = 0; i < nodes.length; i++) if (nodes[i]!.id !== ids[i]) return false;
  return true;
}

/** What joins nodes: a conductor or a bus link, by the ids of its two ends. */
interface Edge {
  readonly from: string;
  readonly to: string;
}

interface KeptEnds {
  /** The node index the ends were looked up in. */
  readonly index: ReadonlyMap<string, number>;
  readonly from: Int32Array;
  readonly to: Int32Array;
  /** The end ids in list order when the ends were looked up. */
  readonly fromIds: readonly string[];
  readonly toIds: readonly string[];
}

const keptEnds = new WeakMap<readonly Edge[], KeptEnds>();

/** Keeps the node positions `from` and `to` of each edge of `edges`, looked up in `index`, for `edgeEndsOf`. */
export function rememberEdgeEnds(edges: readonly Edge[], index: ReadonlyMap<string, number>, from: Int32Array, to: Int32Array): void {
  const fromIds = new Array<string>(edges.length);
  const toIds = new Array<string>(edges.length);
  for (let i = 0; i < edges.length; i++) {
    fromIds[i] = edges[i]!.from;
    toIds[i] = edges[i]!.to;
  }
  keptEnds.set(edges, { index, from, to, fromIds, toIds });
}

/** The node position of each edge's two ends in `index` (-1 for an id it lacks), in fresh arrays. */
export function edgeEndsOf(edges: readonly Edge[], index: ReadonlyMap<string, number>): { from: Int32Array; to: Int32Array } {
  const kept = keptEnds.get(edges);
  if (kept && kept.index === index && sameEnds(edges, kept)) return { from: kept.from.slice(), to: kept.to.slice() };
  const from = new Int32Array(edges.length);
  const to = new Int32Array(edges.length);
  for (let i = 0; i < edges.length; i++) {
    const e = edges[i]!;
    from[i] = index.get(e.from) ?? -1;
    to[i] = index.get(e.to) ?? -1;
  }
  return { from, to };
}

function sameEnds(edges: readonly Edge[], kept: KeptEnds): boolean {
  if (edges.length !== kept.fromIds.length) return false;
  for (let i = 0; i < edges.length; i++) {
    const e = edges[i]!;
    if (e.from !== kept.fromIds[i] || e.to !== kept.toIds[i]) return false;
  }
  return true;
}
