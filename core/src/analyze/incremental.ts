import type { Conductor, EquipmentNode, NodeOfKind, Project } from '../model/schema';
import { conductorReport } from './conductorReports';
import { conductorFindingsOf } from './conductorFindings';
import { conductorAmpacity, terminalTempOf } from './ampacities';
import { judgeFedByOcpd } from './classify';
import { fixesOfRun } from './fixes';
import { loadCircuit, loadConnection, rollUpAt } from './loads';
import { runFactsOf } from './runFacts';
import { assumptionsFor, countsOf, runAnalysis, type AnalysisState } from './analyze';
import type { FixedContext } from './context';
import type { AnalysisReport, Finding } from './types';
import { hasImpedance, restepBelow } from '../studies/faultCurrent/faultCurrent';
import { redropBelow, redropPath } from '../studies/voltageDrop/voltageDrop';
import { conductorDropRow, nodeFault, voltageDropInputs, type ConductorDrop, type NodeFault } from '../studies/index';
import { edgeFrom, edgeTo, type Graph } from '../topology/graph';
import { isPassThroughJoint } from '../topology/runs';
import { isOcpd } from './equipment';
import { type DropsAmong, MAX_REJUDGED_FRACTION, boundOf, findingIdsOf, refaultDuty, rejudge, reported, spliceFindings, withPrimaries, withRows } from './rejudge';
import { type KeptShape, appendedLeaves, recheckAppended } from './addedEquipment';

/** How the last re-check was done: only what the edit can change, or the whole analysis (and why). */
export type UpdateMode =
  | { mode: 'incremental'; conductorId: string }
  | { mode: 'incremental'; nodeId: string; edit: 'load' | 'device' | 'layout' | 'added' | 'connected' }
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
 * An incremental analysis. These edits are re-checked without the whole analysis:
 * - one conductor's own data (length, size, material, sets, insulation, wiring, ambient, installation
 *   facts, label) anywhere but on the service: its run (with the transformer primary or secondaries
 *   that read it, and what a changed verdict reaches), the fault current and voltage drop of every
 *   node below it and what judges them (110.9/110.10, withstand, voltage-drop warnings). A branch
 *   circuit (an OCPD to one load, nothing below it: the most common edit by far) takes a shorter way;
 * - one load's data (its VA or amperes, continuous, motor, HVAC, power factor) with its connection
 *   unchanged: the load roll-up along its supply path, the runs on that path (facts, verdicts,
 *   fixes, findings, report lines) and the voltage drops below the path;
 * - one OCPD's rating, type or name (`recheckDevice`), or its interrupting rating alone (its 110.9 finding);
 * - a node moved or its notes edited: nothing the analysis reads;
 * - one node added below a node already drawn with the conductor or bus link that supplies it (the
 *   editor's "add equipment"), or one conductor or bus link from a node drawn to one connected to
 *   nothing (the editor's "connect" after adding with nothing selected): the new node and run, the
 *   loads, drops and runs along its supply path (`recheckAppended`).
 * Removals (a deletion, a splice joined or split, a connection converted) run the whole analysis: they
 * move the position of everything after them in the lists, and every index the stages keep with it.
 * Any other edit, and any edit whose reach it cannot bound (any other change of topology, of the project
 * settings, of a service conductor, of a circuit's makeup, a conductor gaining or losing its
 * impedance, one that adds or removes a study note, or past a quarter of the runs or nodes), runs
 * the whole analysis.
 * The property test (test/property/incremental.property.test.ts) holds it equal to `analyze()`.
 */
export function createAnalysis(project: Project): AnalysisSession {
  let state = runAnalysis(project);
  let current = project;
  let last: UpdateMode = { mode: 'full', reason: 'first analysis' };
  const kept: KeptShape = { shape: null };
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
      const result = recheck(state, current, next, kept);
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
function recheck(state: AnalysisState, prev: Project, next: Project, kept: KeptShape): { state: AnalysisState; mode: UpdateMode } | string {
  let conductorsChanged = false;
  let nodesChanged = false;
  let linksChanged = false;
  for (const key of new Set([...Object.keys(prev), ...Object.keys(next)]) as Set<keyof Project>) {
    if (prev[key] === next[key]) continue;
    if (key === 'conductors') conductorsChanged = true;
    else if (key === 'nodes') nodesChanged = true;
    else if (key === 'busLinks') linksChanged = true;
    else return `${key} changed`;
  }
  if (linksChanged || prev.nodes.length !== next.nodes.length || prev.conductors.length !== next.conductors.length) {
    const steps = appendedLeaves(state, prev, next);
    if (typeof steps === 'string') return steps;
    // Several nodes added at once (a paste) are re-checked one after another, each on the drawing as it stood then.
    let after = state;
    for (const { project, leaf } of steps) {
      const result = recheckAppended(after, project, leaf, kept);
      if (typeof result === 'string') return result;
      after = result;
    }
    const { leaf } = steps[steps.length - 1]!;
    return { state: after, mode: { mode: 'incremental', nodeId: next.nodes[leaf.node]!.id, edit: leaf.added ? 'added' : 'connected' } };
  }
  if (conductorsChanged && nodesChanged) return 'conductors and nodes changed';
  if (conductorsChanged) {
    const edit = singleEdit(prev.conductors, next.conductors, 'conductor');
    if (typeof edit === 'string') return edit;
    const { index, before, after } = edit;
    const why = conductorBlocker(state, next, index, before, after);
    if (why !== null) return why;
    const result = isBranchLeaf(state, index) ? recheckLeaf(state, next, index) : recheckConductor(state, next, index);
    return typeof result === 'string' ? result : { state: result, mode: { mode: 'incremental', conductorId: after.id } };
  }
  const edit = singleEdit(prev.nodes, next.nodes, 'node');
  if (typeof edit === 'string') return edit;
  const { index, before, after } = edit;
  if (before.id !== after.id || before.kind !== after.kind) return 'a node was replaced';
  if (changedOnly(before, after, LAYOUT_FIELDS)) return { state: relayout(state, next), mode: { mode: 'incremental', nodeId: after.id, edit: 'layout' } };
  let result: AnalysisState | string;
  if (before.kind === 'load' && after.kind === 'load') result = recheckLoad(state, next, index, before, after);
  else if ((before.kind === 'breaker' && after.kind === 'breaker') || (before.kind === 'fuse' && after.kind === 'fuse')) {
    result = changedOnly(before, after, INTERRUPTING_FIELDS) ? recheckInterrupting(state, next, index, before, after) : recheckDevice(state, next, index, before, after);
  }
  else return `a ${before.kind} node changed`;
  return typeof result === 'string' ? result : { state: result, mode: { mode: 'incremental', nodeId: after.id, edit: before.kind === 'load' ? 'load' : 'device' } };
}

/** The one element of a list an edit changed, or why the edit is something else. Compares by identity only. */
function singleEdit<T>(a: readonly T[], b: readonly T[], what: string): { index: number; before: T; after: T } | string {
  if (a.length !== b.length) return `a ${what} was added or removed`;
  let index = -1;
  for (let i = 0; i < a.length; i++) {
    if (a[i] === b[i]) continue;
    if (index >= 0) return `more than one ${what} changed`;
    index = i;
  }
  if (index < 0) return 'nothing changed';
  return { index, before: a[index]!, after: b[index]! };
}

/** Fields of a node no stage of the analysis reads: where it is drawn and the designer's notes. */
const LAYOUT_FIELDS: ReadonlySet<string> = new Set(['position', 'notes']);

/** What only 110.9 reads of an OCPD: its own finding there. */
const INTERRUPTING_FIELDS: ReadonlySet<string> = new Set(['interruptingKA', ...LAYOUT_FIELDS]);

/** True when `before` and `after` differ in `fields` at most. */
function changedOnly(before: EquipmentNode, after: EquipmentNode, fields: ReadonlySet<string>): boolean {
  const a = before as Record<string, unknown>;
  const b = after as Record<string, unknown>;
  for (const key of new Set([...Object.keys(a), ...Object.keys(b)])) if (!fields.has(key) && a[key] !== b[key]) return false;
  return true;
}

/** A node moved or its notes changed: the same report, over the new project. */
function relayout(state: AnalysisState, next: Project): AnalysisState {
  const graph: Graph = { ...state.ctx.graph, nodes: next.nodes };
  return { ...state, ctx: { ...state.ctx, project: next, graph } };
}

/**
 * An OCPD's interrupting rating changed (and perhaps where it is drawn): its 110.9 finding is judged
 * again. Nothing else of the analysis reads it, but the project's finding that counts the devices
 * without one: a rating entered or removed runs the whole analysis.
 */
function recheckInterrupting(state: AnalysisState, next: Project, d: number, before: NodeOfKind<'breaker' | 'fuse'>, after: NodeOfKind<'breaker' | 'fuse'>): AnalysisState | string {
  if ((before.interruptingKA === undefined) !== (after.interruptingKA === undefined)) return 'an interrupting rating was entered or removed (110.9)';
  const relaid = relayout(state, next);
  const old = state.report;
  const section = refaultDuty(relaid.ctx, state.studies.fault, old.findings.slice(state.studyFindingStart), [d]);
  const findings = [...old.findings.slice(0, state.studyFindingStart), ...section];
  return { ...relaid, report: { ...old, findings, counts: { ...old.counts, bySeverity: countsOf([], findings).bySeverity } } };
}

/**
 * Why the edit of conductor `ci` cannot be re-checked without the whole analysis, or null when it can
 * (what it reaches is bounded later: its run, the runs that read its run's verdict, its subtree).
 */
function conductorBlocker(state: AnalysisState, next: Project, ci: number, before: Conductor, after: Conductor): string | null {
  if (before.id !== after.id || before.from !== after.from || before.to !== after.to) return 'a conductor was reconnected';
  // Conductors of the same material, size and sets through a splice or tap box are one run (topology/runs.ts).
  const g = state.ctx.graph;
  const gNext: Graph = { ...g, conductors: next.conductors };
  for (const v of [g.conductorFrom[ci]!, g.conductorTo[ci]!]) if (isPassThroughJoint(g, v) !== isPassThroughJoint(gNext, v)) return 'the edit joins or splits a run at a splice or tap box';
  // The 310.15(E) count of its circuit (analyze/circuits.ts) reads these; the rest of the circuit is the nodes'.
  if (before.neutral !== after.neutral || before.nonlinearLoad !== after.nonlinearLoad || before.currentCarrying !== after.currentCarrying) return 'the edit changes the circuit makeup';
  // A conductor without a length or a Table 9 impedance counts as zero, makes the fault current below it an upper
  // bound and adds a note to the study, worded by whether it has a size (which also decides what is judged below it):
  // let the full run say so when that changes.
  if (hasImpedance(before) !== hasImpedance(after)) return 'the conductor gained or lost a length or Table 9 impedance';
  if ((before.size === undefined) !== (after.size === undefined)) return 'the conductor gained or lost its size';
  // Service conductors: the service markings (110.24) and every fault figure in the building read them.
  if (state.ctx.verdicts[state.ctx.runs.runOf[ci]!]!.family === 'service') return 'the conductor is a service conductor';
  return null;
}

/**
 * A branch circuit of one conductor from an OCPD to one load with nothing below it (the most common
 * edit by far): `recheckLeaf` re-checks it with less bookkeeping than `recheckConductor`.
 */
function isBranchLeaf(state: AnalysisState, ci: number): boolean {
  const { graph: g, runs, verdicts } = state.ctx;
  const r = runs.runOf[ci]!;
  const v = verdicts[r]!;
  if (runs.members[r]!.length !== 1 || v.facts.conductorIds.length !== 1) return false;
  if (v.family !== 'fed-by-ocpd' || v.role !== 'branch' || v.supply.kind !== 'ocpd') return false;
  const load = g.conductorTo[ci]!;
  if (load < 0 || g.nodes[load]!.kind !== 'load' || g.outEdges[load]!.length !== 0 || g.inEdges[load]!.length !== 1) return false;
  return state.studies.fault.parentEdge[load] === ci && state.studies.fault.parent[load]! >= 0;
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
  const ampacities = ampacitiesAfter(prev, next, ci);
  const base = { ...prev, project: next, graph, ampacities };
  const oldVerdict = prev.verdicts[r]!;
  const facts = runFactsOf(base, r, oldVerdict.facts.site);
  const verdicts = prev.verdicts.slice();
  verdicts[r] = judgeFedByOcpd({ ...base, facts: [] }, r, oldVerdict.supply, oldVerdict.deviceNode, facts);
  const fixes = prev.fixes.slice();
  const ctx: FixedContext = { ...base, verdicts, fixes };
  fixes[r] = fixesOfRun(ctx, r);

  // Studies: the load's fault current and the conductor's drop; nothing above the load changes.
  const load = graph.conductorTo[ci]!;
  const { studies, conductorMoved, nodeMoved, among } = restudyBelow(state, ctx, ci, [load]);
  nodeMoved[load] = 1;
  const old = state.report;
  const own = new Map<number, Finding[]>([[ci, []]]);
  conductorFindingsOf(ctx, ci, own.get(ci)!);
  const { findings, conductorFindingStart, studyFindingStart } = spliceFindings(state, ctx, own, conductorMoved, nodeMoved, undefined, undefined, among);
  const conductors = old.conductors.slice();
  conductors[ci] = conductorReport(ctx, ci, findingIdsOf(state, verdicts, { findings, conductorFindingStart, studyFindingStart }, [ci]).get(conductor.id));

  const byVerdict = { ...old.counts.byVerdict };
  byVerdict[old.conductors[ci]!.verdict]--;
  byVerdict[conductors[ci]!.verdict]++;
  const report: AnalysisReport = {
    ...old,
    assumptions: assumptionsAfter(state, next, ci),
    conductors,
    findings,
    studies,
    counts: { conductors: conductors.length, byVerdict, bySeverity: countsOf([], findings).bySeverity },
  };
  return { ...state, ctx, studies: { ...state.studies, report: studies }, conductorFindingStart, studyFindingStart, report };
}

/** The ampacities after conductor `ci`'s own data changed (its circuit's makeup unchanged): its own again, the rest kept. */
function ampacitiesAfter(prev: FixedContext, next: Project, ci: number): FixedContext['ampacities'] {
  const ampacities = prev.ampacities.slice();
  ampacities[ci] = conductorAmpacity(next.conductors[ci]!, prev.edition, next.project.terminationDefault, prev.circuits[ci]!.currentCarrying.adjustmentCount);
  return ampacities;
}

/** The report's assumptions after conductor `ci` changed: they name the termination ratings in use and count the conductors that state none. */
function assumptionsAfter(state: AnalysisState, next: Project, ci: number): string[] {
  const before = state.ctx.graph.conductors[ci]!;
  const after = next.conductors[ci]!;
  const setting = next.project.terminationDefault;
  const same = terminalTempOf(before, setting) === terminalTempOf(after, setting) && (before.terminalTempC === undefined) === (after.terminalTempC === undefined);
  return same ? state.report.assumptions : assumptionsFor(next);
}

/**
 * The studies after conductor `ci`'s impedance changed, `below` the nodes supplied through it on the
 * supply tree (each after its supply, its end first; empty when it is not on the tree): their fault
 * current and the drops and sums there, with their rows of the study tables. The typed arrays of the
 * studies are updated in place (the session owns them). Marks the conductors and nodes whose drop
 * figures moved.
 */
function restudyBelow(state: AnalysisState, ctx: FixedContext, ci: number, below: readonly number[]): { studies: NonNullable<AnalysisReport['studies']>; conductorMoved: Uint8Array; nodeMoved: Uint8Array; among: DropsAmong } {
  const { graph } = ctx;
  const { fault, drop } = state.studies;
  const conductorMoved = new Uint8Array(graph.conductors.length);
  const nodeMoved = new Uint8Array(graph.nodes.length);
  const oldStudies = state.report.studies!;
  conductorMoved[ci] = 1;
  const among: DropsAmong = { conductors: [ci], nodes: below };
  if (below.length === 0) return { studies: oldStudies, conductorMoved, nodeMoved, among };
  restepBelow(graph, fault, ci, below);
  redropBelow(graph, drop, voltageDropInputs(ctx, fault), ci, below, conductorMoved, nodeMoved);
  const faults = below.map((v): [number, NodeFault] => [v, nodeFault(graph, fault, v)]);
  const dropRows: [number, ConductorDrop][] = [[ci, conductorDropRow(graph, fault, drop, ci)]];
  for (const v of below) {
    const e = fault.parentEdge[v]!;
    if (e >= 0 && conductorMoved[e]) {
      dropRows.push([e, conductorDropRow(graph, fault, drop, e)]);
      among.conductors.push(e);
    }
  }
  return { studies: withRows(oldStudies, faults, dropRows), conductorMoved, nodeMoved, among };
}

/**
 * The nodes supplied through conductor `ci` on the fault study's supply tree, each after its supply,
 * its end first; empty when its end is not supplied through it (several supplies, a loop, unreached);
 * null past `limit` nodes.
 */
function nodesBelow(state: AnalysisState, ci: number, limit: number): number[] | null {
  const g = state.ctx.graph;
  const { parent, parentEdge } = state.studies.fault;
  const end = g.conductorTo[ci]!;
  if (end < 0 || parent[end]! < 0 || parentEdge[end] !== ci) return [];
  const out = [end];
  for (let k = 0; k < out.length; k++) {
    const v = out[k]!;
    for (const e of g.outEdges[v]!) {
      const w = edgeTo(g, e);
      if (w >= 0 && parent[w] === v && parentEdge[w] === e) out.push(w);
    }
    if (out.length > limit) return null;
  }
  return out;
}

/**
 * Re-checks the network after one conductor's own data changed (its length, size, material, sets,
 * insulation, wiring, ambient, installation facts, label; not what decides its circuit's makeup)
 * anywhere but on the service: its ampacity; its run's facts, verdict and fixes, with the primary of
 * the transformer it leaves (which reads its secondaries) and the secondaries of the transformer it
 * feeds (which read the primary), and what is supplied through any run whose verdict changes (see
 * `rejudge`); the fault current and voltage drop of every node below it, with the 110.9/110.10
 * findings there and the withstand of the taps and secondaries that start there; the findings and
 * report lines of all of these. Past a bound on what it reaches, returns why.
 */
function recheckConductor(state: AnalysisState, next: Project, ci: number): AnalysisState | string {
  const prev = state.ctx;
  const { runs } = prev;
  const graph: Graph = { ...prev.graph, conductors: next.conductors };
  const below = nodesBelow(state, ci, boundOf(graph.nodes.length));
  if (below === null) return `the edit reaches more than ${MAX_REJUDGED_FRACTION * 100} % of the nodes`;
  const marked = state.report.studies!.serviceMarkings;
  if (marked.length > 0 && below.length > 0) {
    const inBelow = new Set(below);
    if (marked.some((m) => inBelow.has(graph.nodeIndex.get(m.nodeId)!))) return 'a service marking (110.24) reads the fault current below the conductor';
  }
  const ampacities = ampacitiesAfter(prev, next, ci);
  const rs = withPrimaries(graph, runs, new Set([runs.runOf[ci]!]));
  const judged = rejudge(state, { ...prev, project: next, graph, ampacities }, rs);
  if (typeof judged === 'string') return judged;

  const { studies, conductorMoved, nodeMoved, among } = restudyBelow(state, judged.ctx, ci, below);
  // The taps and secondaries that start below read the fault current there (their withstand).
  const withstandRuns: number[] = [];
  for (const v of below) for (const e of graph.outEdges[v]!) if (e >= 0 && runs.members[runs.runOf[e]!]![0] === e) withstandRuns.push(runs.runOf[e]!);
  const after = reported(state, judged, { conductorMoved, nodeMoved, among, faultNodes: below, withstandRuns }, studies);
  const assumptions = assumptionsAfter(state, next, ci);
  return assumptions === after.report.assumptions ? after : { ...after, report: { ...after.report, assumptions } };
}

/**
 * Re-checks the network after one load's data changed (its volt-amperes or current, continuous,
 * motor, HVAC, power factor, its name: what ends at it names it) with its connection and what the fault study reads of it unchanged:
 * the load roll-up along its supply path, every run on that path (see `rejudge`) and the voltage
 * drops at and below the path. The fault current, the circuits and the ampacities stay. Returns why
 * it cannot when the edit reaches further: a load with several supplies or anything below it, a node
 * with several supplies on the path, a verdict that changes, or a study note that changes.
 */
function recheckLoad(state: AnalysisState, next: Project, v: number, before: NodeOfKind<'load'>, after: NodeOfKind<'load'>): AnalysisState | string {
  const prev = state.ctx;
  const g0 = prev.graph;
  const { loads, runs } = prev;
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
  // A load supplied by nothing (or by several) has a finding about the network's shape that names it.
  if (before.label !== after.label && g0.inEdges[v]!.length !== 1) return "the load's name is in a finding about the network";

  // The supply path, load first: every node on it supplied once, so the roll-up changes along it alone.
  const path: number[] = [];
  const pathRuns = new Set<number>();
  for (let w = v; ; ) {
    path.push(w);
    const ins = g0.inEdges[w]!;
    if (ins.length === 0) break;
    if (ins.length > 1) return 'a node on the supply path has several supplies';
    if (path.length > g0.nodes.length) return 'the supply path loops';
    const e = ins[0]!;
    if (e >= 0) pathRuns.add(runs.runOf[e]!);
    w = edgeFrom(g0, e);
    if (w < 0) break;
  }

  const graph: Graph = { ...g0, nodes: next.nodes };
  // The session owns the analysis' arrays: the roll-up and the studies are updated in place.
  for (const w of path) rollUpAt(graph, loads, w);
  const judged = rejudge(state, { ...prev, project: next, graph }, pathRuns);
  if (typeof judged === 'string') return judged;
  const { ctx } = judged;

  // Voltage drop: the power along the path, then the sums below it.
  const { fault, drop } = state.studies;
  const conductorMoved = new Uint8Array(graph.conductors.length);
  const nodeMoved = new Uint8Array(graph.nodes.length);
  const among = { conductors: [] as number[], nodes: [] as number[] };
  redropPath(graph, drop, voltageDropInputs(ctx, fault), path, conductorMoved, nodeMoved, among);
  const dropRows = among.conductors.map((c): [number, ConductorDrop] => [c, conductorDropRow(graph, fault, drop, c)]);
  return reported(state, judged, { conductorMoved, nodeMoved, among }, withRows(state.report.studies!, [], dropRows));
}

/**
 * Re-checks the network after one OCPD's rating, type or name changed (its rating, adjustable trip, trip
 * type, time delay, arrangement, disconnecting-means facts, label) with its interrupting rating and
 * series ratings unchanged: every run judged against it (their supply facts and the device their
 * report lines name), the runs that end at it or at the equipment it is linked into (the termination
 * they read, a board's grouped ratings), the transformers those feed (Table 450.3(B)) and the
 * panelboards it protects (408.36). Of the studies only the withstand of the taps and secondaries
 * judged against it reads the device (its clearing time), and its 110.9 finding its name; the rest
 * stays. A new name is also in the findings about its place in the network and what it feeds.
 */
function recheckDevice(state: AnalysisState, next: Project, d: number, before: NodeOfKind<'breaker' | 'fuse'>, after: NodeOfKind<'breaker' | 'fuse'>): AnalysisState | string {
  const prev = state.ctx;
  const g0 = prev.graph;
  const { runs, verdicts } = prev;
  // A name is read where the device is named: its runs' findings and lines (judged again here), its 110.9 finding, the
  // shape findings of it and what it feeds; a service marking (110.24) names it too.
  const renamed = before.label !== after.label;
  if (renamed && state.report.studies!.serviceMarkings.some((m) => m.nodeId === before.id)) return 'a device with a service marking (110.24) was renamed';
  if (before.interruptingKA !== after.interruptingKA) return 'the interrupting rating changed (110.9)';
  if ((next.seriesRatings ?? []).some((s) => s.loadSideId === before.id || s.lineSideId === before.id)) return 'the device is part of a series rating';
  const rs = new Set<number>();
  for (let r = 0; r < verdicts.length; r++) if (verdicts[r]!.deviceNode === d) rs.add(r);
  // What ends at the device, or at the equipment it is linked into, reads its rating in its termination.
  const ends = [d];
  for (const e of g0.inEdges[d]!) if (e < 0) ends.push(edgeFrom(g0, e));
  for (const u of ends) for (const e of u >= 0 ? g0.inEdges[u]! : []) if (e >= 0) rs.add(runs.runOf[e]!);
  const graph: Graph = { ...g0, nodes: next.nodes };
  const judged = rejudge(state, { ...prev, project: next, graph }, withPrimaries(g0, runs, rs));
  if (typeof judged === 'string') return judged;
  // 408.36: the panelboards below the device, up to the next OCPD (their walk up stops at this one).
  const panelboards: number[] = [];
  const stack = [d];
  for (let steps = 0; stack.length > 0 && steps <= g0.nodes.length; steps++) {
    const u = stack.pop()!;
    for (const e of g0.outEdges[u]!) {
      const w = edgeTo(g0, e);
      if (w < 0 || isOcpd(graph.nodes[w]!)) continue;
      if (graph.nodes[w]!.kind === 'bus') panelboards.push(w);
      stack.push(w);
    }
  }
  const named = renamed ? { faultNodes: [d], topology: [d, ...g0.outEdges[d]!.map((e) => edgeTo(g0, e)).filter((w) => w >= 0)] } : {};
  return reported(state, judged, { panelboards, ...named }, state.report.studies!);
}
