import type { CodeEdition } from '../model/schema';
import { ruleCitation } from '../rules/define';
import type { Graph } from '../topology/graph';
import type { RunVerdict } from './classify';
import type { FixedContext } from './context';
import { effectiveRatingA, nodeLabel } from './equipment';
import { describeRun } from './summary';
import type { Citation, ConductorReport, DeviceRef, Finding } from './types';

/** Stage: one report line per conductor, in file order; what a run's conductors share is built once per run. */
export function conductorReports(ctx: FixedContext & { findings: readonly Finding[] }): ConductorReport[] {
  const { graph, runs, verdicts, edition } = ctx;
  const chains = new Map<string, readonly string[]>();
  for (const v of verdicts) if (v.facts.conductorIds.length > 1) chains.set(v.facts.conductorIds[0]!, v.facts.conductorIds);
  const findingIdsBySubject = findingIdsByConductor(ctx.findings, (id) => chains.get(id));
  const shared = verdicts.map((v) => runShared(graph, v, edition));
  const conductors: ConductorReport[] = new Array(graph.conductors.length);
  for (let ci = 0; ci < graph.conductors.length; ci++) {
    conductors[ci] = conductorReport(ctx, ci, findingIdsBySubject.get(graph.conductors[ci]!.id), shared[runs.runOf[ci]!]);
  }
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

/** The report line of conductor `ci`, given the ids of its findings and (when known) what its run's lines share. */
export function conductorReport(ctx: FixedContext, ci: number, findingIds: string[] | undefined, shared?: RunShared): ConductorReport {
  const { graph, runs, verdicts, ampacities, edition } = ctx;
  const c = graph.conductors[ci]!;
  const r = runs.runOf[ci]!;
  const v = verdicts[r]!;
  const s = shared ?? runShared(graph, v, edition);
  return {
      id: c.id,
      label: c.label ?? c.id,
      from: c.from,
      to: c.to,
      verdict: v.verdict,
      rule: v.rule?.id ?? null,
      cites: s.cites,
      role: v.role,
      summary: s.summary,
      size: c.size ?? null,
      material: c.material,
      parallelSets: c.parallelSets,
      lengthFt: c.lengthFt ?? null,
      ampacity: ampacities[ci]!.working,
      upstreamDevice: s.device,
      supply: s.supply,
      chain: v.facts.conductorIds,
      tapLengthFt: s.tapLengthFt,
      load: s.load,
      tried: v.tried,
      fixes: ctx.fixes[r]!,
      findingIds: findingIds ?? NONE,
    };
}

interface RunShared {
  cites: Citation | null;
  summary: string;
  device: DeviceRef | null;
  supply: ConductorReport['supply'];
  tapLengthFt: number | null;
  load: ConductorReport['load'];
}

function runShared(graph: Graph, v: RunVerdict, edition: CodeEdition): RunShared {
  const device = v.deviceNode >= 0 ? deviceRef(graph, v.deviceNode) : null;
  const s = v.supply;
  const supply: ConductorReport['supply'] =
    s.kind === 'ocpd' || s.kind === 'utility' || s.kind === 'generator' || s.kind === 'transformer'
      ? supplyRef(graph, s.kind, s.node)
      : device ? supplyRef(graph, 'ocpd', v.deviceNode) : NO_SUPPLY;
  const isTap = v.family === 'fed-by-ocpd' && v.verdict !== 'protected' && v.verdict !== 'protected-next-size' && v.verdict !== 'incomplete';
  const f = v.facts;
  return {
    cites: v.rule ? ruleCitation(v.rule, edition) : null,
    summary: summaryOf(v),
    device,
    supply,
    tapLengthFt: v.verdict === 'tap-transformer' ? transformerTapLength(v) : isTap || v.family === 'on-tap' || v.family === 'secondary' ? f.lengthFt : null,
    load: f.loadA === null || f.calculatedLoadA === null ? null : { flowingA: f.loadA, calculatedA: f.calculatedLoadA },
  };
}

/** One DeviceRef per device node, shared by every run it feeds (reports are read-only); kept while the nodes are (an incremental re-check of a conductor keeps them). */
const deviceRefs = new WeakMap<Graph['nodes'], (DeviceRef | undefined)[]>();
function deviceRef(graph: Graph, v: number): DeviceRef {
  let byNode = deviceRefs.get(graph.nodes);
  if (!byNode) deviceRefs.set(graph.nodes, (byNode = new Array(graph.nodes.length)));
  let d = byNode[v];
  if (!d) {
    const n = graph.nodes[v]!;
    byNode[v] = d = { id: n.id, kind: n.kind, label: nodeLabel(n), ratingA: effectiveRatingA(n) };
  }
  return d;
}

/** What a run's supply end is, one object per node and kind, shared by every run it supplies (reports are read-only). */
const supplyRefs = new WeakMap<Graph, Map<number, ConductorReport['supply']>>();
const NO_SUPPLY: ConductorReport['supply'] = { kind: 'none', id: null };
function supplyRef(graph: Graph, kind: 'ocpd' | 'utility' | 'generator' | 'transformer', v: number): ConductorReport['supply'] {
  let byNode = supplyRefs.get(graph);
  if (!byNode) supplyRefs.set(graph, (byNode = new Map()));
  // A node is one kind of supply (an OCPD, or a source); the kind is in the key all the same.
  const key = v * 4 + (kind === 'ocpd' ? 0 : kind === 'utility' ? 1 : kind === 'generator' ? 2 : 3);
  let ref = byNode.get(key);
  if (!ref) byNode.set(key, (ref = { kind, id: graph.nodes[v]!.id }));
  return ref;
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
