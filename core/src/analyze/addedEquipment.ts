import type { Conductor, Project } from '../model/schema';
import { conductorAmpacity } from './ampacities';
import { keptNodeSupply, ocpdBelowAt, type KeptWalk } from './classify';
import { conductorCircuit, networkSystems, servesBitsAt, systemFromSupply, type ConductorCircuit, type NetworkSystems } from './circuits';
import { rollUpAt, systemFromSupplies, type SystemLoads } from './loads';
import { assumptionsFor, type AnalysisState } from './analyze';
import { hasImpedance, stepAppended, type FaultStudy } from '../studies/faultCurrent/faultCurrent';
import { isThreePhase, redropPath, type VoltageDropStudy } from '../studies/voltageDrop/voltageDrop';
import { conductorDropRow, nodeFault, voltageDropInputs, type ConductorDrop } from '../studies/index';
import { settleTables } from '../studies/lazyTable';
import { edgeFrom, edgeTo, KIND, orderPositions, type Graph } from '../topology/graph';
import { isJoint } from '../topology/runs';
import { conductorIndexOf, keepConductorIndex, rejudge, reported, withRows } from './rejudge';

/**
 * Equipment added to the drawing, re-checked without the whole analysis (./incremental.ts dispatches
 * here): the kept graph, runs, roll-up and study arrays grow by the new piece, and its supply path is
 * rolled up and judged again (./rejudge.ts).
 */

/**
 * What the analysis computes of the network's shape and does not keep, kept by the session for the
 * edits that add to the drawing (`recheckAppended`): the system at and what is served below each node,
 * and how many loads lie at and below each. Built from the analysis on the first such edit and kept up
 * with each; a whole analysis leaves it behind (it belongs to the graph it was built for).
 */
interface Shape {
  /** The graph's node kinds it was built for: a new graph (a whole analysis) makes a new one. */
  readonly nodeKind: Uint8Array;
  readonly systems: Pick<NetworkSystems, 'at' | 'service' | 'systemId' | 'servesBits'>;
  /** Loads at and below each node, as the roll-up counts them (loads.ts `onlyLoad`). */
  readonly loadCount: Uint32Array;
}
export interface KeptShape {
  shape: Shape | null;
}

function shapeOf(state: AnalysisState, kept: KeptShape): Shape {
  const { graph: g, order, count, loads } = state.ctx;
  if (kept.shape && kept.shape.nodeKind === g.nodeKind) return kept.shape;
  const loadCount = new Uint32Array(g.nodes.length);
  for (let k = count - 1; k >= 0; k--) {
    const v = order[k]!;
    let c = g.nodeKind[v] === KIND.load ? 1 : 0;
    for (const e of g.outEdges[v]!) c += loadCount[edgeTo(g, e)]!;
    loadCount[v] = c;
  }
  return { nodeKind: g.nodeKind, systems: networkSystems(g, order, count, loads), loadCount };
}

/** One node added to the drawing with the one conductor or bus link that supplies it from a node already there. */
interface AppendedLeaf {
  /** The node it supplies: new (the last), or one drawn connected to nothing. */
  node: number;
  /** True when `node` is new to the drawing. */
  added: boolean;
  /** The node supplying it. */
  from: number;
  /** The new edge: a conductor's index, or -(j + 1) for bus link j (graph.ts). */
  edge: number;
}

/** The node and edge an edit appended (`AppendedLeaf`), or why the edit is something else. Compares by identity. */
/**
 * The additions of an edit as steps of one node and the edge that supplies it (`AppendedLeaf`), each
 * with the drawing as it stands after it (the last is `next`): the nodes in their order, each supplied
 * by the next new conductor or bus link (from a node drawn before it), or one edge to a node drawn
 * connected to nothing; or why the edit is something else. Compares by identity.
 */
export function appendedLeaves(state: AnalysisState, prev: Project, next: Project): { project: Project; leaf: AppendedLeaf }[] | string {
  const n0 = prev.nodes.length;
  const m0 = prev.conductors.length;
  const l0 = prev.busLinks.length;
  const added = next.nodes.length - n0;
  if (added <= 1) {
    const leaf = appendedLeaf(state, prev, next);
    return typeof leaf === 'string' ? leaf : [{ project: next, leaf }];
  }
  if (next.conductors.length - m0 + next.busLinks.length - l0 !== added) return 'equipment was pasted with more or fewer connections than pieces';
  const steps: { project: Project; leaf: AppendedLeaf }[] = [];
  let m = m0;
  let l = l0;
  let before = prev;
  for (let k = 0; k < added; k++) {
    const node = next.nodes[n0 + k]!;
    // Its supply is the next new conductor or bus link, whichever ends at it.
    const c = next.conductors[m];
    const b = next.busLinks[l];
    const byConductor = c !== undefined && c.to === node.id;
    if (!byConductor && (b === undefined || b.to !== node.id)) return 'pasted equipment is not supplied in the order it is listed';
    if (byConductor) m++;
    else l++;
    const last = k === added - 1;
    const project = last ? next : { ...next, nodes: next.nodes.slice(0, n0 + k + 1), conductors: next.conductors.slice(0, m), busLinks: next.busLinks.slice(0, l) };
    const leaf = appendedLeaf(state, before, project);
    if (typeof leaf === 'string') return leaf;
    steps.push({ project, leaf });
    before = project;
  }
  return steps;
}

/** One step of `appendedLeaves`: `prev` may hold nodes pasted in earlier steps, after those of `state`'s drawing. */
function appendedLeaf(state: AnalysisState, prev: Project, next: Project): AppendedLeaf | string {
  // A removal moves every later element to a new index, and the stages keep what they found by index: the whole analysis.
  const grew = (a: readonly unknown[], b: readonly unknown[]) => {
    if (a === b) return 0;
    if (b.length < a.length) return -1;
    for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return -1;
    return b.length - a.length;
  };
  const nodes = grew(prev.nodes, next.nodes);
  const conductors = grew(prev.conductors, next.conductors);
  const links = grew(prev.busLinks, next.busLinks);
  if (nodes < 0 || conductors < 0 || links < 0) return 'equipment or a connection was removed or replaced (every later element moves to another index, which the analysis keeps its findings by)';
  if (nodes > 1 || conductors + links > 1) return 'more than one piece of equipment or connection was added';
  if (conductors + links === 0) return 'equipment was added, connected to nothing';
  const edge = conductors === 1 ? next.conductors[prev.conductors.length]! : next.busLinks[prev.busLinks.length]!;
  const g = state.ctx.graph;
  let from = g.nodeIndex.get(edge.from);
  for (let v = g.nodes.length; from === undefined && v < prev.nodes.length; v++) if (prev.nodes[v]!.id === edge.from) from = v;
  const at = conductors === 1 ? prev.conductors.length : -(prev.busLinks.length + 1);
  if (nodes === 0) {
    // The editor's connect: to equipment drawn on its own (connected to nothing) it supplies a leaf, as if just added.
    const to = g.nodeIndex.get(edge.to);
    if (from === undefined || to === undefined || to === from || g.inEdges[to]!.length + g.outEdges[to]!.length > 0) return 'a connection was added between equipment already connected';
    return { node: to, added: false, from, edge: at };
  }
  const node = next.nodes[prev.nodes.length]!;
  if (edge.to !== node.id || from === undefined) return 'the new connection does not run from equipment already drawn to the new equipment';
  return { node: prev.nodes.length, added: true, from, edge: at };
}

type Column = Float64Array | Int32Array | Uint32Array | Uint8Array;

/**
 * `a` one longer, its last element `fill`: a view of the same memory where its buffer has room (a
 * buffer is made half as large again when it has none), so a run of additions copies each array now
 * and then, not on every edit. The view shares the earlier elements with `a`: the session owns the
 * analysis' arrays, as the re-checks that write them in place do (the studies' tables are settled first).
 */
function grown<T extends Column>(a: T, fill: number): T {
  const Of = a.constructor as { new (buffer: ArrayBufferLike, byteOffset: number, length: number): T; BYTES_PER_ELEMENT: number };
  let out: T;
  if (a.byteOffset + (a.length + 1) * Of.BYTES_PER_ELEMENT <= a.buffer.byteLength) out = new Of(a.buffer, a.byteOffset, a.length + 1);
  else {
    out = new Of(new ArrayBuffer(Math.ceil(a.length * 1.5 + 16) * Of.BYTES_PER_ELEMENT), 0, a.length + 1);
    out.set(a);
  }
  out[a.length] = fill;
  return out;
}

/**
 * `a` with `x` added at its end, in place: the session owns the analysis' lists as it owns its arrays
 * (`grown`), and copying a campus's lists on every edit costs more than the rest of the re-check.
 */
function plus<T>(a: readonly T[], x: T): T[] {
  const out = a as T[];
  out.push(x);
  return out;
}

/**
 * An index of ids to positions with ids appended, standing on the one before it (copying a campus's
 * index costs more than the rest of the re-check). Only `recheckAppended` makes one.
 */
class AppendedIndex implements ReadonlyMap<string, number> {
  readonly #base: ReadonlyMap<string, number>;
  readonly #added: ReadonlyMap<string, number>;
  constructor(before: ReadonlyMap<string, number>, id: string, at: number) {
    // One level deep: the ids appended since the base, copied (they are few next to it).
    this.#base = before instanceof AppendedIndex ? before.#base : before;
    this.#added = new Map([...(before instanceof AppendedIndex ? before.#added : []), [id, at]]);
  }
  get size(): number {
    return this.#base.size + this.#added.size;
  }
  get(id: string): number | undefined {
    return this.#base.get(id) ?? this.#added.get(id);
  }
  has(id: string): boolean {
    return this.#base.has(id) || this.#added.has(id);
  }
  *entries(): MapIterator<[string, number]> {
    yield* this.#base.entries();
    yield* this.#added.entries();
  }
  *keys(): MapIterator<string> {
    for (const [k] of this.entries()) yield k;
  }
  *values(): MapIterator<number> {
    for (const [, v] of this.entries()) yield v;
  }
  [Symbol.iterator](): MapIterator<[string, number]> {
    return this.entries();
  }
  forEach(fn: (value: number, key: string, map: ReadonlyMap<string, number>) => void): void {
    for (const [k, v] of this.entries()) fn(v, k, this);
  }
}

/** The graph with node `leaf.node` and its edge appended (the earlier arrays and lists grown in place), the list of its supply's edges new. */
function appendToGraph(g0: Graph, next: Project, leaf: AppendedLeaf): Graph {
  const { node: w, from: u, edge: e, added } = leaf;
  const inEdges = added ? plus(g0.inEdges, [e]) : (g0.inEdges as number[][]);
  const outEdges = added ? plus<number[]>(g0.outEdges, []) : (g0.outEdges as number[][]);
  // A node drawn connected to nothing has the graph's shared empty list: it gets its own.
  if (!added) inEdges[w] = [e];
  // Conductors first, then bus links, each in file order (graph.ts edgeLists): a new conductor goes before the links.
  const outs = g0.outEdges[u]!;
  let at = outs.length;
  if (e >= 0) while (at > 0 && outs[at - 1]! < 0) at--;
  outEdges[u] = [...outs.slice(0, at), e, ...outs.slice(at)];
  const graph: Graph = {
    ...g0,
    nodes: next.nodes,
    conductors: next.conductors,
    links: next.busLinks,
    nodeIndex: added ? new AppendedIndex(g0.nodeIndex, next.nodes[w]!.id, w) : g0.nodeIndex,
    nodeKind: added ? grown(g0.nodeKind, KIND[next.nodes[w]!.kind]) : g0.nodeKind,
    inEdges,
    outEdges,
  };
  if (e >= 0) {
    graph.conductorFrom = grown(g0.conductorFrom, u);
    graph.conductorTo = grown(g0.conductorTo, w);
  } else {
    graph.linkFrom = grown(g0.linkFrom, u);
    graph.linkTo = grown(g0.linkTo, w);
  }
  return graph;
}

/**
 * The supply-to-load order with node `leaf.node` added: right after the last of the nodes its supply
 * feeds before it (through an edge listed before its own) with no other supply, else right after its
 * supply. What reads the order needs a node after its supply, and the nodes one node supplies in the
 * order of its edges (the voltage-drop study sums them so, topology/graph.ts topologicalOrder); the
 * whole order is not made again.
 */
function orderWith(g: Graph, order: Int32Array, count: number, leaf: AppendedLeaf): Int32Array {
  const { node: w, from: u, edge: e } = leaf;
  const pos = orderPositions(order, count);
  let at = pos[u]!;
  for (const x of g.outEdges[u]!) {
    if (x === e) break;
    const v = edgeTo(g, x);
    if (v >= 0 && g.inEdges[v]!.length === 1 && pos[v]! > at) at = pos[v]!;
  }
  // A node drawn connected to nothing leaves its place among the nodes supplied by nothing (they come first).
  const rest = leaf.added ? order.subarray(0, count) : order.filter((v) => v !== w);
  if (!leaf.added && pos[w]! < at) at--;
  const out = new Int32Array(rest.length + 1);
  out.set(rest.subarray(0, at + 1));
  out[at + 1] = w;
  out.set(rest.subarray(at + 1), at + 2);
  return out;
}

/** Equipment whose addition starts a system or a supply of its own: the whole analysis places it. */
const STARTS_A_SYSTEM: ReadonlySet<string> = new Set(['utility', 'generator', 'transformer']);

/**
 * Re-checks the network after one node was added below a node already drawn, with the conductor or
 * bus link that supplies it (the editor's "add equipment" below a breaker or panelboard): the graph,
 * runs, roll-up and studies grown by one node (and one conductor); the loads and drops along its
 * supply path; every run on that path judged again with the new one (see `rejudge`), its findings and
 * report lines; the new node's fault current and its 110.9/110.10 finding, the shape of the network
 * (its dangling ends); the circuits on the path that now serve more (their neutral and 310.15(E)
 * count) are made up again. Returns why not where the addition reaches further: a new source or
 * transformer, a transformer secondary, a conductor that continues a run through a splice or tap box,
 * one on the service, a node on the path with several supplies, a new study note (or one made earlier
 * in the walk), a verdict on the path that changes (see `rejudge`), or a drawing with a loop.
 */
export function recheckAppended(state: AnalysisState, next: Project, leaf: AppendedLeaf, kept: KeptShape): AnalysisState | string {
  const prev = state.ctx;
  const g0 = prev.graph;
  const { node: w, from: u, edge: e, added } = leaf;
  const node = next.nodes[w]!;
  if (prev.count !== g0.nodes.length) return 'the drawing has a loop';
  if (KIND[node.kind] === undefined || STARTS_A_SYSTEM.has(node.kind)) return `a ${node.kind} was ${added ? 'added' : 'connected'} (it starts a system of its own)`;
  if (added && g0.nodeIndex.has(node.id)) return 'the new equipment repeats an id';
  if (e >= 0 ? conductorIndexOf(state).has(next.conductors[e]!.id) : next.busLinks.some((l, j) => l.id === next.busLinks[-e - 1]!.id && j !== -e - 1)) return 'the new connection repeats an id';
  if (e >= 0 && g0.nodeKind[u] === KIND.transformer) return "a transformer secondary was added (the primary's rules read its secondaries)";
  if (node.kind === 'load' && node.faultContributionXFlc !== undefined) return 'a load with a motor contribution was added (the fault current of its zone moves)';
  const { fault: fault0, drop: drop0 } = state.studies;
  // A load drawn on its own has no known current: the voltage-drop study's note about such loads may go when it is connected.
  if (!added && node.kind === 'load' && prev.loads.loadCircuits[w] === null && drop0.notes.length > 1) return 'a load without a known current was connected (the voltage-drop study may drop its note)';
  // 110.24: equipment supplied by a conductor from a utility, through splices, has a service marking.
  let up = u;
  while (up >= 0 && g0.nodeKind[up] === KIND.splice) up = fault0.parent[up]!;
  if (e >= 0 && up >= 0 && g0.nodeKind[up] === KIND.utility) return 'equipment was added on the service conductors (110.24)';
  // The supply path, the new node first: every node on it supplied once, so its roll-up changes along it alone.
  const path = [w];
  for (let v = u; v >= 0; ) {
    path.push(v);
    const ins = g0.inEdges[v]!;
    if (ins.length === 0) break;
    if (ins.length > 1) return 'a node on the supply path has several supplies';
    if (path.length > g0.nodes.length + 1) return 'the supply path loops';
    v = edgeFrom(g0, ins[0]!);
  }

  // A splice or tap box with one conductor in and one out joins them into one run (topology/runs.ts).
  const wasJoint = isJoint(g0, u);
  // From here the session's arrays and lists are grown in place: a re-check that gives up runs the whole analysis.
  const graph = appendToGraph(g0, next, leaf);
  if (wasJoint !== isJoint(graph, u)) return 'the new conductor continues a run through a splice or tap box, or splits one';
  const order = orderWith(graph, prev.order, prev.count, leaf);
  const count = prev.count + (added ? 1 : 0);
  // Per node: one longer for a new node; a node connected keeps its place, written again below.
  const perNode = <T extends Column>(a: T, fill: number): T => (added ? grown(a, fill) : a);
  const onCycle = perNode(prev.onCycle, 0);

  // The roll-up: the new node on its supply's system, then the totals and load counts along the path.
  const l0 = prev.loads;
  const loads: SystemLoads = {
    voltsLL: perNode(l0.voltsLL, Number.NaN),
    phases: perNode(l0.phases, 0),
    voltsLN: perNode(l0.voltsLN, Number.NaN),
    vaNoncontinuous: perNode(l0.vaNoncontinuous, 0),
    vaContinuous: perNode(l0.vaContinuous, 0),
    largestMotorVA: perNode(l0.largestMotorVA, 0),
    singleA: perNode(l0.singleA, 0),
    singleCalcA: perNode(l0.singleCalcA, 0),
    unknown: perNode(l0.unknown, 0),
    onlyLoad: perNode(l0.onlyLoad, -1),
    loadCircuits: added ? plus(l0.loadCircuits, null) : l0.loadCircuits,
    ownArticle: perNode(l0.ownArticle, 0),
  };
  systemFromSupplies(graph, loads, w);
  const shape0 = shapeOf(state, kept);
  const loadCount = perNode(shape0.loadCount, 0);
  const isLoad = node.kind === 'load';
  for (const v of path) {
    // A node connected already counts itself.
    if (isLoad && (added || v !== w)) {
      loadCount[v] = loadCount[v]! + 1;
      loads.onlyLoad[v] = loadCount[v] === 1 ? w : -1;
    }
    rollUpAt(graph, loads, v);
  }

  // What each circuit serves: the new node's, then up the path; a circuit above that now serves more is made up anew (the whole analysis).
  const s0 = shape0.systems;
  const systems = { at: added ? plus(s0.at, s0.at[u]!) : s0.at, service: perNode(s0.service, 0), systemId: perNode(s0.systemId, 0), servesBits: perNode(s0.servesBits, 0) };
  systemFromSupply(graph, systems, w);
  // The circuits whose load end now serves more are made up again (their neutral and 310.15(E) count), with their ampacity.
  const remade = e >= 0 ? [e] : [];
  for (const v of path) {
    const bits = servesBitsAt(graph, loads, systems.at, systems.servesBits, v);
    if (bits !== systems.servesBits[v] && v !== w && graph.inEdges[v]![0]! >= 0) remade.push(graph.inEdges[v]![0]!);
    systems.servesBits[v] = bits;
  }
  const circuits = prev.circuits.slice();
  const ampacities = prev.ampacities.slice();
  const memo = new Map<number, ConductorCircuit>();
  for (const c of remade) {
    circuits[c] = conductorCircuit(graph, systems, c, memo);
    ampacities[c] = conductorAmpacity(next.conductors[c]!, prev.edition, next.project.terminationDefault, circuits[c]!.currentCarrying.adjustmentCount);
  }
  const members = prev.runs.members.slice();
  let runOf = prev.runs.runOf;
  if (e >= 0) {
    runOf = grown(runOf, members.length);
    members.push([e]);
  }
  const runs = { members, runOf };
  const base = { ...prev, project: next, graph, order, count, onCycle, loads, runs, circuits, ampacities };
  // What the classifier learned: the new node's supply, and an OCPD below each node of the path.
  const below = perNode(state.walk.below, 0);
  for (const v of path) below[v] = ocpdBelowAt(graph, below, v);
  const walk0 = { ...state.walk, below };
  const supply = keptNodeSupply({ ...base, facts: [] }, walk0, w);
  const nodeSupply = added ? plus(state.walk.nodeSupply, supply) : (state.walk.nodeSupply as KeptWalk['nodeSupply'][number][]);
  nodeSupply[w] = supply;
  const walk: KeptWalk = { ...walk0, nodeSupply };

  // The studies, one node (and conductor) longer: the new node's fault current; the drops along the path.
  const fault = growFault(fault0, e >= 0, added);
  const note = stepAppended(graph, fault, w, u, e);
  // The study's notes come in the order the supply-to-load walk first makes them: the new one must be made earlier.
  if (note !== null && (!fault.notes.includes(note) || !madeEarlier(graph, order, w, next.conductors[e]!))) return 'the fault study gains a note (a conductor counted as zero impedance), or makes one earlier';
  if (isLoad && loads.loadCircuits[w] === null && drop0.notes.length === 1) return 'the voltage-drop study gains a note (a load without a known current)';
  const drop = growDrop(drop0, e >= 0, added);
  const studied = { ...state.studies, fault, drop };
  const ctx0 = { ...base, verdicts: prev.verdicts, fixes: prev.fixes };
  const inputs = voltageDropInputs(ctx0, fault);
  for (const c of remade) drop.singlePhase[c] = isThreePhase(inputs, c) ? 0 : 1;
  const conductorMoved = new Uint8Array(graph.conductors.length);
  const nodeMoved = new Uint8Array(graph.nodes.length);
  const among = { conductors: [] as number[], nodes: [] as number[] };
  redropPath(graph, drop, inputs, path, conductorMoved, nodeMoved, among);

  // The state as if the new node and conductor had always been there with no verdict: what the re-check stands on.
  const start = grown(state.conductorFindingStart, state.conductorFindingStart[g0.conductors.length]!);
  if (e >= 0) keepConductorIndex(graph, new AppendedIndex(conductorIndexOf(state), next.conductors[e]!.id, e));
  const stood: AnalysisState = { ...state, ctx: { ...prev, graph, runs }, walk, studies: studied, conductorFindingStart: e >= 0 ? start : state.conductorFindingStart };
  const rs = new Set<number>();
  for (const v of path) for (const x of graph.inEdges[v]!) if (x >= 0) rs.add(runs.runOf[x]!);
  const judged = rejudge(stood, base, rs);
  if (typeof judged === 'string') return judged;
  if (e >= 0 && judged.ctx.verdicts[runs.runOf[e]!]!.family === 'service') return 'the new conductor is a service conductor';
  const dropRows = among.conductors.map((c): [number, ConductorDrop] => [c, conductorDropRow(graph, fault, drop, c)]);
  const studies = withRows(state.report.studies!, [[w, nodeFault(graph, fault, w)]], dropRows);
  const after = reported(stood, judged, { conductorMoved, nodeMoved, among, faultNodes: [w], addedNodes: [w], panelboards: node.kind === 'bus' ? [w] : [], topology: [u, w] }, studies);
  kept.shape = { nodeKind: graph.nodeKind, systems, loadCount };
  return e >= 0 ? { ...after, report: { ...after.report, assumptions: assumptionsFor(next) } } : after;
}

/**
 * True when a node before `w` in the supply-to-load `order` is supplied by one conductor counted as
 * zero impedance for the reason `c` is (no size; no length or Table 9 value): the fault study's note
 * for it is made there first, so `c` adds nothing to the notes or their order.
 */
function madeEarlier(g: Graph, order: Int32Array, w: number, c: Conductor): boolean {
  const sizeless = c.size === undefined;
  for (let k = 0; k < order.length && order[k] !== w; k++) {
    const ins = g.inEdges[order[k]!]!;
    if (ins.length !== 1 || ins[0]! < 0 || g.conductorFrom[ins[0]!]! < 0) continue;
    const d = g.conductors[ins[0]!]!;
    if (!hasImpedance(d) && (d.size === undefined) === sizeless) return true;
  }
  return false;
}

/**
 * The fault study with room for one more node (and conductor), as the whole study leaves a node it
 * has not reached. Its arrays are written in place from here on: the tables of reports already handed
 * out that are still to be built from them are built first (studies/lazyTable.ts).
 */
function growFault(f: FaultStudy, conductor: boolean, node: boolean): FaultStudy {
  settleTables(f);
  const nan = Number.NaN;
  const perNode = <T extends Column>(a: T, fill: number): T => (node ? grown(a, fill) : a);
  return {
    kA: perNode(f.kA, nan),
    xOverR: perNode(f.xOverR, nan),
    r: perNode(f.r, nan),
    x: perNode(f.x, nan),
    loop: perNode(f.loop, 0),
    voltsLL: perNode(f.voltsLL, nan),
    motorKA: perNode(f.motorKA, 0),
    lineToGroundKA: perNode(f.lineToGroundKA, nan),
    upperBound: perNode(f.upperBound, 0),
    unknownWhy: node ? plus(f.unknownWhy, '') : f.unknownWhy,
    parent: perNode(f.parent, -1),
    parentEdge: perNode(f.parentEdge, 0),
    stepR: perNode(f.stepR, 0),
    stepX: perNode(f.stepX, 0),
    zone: perNode(f.zone, -1),
    zoneMotorA: perNode(f.zoneMotorA, 0),
    rOhmPerKft: conductor ? grown(f.rOhmPerKft, nan) : f.rOhmPerKft,
    xOhmPerKft: conductor ? grown(f.xOhmPerKft, nan) : f.xOhmPerKft,
    notes: f.notes,
  };
}

/** The voltage-drop study with room for one more node (and conductor), as the whole study leaves what is not on the supply tree. */
function growDrop(d: VoltageDropStudy, conductor: boolean, node: boolean): VoltageDropStudy {
  settleTables(d);
  const nan = Number.NaN;
  const perNode = <T extends Column>(a: T, fill: number): T => (node ? grown(a, fill) : a);
  return {
    currentA: conductor ? grown(d.currentA, nan) : d.currentA,
    powerFactor: conductor ? grown(d.powerFactor, nan) : d.powerFactor,
    pct: conductor ? grown(d.pct, nan) : d.pct,
    singlePhase: conductor ? grown(d.singlePhase, 0) : d.singlePhase,
    totalPct: perNode(d.totalPct, nan),
    circuitPct: perNode(d.circuitPct, nan),
    p: perNode(d.p, 0),
    q: perNode(d.q, 0),
    notes: d.notes,
  };
}
