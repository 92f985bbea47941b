import type { EquipmentNode } from './schema';

/**
 * Node ids interned once. The load step's consistency check (model/load.ts) builds the index of
 * every node id to its position; the analysis's graph (topology/graph.ts) reuses it instead of
 * hashing every id a second time, for as long as the project's node list still holds the ids it
 * was built from. An edit makes a new list (immer) or changes an id in place; either way the
 * check below sees it and the graph builds its own index.
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
