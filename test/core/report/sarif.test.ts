import { describe, expect, it } from 'vitest';
import { CAUTION } from '@linewright/core';
import { SARIF_SCHEMA, idLines, toSarif, toUriReference } from '../../../core/src/report/sarif';
import { cleanReport, fixtureInput, fixtureReport } from './fixture';

/**
 * Structural checks of the required properties and allowed values of a SARIF log, written from the
 * specification; they add what a JSON schema cannot say (ruleIndex points at the rule named by ruleId,
 * artifact indexes exist). The official schema itself is checked in sarifSchema.test.ts.
 * Source: OASIS SARIF 2.1.0, §3.13–3.27 (sarifLog, run, tool, toolComponent, result), with §3.4 artifactLocation, §3.11 message,
 * §3.28–3.29 location and physicalLocation, §3.33 logicalLocation, §3.49 reportingDescriptor
 * (those section numbers from memory). Key sets are the properties the spec defines for each
 * object, so a misspelt key fails here as it would under the schema's additionalProperties: false.
 */
const ALLOWED: Record<string, readonly string[]> = {
  sarifLog: ['$schema', 'version', 'runs', 'inlineExternalProperties', 'properties'],
  run: ['tool', 'invocations', 'conversion', 'language', 'versionControlProvenance', 'originalUriBaseIds', 'artifacts', 'logicalLocations', 'graphs', 'results', 'automationDetails', 'runAggregates', 'baselineGuid', 'redactionTokens', 'defaultEncoding', 'defaultSourceLanguage', 'newlineSequences', 'columnKind', 'externalPropertyFileReferences', 'threadFlowLocations', 'taxonomies', 'addresses', 'translations', 'policies', 'webRequests', 'webResponses', 'specialLocations', 'properties'],
  toolComponent: ['guid', 'name', 'organization', 'product', 'productSuite', 'shortDescription', 'fullDescription', 'fullName', 'version', 'semanticVersion', 'dottedQuadFileVersion', 'releaseDateUtc', 'downloadUri', 'informationUri', 'globalMessageStrings', 'notifications', 'rules', 'taxa', 'locations', 'language', 'contents', 'isComprehensive', 'localizedDataSemanticVersion', 'minimumRequiredLocalizedDataSemanticVersion', 'associatedComponent', 'translationMetadata', 'supportedTaxonomies', 'properties'],
  reportingDescriptor: ['id', 'deprecatedIds', 'guid', 'deprecatedGuids', 'name', 'deprecatedNames', 'shortDescription', 'fullDescription', 'messageStrings', 'defaultConfiguration', 'helpUri', 'help', 'relationships', 'properties'],
  result: ['ruleId', 'ruleIndex', 'rule', 'kind', 'level', 'message', 'analysisTarget', 'locations', 'guid', 'correlationGuid', 'occurrenceCount', 'partialFingerprints', 'fingerprints', 'stacks', 'codeFlows', 'graphs', 'graphTraversals', 'relatedLocations', 'suppressions', 'baselineState', 'rank', 'attachments', 'hostedViewerUri', 'workItemUris', 'provenance', 'fixes', 'taxa', 'webRequest', 'webResponse', 'properties'],
  location: ['id', 'physicalLocation', 'logicalLocations', 'message', 'annotations', 'relationships', 'properties'],
  physicalLocation: ['address', 'artifactLocation', 'region', 'contextRegion', 'properties'],
  artifactLocation: ['uri', 'uriBaseId', 'index', 'description', 'properties'],
  logicalLocation: ['name', 'index', 'fullyQualifiedName', 'decoratedName', 'parentIndex', 'kind', 'properties'],
  artifact: ['description', 'location', 'parentIndex', 'offset', 'length', 'roles', 'mimeType', 'contents', 'encoding', 'sourceLanguage', 'hashes', 'lastModifiedTimeUtc', 'properties'],
};

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);

function keysAllowed(o: Obj, kind: string, path: string, problems: string[]): void {
  for (const k of Object.keys(o)) if (!ALLOWED[kind]!.includes(k)) problems.push(`${path}: ${kind} has no property "${k}"`);
}

function checkPropertyBag(v: unknown, path: string, problems: string[]): void {
  if (v === undefined) return;
  if (!isObj(v)) return void problems.push(`${path}: a property bag is an object`);
  if (v.tags !== undefined) {
    if (!Array.isArray(v.tags) || v.tags.some((t) => typeof t !== 'string')) problems.push(`${path}.tags: strings`);
    else if (new Set(v.tags).size !== v.tags.length) problems.push(`${path}.tags: unique`);
  }
}

/** RFC 3986 URI reference, coarsely: no spaces or characters that must be escaped. */
const URI_REFERENCE = /^[A-Za-z0-9\-._~:/?#[\]@!$&'()*+,;=%]*$/;

function checkLocation(l: unknown, path: string, artifacts: number, problems: string[]): void {
  if (!isObj(l)) return void problems.push(`${path}: location is an object`);
  keysAllowed(l, 'location', path, problems);
  if (l.physicalLocation !== undefined) {
    const p = l.physicalLocation as Obj;
    keysAllowed(p, 'physicalLocation', `${path}.physicalLocation`, problems);
    if (p.artifactLocation === undefined && p.address === undefined) problems.push(`${path}.physicalLocation: needs artifactLocation or address`);
    const a = p.artifactLocation as Obj | undefined;
    const region = p.region as Obj | undefined;
    if (region !== undefined && (!Number.isInteger(region.startLine) || (region.startLine as number) < 1)) problems.push(`${path}.region.startLine: integer from 1`);
    if (a) {
      keysAllowed(a, 'artifactLocation', `${path}.artifactLocation`, problems);
      if (typeof a.uri !== 'string' || !URI_REFERENCE.test(a.uri)) problems.push(`${path}.artifactLocation.uri: a URI reference`);
      if (a.index !== undefined && (!Number.isInteger(a.index) || (a.index as number) < -1 || (a.index as number) >= artifacts)) problems.push(`${path}.artifactLocation.index: refers to run.artifacts`);
    }
  }
  if (l.logicalLocations !== undefined) {
    if (!Array.isArray(l.logicalLocations)) problems.push(`${path}.logicalLocations: array`);
    else
      l.logicalLocations.forEach((ll, i) => {
        if (!isObj(ll)) return void problems.push(`${path}.logicalLocations[${i}]: object`);
        keysAllowed(ll, 'logicalLocation', `${path}.logicalLocations[${i}]`, problems);
        for (const k of ['name', 'fullyQualifiedName', 'kind']) if (ll[k] !== undefined && typeof ll[k] !== 'string') problems.push(`${path}.logicalLocations[${i}].${k}: string`);
      });
  }
}

function sarifProblems(log: unknown): string[] {
  const problems: string[] = [];
  if (!isObj(log)) return ['sarifLog: an object'];
  keysAllowed(log, 'sarifLog', '$', problems);
  if (log.version !== '2.1.0') problems.push('$.version: required, "2.1.0" (§3.13.2)');
  if (!Array.isArray(log.runs)) return [...problems, '$.runs: required array (§3.13.4)'];
  log.runs.forEach((run: unknown, r) => {
    const rp = `$.runs[${r}]`;
    if (!isObj(run)) return void problems.push(`${rp}: object`);
    keysAllowed(run, 'run', rp, problems);
    const tool = run.tool as Obj | undefined;
    if (!isObj(tool)) return void problems.push(`${rp}.tool: required (§3.14.6)`);
    const driver = tool.driver as Obj | undefined;
    if (!isObj(driver)) return void problems.push(`${rp}.tool.driver: required (§3.18.2)`);
    keysAllowed(driver, 'toolComponent', `${rp}.tool.driver`, problems);
    if (typeof driver.name !== 'string' || driver.name === '') problems.push(`${rp}.tool.driver.name: required (§3.19.8)`);
    const rules = (driver.rules ?? []) as Obj[];
    const ids = new Set<string>();
    rules.forEach((rule, i) => {
      const p = `${rp}.tool.driver.rules[${i}]`;
      keysAllowed(rule, 'reportingDescriptor', p, problems);
      if (typeof rule.id !== 'string' || rule.id === '') problems.push(`${p}.id: required`);
      if (ids.has(rule.id as string)) problems.push(`${p}.id: unique`);
      ids.add(rule.id as string);
      const sd = rule.shortDescription as Obj | undefined;
      if (sd !== undefined && typeof sd.text !== 'string') problems.push(`${p}.shortDescription.text: required`);
      checkPropertyBag(rule.properties, `${p}.properties`, problems);
    });
    const artifacts = Array.isArray(run.artifacts) ? run.artifacts.length : 0;
    ((run.artifacts ?? []) as Obj[]).forEach((a, i) => keysAllowed(a, 'artifact', `${rp}.artifacts[${i}]`, problems));
    if (run.results !== undefined && !Array.isArray(run.results)) problems.push(`${rp}.results: array`);
    ((run.results ?? []) as Obj[]).forEach((res, i) => {
      const p = `${rp}.results[${i}]`;
      keysAllowed(res, 'result', p, problems);
      const msg = res.message as Obj | undefined;
      if (!isObj(msg) || (typeof msg.text !== 'string' && typeof msg.id !== 'string')) problems.push(`${p}.message: required with text or id (§3.27.11)`);
      if (res.level !== undefined && !['none', 'note', 'warning', 'error'].includes(res.level as string)) problems.push(`${p}.level: none|note|warning|error (§3.27.10)`);
      if (res.ruleIndex !== undefined) {
        const k = res.ruleIndex as number;
        if (!Number.isInteger(k) || k < -1 || k >= rules.length) problems.push(`${p}.ruleIndex: within rules (§3.27.6)`);
        else if (k >= 0 && rules[k]!.id !== res.ruleId) problems.push(`${p}.ruleIndex: rules[ruleIndex].id equals ruleId (§3.27.6)`);
      }
      if (res.partialFingerprints !== undefined) {
        if (!isObj(res.partialFingerprints) || Object.values(res.partialFingerprints).some((v) => typeof v !== 'string')) problems.push(`${p}.partialFingerprints: string values (§3.27.17)`);
      }
      ((res.locations ?? []) as unknown[]).forEach((l, j) => checkLocation(l, `${p}.locations[${j}]`, artifacts, problems));
      ((res.relatedLocations ?? []) as unknown[]).forEach((l, j) => checkLocation(l, `${p}.relatedLocations[${j}]`, artifacts, problems));
      checkPropertyBag(res.properties, `${p}.properties`, problems);
    });
    checkPropertyBag(run.properties, `${rp}.properties`, problems);
  });
  return problems;
}

describe('toSarif', () => {
  const log = toSarif(fixtureReport, { artifactUri: 'samples/harbor lane.json' });
  const run = log.runs[0]!;

  it('is structurally valid SARIF 2.1.0 (OASIS SARIF 2.1.0, §3.13–3.27)', () => {
    expect(sarifProblems(log)).toEqual([]);
    expect(sarifProblems(toSarif(cleanReport, { artifactUri: 'a.json' }))).toEqual([]);
    expect(log.$schema).toBe(SARIF_SCHEMA);
  });

  it('the checker itself catches broken logs', () => {
    expect(sarifProblems({ runs: [] })).toContain('$.version: required, "2.1.0" (§3.13.2)');
    const broken = structuredClone(log) as unknown as { runs: { tool: { driver: Obj }; results: Obj[] }[] };
    broken.runs[0]!.tool.driver.informationUrl = 'x';
    broken.runs[0]!.results[0]!.level = 'fatal';
    broken.runs[0]!.results[0]!.ruleIndex = 99;
    expect(sarifProblems(broken).length).toBe(3);
  });

  it('names the tool, leaves informationUri out (offline), and has one rule per rule id with its NEC citation', () => {
    expect(run.tool.driver.name).toBe('Linewright');
    expect(run.tool.driver).not.toHaveProperty('informationUri');
    expect(run.tool.driver.rules.map((r) => r.id)).toEqual(['tap-25ft', 'incomplete', 'island']);
    const tap = run.tool.driver.rules[0]!;
    expect(tap.shortDescription.text).toBe('Feeder tap up to 25 ft (NEC 2023 240.21(B)(2))');
    expect(tap.properties.citation).toBe('NEC 2023 240.21(B)(2)');
    expect(JSON.stringify(run.tool.driver.rules)).not.toContain('helpUri');
  });

  it('maps severity to level, tags needs-AHJ findings, and fingerprints by finding id', () => {
    expect(run.results.map((r) => [r.level, r.properties.severity])).toEqual([
      ['error', 'violation'],
      ['warning', 'needs-ahj'],
      ['warning', 'warning'],
      ['note', 'info'],
    ]);
    expect(run.results[1]!.properties.tags).toContain('needs-ahj');
    expect(run.results[0]!.partialFingerprints).toEqual({ 'linewrightFindingId/v1': 'tap-25ft:conductor:C4:tooSmall' });
  });

  it('locates each result at the element (logical) and the file (physical)', () => {
    const loc = run.results[0]!.locations[0]!;
    expect(loc.logicalLocations).toEqual([{ name: 'C4', fullyQualifiedName: 'conductors/C4', kind: 'conductor' }]);
    expect(loc.physicalLocation.artifactLocation.uri).toBe('samples/harbor%20lane.json');
    expect(run.results[0]!.relatedLocations![0]!.logicalLocations[0]).toMatchObject({ name: 'CB-F1', kind: 'node' });
    expect(run.artifacts).toEqual([{ location: { uri: 'samples/harbor%20lane.json' } }]);
  });

  it('points each result at the line of its element in the file when the text is given (§3.30 region, from memory)', () => {
    const text = JSON.stringify(fixtureInput, null, 2);
    const withLines = toSarif(fixtureReport, { artifactUri: 'a.json', sourceText: text });
    expect(sarifProblems(withLines)).toEqual([]);
    const line = withLines.runs[0]!.results[0]!.locations[0]!.physicalLocation.region!.startLine;
    expect(text.split('\n')[line - 1]).toContain('"id": "C4"');
    expect(idLines('{\n"id": "a\\"b",\n  "id":"c"}')).toEqual(new Map([['a"b', 2], ['c', 3]]));
  });

  it('carries the caution in run.properties', () => {
    expect(run.properties.caution).toBe(CAUTION);
  });

  it.each([
    ['samples/a.json', 'samples/a.json'],
    ['dir with space/a#1.json', 'dir%20with%20space/a%231.json'],
    ['file:///tmp/a%20b.json', 'file:///tmp/a%20b.json'],
  ])('toUriReference(%j) = %j (RFC 3986 percent-encoding)', (input, expected) => {
    expect(toUriReference(input)).toBe(expected);
  });
});
