import { analyze } from '../analyze/analyze';
import { applyFix } from '../analyze/applyFix';
import { conductorAmpacity } from '../analyze/ampacities';
import { classifyRuns, type RunVerdict } from '../analyze/classify';
import { sizedByCalculatedLoad } from '../analyze/conductorFindings';
import { prepareContext } from '../analyze/context';
import { effectiveRatingA } from '../analyze/equipment';
import { segmentsAsAdjusted } from '../analyze/fixes';
import { baseRunFacts } from '../analyze/runFacts';
import { failedTexts, nearestTrial } from '../analyze/summary';
import { FAILING_VERDICTS, VERDICT_LABELS, type AnalysisReport, type Finding, type Fix, type Verdict } from '../analyze/types';
import type { Conductor, ConductorId, Material, NodeId, Project } from '../model/schema';
import { conductorName, formatNumber } from '../rules/define';
import { SIZE_INDEX_1_0, sizeIndexOf } from '../tables/sizes';
import { largestStandardRatingAtMost, standardRatingsA } from '../tables/standardRatings';
import { configsByCost, MAX_PARALLEL_SETS } from './configs';
import { COST_BASIS, costPerFt } from './cost';
import { passesScreen, screenConfig, type RunUnderTest, type Screen } from './screen';
import { changedSegments, runCost, type SizingConfig } from './trial';

export interface SizingOptions {
  /** Materials to choose from at every size; default: the project's `sizingMaterials`, else copper, aluminum from 1/0 AWG, and the run's own. */
  materials?: readonly Material[];
  /** Most sets in parallel (default 8). */
  maxSets?: number;
  /** How many acceptable choices to list that keep the device ahead (default 4); up to half as many more lower it. */
  top?: number;
  /** Most whole re-analyses to confirm choices with (default 60); the search says when it stopped there. */
  maxAnalyses?: number;
}

/** Why a configuration is not acceptable: the first limit it fails. */
export interface BindingLimit {
  /** Code section, or null for a missing fact. */
  section: string | null;
  text: string;
  /** Where it was found: the analyzer's rules over the run's trial facts, or the whole re-analysis (studies included). */
  stage: 'rules' | 'analysis';
}

export interface SizingChoice {
  config: SizingConfig;
  /** 'Cu, 2 sets of 250 kcmil' as a reviewer writes it, with the device when it changes. */
  label: string;
  /** New rating of the OCPD ahead, A, when the choice changes it; null keeps the drawing's. */
  deviceRatingA: number | null;
  /** Relative cost of the whole run (cost proxy × length); see `costBasis`. */
  cost: number;
  /** Relative cost per foot of one phase. */
  costPerFt: number;
  /** The run's ampacity in this configuration; null when it has none. */
  ampacityA: number | null;
}

export interface SizingCandidate extends SizingChoice {
  /** The drawing's own configuration. */
  present: boolean;
  verdict: Verdict;
  /** Why it passes, one line per check, each naming its section. */
  reasons: string[];
  /** The edits that build it, applied together as one undoable edit. */
  fixes: Fix[];
  /** The next smaller size of the same material and sets (and device), and the limit it fails; null for the smallest. */
  smallerFails: (SizingChoice & { binding: BindingLimit }) | null;
}

export interface SizingResult {
  conductorId: ConductorId;
  /** The run judged as one (splices with no branch), supply end first. */
  runIds: ConductorId[];
  present: SizingChoice & { passes: boolean; binding: BindingLimit | null };
  /** Acceptable choices, cheapest first (one per material, number of sets and device choice). */
  candidates: SizingCandidate[];
  /** Cheaper choices than the first candidate, nearest misses first, with the limit each fails. */
  rejected: (SizingChoice & { binding: BindingLimit })[];
  /** Why the search cannot help (e.g. a tap from a tap), or null. */
  problem: string | null;
  costBasis: string;
  /** What the search took as given, and where it stopped. */
  notes: string[];
  /** Configurations tried on the rules, and whole re-analyses made. */
  screened: number;
  analyses: number;
}

interface Family {
  key: string;
  done: boolean;
  /** The latest configuration of the family that failed, and why. */
  lastFail: (SizingChoice & { why: () => BindingLimit }) | null;
}

const DEFAULT_TOP = 4;
const DEFAULT_MAX_ANALYSES = 60;
const MAX_REJECTED = 8;

/**
 * The sizing assistant: the cheapest configurations of one conductor's run (size, material,
 * sets in parallel and, where the device ahead serves this run alone, its 240.6(A) rating)
 * that the analyzer accepts. Each configuration is first tried with the analyzer's own rules
 * over the run's trial facts (ampacity by computeAmpacity, 240.4 with (B) and (D), the tap or
 * secondary rule the run is under, 210.19/215.2/230.42 load); each that passes is then built
 * on a copy of the project and the whole project re-analyzed (studies included: voltage drop,
 * short-circuit withstand), so a listed choice is one the analyzer does not flag. Pure.
 */
export function sizeConductor(project: Project, conductorId: string, options: SizingOptions = {}): SizingResult {
  const prepared = prepareContext(project);
  const verdicts = classifyRuns({ ...prepared, facts: baseRunFacts(prepared) });
  const { graph: g, runs, edition } = prepared;
  const ci = g.conductors.findIndex((c) => c.id === conductorId);
  if (ci < 0) throw new Error(`There is no conductor "${conductorId}" in the drawing; give the id of a conductor.`);
  const v = verdicts[runs.runOf[ci]!]!;
  const index = new Map(g.conductors.map((c, i) => [c.id as string, i]));
  const members = segmentsAsAdjusted(prepared, v.facts.conductorIds.map((id) => index.get(id)!));
  const baseline = analyze(project);
  const run: RunUnderTest = {
    facts: v.facts,
    members,
    rules: v.candidates.length > 0 ? v.candidates : v.rule ? [v.rule] : [],
    loadRule: sizedByCalculatedLoad(v),
    edition,
    terminationDefault: project.project.terminationDefault,
    mode: 'whole',
  };
  if (v.facts.size === null) throw new Error(`Conductor "${conductorId}" has no size yet (field size): choose one in its details first; the assistant compares against the size drawn.`);
  const presentConfig: SizingConfig = { size: v.facts.size, material: v.facts.material, parallelSets: v.facts.parallelSets };
  const device = adjustableDevice(project, prepared.graph, v, members[0]!);
  const notes = [
    COST_BASIS,
    'Added parallel sets are taken each in a raceway of its own, like the drawn conductors (310.10(G)(4)); the current-carrying count per raceway stays as drawn.',
  ];
  const baseRes = judge(baseline, baseline, v.facts.conductorIds);
  const present: SizingResult['present'] = {
    ...choice(members, presentConfig, null, v.facts.ampacityA),
    passes: baseRes === null,
    binding: baseRes,
  };
  const result: SizingResult = {
    conductorId: conductorId as ConductorId,
    runIds: v.facts.conductorIds,
    present,
    candidates: [],
    rejected: [],
    problem: null,
    costBasis: COST_BASIS,
    notes,
    screened: 0,
    analyses: 0,
  };
  const problem = cannotHelp(v);
  if (problem) return { ...result, problem };

  const materials = allowedMaterials(project, v.facts.material, options.materials);
  notes.push(materials.note);
  if (device) notes.push(device.note);
  else if (v.family === 'fed-by-ocpd') notes.push('The device ahead keeps its rating: the run is a feeder, a motor or HVAC circuit (sized by its own article), or the device serves more than this run.');
  const top = options.top ?? DEFAULT_TOP;
  const maxAnalyses = options.maxAnalyses ?? DEFAULT_MAX_ANALYSES;
  const families = new Map<string, Family>();
  const familyOf = (c: SizingConfig, changed: boolean): Family => {
    const key = `${c.material}/${c.parallelSets}/${changed ? 'device' : 'kept'}`;
    let f = families.get(key);
    if (!f) families.set(key, (f = { key, done: false, lastFail: null }));
    return f;
  };
  const deviceChoices: readonly ('kept' | 'lowered')[] = device ? ['kept', 'lowered'] : ['kept'];
  const configs = configsByCost(materials.list, Math.max(options.maxSets ?? MAX_PARALLEL_SETS, 1)).filter(materials.allows);
  let stopped = false;

  const wanted = { kept: top, lowered: Math.max(1, Math.floor(top / 2)) };
  const found = { kept: 0, lowered: 0 };
  // A lowered device is worth listing only while it is cheaper than every choice that keeps the device.
  const full = () => found.kept >= wanted.kept;
  for (const config of configs) {
    if (full()) break;
    for (const deviceChoice of deviceChoices) {
      const fam = familyOf(config, deviceChoice === 'lowered');
      if (fam.done || found[deviceChoice] >= wanted[deviceChoice] || (deviceChoice === 'lowered' && found.kept > 0)) continue;
      // The device ahead: kept, or the largest lower standard rating under which the rules hold.
      let s: Screen | null = null;
      let rating: number | null = null;
      if (deviceChoice === 'kept') {
        s = screenConfig(run, config);
        result.screened++;
      } else {
        // Largest first; when none passes, the lowest (the most lenient) says why.
        for (const r of device!.lower) {
          s = screenConfig(run, config, r);
          rating = r;
          result.screened++;
          if (passesScreen(run, s)) break;
        }
      }
      const c = choice(members, config, rating, s?.at?.ampacityA ?? null, device?.kind);
      if (s === null || !passesScreen(run, s)) {
        const screened = s;
        fam.lastFail = { ...c, why: () => screenBinding(run, v, screened!) };
        continue;
      }
      if (result.analyses >= maxAnalyses) {
        stopped = true;
        break;
      }
      const isPresent = rating === null && changedSegments(members, config, 'whole').length === 0;
      const fixes = isPresent ? [] : editsFor(members, config, rating, device, c.label, v);
      const after = isPresent ? baseline : analyzeWith(project, fixes);
      if (!isPresent) result.analyses++;
      const binding = judge(after, baseline, v.facts.conductorIds);
      if (binding) {
        fam.lastFail = { ...c, why: () => binding };
        continue;
      }
      fam.done = true;
      found[deviceChoice]++;
      const lf = fam.lastFail;
      result.candidates.push({
        ...c,
        present: isPresent,
        verdict: verdictIn(after, conductorIdOfRun(v)),
        reasons: reasonsFor(after, v.facts.conductorIds, run.loadRule),
        fixes,
        smallerFails: lf ? { ...stripWhy(lf), binding: lf.why() } : null,
      });
    }
    if (stopped) break;
  }
  if (stopped) notes.push(`The search stopped after ${maxAnalyses} whole re-analyses; costlier choices were not tried.`);
  const cheapest = result.candidates[0]?.cost ?? Number.POSITIVE_INFINITY;
  result.rejected = [...families.values()]
    .map((f) => f.lastFail)
    .filter((x): x is NonNullable<typeof x> => x !== null && x.cost < cheapest)
    .sort((a, b) => b.cost - a.cost)
    .slice(0, MAX_REJECTED)
    .map((x) => ({ ...stripWhy(x), binding: x.why() }));
  if (result.candidates.length === 0) {
    result.problem = stopped
      ? 'No acceptable configuration among those tried; the search stopped at its limit of re-analyses.'
      : `No configuration up to ${MAX_PARALLEL_SETS} sets of 2000 kcmil passes${present.binding ? `: ${present.binding.text}` : ''}. Change what the size does not decide (the device ahead, the length or the route).`;
  }
  return result;
}

function stripWhy<T extends { why: unknown }>(x: T): Omit<T, 'why'> {
  const { why: _why, ...rest } = x;
  return rest;
}

function conductorIdOfRun(v: RunVerdict): ConductorId {
  return v.facts.conductorIds[0]!;
}

/** A run no size can make acceptable, in words; null when sizing can help. */
function cannotHelp(v: RunVerdict): string | null {
  if (v.family === 'on-tap') return 'It is supplied from a tap or transformer secondary; no size makes that acceptable (240.21). Supply it through an OCPD that meets 240.4.';
  const up = v.facts.suppliedFrom;
  if (up && FAILING_VERDICTS.has(up.verdict)) return `It is fed from ${up.conductorIds.join(' → ')} (${VERDICT_LABELS[up.verdict]}), which no OCPD protects; size that conductor first.`;
  if (v.family === 'no-supply') return 'Nothing upstream supplies it (or it lies on a loop); connect it to a source first.';
  if (v.facts.supplyOcpdA === null && v.family === 'fed-by-ocpd') return 'The device ahead has no rating; enter it (ratingA) first.';
  return null;
}

/** Materials the search may choose, and a predicate for the sizes each is allowed at. */
function allowedMaterials(project: Project, own: Material, given: readonly Material[] | undefined): { list: Material[]; allows: (c: SizingConfig) => boolean; note: string } {
  const stated = given ?? project.project.sizingMaterials;
  if (stated) {
    const list = [...new Set(stated)];
    return { list, allows: () => true, note: `Materials: ${list.map(materialWord).join(', ')} (project setting sizingMaterials).` };
  }
  const list = [...new Set<Material>(['cu', 'al', own])];
  return {
    list,
    allows: (c) => c.material === 'cu' || c.material === own || sizeIndexOf(c.size) >= SIZE_INDEX_1_0,
    note: `Materials: copper at every size, aluminum at 1/0 AWG and larger (common practice of project specifications)${own !== 'cu' ? `, and the run's own ${materialWord(own)}` : ''}; set sizingMaterials in the project to change this.`,
  };
}

function materialWord(m: Material): string {
  return m === 'cu' ? 'copper' : m === 'al' ? 'aluminum' : 'copper-clad aluminum';
}

interface AdjustableDevice {
  id: NodeId;
  kind: 'breaker' | 'fuse';
  ratingA: number;
  /** Lower 240.6(A) ratings the device may take, largest first: not below the calculated load (210.20(A), 215.3). */
  lower: number[];
  note: string;
}

/**
 * The OCPD ahead, when its rating is the sizing's to choose: the run is a branch circuit sized
 * by 240.4 (not a motor or HVAC branch circuit), the device feeds it alone and its rating is stated. It is only ever lowered, to a standard rating of 240.6(A) not
 * below the calculated load (210.20(A), 215.3: the device carries 125 % of the continuous load
 * plus the noncontinuous load).
 */
function adjustableDevice(project: Project, g: ReturnType<typeof prepareContext>['graph'], v: RunVerdict, first: Conductor): AdjustableDevice | null {
  // A branch circuit only: a feeder's drawn load is seldom all it will carry.
  if (v.family !== 'fed-by-ocpd' || v.role !== 'branch' || v.deviceNode < 0 || !sizedByCalculatedLoad(v)) return null;
  const node = g.nodes[v.deviceNode]!;
  if (node.kind !== 'breaker' && node.kind !== 'fuse') return null;
  const ratingA = effectiveRatingA(node);
  if (ratingA === null || ratingA !== node.ratingA || first.from !== node.id) return null;
  if (g.outEdges[v.deviceNode]!.length !== 1) return null;
  const minA = v.facts.calculatedLoadA;
  if (minA === null) return null;
  const lower = standardRatingsA(project.project.codeEdition, node.kind)
    .filter((r) => r < ratingA && r >= minA)
    .reverse();
  if (lower.length === 0) return null;
  const floor = largestStandardRatingAtMost(ratingA, project.project.codeEdition, node.kind);
  return {
    id: node.id,
    kind: node.kind,
    ratingA: floor ?? ratingA,
    lower,
    note: `The ${formatNumber(ratingA)} A ${node.kind} ahead feeds this run alone: choices may lower it to a 240.6(A) standard rating not below the ${formatNumber(minA)} A calculated load (210.20(A), 215.3).`,
  };
}

function choice(members: readonly Conductor[], config: SizingConfig, deviceRatingA: number | null, ampacityA: number | null, kind: 'breaker' | 'fuse' = 'breaker'): SizingChoice {
  return {
    config,
    label: `${conductorName(config)}${deviceRatingA !== null ? `, ${deviceRatingA} A ${kind} ahead` : ''}`,
    deviceRatingA,
    cost: runCost(members, config, 'whole'),
    costPerFt: Math.round(costPerFt(config) * 10) / 10,
    ampacityA,
  };
}

/** The edits that build a configuration: a resize of the segments it changes, and the device's new rating. */
function editsFor(members: readonly Conductor[], config: SizingConfig, ratingA: number | null, device: AdjustableDevice | null, label: string, v: RunVerdict): Fix[] {
  const fixes: Fix[] = [];
  const ids = changedSegments(members, config, 'whole');
  if (ids.length > 0) {
    fixes.push({ kind: 'resize', conductorIds: ids, size: config.size, material: config.material, parallelSets: config.parallelSets, forRule: v.rule?.id ?? 'sizing', label: `Size ${v.facts.conductorIds.join(' → ')}: ${label}` });
  }
  if (ratingA !== null && device) {
    fixes.push({ kind: 'set-field', ref: { kind: 'node', id: device.id }, field: 'ratingA', value: ratingA, label: `Set the ${device.kind} ahead to ${ratingA} A` });
  }
  return fixes;
}

function analyzeWith(project: Project, fixes: readonly Fix[]): AnalysisReport {
  const copy = structuredClone(project);
  for (const f of fixes) applyFix(copy, f);
  return analyze(copy);
}

function verdictIn(report: AnalysisReport, id: ConductorId): Verdict {
  return report.conductors.find((c) => c.id === id)?.verdict ?? 'incomplete';
}

/**
 * Whether the analyzer accepts the run in `after`: null when it does, else the first limit it
 * fails. Not accepted: a failing or incomplete verdict, a violation on any of its segments, a
 * voltage-drop finding on them (the project limit), or a warning or violation anywhere that the
 * drawing as it stands does not have (the change must not break something else).
 */
export function judge(after: AnalysisReport, baseline: AnalysisReport, runIds: readonly ConductorId[]): BindingLimit | null {
  const inRun = new Set<string>(runIds);
  const onRun = (f: Finding) => f.subject.kind === 'conductor' && inRun.has(f.subject.id);
  const limit = (f: Finding): BindingLimit => ({ section: f.cites?.section ?? null, text: f.message, stage: 'analysis' });
  const violation = after.findings.find((f) => onRun(f) && f.severity === 'violation');
  if (violation) return limit(violation);
  const drop = after.findings.find((f) => onRun(f) && f.ruleId === 'voltage-drop');
  if (drop) return limit(drop);
  const report = after.conductors.find((c) => c.id === runIds[0]);
  if (!report || report.verdict === 'incomplete' || FAILING_VERDICTS.has(report.verdict)) {
    return { section: report?.cites?.section ?? null, text: report ? `${VERDICT_LABELS[report.verdict]}: ${report.summary}` : 'The conductor is not in the analysis.', stage: 'analysis' };
  }
  const before = new Set(baseline.findings.map((f) => f.id));
  const added = after.findings.find((f) => !before.has(f.id) && (f.severity === 'violation' || f.severity === 'warning'));
  if (added) return limit(added);
  return null;
}

/** The first limit a configuration fails on the rules: no ampacity, no rule that holds (the nearest, its failed conditions), or the load. */
function screenBinding(run: RunUnderTest, v: RunVerdict, s: Screen): BindingLimit {
  if (s.at === null) {
    const problem = run.members
      .map((c) => conductorAmpacity({ ...c, ...s.config }, run.edition, run.terminationDefault).problem)
      .find((p) => p !== null);
    return { section: problem?.field === 'parallelSets' ? '310.10(G)' : '310.16', text: problem?.message ?? 'No ampacity for this configuration.', stage: 'rules' };
  }
  if (run.rules.length > 0 && s.holds === null) {
    const n = nearestTrial(s.trials);
    if (n) return { section: n.cites.section, text: `${n.title}: ${failedTexts(n).join(' ') || failedTexts(n, 'unknown').join(' ')}`, stage: 'rules' };
  }
  const load = s.load?.conditions.find((c) => c.status === 'fail');
  const section = v.role === 'branch' ? '210.19(A)(1)' : v.role === 'service' ? '230.42(A)' : '215.2(A)(1)';
  return { section, text: load?.text ?? 'Fails the load check.', stage: 'rules' };
}

/** Why a configuration passes, from its re-analysis: verdict and rule, ampacity, load, voltage drop, withstand. */
function reasonsFor(after: AnalysisReport, runIds: readonly ConductorId[], loadRule: boolean): string[] {
  const c = after.conductors.find((x) => x.id === runIds[0]);
  if (!c) return [];
  const out: string[] = [];
  const dev = c.upstreamDevice ? ` by ${c.upstreamDevice.label || c.upstreamDevice.id} (${c.upstreamDevice.ratingA ?? '?'} A)` : '';
  out.push(`${VERDICT_LABELS[c.verdict]}${c.cites ? ` (${c.cites.section})` : ''}${dev}.`);
  const w = c.ampacity;
  if (w) {
    const terminal = w.steps.find((s) => s.id === 'terminal');
    const sets = w.steps.find((s) => s.id === 'parallel');
    out.push(`Ampacity ${formatNumber(w.ampacityA)} A: ${sets?.text ?? ''}${terminal ? `; ${terminal.text}` : ''}.`);
  }
  if (c.load && loadRule && w) {
    out.push(`Load ${formatNumber(c.load.flowingA)} A within ${formatNumber(w.ampacityA)} A; 125 % of the continuous load plus the rest, ${formatNumber(c.load.calculatedA)} A, within ${formatNumber(Math.round(w.terminalLimitA * w.parallelSets * 100) / 100)} A before correction (210.19(A)(1), 215.2(A)(1)).`);
  }
  const vd = after.studies?.voltageDrop;
  const drops = (vd?.conductors ?? []).filter((d) => runIds.includes(d.conductorId) && d.circuitPct !== null);
  if (drops.length > 0) {
    const worst = Math.max(...drops.map((d) => d.circuitPct!));
    out.push(`Voltage drop of the circuit ${formatNumber(Math.round(worst * 100) / 100)} % (limit ${formatNumber(vd!.circuitLimitPct)} %, 210.19 and 215.2 informational notes).`);
  }
  const ws = after.studies?.withstand.find((x) => x.conductorIds.some((id) => runIds.includes(id)));
  if (ws && ws.withstands && ws.allowedS !== null && ws.faultKA !== null) {
    out.push(`Withstands ${formatNumber(ws.faultKA)} kA for ${formatNumber(Math.round(ws.allowedS * 1000) / 1000)} s, longer than the ${formatNumber(ws.clearingTimeS)} s clearing time (ICEA P-32-382).`);
  }
  return out;
}
