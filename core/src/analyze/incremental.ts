import type { Conductor, Project } from '../model/schema';
import { conductorReport } from './conductorReports';
import { conductorFindingsOf } from './conductorFindings';
import { conductorAmpacity, terminalTempOf } from './ampacities';
import { judgeFedByOcpd } from './classify';
import { fixesOfRun } from './fixes';
import { runFactsOf } from './runFacts';
import { assumptionsFor, countsOf, runAnalysis, type AnalysisState } from './analyze';
import type { FixedContext } from './context';
import type { AnalysisReport, Finding } from './types';
import { hasImpedance, restepThroughConductor } from '../studies/faultCurrent/faultCurrent';
import { redropConductor } from '../studies/voltageDrop/voltageDrop';
import { conductorDropRow, dropFindings, nodeFault, voltageDropInputs } from '../studies/index';

/** How the last re-check was done: only what the edit can change, or the whole analysis (and why). */
export type UpdateMode = { mode: 'incremental'; conductorId: string } | { mode: 'full'; reason: string };

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
 * An incremental analysis. A one-conductor edit of a branch circuit (an OCPD to one load, nothing
 * below it: the most common edit by far) re-checks that conductor's run, its load's fault current
 * and voltage drop and its findings, and reuses everything else; any other edit, and any edit whose
 * reach it cannot bound (a change of topology, of a node, of the project settings, of a conductor
 * that feeds anything, or one that adds or removes a study note) runs the whole analysis.
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
      const edit = singleConductorEdit(current, next);
      const why = typeof edit === 'string' ? edit : leafBlocker(state, edit.index, edit.before, edit.after);
      if (why === null && typeof edit !== 'string') {
        state = recheckLeaf(state, next, edit.index);
        last = { mode: 'incremental', conductorId: edit.after.id };
      } else {
        state = runAnalysis(next);
        last = { mode: 'full', reason: why ?? 'unknown' };
      }
      current = next;
      return state.report;
    },
  };
}

/** The one conductor an edit changed, or why the edit is something else. Compares by identity only. */
function singleConductorEdit(prev: Project, next: Project): { index: number; before: Conductor; after: Conductor } | string {
  if (prev === next) return 'nothing changed';
  for (const key of new Set([...Object.keys(prev), ...Object.keys(next)]) as Set<keyof Project>) {
    if (key !== 'conductors' && prev[key] !== next[key]) return `${key} changed`;
  }
  const a = prev.conductors;
  const b = next.conductors;
  if (a.length !== b.length) return 'a conductor was added or removed';
  let index = -1;
  for (let i = 0; i < a.length; i++) {
    if (a[i] === b[i]) continue;
    if (index >= 0) return 'more than one conductor changed';
    index = i;
  }
  if (index < 0) return 'nothing changed';
  const before = a[index]!;
  const after = b[index]!;
  if (before.id !== after.id || before.from !== after.from || before.to !== after.to) return 'a conductor was reconnected';
  return { index, before, after };
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

  // Findings: the conductor's own section, then its voltage-drop warnings among the study findings.
  const start = state.conductorFindingStart;
  const own: Finding[] = [];
  conductorFindingsOf(ctx, ci, own);
  const from = start[ci]!;
  const to = start[ci + 1]!;
  const delta = own.length - (to - from);
  const m = graph.conductors.length;
  const conductorFindingStart = delta === 0 ? start : start.slice();
  if (delta !== 0) for (let k = ci + 1; k <= m; k++) conductorFindingStart[k] = start[k]! + delta;
  const studyStart = state.studyFindingStart + delta;
  const studyFindings = replaceDropFindings(ctx, state, ci, load, old.findings.slice(state.studyFindingStart));
  const findings = [...old.findings.slice(0, from), ...own, ...old.findings.slice(to, state.studyFindingStart), ...studyFindings];

  const conductors = old.conductors.slice();
  const ids: string[] = [];
  for (const f of findings) if (f.subject.kind === 'conductor' && f.subject.id === conductor.id) ids.push(f.id);
  conductors[ci] = conductorReport(ctx, ci, ids);
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
  return { ctx, studies: { ...state.studies, report: studies }, conductorFindingStart, studyFindingStart: studyStart, report };
}

/** The study findings with the voltage-drop warnings of conductor `ci` and of its load re-judged, in the order a full run writes them. */
function replaceDropFindings(ctx: FixedContext, state: AnalysisState, ci: number, load: number, list: readonly Finding[]): Finding[] {
  const g = ctx.graph;
  const cid = g.conductors[ci]!.id;
  const lid = g.nodes[load]!.id;
  const isCircuit = (f: Finding) => f.ruleId === 'voltage-drop' && f.subject.kind === 'conductor';
  const isTotal = (f: Finding) => f.ruleId === 'voltage-drop' && f.subject.kind === 'node';
  const kept = list.filter((f) => !(isCircuit(f) && f.subject.kind === 'conductor' && f.subject.id === cid) && !(isTotal(f) && f.subject.kind === 'node' && f.subject.id === lid));
  const { circuit, total } = dropFindings(ctx.project, g, state.studies.fault, state.studies.drop, ci, load);
  const conductorIndex = conductorIndexOf(state);
  if (circuit) {
    let at = kept.findIndex((f) => isTotal(f) || (isCircuit(f) && f.subject.kind === 'conductor' && conductorIndex.get(f.subject.id)! > ci));
    if (at < 0) at = kept.length;
    kept.splice(at, 0, circuit);
  }
  if (total) {
    let at = kept.findIndex((f) => isTotal(f) && f.subject.kind === 'node' && g.nodeIndex.get(f.subject.id)! > load);
    if (at < 0) at = kept.length;
    kept.splice(at, 0, total);
  }
  return kept;
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
