import { edgeEndsOf, nodeIndexOf } from '../model/nodeIndex';
import { EQUIPMENT_KINDS, type BusLink, type Conductor, type EquipmentKind, type EquipmentNode, type Project } from '../model/schema';

/**
 * The project as arrays indexed by position, built once in linear time.
 * Edges are encoded as numbers: a conductor `i` is `i`, a bus link `j` is
 * `-(j + 1)`. No judgement happens here.
 */
export interface Graph {
  nodes: readonly EquipmentNode[];
  conductors: readonly Conductor[];
  links: readonly BusLink[];
  nodeIndex: ReadonlyMap<string, number>;
  /**
   * Each node's kind as a small integer (`KIND`), read once here in file order: the passes in
   * supply-to-load order that need nothing else of most nodes test this instead of reaching each
   * node object (a cache miss on a large drawing, and a property read of many shapes).
   */
  nodeKind: Uint8Array;
  /** Edges arriving at each node (its supply side). */
  inEdges: readonly number[][];
  /** Edges leaving each node (its load side). */
  outEdges: readonly number[][];
  conductorFrom: Int32Array;
  conductorTo: Int32Array;
  linkFrom: Int32Array;
  linkTo: Int32Array;
}

export function buildGraph(project: Project): Graph {
  const { nodes, conductors, busLinks: links } = project;
  // Built by the load step's check when the nodes are as it left them; else here.
  const nodeIndex = nodeIndexOf(nodes);
  // Each end's node position: the load step's look-ups while the lists are as it left them (model/nodeIndex.ts).
  const { from: conductorFrom, to: conductorTo } = edgeEndsOf(conductors, nodeIndex);
  const { from: linkFrom, to: linkTo } = edgeEndsOf(links, nodeIndex);
  // Every node has a list each way, but most lists are empty (a load feeds nothing, a source is fed by
  // nothing): those share one empty list (read-only, like the whole graph), so a large drawing makes
  // about one list per edge, not two per node.
  const inEdges = edgeLists(nodes.length, conductorTo, linkTo);
  const outEdges = edgeLists(nodes.length, conductorFrom, linkFrom);
  const nodeKind = new Uint8Array(nodes.length);
  for (let i = 0; i < nodes.length; i++) nodeKind[i] = KIND[nodes[i]!.kind] ?? UNKNOWN_KIND;
  return { nodes, conductors, links, nodeIndex, nodeKind, inEdges, outEdges, conductorFrom, conductorTo, linkFrom, linkTo };
}

/** Equipment kinds as small integers (Graph.nodeKind); a kind the schema does not know (an unchecked project) reads UNKNOWN_KIND. */
const UNKNOWN_KIND = 255;
export const KIND: Readonly<Record<EquipmentKind, number>> = Object.freeze(Object.fromEntries(EQUIPMENT_KINDS.map((k, i) => [k, i])) as Record<EquipmentKind, number>);

/** Not frozen: a frozen array has another shape, and every loop over the lists would then see two. */
const NO_EDGES: readonly number[] = [];

/** Per node, the edges whose end (`conductorEnd`, `linkEnd`) is that node: conductors first, then bus links, each in file order. */
function edgeLists(n: number, conductorEnd: Int32Array, linkEnd: Int32Array): number[][] {
  const lists = new Array<number[]>(n).fill(NO_EDGES as number[]);
  for (let i = 0; i < conductorEnd.length; i++) {
    const v = conductorEnd[i]!;
    if (v < 0) continue;
    if (lists[v] === NO_EDGES) lists[v] = [i];
    else lists[v]!.push(i);
  }
  for (let j = 0; j < linkEnd.length; j++) {
    const v = linkEnd[j]!;
    if (v < 0) continue;
    if (lists[v] === NO_EDGES) lists[v] = [-(j + 1)];
    else lists[v]!.push(-(j + 1));
  }
  return lists;
}

export function edgeFrom(g: Graph, e: number): number {
  return e >= 0 ? g.conductorFrom[e]! : g.linkFrom[-e - 1]!;
}

export function edgeTo(g: Graph, e: number): number {
  return e >= 0 ? g.conductorTo[e]! : g.linkTo[-e - 1]!;
}

/**
 * Kahn's algorithm over nodes. Returns the nodes in supply-to-load order and,
 * separately, the nodes that lie on or below a cycle (never reached).
 */
export function topologicalOrder(g: Graph): { order: Int32Array; count: number; onCycle: Uint8Array } {
  const n = g.nodes.length;
  // Each node's in-edge count (its inEdges list's length) from the end arrays: a sequential pass, no list read.
  const indegree = new Int32Array(n);
  countEnds(indegree, g.conductorTo);
  countEnds(indegree, g.linkTo);
  const order = new Int32Array(n);
  let head = 0;
  let tail = 0;
  for (let i = 0; i < n; i++) if (indegree[i] === 0) order[tail++] = i;
  while (head < tail) {
    const v = order[head++]!;
    const outs = g.outEdges[v]!;
    for (let i = 0; i < outs.length; i++) {
      const e = outs[i]!;
      const w = edgeTo(g, e);
      if (--indegree[w]! === 0) order[tail++] = w;
    }
  }
  const onCycle = new Uint8Array(n);
  for (let i = 0; i < n; i++) if (indegree[i]! > 0) onCycle[i] = 1;
  return { order, count: tail, onCycle };
}

function countEnds(count: Int32Array, ends: Int32Array): void {
  for (let i = 0; i < ends.length; i++) {
    const v = ends[i]!;
    if (v >= 0) count[v]!++;
  }
}

/** Each node's position in a supply-to-load order (-1 when not reached), built once per order array. */
const positions = new WeakMap<Int32Array, Int32Array>();
export function orderPositions(order: Int32Array, count: number): Int32Array {
  let pos = positions.get(order);
  if (!pos) {
    pos = new Int32Array(order.length).fill(-1);
    for (let k = 0; k < count; k++) pos[order[k]!] = k;
    positions.set(order, pos);
  }
  return pos;
}
