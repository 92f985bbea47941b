import type { AnalysisReport, Citation, ConductorReport, ElementRef, Finding, Fix, RuleTrial } from '../analyze/types';
import { SEVERITIES, VERDICTS } from '../analyze/types';
import { CAUTION } from '../caution';
import { VERDICT_WORDS } from './format';
import { jsonStudies, type JsonStudies } from './studies';
import { TOOL_NAME, TOOL_VERSION } from './version';

/**
 * The machine-readable report (documented in docs/report-json.md). Every object is built key by key
 * so the order of keys is stable whatever order the analyzer filled them in; CI diffs stay quiet.
 *
 * Its size is linear in the drawing: the conductors of a run joined at pass-through splices are
 * listed once, in `runs`, and every conductor and fix of that run names the run by id instead of
 * repeating the list (a 10 000-conductor spliced run would otherwise repeat 10 000 ids 10 000 times).
 * The rules' full working (`tried`, every condition of every rule tried) is written only when asked
 * for with `detail: 'full'`; by default each conductor carries its verdict, the rule and section
 * that decided it, the numbers behind it and its fixes.
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
  /** Runs of more than one conductor joined at pass-through splices, each listed once. */
  runs: JsonRun[];
  /** How much working the report carries: `summary` (the default) or `full` (adds `tried` and the short-circuit working). */
  detail: JsonDetail;
  /** Available fault current by node and voltage drop by conductor (core/src/report/studies.ts). */
  studies?: JsonStudies;
}

/** `summary`: verdicts, numbers, findings and fixes. `full`: also every rule tried, condition by condition, and the short-circuit working of every node. */
export const JSON_DETAILS = ['summary', 'full'] as const;
export type JsonDetail = (typeof JSON_DETAILS)[number];

export interface JsonReportOptions {
  /** Default `summary`. */
  detail?: JsonDetail;
}

/** Conductors joined at pass-through splices and judged as one conductor; `id` is its supply-end conductor's id. */
export interface JsonRun {
  id: string;
  conductorIds: string[];
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
  /** Null when the drawing gives no size. */
  size: string | null;
  material: string;
  parallelSets: number;
  load: { flowingA: number; calculatedA: number } | null;
  /** Id of the spliced run (in `runs`) the conductor was judged as part of; null when judged on its own. */
  run: string | null;
  findingIds: string[];
  fixes: Record<string, unknown>[];
  /** Only with `detail: 'full'`. */
  tried?: JsonTrial[];
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

/**
 * Names a list of conductors in the report: a spliced run by its id (the list is in `runs`), anything
 * else by the list itself. The analyzer hands every fix of a run the run's own array, so the lookup
 * is by reference first; a copy of it is recognised by its ends and length (a run is one path
 * through splices: its first conductor, its last and its count fix it).
 */
type ConductorList = (ids: readonly string[]) => { run: string } | { conductorIds: string[] };

function runIndex(report: AnalysisReport): { runs: JsonRun[]; runOf: Map<string, string>; list: ConductorList } {
  const runs: JsonRun[] = [];
  const byFirst = new Map<string, readonly string[]>();
  const runOf = new Map<string, string>();
  for (const c of report.conductors) {
    const chain = c.chain;
    if (chain.length < 2) continue;
    const id = chain[0]!;
    runOf.set(c.id, id);
    if (byFirst.has(id)) continue;
    byFirst.set(id, chain);
    runs.push({ id, conductorIds: [...chain] });
  }
  const list: ConductorList = (ids) => {
    if (ids.length >= 2) {
      const chain = byFirst.get(ids[0]!);
      if (chain && (chain === ids || (chain.length === ids.length && chain[chain.length - 1] === ids[ids.length - 1]))) return { run: ids[0]! };
    }
    return { conductorIds: [...ids] };
  };
  return { runs, runOf, list };
}

const ownList: ConductorList = (ids) => ({ conductorIds: [...ids] });

/**
 * `kind` and `label` first, then the kind's own fields in a fixed order. A resize or shorten of a
 * spliced run names the run (`run`) where a fix of one conductor lists it (`conductorIds`).
 */
export function jsonFix(f: Fix, list: ConductorList = ownList): Record<string, unknown> {
  switch (f.kind) {
    case 'resize':
      return { kind: f.kind, label: f.label, forRule: f.forRule, ...list(f.conductorIds), size: f.size, material: f.material, parallelSets: f.parallelSets };
    case 'shorten':
      return { kind: f.kind, label: f.label, forRule: f.forRule, ...list(f.conductorIds), maxLengthFt: f.maxLengthFt };
    case 'add-ocpd':
      return { kind: f.kind, label: f.label, conductorId: f.conductorId, ratingA: f.ratingA };
    case 'add-main':
      return { kind: f.kind, label: f.label, busId: f.busId, ratingA: f.ratingA };
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

function conductor(c: ConductorReport, detail: JsonDetail, runOf: Map<string, string>, list: ConductorList): JsonConductor {
  const d = c.upstreamDevice;
  const out: JsonConductor = {
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
    run: runOf.get(c.id) ?? null,
    findingIds: [...c.findingIds],
    fixes: c.fixes.map((f) => jsonFix(f, list)),
  };
  if (detail === 'full') out.tried = c.tried.map(trial);
  return out;
}

function finding(f: Finding, list: ConductorList): JsonFinding {
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
    fixes: f.fixes.map((x) => jsonFix(x, list)),
  };
}

/**
 * The documented JSON shape of a report (see docs/report-json.md). Serialize with JSON.stringify
 * (the CLI writes it without indentation); `detail: 'full'` adds every rule tried to each conductor.
 */
export function toJsonReport(report: AnalysisReport, options: JsonReportOptions = {}): JsonReport {
  const detail = options.detail ?? 'summary';
  const { runs, runOf, list } = runIndex(report);
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
    conductors: report.conductors.map((c) => conductor(c, detail, runOf, list)),
    findings: report.findings.map((f) => finding(f, list)),
    counts: { conductors: report.counts.conductors, byVerdict, bySeverity },
    runs,
    detail,
    ...(report.studies ? { studies: jsonStudies(report.studies, detail === 'full') } : {}),
  };
}
