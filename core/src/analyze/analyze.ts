import { CAUTION } from '../caution';
import type { CodeEdition, Project } from '../model/schema';
import { buildGraph, topologicalOrder, type Graph } from '../topology/graph';
import { buildRuns } from '../topology/runs';
import { classifyRuns, type RunVerdict } from './classify';
import { collectFindings } from './findings';
import { rollUpLoads } from './loads';
import { suggestFixes } from './fixes';
import {
  SEVERITIES,
  VERDICTS,
  type AnalysisReport,
  type Citation,
  type ConductorReport,
  type DeviceRef,
  type Fix,
  type Severity,
  type Verdict,
} from './types';
import { describeRun } from './summary';
import { ruleCitation } from '../rules/define';
import { baseRunFacts, conductorAmpacity, effectiveRatingA, nodeLabel } from './facts';

/**
 * The whole analysis, top to bottom. Every stage is a pure function; odd
 * networks (cycles, islands, several supplies, missing data) come out as
 * findings and "incomplete" verdicts, never as exceptions.
 */
export function analyze(project: Project): AnalysisReport {
  const edition = project.project.codeEdition;
  const graph = buildGraph(project);
  const { order, count, onCycle } = topologicalOrder(graph);
  const loads = rollUpLoads(graph, order, count);
  const runs = buildRuns(graph);
  const ampacities = graph.conductors.map((c) => conductorAmpacity(c, edition));
  const base = baseRunFacts(project, graph, runs, loads, ampacities);
  const verdicts = classifyRuns(project, graph, runs, order, count, onCycle, base);

  const runFixes: Fix[][] = verdicts.map((v, r) => {
    if (v.verdict !== 'unprotected' && v.verdict !== 'tap-from-tap') return NO_FIXES;
    const members = runs.members[r]!.map((ci) => graph.conductors[ci]!);
    return suggestFixes(v.facts, members, v.verdict === 'tap-from-tap' ? [] : v.candidates, v.tried, edition);
  });

  const findings = collectFindings(project, graph, runs, verdicts, runFixes, ampacities, onCycle);
  const findingIdsBySubject = new Map<string, string[]>();
  for (const f of findings) {
    if (f.subject.kind !== 'conductor') continue;
    const list = findingIdsBySubject.get(f.subject.id) ?? [];
    list.push(f.id);
    findingIdsBySubject.set(f.subject.id, list);
  }

  // Everything a run's conductors share is built once per run.
  const shared = verdicts.map((v) => runShared(graph, v, edition));
  const conductors: ConductorReport[] = new Array(graph.conductors.length);
  for (let ci = 0; ci < graph.conductors.length; ci++) {
    const c = graph.conductors[ci]!;
    const r = runs.runOf[ci]!;
    const v = verdicts[r]!;
    const s = shared[r]!;
    conductors[ci] = {
      id: c.id,
      label: c.label ?? c.id,
      from: c.from,
      to: c.to,
      verdict: v.verdict,
      rule: v.rule?.id ?? null,
      cites: s.cites,
      role: v.role,
      summary: s.summary,
      size: c.size,
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
      fixes: runFixes[r]!,
      findingIds: findingIdsBySubject.get(c.id) ?? NONE,
    };
  }

  const byVerdict = Object.fromEntries(VERDICTS.map((v) => [v, 0])) as Record<Verdict, number>;
  for (const c of conductors) byVerdict[c.verdict]++;
  const bySeverity = Object.fromEntries(SEVERITIES.map((s) => [s, 0])) as Record<Severity, number>;
  for (const f of findings) bySeverity[f.severity]++;

  return {
    format: 'linewright-analysis',
    version: 1,
    projectName: project.project.name,
    edition,
    assumptions: assumptionsFor(project),
    caution: CAUTION,
    conductors,
    findings,
    counts: { conductors: conductors.length, byVerdict, bySeverity },
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
      ? { kind: s.kind, id: graph.nodes[s.node]!.id }
      : { kind: device ? 'ocpd' : 'none', id: device?.id ?? null };
  const isTap = v.family === 'fed-by-ocpd' && v.verdict !== 'protected' && v.verdict !== 'protected-next-size' && v.verdict !== 'incomplete';
  const f = v.facts;
  return {
    cites: v.rule ? ruleCitation(v.rule, edition) : null,
    summary: describeRun(v),
    device,
    supply,
    tapLengthFt: v.verdict === 'tap-transformer' ? transformerTapLength(v) : isTap || v.family === 'on-tap' || v.family === 'secondary' ? f.lengthFt : null,
    load: f.loadA === null || f.calculatedLoadA === null ? null : { flowingA: f.loadA, calculatedA: f.calculatedLoadA },
  };
}

/** One DeviceRef per device node, shared by every run it feeds (reports are read-only). */
const deviceRefs = new WeakMap<Graph, (DeviceRef | undefined)[]>();
function deviceRef(graph: Graph, v: number): DeviceRef {
  let byNode = deviceRefs.get(graph);
  if (!byNode) deviceRefs.set(graph, (byNode = new Array(graph.nodes.length)));
  let d = byNode[v];
  if (!d) {
    const n = graph.nodes[v]!;
    byNode[v] = d = { id: n.id, kind: n.kind, label: nodeLabel(n), ratingA: effectiveRatingA(n) };
  }
  return d;
}

/** 240.21(B)(3) counts primary plus secondary; the trial that decided it carries the sum for both runs. */
function transformerTapLength(v: RunVerdict): number | null {
  const total = v.tried.find((t) => t.ruleId === 'tap-transformer')?.conditions.find((c) => c.id === 'length')?.data.totalFt;
  return typeof total === 'number' ? total : null;
}


/** Shared empty lists: most conductors have no findings and no fixes. Reports are read-only. */
const NONE: string[] = Object.freeze([]) as unknown as string[];
const NO_FIXES: Fix[] = Object.freeze([]) as unknown as Fix[];

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
