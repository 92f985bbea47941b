import { ruleCitation } from '../rules/define';
import type { Graph } from '../topology/graph';
import type { RunVerdict } from './classify';
import type { FixedContext } from './context';
import { effectiveRatingA, nodeLabel } from './equipment';
import { describeRun } from './summary';
import type { ConductorReport, DeviceRef, Finding } from './types';

/** Stage: one report line per conductor, in file order; what a run's conductors share is shared, not copied. */
export function conductorReports(ctx: FixedContext & { findings: readonly Finding[] }): ConductorReport[] {
  const { graph, verdicts } = ctx;
  const chains = new Map<string, readonly string[]>();
  for (const v of verdicts) if (v.facts.conductorIds.length > 1) chains.set(v.facts.conductorIds[0]!, v.facts.conductorIds);
  const findingIdsBySubject = findingIdsByConductor(ctx.findings, (id) => chains.get(id));
  const conductors: ConductorReport[] = new Array(graph.conductors.length);
  const shared = sharedParts(graph);
  for (let ci = 0; ci < graph.conductors.length; ci++) conductors[ci] = conductorReport(ctx, ci, findingIdsBySubject.get(graph.conductors[ci]!.id), shared);
  return conductors;
}

/**
 * The ids of the findings each conductor's report line lists, by conductor id. `chainOf(id)` gives
 * the conductors judged as one run whose first conductor is `id` (undefined for none or a run of one).
 */
export function findingIdsByConductor(findings: readonly Finding[], chainOf: (id: string) => readonly string[] | undefined): Map<string, string[]> {
  // A run's finding sits on its first conductor and names the others as related: every segment shows it.
  const findingIdsBySubject = new Map<string, string[]>();
  const add = (id: string, findingId: string) => {
    const list = findingIdsBySubject.get(id) ?? [];
    list.push(findingId);
    findingIdsBySubject.set(id, list);
  };
  for (const f of findings) {
    if (f.subject.kind !== 'conductor') continue;
    add(f.subject.id, f.id);
    const chain = chainOf(f.subject.id);
    if (chain) for (const r of f.related) if (r.kind === 'conductor' && r.id !== f.subject.id && chain.includes(r.id)) add(r.id, f.id);
  }
  return findingIdsBySubject;
}

/** What report lines share, looked up once for all the lines a report builds: the device and supply objects by node. */
export interface SharedParts {
  devices: Map<number, DeviceRef>;
  supplies: Map<number, ConductorReport['supply']>;
}

export function sharedParts(graph: Graph): SharedParts {
  return { devices: byNodeOf(deviceRefs, graph), supplies: byNodeOf(supplyRefs, graph) };
}

/** The report line of conductor `ci`, given the ids of its findings. Built straight from its run's verdict: no object per run in between. */
export function conductorReport(ctx: FixedContext, ci: number, findingIds: string[] | undefined, shared: SharedParts = sharedParts(ctx.graph)): ConductorReport {
  const { graph, runs, verdicts, ampacities, edition } = ctx;
  const c = graph.conductors[ci]!;
  const r = runs.runOf[ci]!;
  const v = verdicts[r]!;
  const f = v.facts;
  return {
    id: c.id,
    label: c.label ?? c.id,
    from: c.from,
    to: c.to,
    verdict: v.verdict,
    rule: v.rule?.id ?? null,
    cites: v.rule ? ruleCitation(v.rule, edition) : null,
    role: v.role,
    summary: summaryOf(v),
    size: c.size ?? null,
    material: c.material,
    parallelSets: c.parallelSets,
    lengthFt: c.lengthFt ?? null,
    ampacity: ampacities[ci]!.working,
    upstreamDevice: v.deviceNode >= 0 ? deviceRef(graph, shared.devices, v.deviceNode) : null,
    supply: supplyOf(graph, shared.supplies, v),
    chain: f.conductorIds,
    tapLengthFt: tapLengthOf(v),
    load: f.loadA === null || f.calculatedLoadA === null ? null : { flowingA: f.loadA, calculatedA: f.calculatedLoadA },
    tried: v.tried,
    fixes: ctx.fixes[r]!,
    findingIds: findingIds ?? NONE,
  };
}

/** What the upstream walk ended on: the source or OCPD itself, or the device ahead of a run supplied from another. */
function supplyOf(graph: Graph, byNode: Map<number, ConductorReport['supply']>, v: RunVerdict): ConductorReport['supply'] {
  const s = v.supply;
  if (s.kind === 'ocpd' || s.kind === 'utility' || s.kind === 'generator' || s.kind === 'transformer') return supplyRef(graph, byNode, s.kind, s.node);
  return v.deviceNode >= 0 ? supplyRef(graph, byNode, 'ocpd', v.deviceNode) : NO_SUPPLY;
}

/** The tap length the rule counted: a feeder tap's, a tap from a tap's or a secondary's run length; a transformer tap's total. */
function tapLengthOf(v: RunVerdict): number | null {
  if (v.verdict === 'tap-transformer') return transformerTapLength(v);
  const isTap = v.family === 'fed-by-ocpd' && v.verdict !== 'protected' && v.verdict !== 'protected-next-size' && v.verdict !== 'incomplete';
  return isTap || v.family === 'on-tap' || v.family === 'secondary' ? v.facts.lengthFt : null;
}

/** One DeviceRef per device node, shared by every run it feeds (reports are read-only); kept while the nodes are (an incremental re-check of a conductor keeps them). */
const deviceRefs = new WeakMap<Graph['nodes'], Map<number, DeviceRef>>();
function deviceRef(graph: Graph, byNode: Map<number, DeviceRef>, v: number): DeviceRef {
  let d = byNode.get(v);
  if (!d) {
    const n = graph.nodes[v]!;
    byNode.set(v, (d = { id: n.id, kind: n.kind, label: nodeLabel(n), ratingA: effectiveRatingA(n) }));
  }
  return d;
}

/** What a run's supply end is: one object per node, shared by every run it supplies (reports are read-only); kept while the nodes are. */
const supplyRefs = new WeakMap<Graph['nodes'], Map<number, ConductorReport['supply']>>();
const NO_SUPPLY: ConductorReport['supply'] = { kind: 'none', id: null };
function supplyRef(graph: Graph, byNode: Map<number, ConductorReport['supply']>, kind: 'ocpd' | 'utility' | 'generator' | 'transformer', v: number): ConductorReport['supply'] {
  const ref = byNode.get(v);
  // A node is one kind of supply (an OCPD or a source), so the kind always agrees; were it not to, the line gets its own.
  if (ref) return ref.kind === kind ? ref : { kind, id: graph.nodes[v]!.id };
  const made: ConductorReport['supply'] = { kind, id: graph.nodes[v]!.id };
  byNode.set(v, made);
  return made;
}

/**
 * The objects kept for the nodes of `graph` in `refs`, by node index, made on first use. A Map, not an
 * array as long as the nodes: an edit of one node gives a new nodes list, and a re-check then reads a
 * handful of nodes, where allocating two arrays of every node cost it about 0.3 ms at 10 000 conductors.
 */
function byNodeOf<T>(refs: WeakMap<Graph['nodes'], Map<number, T>>, graph: Graph): Map<number, T> {
  let byNode = refs.get(graph.nodes);
  if (!byNode) refs.set(graph.nodes, (byNode = new Map<number, T>()));
  return byNode;
}

/**
 * The run's summary. A riser protects thousands of runs with the same device on the same
 * ampacity, and their summaries read alike: one string each for those (strings are values).
 */
const protectedSummaries = { protected: new Map<number, Map<number, string>>(), 'protected-next-size': new Map<number, Map<number, string>>() };
let protectedSummaryCount = 0;
function summaryOf(v: RunVerdict): string {
  const R = v.facts.supplyOcpdA;
  const A = v.facts.ampacityA;
  if ((v.verdict !== 'protected' && v.verdict !== 'protected-next-size') || R === null || A === null) return describeRun(v);
  const byR = protectedSummaries[v.verdict];
  let byA = byR.get(R);
  let text = byA?.get(A);
  if (text !== undefined) return text;
  if (++protectedSummaryCount > 4096) {
    protectedSummaries.protected.clear();
    protectedSummaries['protected-next-size'].clear();
    protectedSummaryCount = 0;
    byA = undefined;
  }
  if (!byA) byR.set(R, (byA = new Map()));
  byA.set(A, (text = describeRun(v)));
  return text;
}

/** 240.21(B)(3) counts primary plus secondary: a secondary its own set's total, the primary the longest. */
function transformerTapLength(v: RunVerdict): number | null {
  const lengths = v.tried.find((t) => t.ruleId === 'tap-transformer')?.conditions.filter((c) => c.id === 'length') ?? [];
  const own = lengths.find((c) => c.data.secondaryId === v.facts.conductorIds[0]);
  const totals = (own ? [own] : lengths).map((c) => c.data.totalFt).filter((x): x is number => typeof x === 'number');
  return totals.length > 0 ? Math.max(...totals) : null;
}


/** Shared empty list: most conductors have no findings. Reports are read-only. */
const NONE: string[] = Object.freeze([]) as unknown as string[];
