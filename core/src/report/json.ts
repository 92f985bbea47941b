import type { AnalysisReport, Citation, ConductorReport, ElementRef, Finding, Fix, RuleTrial } from '../analyze/types';
import { SEVERITIES, VERDICTS } from '../analyze/types';
import { CAUTION } from '../caution';
import { VERDICT_WORDS } from './format';
import { TOOL_NAME, TOOL_VERSION } from './version';

/**
 * The machine-readable report (documented in docs/report-json.md). Every object is built key by key
 * so the order of keys is stable whatever order the analyzer filled them in; CI diffs stay quiet.
 */
export interface JsonReport {
  tool: string;
  version: string;
  caution: string;
  edition: number;
  projectName: string;
  assumptions: string[];
  conductors: JsonConductor[];
  findings: JsonFinding[];
  counts: AnalysisReport['counts'];
}

export interface JsonConductor {
  id: string;
  label: string;
  from: string;
  to: string;
  verdict: ConductorReport['verdict'];
  verdictText: string;
  rule: string | null;
  cites: Citation | null;
  summary: string;
  role: ConductorReport['role'];
  ampacityA: number | null;
  /** Same as ampacityA: the name the CLI contract uses. */
  ampacity: number | null;
  ampacityGovernedBy: string | null;
  upstreamDevice: { id: string; kind: string; label: string; ratingA: number | null } | null;
  supply: ConductorReport['supply'];
  tapLengthFt: number | null;
  /** Same as tapLengthFt: the name the CLI contract uses. */
  tapLength: number | null;
  lengthFt: number | null;
  size: string;
  material: string;
  parallelSets: number;
  load: { flowingA: number; calculatedA: number } | null;
  chain: string[];
  findingIds: string[];
  fixes: Record<string, unknown>[];
  tried: JsonTrial[];
}

export interface JsonTrial {
  ruleId: string;
  title: string;
  cites: Citation;
  outcome: RuleTrial['outcome'];
  conditions: { id: string; status: string; text: string; data: Record<string, string | number> }[];
}

export interface JsonFinding {
  id: string;
  severity: Finding['severity'];
  ruleId: string;
  messageId: string;
  cites: Citation | null;
  subject: ElementRef;
  related: ElementRef[];
  message: string;
  data: Record<string, string | number>;
  fixes: Record<string, unknown>[];
}

function sortedData(data: Record<string, string | number>): Record<string, string | number> {
  const out: Record<string, string | number> = {};
  for (const k of Object.keys(data).sort()) out[k] = data[k]!;
  return out;
}

function cites(c: Citation | null): Citation | null {
  return c ? { code: c.code, edition: c.edition, section: c.section } : null;
}

function ref(r: ElementRef): ElementRef {
  return r.kind === 'project' ? { kind: 'project' } : ({ kind: r.kind, id: r.id } as ElementRef);
}

/** `kind` and `label` first, then the kind's own fields in a fixed order. */
export function jsonFix(f: Fix): Record<string, unknown> {
  switch (f.kind) {
    case 'resize':
      return { kind: f.kind, label: f.label, forRule: f.forRule, conductorIds: [...f.conductorIds], size: f.size, material: f.material, parallelSets: f.parallelSets };
    case 'shorten':
      return { kind: f.kind, label: f.label, forRule: f.forRule, conductorIds: [...f.conductorIds], maxLengthFt: f.maxLengthFt };
    case 'add-ocpd':
      return { kind: f.kind, label: f.label, conductorId: f.conductorId, ratingA: f.ratingA };
    case 'set-field':
      return { kind: f.kind, label: f.label, ref: ref(f.ref), field: f.field, value: f.value };
  }
}

function trial(t: RuleTrial): JsonTrial {
  return {
    ruleId: t.ruleId,
    title: t.title,
    cites: cites(t.cites)!,
    outcome: t.outcome,
    conditions: t.conditions.map((c) => ({ id: c.id, status: c.status, text: c.text, data: sortedData(c.data) })),
  };
}

function conductor(c: ConductorReport): JsonConductor {
  const d = c.upstreamDevice;
  return {
    id: c.id,
    label: c.label,
    from: c.from,
    to: c.to,
    verdict: c.verdict,
    verdictText: VERDICT_WORDS[c.verdict],
    rule: c.rule,
    cites: cites(c.cites),
    summary: c.summary,
    role: c.role,
    ampacityA: c.ampacity ? c.ampacity.ampacityA : null,
    ampacity: c.ampacity ? c.ampacity.ampacityA : null,
    ampacityGovernedBy: c.ampacity ? c.ampacity.governedBy : null,
    upstreamDevice: d ? { id: d.id, kind: d.kind, label: d.label, ratingA: d.ratingA } : null,
    supply: { kind: c.supply.kind, id: c.supply.id },
    tapLengthFt: c.tapLengthFt,
    tapLength: c.tapLengthFt,
    lengthFt: c.lengthFt,
    size: c.size,
    material: c.material,
    parallelSets: c.parallelSets,
    load: c.load ? { flowingA: c.load.flowingA, calculatedA: c.load.calculatedA } : null,
    chain: [...c.chain],
    findingIds: [...c.findingIds],
    fixes: c.fixes.map(jsonFix),
    tried: c.tried.map(trial),
  };
}

function finding(f: Finding): JsonFinding {
  return {
    id: f.id,
    severity: f.severity,
    ruleId: f.ruleId,
    messageId: f.messageId,
    cites: cites(f.cites),
    subject: ref(f.subject),
    related: f.related.map(ref),
    message: f.message,
    data: sortedData(f.data),
    fixes: f.fixes.map(jsonFix),
  };
}

/** The documented JSON shape of a report (see docs/report-json.md). Serialize with JSON.stringify. */
export function toJsonReport(report: AnalysisReport): JsonReport {
  const byVerdict = {} as AnalysisReport['counts']['byVerdict'];
  for (const v of VERDICTS) byVerdict[v] = report.counts.byVerdict[v] ?? 0;
  const bySeverity = {} as AnalysisReport['counts']['bySeverity'];
  for (const s of SEVERITIES) bySeverity[s] = report.counts.bySeverity[s] ?? 0;
  return {
    tool: TOOL_NAME,
    version: TOOL_VERSION,
    caution: report.caution || CAUTION,
    edition: report.edition,
    projectName: report.projectName,
    assumptions: [...report.assumptions],
    conductors: report.conductors.map(conductor),
    findings: report.findings.map(finding),
    counts: { conductors: report.counts.conductors, byVerdict, bySeverity },
  };
}
