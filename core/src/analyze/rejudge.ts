import type { NodeId } from '../model/schema';
import { conductorReport, sharedParts, findingIdsByConductor } from './conductorReports';
import { conductorFindingsOf } from './conductorFindings';
import { rejudgeRuns, type KeptWalk, type RunVerdict } from './classify';
import { fixesOfRun } from './fixes';
import { runFactsOf, siteFacts } from './runFacts';
import { countsOf, type AnalysisState } from './analyze';
import type { FixedContext } from './context';
import type { AnalysisReport, Finding } from './types';
import type { RunFacts } from '../rules/facts';
import { faultDutyFinding, NO_RATING, NO_RATING_ID, NO_RATING_MAX_RELATED, noRatingFinding, redoDropFindings, RELIES_ON_DEVICE_AHEAD, seriesByLoadSide, tapWithstand, type ConductorDrop, type NodeFault, type StudiesReport, type WithstandResult } from '../studies/index';
import { lazyTable } from '../studies/lazyTable';
import { conductorWithstand } from '../rules/conductor-withstand';
import { equipmentSccr } from '../rules/equipment-sccr';
import { interruptingRating } from '../rules/interrupting-rating';
import { KIND, orderPositions, type Graph } from '../topology/graph';
import { voltageDropRule } from '../rules/voltage-drop';
import { transformerProtection } from '../rules/transformer-protection';
import { panelboardProtection } from '../rules/panelboard-protection';
import { transformerFindingOf } from './equipmentFindings';
import { panelboardFindingOf } from './panelboardFindings';
import { nodeTopologyFindings } from './topologyFindings';

/**
 * What every incremental re-check (./incremental.ts) shares once it knows what an edit reaches: the
 * runs judged again (with what a changed verdict reaches, up to a bound), then the report written back:
 * findings spliced in place, report lines, study table rows, withstand and 110.9 duty findings.
 */

/** The studies report with rows of its short-circuit table (by node) and voltage-drop table (by conductor) replaced; the tables are built when read. */
export function withRows(before: StudiesReport, faults: readonly [number, NodeFault][], drops: readonly [number, ConductorDrop][]): StudiesReport {
  const studies = copyOf(before);
  if (faults.length > 0) patchTable<'faults', NodeFault>(studies, before, 'faults', faults);
  if (drops.length > 0) {
    const voltageDrop = copyOf(before.voltageDrop);
    patchTable<'conductors', ConductorDrop>(voltageDrop, before.voltageDrop, 'conductors', drops);
    studies.voltageDrop = voltageDrop;
  }
  return studies;
}

/**
 * A shallow copy of `o` with its properties as they are: a table of the studies not yet built
 * (studies/lazyTable.ts, `patchTable`) stays so, where spreading would build it. Replace a copied
 * table with `patchTable` or Object.defineProperty, never by assignment (its setter is the original's).
 */
function copyOf<T extends object>(o: T): T {
  const copy = Object.defineProperties({}, Object.getOwnPropertyDescriptors(o)) as T;
  const pending = pendingRows.get(o);
  if (pending) pendingRows.set(copy, pending);
  return copy;
}

/** A table `patchTable` has not built: the object whose table it starts from, and the rows each re-check since replaced, in order. */
interface PendingRows {
  readonly base: object;
  readonly rows: readonly (readonly [number, unknown][])[];
}
/** By the object holding the table (each holds one table `patchTable` patches). */
const pendingRows = new WeakMap<object, PendingRows>();
/** Past this many re-checks standing on one base, `patchTable` builds the table at once, so the old reports are let go. */
const MAX_PENDING_EDITS = 32;

/**
 * Puts on `owner[key]` the table `before[key]` with the `rows` (index, row) replaced, built when first
 * read: re-checks whose tables nobody reads copy none of a whole table (20 000 rows at 10 000
 * conductors) each. A table patched again stands on the same base with the rows added, so it is
 * built with one copy whenever it is read.
 */
function patchTable<K extends string, R>(owner: { [k in K]: R[] }, before: { readonly [k in K]: R[] }, key: K, rows: readonly [number, R][]): void {
  const prev = pendingRows.get(before);
  const pending: PendingRows = prev ? { base: prev.base, rows: [...prev.rows, rows] } : { base: before, rows: [rows] };
  let from: PendingRows | null = pending;
  const build = (): R[] => {
    const table = (from!.base as { readonly [k in K]: R[] })[key].slice();
    for (const changed of from!.rows as readonly (readonly [number, R][])[]) for (const [i, row] of changed) table[i] = row;
    from = null;
    return table;
  };
  if (pending.rows.length >= MAX_PENDING_EDITS) {
    Object.defineProperty(owner, key, { value: build(), enumerable: true, writable: true, configurable: true });
    pendingRows.delete(owner);
    return;
  }
  lazyTable(owner, key, build, []);
  pendingRows.set(owner, pending);
}

/**
 * `rs` with the primary runs of every transformer a run of `rs` leaves: a transformer's primary reads
 * the facts of its secondaries (240.21(B)(3)). Adds to `rs` and returns it.
 */
export function withPrimaries(g: Graph, runs: FixedContext['runs'], rs: Set<number>): Set<number> {
  for (const r of [...rs]) {
    const from = g.conductorFrom[runs.members[r]![0]!]!;
    if (from >= 0 && g.nodeKind[from] === KIND.transformer) for (const e of g.inEdges[from]!) if (e >= 0) rs.add(runs.runOf[e]!);
  }
  return rs;
}

/** Runs judged again and what comes of it. */
interface Rejudged {
  readonly ctx: FixedContext;
  readonly walk: KeptWalk;
  /** The runs judged again, in supply-to-load order. */
  readonly runs: readonly number[];
}

/**
 * Judges the runs `rs` again after what their base facts read changed (`base` holds the new
 * project, graph and roll-up), with the secondaries of any transformer they feed, in supply-to-load
 * order as the classifier does, then their fixes. Returns why not when a verdict changes (what is
 * supplied through the run reads it) or a run shares its verdict with another.
 */
export function rejudge(state: AnalysisState, base: Omit<FixedContext, 'verdicts' | 'fixes'>, rs: Set<number>): Rejudged | string {
  for (;;) {
    const judged = rejudgeOnce(state, base, rs);
    if (typeof judged === 'string' || !('reached' in judged)) return judged;
    // A verdict changed: what is supplied through its run is judged again too, up to a bound.
    for (const r of judged.reached) rs.add(r);
    if (rs.size > boundOf(base.runs.members.length)) return `the edit reaches more than ${MAX_REJUDGED_FRACTION * 100} % of the runs`;
  }
}

/**
 * Past this share of the runs judged again, the whole analysis runs instead: a re-judged run costs
 * about what it costs in the whole analysis, and the re-check adds its own bookkeeping.
 */
export const MAX_REJUDGED_FRACTION = 0.25;
/** Below this many runs (or nodes) the bound does not apply (a small drawing re-checks in no time either way). */
const MIN_REJUDGED_BOUND = 64;
/** How many of `total` runs (or nodes) an edit may reach before the whole analysis runs instead. */
export const boundOf = (total: number) => Math.max(MIN_REJUDGED_BOUND, MAX_REJUDGED_FRACTION * total);

function rejudgeOnce(state: AnalysisState, base: Omit<FixedContext, 'verdicts' | 'fixes'>, rs: Set<number>): Rejudged | { reached: number[] } | string {
  const prev = state.ctx;
  const { graph, runs } = base;
  // The secondaries of a transformer a run feeds (at its end, or bus-linked from there) are judged on that run (240.21(C)(5), (B)(3)).
  for (const r of rs) {
    const members = runs.members[r]!;
    const end = graph.conductorTo[members[members.length - 1]!]!;
    if (end < 0) continue;
    for (const tx of suppliedThrough(graph, end, false)) if (graph.nodes[tx]!.kind === 'transformer') for (const v of suppliedThrough(graph, tx, true)) for (const e of graph.outEdges[v]!) if (e >= 0) rs.add(runs.runOf[e]!);
  }
  const pos = orderPositions(base.order, base.count);
  const fromOf = (r: number) => graph.conductorFrom[runs.members[r]![0]!]!;
  const at = (r: number) => (fromOf(r) >= 0 ? pos[fromOf(r)]! : -1);
  const ordered = [...rs].sort((a, b) => at(a) - at(b) || a - b);
  const facts: RunFacts[] = [];
  let secondariesOf = state.walk.secondariesOf;
  for (const r of ordered) {
    // A run added to the drawing (recheckAppended) has no verdict yet.
    const old = prev.verdicts[r]?.facts;
    if (at(r) < 0) return 'a run is not reached from a supply';
    if (old && old.conductorIds.length !== runs.members[r]!.length) return `${old.conductorIds[0]} is judged with the run it continues`;
    facts[r] = runFactsOf(base, r, old?.site ?? siteFacts(base.project));
    const list = secondariesOf.get(fromOf(r));
    if (list && old) {
      // A transformer's primary reads the facts of its secondaries (240.21(B)(3)).
      const k = list.indexOf(old);
      if (k < 0) return 'a secondary run is judged with another';
      if (secondariesOf === state.walk.secondariesOf) secondariesOf = new Map(secondariesOf);
      (secondariesOf as Map<number, RunFacts[]>).set(fromOf(r), list.map((f, j) => (j === k ? facts[r]! : f)));
    }
  }
  const walk: KeptWalk = { ...state.walk, secondariesOf };
  const verdicts = prev.verdicts.slice();
  rejudgeRuns({ ...base, facts }, walk, verdicts, ordered);
  const reached: number[] = [];
  for (const r of ordered) {
    const a = prev.verdicts[r];
    const b = verdicts[r]!;
    const members = runs.members[r]!;
    if (b.facts.conductorIds.length !== members.length) return `${b.facts.conductorIds[0]} is now judged with the run it continues`;
    // A new run supplies nothing yet.
    if (!a) continue;
    // What is supplied through a run reads its verdict, and of an incomplete one whether only its size is missing (classify.ts isUnsizedOnOcpd).
    const sameUnsized = (a.facts.size === null) === (b.facts.size === null) && (a.facts.supplyOcpdA === null) === (b.facts.supplyOcpdA === null);
    if (a.verdict === b.verdict && a.rule === b.rule && a.family === b.family && a.deviceNode === b.deviceNode && a.generatorNode === b.generatorNode && sameUnsized) continue;
    // A new verdict reaches what is supplied through the run (judged again here only when it is in `rs`).
    if (a.deviceNode !== b.deviceNode || a.generatorNode !== b.generatorNode) return `the device ${a.facts.conductorIds[0]} is judged against changed`;
    const end = graph.conductorTo[members[members.length - 1]!]!;
    if (end >= 0) for (const v of suppliedThrough(graph, end, false)) for (const e of graph.outEdges[v]!) if (e >= 0 && !rs.has(runs.runOf[e]!)) reached.push(runs.runOf[e]!);
  }
  if (reached.length > 0) return { reached };
  const fixes = prev.fixes.slice();
  const ctx: FixedContext = { ...base, verdicts, fixes };
  for (const r of ordered) fixes[r] = fixesOfRun(ctx, r);
  return { ctx, walk, runs: ordered };
}

/**
 * The withstand table and the study findings with the short-circuit withstand judged again of the
 * runs that are (or were) taps or secondaries among `rs` (judged again: when what the withstand
 * reads of them changed, their verdict, device or conductors) and `faultMoved` (the fault current
 * where they start moved), in the order a full run writes them (by run, then by conductor of the run).
 */
function rewithstand(state: AnalysisState, ctx: FixedContext, rs: readonly number[], faultMoved: readonly number[], studies: NonNullable<AnalysisReport['studies']>): { studies: NonNullable<AnalysisReport['studies']>; findings: readonly Finding[] } {
  const old = state.report.findings.slice(state.studyFindingStart);
  const before = state.ctx.verdicts;
  const g0 = state.ctx.graph;
  // A run added to the drawing (recheckAppended) has no verdict before.
  const withstands = (r: number) => (before[r] !== undefined && RELIES_ON_DEVICE_AHEAD.has(before[r].verdict)) || RELIES_ON_DEVICE_AHEAD.has(ctx.verdicts[r]!.verdict);
  const changed = (r: number) => {
    const a = before[r];
    const b = ctx.verdicts[r]!;
    if (!a) return true;
    if (RELIES_ON_DEVICE_AHEAD.has(a.verdict) !== RELIES_ON_DEVICE_AHEAD.has(b.verdict) || a.deviceNode !== b.deviceNode) return true;
    if (b.deviceNode >= 0 && g0.nodes[b.deviceNode] !== ctx.graph.nodes[b.deviceNode]) return true;
    return ctx.runs.members[r]!.some((ci) => g0.conductors[ci] !== ctx.graph.conductors[ci]);
  };
  const redo = new Set<number>();
  for (const r of rs) if (withstands(r) && changed(r)) redo.add(r);
  for (const r of faultMoved) if (withstands(r)) redo.add(r);
  if (redo.size === 0) return { studies, findings: old };
  const { graph: g, runs } = ctx;
  const index = conductorIndexOf(state);
  const runOfId = (id: string) => runs.runOf[index.get(id)!]!;
  const added: [number, WithstandResult][] = [];
  // Findings by run, then by the conductor's place in its run.
  const key = (id: string) => runOfId(id) * (g.conductors.length + 1) + runs.members[runOfId(id)]!.indexOf(index.get(id)!);
  const found: [number, Finding][] = [];
  let first = -1;
  for (let k = 0; k < old.length; k++) {
    const f = old[k]!;
    if (f.ruleId !== conductorWithstand.id) continue;
    if (first < 0) first = k;
    if (f.subject.kind === 'conductor' && !redo.has(runOfId(f.subject.id))) found.push([key(f.subject.id), f]);
  }
  for (const r of redo) {
    const v = ctx.verdicts[r]!;
    if (!RELIES_ON_DEVICE_AHEAD.has(v.verdict)) continue;
    const w = tapWithstand(ctx.edition, g, state.studies.fault, { conductors: runs.members[r]!, deviceNode: v.deviceNode });
    if (!w) continue;
    added.push([r, w.row]);
    for (const f of w.findings) found.push([key((f.subject as { id: string }).id), f]);
  }
  const byKey = <T>(a: [number, T], b: [number, T]) => a[0] - b[0];
  // The table is by run: the rows kept and the rows judged again, merged.
  const table = studies.withstand;
  const tableRuns = withstandRunsOf(state, table);
  added.sort(byKey);
  const rows: WithstandResult[] = [];
  const rowRuns: number[] = [];
  for (let k = 0, j = 0; k <= table.length; k++) {
    const r = k < table.length ? tableRuns[k]! : Number.POSITIVE_INFINITY;
    for (; j < added.length && added[j]![0] < r; j++) {
      rows.push(added[j]![1]);
      rowRuns.push(added[j]![0]);
    }
    if (k < table.length && !redo.has(r)) {
      rows.push(table[k]!);
      rowRuns.push(r);
    }
  }
  withstandRuns.set(rows, Int32Array.from(rowRuns));
  // They come after the 110.9 and 110.10 findings and before the voltage drops.
  if (first < 0) first = old.findIndex((f) => f.ruleId === voltageDropRule.id);
  if (first < 0) first = old.length;
  const rest = old.filter((f) => f.ruleId !== conductorWithstand.id);
  const findings = [...rest.slice(0, first), ...found.sort(byKey).map((x) => x[1]), ...rest.slice(first)];
  const next = copyOf(studies);
  next.withstand = rows;
  return { studies: next, findings };
}

/** The run of each row of a withstand table, by table (a re-check that builds a table sets its own). */
const withstandRuns = new WeakMap<readonly WithstandResult[], Int32Array>();
function withstandRunsOf(state: AnalysisState, table: readonly WithstandResult[]): Int32Array {
  let out = withstandRuns.get(table);
  if (!out) {
    const index = conductorIndexOf(state);
    out = Int32Array.from(table, (row) => state.ctx.runs.runOf[index.get(row.conductorIds[0]!)!]!);
    withstandRuns.set(table, out);
  }
  return out;
}

/**
 * The study findings `section` with the 110.9 and 110.10 findings of `nodes` (whose fault current
 * moved) judged again, in the order a full run writes them: they come first, by node. Which devices
 * count in the project's "no interrupting rating" finding does not change (a fault current known
 * stays known).
 */
export function refaultDuty(ctx: FixedContext, fault: AnalysisState['studies']['fault'], section: readonly Finding[], nodes: readonly number[], added: readonly number[] = []): readonly Finding[] {
  const g = ctx.graph;
  const redo = new Set<number>();
  for (const v of nodes) {
    const kind = g.nodeKind[v];
    if (kind === KIND.breaker || kind === KIND.fuse || kind === KIND.bus) redo.add(v);
  }
  if (redo.size === 0) return section;
  const isDuty = (f: Finding) => f.subject.kind === 'node' && (f.ruleId === interruptingRating.id || f.ruleId === equipmentSccr.id);
  let end = 0;
  while (end < section.length && isDuty(section[end]!)) end++;
  const found: [number, Finding][] = [];
  for (let k = 0; k < end; k++) {
    const f = section[k]!;
    const v = g.nodeIndex.get((f.subject as { id: string }).id)!;
    if (!redo.has(v)) found.push([v, f]);
  }
  const series = seriesByLoadSide(ctx.project);
  const unrated: NodeId[] = [];
  for (const v of redo) {
    const f = faultDutyFinding(ctx.edition, g, fault, series, v);
    if (f !== null && f !== NO_RATING) found.push([v, f]);
    else if (f === NO_RATING && added.includes(v)) unrated.push(g.nodes[v]!.id);
  }
  found.sort((a, b) => a[0] - b[0]);
  const rest = section.slice(end);
  if (unrated.length > 0) {
    // A device added without a rating joins the project's count; it comes last in node order, so after those it names.
    const counted = rest[0]?.id === NO_RATING_ID ? rest.shift()! : null;
    const names = [...(counted?.related ?? []).flatMap((r) => (r.kind === 'node' ? [r.id] : [])), ...unrated].slice(0, NO_RATING_MAX_RELATED);
    rest.unshift(noRatingFinding(ctx.edition, (counted ? Number(counted.data.count) : 0) + unrated.length, names));
  }
  return [...found.map((x) => x[1]), ...rest];
}

/**
 * Node `u` and the nodes bus-linked from it that take their supply from the same point (the
 * classifier's nodeSupply): through equipment that is not itself a source, an OCPD or a transformer
 * (`u` itself may be one when `fromSource`).
 */
function suppliedThrough(g: Graph, u: number, fromSource: boolean): number[] {
  const out = [u];
  for (let k = 0; k < out.length && out.length <= g.nodes.length; k++) {
    const v = out[k]!;
    if ((k > 0 || !fromSource) && SUPPLY_KINDS.has(g.nodes[v]!.kind)) continue;
    for (const e of g.outEdges[v]!) if (e < 0 && g.linkTo[-e - 1]! >= 0) out.push(g.linkTo[-e - 1]!);
  }
  return out;
}

/** Equipment that starts a supply of its own for what it feeds (classify.ts SOURCE_KINDS). */
const SUPPLY_KINDS: ReadonlySet<string> = new Set(['utility', 'generator', 'transformer', 'breaker', 'fuse']);

/** What an edit moved besides the runs judged again: voltage drops, panelboards, fault currents. */
interface Moved {
  conductorMoved?: Uint8Array;
  nodeMoved?: Uint8Array;
  panelboards?: readonly number[];
  /** Nodes whose fault current moved: their 110.9/110.10 findings are judged again. */
  faultNodes?: readonly number[];
  /** Runs whose withstand is judged again besides those judged again (the fault current where they start moved). */
  withstandRuns?: readonly number[];
  /** Every conductor and node that may be marked in `conductorMoved`, `nodeMoved` (absent: any may be). */
  among?: DropsAmong;
  /** Nodes new to the drawing (among `faultNodes`): a breaker or fuse without an interrupting rating counts in the project's 110.9 finding. */
  addedNodes?: readonly number[];
  /** Nodes whose place in the network changed (an edge added at them): their findings about it (loose equipment, dangling ends…) are made again. */
  topology?: readonly number[];
}

/** The conductors and nodes whose drop figures an edit may have moved (the voltage-drop warnings looked at again). */
export interface DropsAmong {
  conductors: number[];
  nodes: readonly number[];
}

/** The state and report after `judged`: the runs' findings and report lines, the transformers they feed, the panelboards and drops that moved. */
export function reported(state: AnalysisState, judged: Rejudged, moved: Moved, studiesReport: NonNullable<AnalysisReport['studies']>): AnalysisState {
  const { ctx, walk } = judged;
  const { graph, runs } = ctx;
  const own = new Map<number, Finding[]>();
  const transformers = new Set<number>();
  for (const r of judged.runs) {
    const members = runs.members[r]!;
    for (const ci of members) {
      own.set(ci, []);
      conductorFindingsOf(ctx, ci, own.get(ci)!);
    }
    const end = graph.conductorTo[members[members.length - 1]!]!;
    if (end >= 0 && graph.nodes[end]!.kind === 'transformer') transformers.add(end);
  }
  const conductorMoved = moved.conductorMoved ?? new Uint8Array(graph.conductors.length);
  const nodeMoved = moved.nodeMoved ?? new Uint8Array(graph.nodes.length);
  const extra = moved.withstandRuns ?? [];
  const withstood = rewithstand(state, ctx, judged.runs, extra, studiesReport);
  const studySection = moved.faultNodes ? refaultDuty(ctx, state.studies.fault, withstood.findings, moved.faultNodes, moved.addedNodes) : withstood.findings;
  const { findings, conductorFindingStart, studyFindingStart } = spliceFindings(state, ctx, own, conductorMoved, nodeMoved, { transformers, panelboards: moved.panelboards ?? [], topology: moved.topology ?? [] }, studySection, moved.among);
  const { studies } = withstood;

  // Report lines: the runs', those whose withstand was judged again, and those whose voltage-drop warning came or went.
  const old = state.report;
  const lines = new Set(own.keys());
  for (const r of extra) for (const ci of runs.members[r]!) lines.add(ci);
  // A line lists the ids of its findings, so a warning that changed only its figures leaves it as it was.
  const index = conductorIndexOf(state);
  const warned = (list: readonly Finding[], from: number) => {
    const ids = new Set<string>();
    for (let k = from; k < list.length; k++) if (list[k]!.ruleId === voltageDropRule.id && list[k]!.subject.kind === 'conductor') ids.add((list[k]!.subject as { id: string }).id);
    return ids;
  };
  const warnedBefore = warned(old.findings, state.studyFindingStart);
  const warnedAfter = warned(findings, studyFindingStart);
  for (const id of warnedBefore) if (!warnedAfter.has(id)) lines.add(index.get(id)!);
  for (const id of warnedAfter) if (!warnedBefore.has(id)) lines.add(index.get(id)!);
  const ids = findingIdsOf(state, ctx.verdicts, { findings, conductorFindingStart, studyFindingStart }, lines);
  const conductors = old.conductors.slice();
  const shared = sharedParts(graph);
  for (const ci of lines) conductors[ci] = conductorReport(ctx, ci, ids.get(graph.conductors[ci]!.id), shared);
  const byVerdict = { ...old.counts.byVerdict };
  for (const ci of own.keys()) {
    // A conductor added to the drawing (recheckAppended) had no line.
    if (ci < old.conductors.length) byVerdict[old.conductors[ci]!.verdict]--;
    byVerdict[conductors[ci]!.verdict]++;
  }
  const report: AnalysisReport = { ...old, conductors, findings, studies, counts: { conductors: conductors.length, byVerdict, bySeverity: countsOf([], findings).bySeverity } };
  return { ctx, studies: { ...state.studies, report: studies }, walk, conductorFindingStart, studyFindingStart, report };
}

/**
 * The report's findings with the sections of the conductors in `own` (conductor index → its findings,
 * as conductorFindingsOf writes them) replaced and the voltage-drop warnings of the conductors and
 * nodes marked as moved judged again; where each conductor's section and the studies' findings now start.
 */
export function spliceFindings(
  state: AnalysisState,
  ctx: FixedContext,
  own: ReadonlyMap<number, Finding[]>,
  conductorMoved: Uint8Array,
  nodeMoved: Uint8Array,
  equipment: { transformers: ReadonlySet<number>; panelboards: readonly number[]; topology?: readonly number[] } = { transformers: new Set(), panelboards: [] },
  studySection: readonly Finding[] = state.report.findings.slice(state.studyFindingStart),
  among?: DropsAmong,
): Pick<AnalysisState, 'conductorFindingStart' | 'studyFindingStart'> & { findings: Finding[] } {
  const old = state.report.findings;
  const start = state.conductorFindingStart;
  const m = ctx.graph.conductors.length;
  const findings: Finding[] = [];
  let from = 0;
  let conductorFindingStart = start;
  const order = [...own.keys()].sort((a, b) => a - b);
  for (const ci of order) {
    for (let k = from; k < start[ci]!; k++) findings.push(old[k]!);
    for (const f of own.get(ci)!) findings.push(f);
    from = start[ci + 1]!;
    const delta = findings.length - from;
    if (delta !== conductorFindingStart[ci + 1]! - start[ci + 1]!) {
      if (conductorFindingStart === start) conductorFindingStart = start.slice();
      for (let k = ci + 1; k <= m; k++) conductorFindingStart[k] = start[k]! + delta;
    }
  }
  const redoEquipment = equipment.transformers.size > 0 || equipment.panelboards.length > 0 || (equipment.topology ?? []).length > 0;
  const equipmentStart = redoEquipment ? start[m]! : state.studyFindingStart;
  for (let k = from; k < equipmentStart; k++) findings.push(old[k]!);
  if (redoEquipment) for (const f of equipmentSection(ctx, conductorIndexOf(state), old.slice(equipmentStart, state.studyFindingStart), equipment.transformers, equipment.panelboards, equipment.topology ?? [])) findings.push(f);
  const studyFindingStart = findings.length;
  const { fault, drop } = state.studies;
  const studyFindings = redoDropFindings(ctx.project, ctx.graph, fault, drop, studySection, conductorMoved, nodeMoved, conductorIndexOf(state), among);
  for (const f of studyFindings) findings.push(f);
  return { findings, conductorFindingStart, studyFindingStart };
}

/**
 * The equipment and network findings (what comes between the conductors' and the studies') with the
 * Table 450.3(B) findings of `transformers`, the 408.36 findings of `panelboards` and the findings
 * about the place in the network of the nodes `topology` (an edge added at them) made again, in the
 * order a full run writes them: transformers by the first run that ends at them, panelboards by node,
 * then the network's shape by node (a drawing with a loop, whose finding comes last, is not re-checked
 * this way).
 */
function equipmentSection(ctx: FixedContext, index: ReadonlyMap<string, number>, section: readonly Finding[], transformers: ReadonlySet<number>, panelboards: readonly number[], topology: readonly number[]): Finding[] {
  const { graph: g, runs, verdicts } = ctx;
  // A full run meets a verdict first at its first run (runs judged as one share it).
  const firstRunOf = (verdict: RunVerdict) => runs.runOf[index.get(verdict.facts.conductorIds[0]!)!]!;
  // A transformer's finding comes from the verdict of a run into it, whose conductors it names: the first one named gives that run.
  const producedBy = (f: Finding) => {
    const c = f.related.find((r) => r.kind === 'conductor');
    return c ? firstRunOf(verdicts[runs.runOf[index.get(c.id)!]!]!) : Number.POSITIVE_INFINITY;
  };
  const txs: [number, Finding][] = [];
  const panels: [number, Finding][] = [];
  const shape: [number, Finding][] = [];
  const redone = new Set(panelboards);
  const placed = new Set(topology);
  for (const f of section) {
    const v = f.subject.kind === 'node' ? g.nodeIndex.get(f.subject.id)! : -1;
    if (f.ruleId === transformerProtection.id) {
      if (!transformers.has(v)) txs.push([producedBy(f), f]);
    } else if (f.ruleId === panelboardProtection.id) {
      if (!redone.has(v)) panels.push([v, f]);
    } else if (!placed.has(v)) shape.push([v, f]);
  }
  for (const v of placed) {
    const out: Finding[] = [];
    nodeTopologyFindings(g, v, out);
    for (const f of out) shape.push([v, f]);
  }
  for (const v of transformers) {
    const seen = new Set<RunVerdict>();
    for (const e of g.inEdges[v]!) {
      if (e < 0 || seen.has(verdicts[runs.runOf[e]!]!)) continue;
      const verdict = verdicts[runs.runOf[e]!]!;
      seen.add(verdict);
      const out: Finding[] = [];
      transformerFindingOf(ctx, verdict, out);
      for (const f of out) txs.push([firstRunOf(verdict), f]);
    }
  }
  for (const v of redone) {
    const f = panelboardFindingOf(ctx, v);
    if (f) panels.push([v, f]);
  }
  const byKey = (a: [number, Finding], b: [number, Finding]) => a[0] - b[0];
  return [...txs.sort(byKey).map((x) => x[1]), ...panels.sort(byKey).map((x) => x[1]), ...shape.sort(byKey).map((x) => x[1])];
}

/**
 * The ids of the findings the report lines of conductors `lines` list (findingIdsByConductor), read
 * from the findings that can name them: their own sections, the section of the first conductor of
 * the run each is judged with (a run's findings sit there), and the studies'. The equipment and
 * network findings between are about nodes.
 */
export function findingIdsOf(
  state: AnalysisState,
  verdicts: readonly RunVerdict[],
  at: Pick<AnalysisState, 'conductorFindingStart' | 'studyFindingStart'> & { findings: readonly Finding[] },
  lines: Iterable<number>,
): Map<string, string[]> {
  const index = conductorIndexOf(state);
  const { runOf } = state.ctx.runs;
  const sections = new Set<number>();
  for (const ci of lines) {
    sections.add(ci);
    const chain = verdicts[runOf[ci]!]!.facts.conductorIds;
    if (chain.length > 1) sections.add(index.get(chain[0]!)!);
  }
  const { findings, conductorFindingStart: start } = at;
  const named: Finding[] = [];
  for (const ci of [...sections].sort((a, b) => a - b)) for (let k = start[ci]!; k < start[ci + 1]!; k++) named.push(findings[k]!);
  for (let k = at.studyFindingStart; k < findings.length; k++) named.push(findings[k]!);
  return findingIdsByConductor(named, chainLookup(state, verdicts));
}

/** The conductors judged as one run whose first conductor is `id` (as conductorReports finds them), from the run of that conductor. */
function chainLookup(state: AnalysisState, verdicts: readonly RunVerdict[]): (id: string) => readonly string[] | undefined {
  const index = conductorIndexOf(state);
  const { runOf } = state.ctx.runs;
  return (id) => {
    const chain = verdicts[runOf[index.get(id)!]!]!.facts.conductorIds;
    return chain.length > 1 && chain[0] === id ? chain : undefined;
  };
}

/** Conductor index by id, built once per topology (the graph's typed arrays are kept while the topology is). */
const conductorIndexes = new WeakMap<Int32Array, ReadonlyMap<string, number>>();
export function conductorIndexOf(state: AnalysisState): ReadonlyMap<string, number> {
  const g = state.ctx.graph;
  let index = conductorIndexes.get(g.conductorFrom);
  if (!index) {
    index = new Map(g.conductors.map((c, i) => [c.id as string, i]));
    conductorIndexes.set(g.conductorFrom, index);
  }
  return index;
}

/** Keeps `index` as the conductor index of `graph`'s topology (added equipment extends the one kept before it). */
export function keepConductorIndex(graph: Graph, index: ReadonlyMap<string, number>): void {
  conductorIndexes.set(graph.conductorFrom, index);
}
