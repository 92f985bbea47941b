import type { Conductor, EquipmentNode, NodeId, NodeOfKind, Project } from '../model/schema';
import { conductorReport, sharedParts, findingIdsByConductor } from './conductorReports';
import { conductorFindingsOf } from './conductorFindings';
import { conductorAmpacity, terminalTempOf } from './ampacities';
import { judgeFedByOcpd, keptNodeSupply, ocpdBelowAt, rejudgeRuns, type KeptWalk, type RunVerdict } from './classify';
import { conductorCircuit, networkSystems, servesBitsAt, systemFromSupply, type ConductorCircuit, type NetworkSystems } from './circuits';
import { fixesOfRun } from './fixes';
import { loadCircuit, loadConnection, rollUpAt, systemFromSupplies, type SystemLoads } from './loads';
import { runFactsOf, siteFacts } from './runFacts';
import { assumptionsFor, countsOf, runAnalysis, type AnalysisState } from './analyze';
import type { FixedContext } from './context';
import type { AnalysisReport, Finding } from './types';
import type { RunFacts } from '../rules/facts';
import { hasImpedance, restepBelow, stepAppended, type FaultStudy } from '../studies/faultCurrent/faultCurrent';
import { isThreePhase, redropBelow, redropPath, type VoltageDropStudy } from '../studies/voltageDrop/voltageDrop';
import { conductorDropRow, faultDutyFinding, NO_RATING, NO_RATING_ID, NO_RATING_MAX_RELATED, noRatingFinding, nodeFault, redoDropFindings, RELIES_ON_DEVICE_AHEAD, seriesByLoadSide, tapWithstand, voltageDropInputs, type ConductorDrop, type NodeFault, type StudiesReport, type WithstandResult } from '../studies/index';
import { lazyTable, settleTables } from '../studies/lazyTable';
import { conductorWithstand } from '../rules/conductor-withstand';
import { equipmentSccr } from '../rules/equipment-sccr';
import { interruptingRating } from '../rules/interrupting-rating';
import { edgeFrom, edgeTo, KIND, orderPositions, type Graph } from '../topology/graph';
import { isJoint, isPassThroughJoint } from '../topology/runs';
import { voltageDropRule } from '../rules/voltage-drop';
import { transformerProtection } from '../rules/transformer-protection';
import { panelboardProtection } from '../rules/panelboard-protection';
import { isOcpd } from './equipment';
import { transformerFindingOf } from './equipmentFindings';
import { panelboardFindingOf } from './panelboardFindings';
import { nodeTopologyFindings } from './topologyFindings';

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

/** The studies report with rows of its short-circuit table (by node) and voltage-drop table (by conductor) replaced; the tables are built when read. */
function withRows(before: StudiesReport, faults: readonly [number, NodeFault][], drops: readonly [number, ConductorDrop][]): StudiesReport {
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

/**
 * `rs` with the primary runs of every transformer a run of `rs` leaves: a transformer's primary reads
 * the facts of its secondaries (240.21(B)(3)). Adds to `rs` and returns it.
 */
function withPrimaries(g: Graph, runs: FixedContext['runs'], rs: Set<number>): Set<number> {
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
function rejudge(state: AnalysisState, base: Omit<FixedContext, 'verdicts' | 'fixes'>, rs: Set<number>): Rejudged | string {
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
const MAX_REJUDGED_FRACTION = 0.25;
/** Below this many runs (or nodes) the bound does not apply (a small drawing re-checks in no time either way). */
const MIN_REJUDGED_BOUND = 64;
/** How many of `total` runs (or nodes) an edit may reach before the whole analysis runs instead. */
const boundOf = (total: number) => Math.max(MIN_REJUDGED_BOUND, MAX_REJUDGED_FRACTION * total);

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
function refaultDuty(ctx: FixedContext, fault: AnalysisState['studies']['fault'], section: readonly Finding[], nodes: readonly number[], added: readonly number[] = []): readonly Finding[] {
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
interface DropsAmong {
  conductors: number[];
  nodes: readonly number[];
}

/** The state and report after `judged`: the runs' findings and report lines, the transformers they feed, the panelboards and drops that moved. */
function reported(state: AnalysisState, judged: Rejudged, moved: Moved, studiesReport: NonNullable<AnalysisReport['studies']>): AnalysisState {
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
function spliceFindings(
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
function findingIdsOf(
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
function conductorIndexOf(state: AnalysisState): ReadonlyMap<string, number> {
  const g = state.ctx.graph;
  let index = conductorIndexes.get(g.conductorFrom);
  if (!index) {
    index = new Map(g.conductors.map((c, i) => [c.id as string, i]));
    conductorIndexes.set(g.conductorFrom, index);
  }
  return index;
}

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
interface KeptShape {
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
function appendedLeaves(state: AnalysisState, prev: Project, next: Project): { project: Project; leaf: AppendedLeaf }[] | string {
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
function recheckAppended(state: AnalysisState, next: Project, leaf: AppendedLeaf, kept: KeptShape): AnalysisState | string {
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
  if (e >= 0) conductorIndexes.set(graph.conductorFrom, new AppendedIndex(conductorIndexOf(state), next.conductors[e]!.id, e));
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
