import type { Conductor, EquipmentNode, NodeOfKind, Project } from '../model/schema';
import { conductorReport, findingIdsByConductor } from './conductorReports';
import { conductorFindingsOf } from './conductorFindings';
import { conductorAmpacity, terminalTempOf } from './ampacities';
import { judgeFedByOcpd, rejudgeRuns, type KeptWalk, type RunVerdict } from './classify';
import { fixesOfRun } from './fixes';
import { loadCircuit, loadConnection, rollUpAt } from './loads';
import { runFactsOf } from './runFacts';
import { assumptionsFor, countsOf, runAnalysis, type AnalysisState } from './analyze';
import type { FixedContext } from './context';
import type { AnalysisReport, Finding } from './types';
import type { RunFacts } from '../rules/facts';
import { hasImpedance, restepThroughConductor } from '../studies/faultCurrent/faultCurrent';
import { redropConductor, redropPath } from '../studies/voltageDrop/voltageDrop';
import { conductorDropRow, nodeFault, redoDropFindings, voltageDropInputs } from '../studies/index';
import type { Graph } from '../topology/graph';

/** How the last re-check was done: only what the edit can change, or the whole analysis (and why). */
export type UpdateMode =
  | { mode: 'incremental'; conductorId: string }
  | { mode: 'incremental'; nodeId: string; edit: 'load' | 'layout' }
  | { mode: 'full'; reason: string }
  /** `update` was given the project it already had. */
  | { mode: 'unchanged' };

/** An analysis kept between edits: `update` returns what `analyze(next)` would, re-checking only what the edit can change. */
export interface AnalysisSession {
  readonly report: AnalysisReport;
  /** How the last `update` (or the creation) was done. */
  readonly last: UpdateMode;
  /**
   * The report of `next`, equal to `analyze(next)`. Elements the edit did not touch must be the
   * same objects as before (as an immer edit leaves them); anything else falls back to a full run.
   */
  update(next: Project): AnalysisReport;
}

/**
 * An incremental analysis. Three edits are re-checked without the whole analysis:
 * - one conductor of a branch circuit (an OCPD to one load, nothing below it: the most common edit
 *   by far): that conductor's run, its load's fault current and voltage drop and its findings;
 * - one load's data (its VA or amperes, continuous, motor, HVAC, power factor) with its connection
 *   unchanged: the load roll-up along its supply path, the runs on that path (facts, verdicts,
 *   fixes, findings, report lines) and the voltage drops below the path;
 * - a node moved or its notes edited: nothing the analysis reads.
 * Any other edit, and any edit whose reach it cannot bound (a change of topology, of the project
 * settings, of a conductor that feeds anything, of a verdict on the supply path, or one that adds
 * or removes a study note), runs the whole analysis.
 * The property test (test/property/incremental.property.test.ts) holds it equal to `analyze()`.
 */
export function createAnalysis(project: Project): AnalysisSession {
  let state = runAnalysis(project);
  let current = project;
  let last: UpdateMode = { mode: 'full', reason: 'first analysis' };
  return {
    get report() {
      return state.report;
    },
    get last() {
      return last;
    },
    update(next: Project): AnalysisReport {
      if (next === current) {
        last = { mode: 'unchanged' };
        return state.report;
      }
      const result = recheck(state, current, next);
      if (typeof result === 'string') {
        state = runAnalysis(next);
        last = { mode: 'full', reason: result };
      } else {
        state = result.state;
        last = result.mode;
      }
      current = next;
      return state.report;
    },
  };
}

/** The state after the edit from `prev` to `next` re-checked on its own, or why it cannot be. */
function recheck(state: AnalysisState, prev: Project, next: Project): { state: AnalysisState; mode: UpdateMode } | string {
  let conductorsChanged = false;
  let nodesChanged = false;
  for (const key of new Set([...Object.keys(prev), ...Object.keys(next)]) as Set<keyof Project>) {
    if (prev[key] === next[key]) continue;
    if (key === 'conductors') conductorsChanged = true;
    else if (key === 'nodes') nodesChanged = true;
    else return `${key} changed`;
  }
  if (conductorsChanged && nodesChanged) return 'conductors and nodes changed';
  if (conductorsChanged) {
    const edit = singleEdit(prev.conductors, next.conductors);
    if (typeof edit === 'string') return edit.replace('element', 'conductor');
    const { index, before, after } = edit;
    if (before.id !== after.id || before.from !== after.from || before.to !== after.to) return 'a conductor was reconnected';
    const why = leafBlocker(state, index, before, after);
    if (why !== null) return why;
    return { state: recheckLeaf(state, next, index), mode: { mode: 'incremental', conductorId: after.id } };
  }
  const edit = singleEdit(prev.nodes, next.nodes);
  if (typeof edit === 'string') return edit.replace('element', 'node');
  const { index, before, after } = edit;
  if (before.id !== after.id || before.kind !== after.kind) return 'a node was replaced';
  if (onlyLayout(before, after)) return { state: relayout(state, next), mode: { mode: 'incremental', nodeId: after.id, edit: 'layout' } };
  if (before.kind !== 'load' || after.kind !== 'load') return `a ${before.kind} node changed`;
  const result = recheckLoad(state, next, index, before, after);
  return typeof result === 'string' ? result : { state: result, mode: { mode: 'incremental', nodeId: after.id, edit: 'load' } };
}

/** The one element of a list an edit changed, or why the edit is something else. Compares by identity only. */
function singleEdit<T>(a: readonly T[], b: readonly T[]): { index: number; before: T; after: T } | string {
  if (a.length !== b.length) return 'an element was added or removed';
  let index = -1;
  for (let i = 0; i < a.length; i++) {
    if (a[i] === b[i]) continue;
    if (index >= 0) return 'more than one element changed';
    index = i;
  }
  if (index < 0) return 'nothing changed';
  return { index, before: a[index]!, after: b[index]! };
}

/** Fields of a node no stage of the analysis reads: where it is drawn and the designer's notes. */
const LAYOUT_FIELDS: ReadonlySet<string> = new Set(['position', 'notes']);

function onlyLayout(before: EquipmentNode, after: EquipmentNode): boolean {
  const a = before as Record<string, unknown>;
  const b = after as Record<string, unknown>;
  for (const key of new Set([...Object.keys(a), ...Object.keys(b)])) if (!LAYOUT_FIELDS.has(key) && a[key] !== b[key]) return false;
  return true;
}

/** A node moved or its notes changed: the same report, over the new project. */
function relayout(state: AnalysisState, next: Project): AnalysisState {
  const graph: Graph = { ...state.ctx.graph, nodes: next.nodes };
  return { ...state, ctx: { ...state.ctx, project: next, graph } };
}

/** Why the edit of conductor `ci` cannot be re-checked on its own, or null when it can. */
function leafBlocker(state: AnalysisState, ci: number, before: Conductor, after: Conductor): string | null {
  const { graph: g, runs, verdicts } = state.ctx;
  const r = runs.runOf[ci]!;
  if (runs.members[r]!.length !== 1) return 'the conductor is part of a spliced run';
  const v = verdicts[r]!;
  if (v.family !== 'fed-by-ocpd' || v.role !== 'branch' || v.supply.kind !== 'ocpd') return 'the conductor is not a branch circuit from an OCPD';
  const load = g.conductorTo[ci]!;
  if (load < 0 || g.nodes[load]!.kind !== 'load' || g.outEdges[load]!.length !== 0 || g.inEdges[load]!.length !== 1) return 'the conductor does not end at a load alone';
  if (state.studies.fault.parentEdge[load] !== ci) return 'the load is not supplied through this conductor';
  // The 310.15(E) count of its circuit (analyze/circuits.ts) reads these; the rest of the circuit is the nodes'.
  if (before.neutral !== after.neutral || before.nonlinearLoad !== after.nonlinearLoad || before.currentCarrying !== after.currentCarrying) return 'the edit changes the circuit makeup';
  // A conductor without a length or an impedance adds a note to the study: let the full run word it.
  if (!hasImpedance(before) || !hasImpedance(after)) return 'the conductor has no length or Table 9 impedance';
  return null;
}

/**
 * Re-checks one branch circuit after its conductor changed: its ampacity, facts, verdict and fixes;
 * the fault current and voltage drop at its load; its findings and report line. Everything the edit
 * cannot reach keeps its object. Typed arrays of the studies are updated in place (the session owns them).
 */
function recheckLeaf(state: AnalysisState, next: Project, ci: number): AnalysisState {
  const prev = state.ctx;
  const conductor = next.conductors[ci]!;
  const graph = { ...prev.graph, conductors: next.conductors };
  const r = prev.runs.runOf[ci]!;
  const ampacities = prev.ampacities.slice();
  ampacities[ci] = conductorAmpacity(conductor, prev.edition, next.project.terminationDefault, prev.circuits[ci]!.currentCarrying.adjustmentCount);
  const base = { ...prev, project: next, graph, ampacities };
  const oldVerdict = prev.verdicts[r]!;
  const facts = runFactsOf(base, r, oldVerdict.facts.site);
  const verdicts = prev.verdicts.slice();
  verdicts[r] = judgeFedByOcpd({ ...base, facts: [] }, r, oldVerdict.supply, oldVerdict.deviceNode, facts);
  const fixes = prev.fixes.slice();
  const ctx: FixedContext = { ...base, verdicts, fixes };
  fixes[r] = fixesOfRun(ctx, r);

  // Studies: the load's fault current and the conductor's drop; nothing above the load changes.
  const { fault, drop } = state.studies;
  const load = graph.conductorTo[ci]!;
  restepThroughConductor(graph, fault, load);
  redropConductor(graph, drop, voltageDropInputs(ctx, fault), ci);
  const old = state.report;
  const oldStudies = old.studies!;
  const faults = oldStudies.faults.slice();
  faults[load] = nodeFault(graph, fault, load);
  const dropRows = oldStudies.voltageDrop.conductors.slice();
  dropRows[ci] = conductorDropRow(graph, fault, drop, ci);
  const studies = { ...oldStudies, faults, voltageDrop: { ...oldStudies.voltageDrop, conductors: dropRows } };

  const conductorMoved = new Uint8Array(graph.conductors.length);
  const nodeMoved = new Uint8Array(graph.nodes.length);
  conductorMoved[ci] = 1;
  nodeMoved[load] = 1;
  const own = new Map<number, Finding[]>([[ci, []]]);
  conductorFindingsOf(ctx, ci, own.get(ci)!);
  const { findings, conductorFindingStart, studyFindingStart } = spliceFindings(state, ctx, own, conductorMoved, nodeMoved);
  const conductors = old.conductors.slice();
  conductors[ci] = conductorReport(ctx, ci, findingIdsByConductor(findings, chainLookup(state, verdicts)).get(conductor.id));

  const before = state.ctx.graph.conductors[ci]!;
  const setting = next.project.terminationDefault;
  // The assumptions name the termination ratings in use and count the conductors that state none.
  const sameTerminals = terminalTempOf(before, setting) === terminalTempOf(conductor, setting) && (before.terminalTempC === undefined) === (conductor.terminalTempC === undefined);
  const byVerdict = { ...old.counts.byVerdict };
  byVerdict[old.conductors[ci]!.verdict]--;
  byVerdict[conductors[ci]!.verdict]++;
  const report: AnalysisReport = {
    ...old,
    assumptions: sameTerminals ? old.assumptions : assumptionsFor(next),
    conductors,
    findings,
    studies,
    counts: { conductors: conductors.length, byVerdict, bySeverity: countsOf([], findings).bySeverity },
  };
  return { ...state, ctx, studies: { ...state.studies, report: studies }, conductorFindingStart, studyFindingStart, report };
}

/**
 * Re-checks the network after one load's data changed (its volt-amperes or current, continuous,
 * motor, HVAC, power factor) with its connection and what the fault study reads of it unchanged:
 * the load roll-up along its supply path, every run on that path (facts, verdict, fixes, findings,
 * report line) and the voltage drops at and below the path. The fault current, the circuits, the
 * ampacities and every other verdict stay. Returns why it cannot when the edit reaches further: a
 * load with several supplies or anything below it, a spliced run on the path, a verdict on the path
 * that changes (what is supplied through it would be judged again), or a study note that changes.
 */
function recheckLoad(state: AnalysisState, next: Project, v: number, before: NodeOfKind<'load'>, after: NodeOfKind<'load'>): AnalysisState | string {
  const prev = state.ctx;
  const g0 = prev.graph;
  const { loads, runs } = prev;
  if (before.label !== after.label) return 'the load was renamed';
  // The fault study reads a load's phases (the loop it sees) and, for a motor contribution, its full-load current.
  if (before.phases !== after.phases) return "the load's phases changed";
  if ((before.faultContributionXFlc !== undefined || after.faultContributionXFlc !== undefined) && (before.faultContributionXFlc !== after.faultContributionXFlc || before.currentA !== after.currentA || before.kva !== after.kva)) return "the load's motor contribution changed";
  // The circuit makeup of every run above it (analyze/circuits.ts) reads the load's connection.
  const sys = [loads.voltsLL[v]!, loads.phases[v]!, loads.voltsLN[v]!] as const;
  const onBefore = loadConnection(before, ...sys);
  const onAfter = loadConnection(after, ...sys);
  if ((onBefore === null) !== (onAfter === null) || (onBefore !== null ? onBefore.connection !== onAfter!.connection : before.connection !== after.connection)) return "the load's connection changed";
  // A load without a known current adds a note to the voltage-drop study.
  if ((loads.loadCircuits[v] === null) !== (loadCircuit(after, ...sys) === null)) return "whether the load's current is known changed";
  if (prev.onCycle[v] || g0.outEdges[v]!.length !== 0) return 'the load supplies something';

  // The supply path, load first: every node on it supplied once, so the roll-up changes along it alone.
  const path: number[] = [];
  const pathRuns: number[] = [];
  for (let w = v; ; ) {
    path.push(w);
    const ins = g0.inEdges[w]!;
    if (ins.length === 0) break;
    if (ins.length > 1) return 'a node on the supply path has several supplies';
    if (path.length > g0.nodes.length) return 'the supply path loops';
    const e = ins[0]!;
    if (e >= 0) {
      const r = runs.runOf[e]!;
      if (runs.members[r]!.length !== 1 || prev.verdicts[r]!.facts.conductorIds.length !== 1) return 'a spliced run lies on the supply path';
      pathRuns.push(r);
    }
    w = e >= 0 ? g0.conductorFrom[e]! : g0.linkFrom[-e - 1]!;
    if (w < 0) break;
  }
  pathRuns.reverse();

  const graph: Graph = { ...g0, nodes: next.nodes };
  // The session owns the analysis' arrays: the roll-up and the studies are updated in place.
  for (const w of path) rollUpAt(graph, loads, w);
  const base = { ...prev, project: next, graph };
  const facts: RunFacts[] = [];
  let secondariesOf = state.walk.secondariesOf;
  for (const r of pathRuns) {
    const old = prev.verdicts[r]!.facts;
    facts[r] = runFactsOf(base, r, old.site);
    const from = graph.conductorFrom[runs.members[r]![0]!]!;
    const list = secondariesOf.get(from);
    if (list) {
      // A transformer's primary reads the facts of its secondaries (240.21(B)(3)).
      const at = list.indexOf(old);
      if (at < 0) return 'a secondary run is judged with another';
      if (secondariesOf === state.walk.secondariesOf) secondariesOf = new Map(secondariesOf);
      (secondariesOf as Map<number, RunFacts[]>).set(from, list.map((f, k) => (k === at ? facts[r]! : f)));
    }
  }
  const walk: KeptWalk = { ...state.walk, secondariesOf };
  const verdicts = prev.verdicts.slice();
  rejudgeRuns({ ...base, facts }, walk, verdicts, pathRuns);
  for (const r of pathRuns) {
    const why = verdictMoved(graph, prev.verdicts[r]!, verdicts[r]!);
    if (why) return why;
  }
  const fixes = prev.fixes.slice();
  const ctx: FixedContext = { ...base, verdicts, fixes };
  for (const r of pathRuns) fixes[r] = fixesOfRun(ctx, r);

  // Voltage drop: the power along the path, then the sums below it.
  const { fault, drop } = state.studies;
  const conductorMoved = new Uint8Array(graph.conductors.length);
  const nodeMoved = new Uint8Array(graph.nodes.length);
  redropPath(graph, drop, voltageDropInputs(ctx, fault), path, conductorMoved, nodeMoved);
  const old = state.report;
  const oldStudies = old.studies!;
  const dropRows = oldStudies.voltageDrop.conductors.slice();
  for (let c = 0; c < conductorMoved.length; c++) if (conductorMoved[c]) dropRows[c] = conductorDropRow(graph, fault, drop, c);
  const studies = { ...oldStudies, voltageDrop: { ...oldStudies.voltageDrop, conductors: dropRows } };

  const own = new Map<number, Finding[]>();
  for (const r of pathRuns) {
    const ci = runs.members[r]![0]!;
    own.set(ci, []);
    conductorFindingsOf(ctx, ci, own.get(ci)!);
  }
  const { findings, conductorFindingStart, studyFindingStart } = spliceFindings(state, ctx, own, conductorMoved, nodeMoved);

  // Report lines: the path's, and those whose voltage-drop warning came or went.
  const lines = new Set(own.keys());
  const index = conductorIndexOf(state);
  for (const list of [old.findings, findings]) {
    for (let k = list === old.findings ? state.studyFindingStart : studyFindingStart; k < list.length; k++) {
      const f = list[k]!;
      if (f.ruleId === 'voltage-drop' && f.subject.kind === 'conductor') lines.add(index.get(f.subject.id)!);
    }
  }
  const ids = findingIdsByConductor(findings, chainLookup(state, verdicts));
  const conductors = old.conductors.slice();
  for (const ci of lines) conductors[ci] = conductorReport(ctx, ci, ids.get(graph.conductors[ci]!.id));
  const report: AnalysisReport = {
    ...old,
    conductors,
    findings,
    studies,
    counts: { ...old.counts, bySeverity: countsOf([], findings).bySeverity },
  };
  return { ctx, studies: { ...state.studies, report: studies }, walk, conductorFindingStart, studyFindingStart, report };
}

/** Why a new verdict of a run on the supply path reaches beyond it (what is supplied through the run reads these), or null. */
function verdictMoved(g: Graph, before: RunVerdict, after: RunVerdict): string | null {
  if (before.verdict !== after.verdict || before.rule !== after.rule || before.family !== after.family || before.deviceNode !== after.deviceNode || before.generatorNode !== after.generatorNode) return `the verdict of ${before.facts.conductorIds[0]} changed`;
  // The secondaries of a transformer whose primary is a tap are judged on the primary's 240.21(B)(3) trial.
  const end = after.facts.termination.nodeId === null ? -1 : g.nodeIndex.get(after.facts.termination.nodeId) ?? -1;
  if (end >= 0 && g.nodes[end]!.kind === 'transformer' && after.verdict !== 'protected' && after.verdict !== 'protected-next-size') return 'a transformer on the supply path is fed by a tap';
  return null;
}

/**
 * The report's findings with the sections of the conductors in `own` (conductor index → its findings,
 * as conductorFindingsOf writes them) replaced and the voltage-drop warnings of the conductors and
 * nodes marked as moved judged again; where each conductor's section and the studies' findings now start.
 */
function spliceFindings(state: AnalysisState, ctx: FixedContext, own: ReadonlyMap<number, Finding[]>, conductorMoved: Uint8Array, nodeMoved: Uint8Array): Pick<AnalysisState, 'conductorFindingStart' | 'studyFindingStart'> & { findings: Finding[] } {
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
  for (let k = from; k < state.studyFindingStart; k++) findings.push(old[k]!);
  const studyFindingStart = findings.length;
  const { fault, drop } = state.studies;
  const studyFindings = redoDropFindings(ctx.project, ctx.graph, fault, drop, old.slice(state.studyFindingStart), conductorMoved, nodeMoved, conductorIndexOf(state));
  for (const f of studyFindings) findings.push(f);
  return { findings, conductorFindingStart, studyFindingStart };
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
const conductorIndexes = new WeakMap<Int32Array, Map<string, number>>();
function conductorIndexOf(state: AnalysisState): Map<string, number> {
  const g = state.ctx.graph;
  let index = conductorIndexes.get(g.conductorFrom);
  if (!index) {
    index = new Map(g.conductors.map((c, i) => [c.id as string, i]));
    conductorIndexes.set(g.conductorFrom, index);
  }
  return index;
}
