import { CAUTION } from '../caution';
import type { Project } from '../model/schema';
import { classifyRuns } from './classify';
import { conductorReports } from './conductorReports';
import { prepareContext } from './context';
import { collectFindings } from './findings';
import { runFixes } from './fixes';
import { runStudies } from '../studies/index';
import { baseRunFacts } from './runFacts';
import { SEVERITIES, VERDICTS, type AnalysisReport, type Severity, type Verdict } from './types';

/**
 * The whole analysis, top to bottom: a chain of stages, each one context
 * object in and one result out. Every stage is a pure function; odd networks
 * (cycles, islands, several supplies, missing data) come out as findings and
 * "incomplete" verdicts, never as exceptions.
 */
export function analyze(project: Project): AnalysisReport {
  const prepared = prepareContext(project);
  const verdicts = classifyRuns({ ...prepared, facts: baseRunFacts(prepared) });
  const judged = { ...prepared, verdicts };
  const fixed = { ...judged, fixes: runFixes(judged) };
  // Fault current and voltage drop: their findings join the rest; withstand is judged on the taps that passed 240.21.
  const studies = runStudies(judged);
  const findings = [...collectFindings(fixed), ...studies.findings];
  const conductors = conductorReports({ ...fixed, findings });

  const byVerdict = Object.fromEntries(VERDICTS.map((v) => [v, 0])) as Record<Verdict, number>;
  for (const c of conductors) byVerdict[c.verdict]++;
  const bySeverity = Object.fromEntries(SEVERITIES.map((s) => [s, 0])) as Record<Severity, number>;
  for (const f of findings) bySeverity[f.severity]++;

  return {
    format: 'linewright-analysis',
    version: 1,
    projectName: project.project.name,
    edition: prepared.edition,
    assumptions: assumptionsFor(project),
    caution: CAUTION,
    conductors,
    findings,
    studies: studies.report,
    counts: { conductors: conductors.length, byVerdict, bySeverity },
  };
}

function assumptionsFor(project: Project): string[] {
  const terminals = new Set(project.conductors.map((c) => c.terminalTempC));
  return [
    `Code edition: NFPA 70 (NEC) ${project.project.codeEdition}, without local amendments.`,
    `Termination temperature ratings used (110.14(C)): ${[...terminals].sort().map((t) => `${t} °C`).join(', ') || 'none'}; 75 °C is the default for equipment marked 60/75 °C (common practice). Confirm the equipment's markings.`,
    'Ampacities from Table 310.16 (not more than three current-carrying conductors in raceway, cable or earth, 30 °C basis), corrected by Table 310.15(B)(1) and adjusted by Table 310.15(C)(1).',
    'Loads roll up as volt-amperes: continuous × 1.25 plus noncontinuous for the calculated load (215.2(A)(1)); tap conductors are compared with the unfactored sum. Single-phase loads on three-phase systems are taken as line to line.',
    'Tap lengths are conductor lengths as entered, not raceway lengths.',
  ];
}
