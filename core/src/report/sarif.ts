import type { AnalysisReport, Citation, ElementRef, Finding, Severity } from '../analyze/types';
import { CAUTION } from '../caution';
import { citationText, fixText } from './format';
import { TOOL_NAME, TOOL_VERSION } from './version';

export const SARIF_SCHEMA = 'https://json.schemastore.org/sarif-2.1.0.json';

export interface SarifOptions {
  /** URI reference of the project file the results are about (e.g. 'samples/demo-clinic.json'). */
  artifactUri: string;
  /** The file's text: when given, each result also points at the line where its element's id is written. */
  sourceText?: string;
  /** Finding id → why it is suppressed (an AHJ acceptance recorded in the review); each becomes a SARIF suppression (§3.35). */
  suppressions?: ReadonlyMap<string, string>;
}

/**
 * Line (1-based) of the first `"id": "<id>"` of each element in a project file's text, so CI
 * annotations land on the element. A scan, not a parse: the file has already been validated.
 */
export function idLines(text: string): Map<string, number> {
  const lines = new Map<string, number>();
  const re = /"id"\s*:\s*"((?:[^"\\]|\\.)*)"/g;
  let line = 1;
  let last = 0;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    for (let i = last; i < m.index; i++) if (text.charCodeAt(i) === 10) line++;
    last = m.index;
    let id: string;
    try {
      id = JSON.parse(`"${m[1]}"`) as string;
    } catch {
      continue;
    }
    if (!lines.has(id)) lines.set(id, line);
  }
  return lines;
}

type SarifLevel = 'error' | 'warning' | 'note';

/** SARIF result levels (§3.27.10): a judgement call for the AHJ is a warning with a 'needs-ahj' tag. */
const LEVELS: Record<Severity, SarifLevel> = { violation: 'error', warning: 'warning', 'needs-ahj': 'warning', info: 'note' };

export interface SarifLog {
  $schema: string;
  version: '2.1.0';
  runs: SarifRun[];
}

export interface SarifRun {
  tool: { driver: { name: string; version: string; semanticVersion: string; rules: SarifRule[] } };
  artifacts: { location: { uri: string } }[];
  results: SarifResult[];
  properties: Record<string, unknown>;
}

export interface SarifRule {
  id: string;
  shortDescription: { text: string };
  properties: { citation: string | null; section: string | null; edition: number | null; tags: string[] };
}

export interface SarifLogicalLocation {
  name: string;
  fullyQualifiedName: string;
  kind: string;
}

export interface SarifLocation {
  physicalLocation: { artifactLocation: { uri: string; index: number }; region?: { startLine: number } };
  logicalLocations: SarifLogicalLocation[];
}

export interface SarifResult {
  ruleId: string;
  ruleIndex: number;
  level: SarifLevel;
  message: { text: string };
  locations: SarifLocation[];
  relatedLocations?: (SarifLocation & { id: number })[];
  partialFingerprints: Record<string, string>;
  properties: { severity: Severity; tags: string[]; citation: string | null; fixes: string[] };
  suppressions?: { kind: 'external'; status: 'accepted'; justification: string }[];
}

/**
 * Our element kinds are not code constructs, so `kind` names the diagram element itself
 * ('conductor', 'node', 'busLink', 'project'); §3.33.7 lets a producer use its own value when none
 * of the listed ones fits (from memory of the spec text).
 */
function logical(ref: ElementRef, projectName: string): SarifLogicalLocation {
  if (ref.kind === 'project') return { name: projectName, fullyQualifiedName: 'project', kind: 'project' };
  const collection = ref.kind === 'conductor' ? 'conductors' : ref.kind === 'node' ? 'nodes' : 'busLinks';
  return { name: ref.id, fullyQualifiedName: `${collection}/${ref.id}`, kind: ref.kind };
}

/** Encodes characters a URI reference may not hold (spaces, '#', '%'...) but keeps '/' and ':'. */
export function toUriReference(path: string): string {
  if (/^[a-z][a-z0-9+.-]+:/i.test(path)) return path; // already a URI (file:///...)
  return path
    .replace(/\\/g, '/')
    .split('/')
    .map((seg, i) => (i === 0 && /^[A-Za-z]:$/.test(seg) ? seg : encodeURIComponent(seg)))
    .join('/');
}

function ruleTitles(report: AnalysisReport): Map<string, string> {
  const titles = new Map<string, string>();
  for (const c of report.conductors) for (const t of c.tried) if (!titles.has(t.ruleId)) titles.set(t.ruleId, t.title);
  return titles;
}

function describe(ruleId: string, title: string | undefined, cites: Citation | null): string {
  const base = title ?? ruleId;
  return cites ? `${base} (${citationText(cites)})` : base;
}

/** The findings as a SARIF 2.1.0 log with one run, for CI systems; the caution rides in run.properties. */
export function toSarif(report: AnalysisReport, options: SarifOptions): SarifLog {
  const uri = toUriReference(options.artifactUri);
  const titles = ruleTitles(report);
  const rules: SarifRule[] = [];
  const ruleIndex = new Map<string, number>();
  for (const f of report.findings) {
    if (ruleIndex.has(f.ruleId)) continue;
    ruleIndex.set(f.ruleId, rules.length);
    rules.push({
      id: f.ruleId,
      shortDescription: { text: describe(f.ruleId, titles.get(f.ruleId), f.cites) },
      properties: {
        citation: f.cites ? citationText(f.cites) : null,
        section: f.cites ? f.cites.section : null,
        edition: f.cites ? f.cites.edition : null,
        tags: f.cites ? ['NEC'] : [],
      },
    });
  }
  const lines = options.sourceText === undefined ? null : idLines(options.sourceText);
  const location = (ref: ElementRef): SarifLocation => {
    const line = lines && ref.kind !== 'project' ? lines.get(ref.id) : undefined;
    return {
      physicalLocation: { artifactLocation: { uri, index: 0 }, ...(line === undefined ? {} : { region: { startLine: line } }) },
      logicalLocations: [logical(ref, report.projectName)],
    };
  };
  const results = report.findings.map((f: Finding): SarifResult => {
    const result: SarifResult = {
      ruleId: f.ruleId,
      ruleIndex: ruleIndex.get(f.ruleId)!,
      level: LEVELS[f.severity],
      message: { text: f.message },
      locations: [location(f.subject)],
      partialFingerprints: { 'linewrightFindingId/v1': f.id },
      properties: {
        severity: f.severity,
        tags: [f.severity],
        citation: f.cites ? citationText(f.cites) : null,
        fixes: f.fixes.map(fixText),
      },
    };
    const why = options.suppressions?.get(f.id);
    if (why !== undefined) result.suppressions = [{ kind: 'external', status: 'accepted', justification: why }];
    if (f.related.length > 0) result.relatedLocations = f.related.map((r, i) => ({ id: i + 1, ...location(r) }));
    return result;
  });
  return {
    $schema: SARIF_SCHEMA,
    version: '2.1.0',
    runs: [
      {
        tool: { driver: { name: TOOL_NAME, version: TOOL_VERSION, semanticVersion: TOOL_VERSION, rules } },
        artifacts: [{ location: { uri } }],
        results,
        properties: {
          caution: report.caution || CAUTION,
          edition: report.edition,
          projectName: report.projectName,
          assumptions: [...report.assumptions],
        },
      },
    ],
  };
}
