import { CAUTION } from '../caution';
import type { Project } from '../model/schema';
import { classifyRunsKeeping, type KeptWalk } from './classify';
import { conductorReports } from './conductorReports';
import { prepareContext, type FixedContext } from './context';
import { collectFindings } from './findings';
import { runFixes } from './fixes';
import { runStudies, type StudiesResult } from '../studies/index';
import { baseRunFacts } from './runFacts';
import { terminalTempOf } from './ampacities';
import { SEVERITIES, VERDICTS, type AnalysisReport, type ConductorReport, type Finding, type Severity, type Verdict } from './types';

/**
 * The whole analysis, top to bottom: a chain of stages, each one context
 * object in and one result out. Every stage is a pure function; odd networks
 * (cycles, islands, several supplies, missing data) come out as findings and
 * "incomplete" verdicts, never as exceptions.
 */
export function analyze(project: Project): AnalysisReport {
  return runAnalysis(project).report;
}

/** The report and what its stages left behind, for an incremental re-check (./incremental.ts). */
export interface AnalysisState {
  readonly ctx: FixedContext;
  readonly studies: StudiesResult;
  /** What the classifier learned about the network besides the verdicts. */
  readonly walk: KeptWalk;
  /** Conductor ci's findings are report.findings[start[ci] .. start[ci + 1]); start[conductors] ends them. */
  readonly conductorFindingStart: Int32Array;
  /** Where the studies' findings begin in report.findings (they come last). */
  readonly studyFindingStart: number;
  readonly report: AnalysisReport;
}

/** `analyze()`, keeping each stage's result. */
export function runAnalysis(project: Project): AnalysisState {
  const prepared = prepareContext(project);
  const { verdicts, walk } = classifyRunsKeeping({ ...prepared, facts: baseRunFacts(prepared) });
  const judged = { ...prepared, verdicts };
  const fixed = { ...judged, fixes: runFixes(judged) };
  // Fault current and voltage drop: their findings join the rest; withstand is judged on the taps that passed 240.21.
  const studies = runStudies(judged);
  const conductorFindingStart = new Int32Array(prepared.graph.conductors.length + 1);
  const collected = collectFindings(fixed, conductorFindingStart);
  const findings = [...collected, ...studies.findings];
  const conductors = conductorReports({ ...fixed, findings });
  const report: AnalysisReport = {
    format: 'linewright-analysis',
    version: 1,
    projectName: project.project.name,
    edition: prepared.edition,
    assumptions: assumptionsFor(project),
    caution: CAUTION,
    conductors,
    findings,
    studies: studies.report,
    counts: countsOf(conductors, findings),
  };
  return { ctx: fixed, studies, walk, conductorFindingStart, studyFindingStart: collected.length, report };
}

/** The report's totals: conductors by verdict, findings by severity (every key, zeros included). */
export function countsOf(conductors: readonly ConductorReport[], findings: readonly Finding[]): AnalysisReport['counts'] {
  const byVerdict = Object.fromEntries(VERDICTS.map((v) => [v, 0])) as Record<Verdict, number>;
  for (const c of conductors) byVerdict[c.verdict]++;
  const bySeverity = Object.fromEntries(SEVERITIES.map((s) => [s, 0])) as Record<Severity, number>;
  for (const f of findings) bySeverity[f.severity]++;
  return { conductors: conductors.length, byVerdict, bySeverity };
}

export function assumptionsFor(project: Project): string[] {
  const setting = project.project.terminationDefault;
  const terminals = new Set<number>();
  let unstated = 0;
  for (const c of project.conductors) {
    terminals.add(terminalTempOf(c, setting));
    if (c.terminalTempC === undefined) unstated++;
  }
  const rule =
    setting === 'per-110.14(C)(1)'
      ? 'per 110.14(C)(1): 60 °C for 14 AWG to 1 AWG (circuits of 100 A or less), 75 °C for larger conductors'
      : '75 °C, for equipment listed and marked for 75 °C conductors (common practice for equipment marked 60/75 °C); confirm the markings';
  return [
    `Code edition: NFPA 70 (NEC) ${project.project.codeEdition}, without local amendments.`,
    `Termination temperature ratings used (110.14(C)): ${[...terminals].sort().map((t) => `${t} °C`).join(', ') || 'none'}. Project default for a conductor that states none (${unstated} of ${project.conductors.length}): ${rule}.`,
    'Ampacities from Table 310.16 (not more than three current-carrying conductors in raceway, cable or earth, 30 °C basis), corrected by Table 310.15(B)(1) and adjusted by Table 310.15(C)(1).',
    'Each load draws its current at its own voltage: three-phase VA / (√3 × V line to line), single-phase VA / V across it (line to neutral, e.g. 277 V on 480Y/277, or line to line); a single-phase load whose connection is not stated is taken at the reading that gives the larger current (kVA loads) or volt-amperes (loads in amperes). Motors draw the full-load current of Tables 430.248/430.250 (or the nameplate), HVAC units their nameplate MCA.',
    'Feeders roll up volt-amperes over their own phases taken as balanced, and never less than the line current of the largest single load they serve; a single-phase transformer draws VA / V on its own primary phases. Calculated load: continuous × 1.25 plus noncontinuous plus 25 % of the largest motor (215.2(A)(1), 430.24); tap conductors are compared with the unfactored load.',
    'Tap lengths are conductor lengths as entered, not raceway lengths.',
  ];
}
