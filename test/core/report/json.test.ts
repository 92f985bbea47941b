import { describe, expect, it } from 'vitest';
import { CAUTION, SEVERITIES, VERDICTS } from '@linewright/core';
import { toJsonReport } from '../../../core/src/report/json';
import { TOOL_VERSION } from '../../../core/src/report/version';
import { fixtureReport } from './fixture';
import corePackage from '../../../core/package.json';

// The shape is our own contract, documented in docs/report-json.md; these checks keep the two in step.
describe('toJsonReport', () => {
  const json = toJsonReport(fixtureReport);

  it('has the documented top-level keys in the documented order', () => {
    expect(Object.keys(json)).toEqual(['tool', 'version', 'caution', 'edition', 'projectName', 'assumptions', 'conductors', 'findings', 'counts']);
    expect(json.tool).toBe('Linewright');
    expect(json.version).toBe(corePackage.version);
    expect(TOOL_VERSION).toBe(corePackage.version);
    expect(json.caution).toBe(CAUTION);
    expect(json.edition).toBe(2023);
  });

  it('gives each conductor the documented keys in a stable order', () => {
    expect(Object.keys(json.conductors[0]!)).toEqual([
      'id', 'label', 'from', 'to', 'verdict', 'verdictText', 'rule', 'cites', 'summary', 'role', 'ampacityA', 'ampacity', 'ampacityGovernedBy',
      'upstreamDevice', 'supply', 'tapLengthFt', 'tapLength', 'lengthFt', 'size', 'material', 'parallelSets', 'load', 'chain', 'findingIds', 'fixes', 'tried',
    ]);
    const c3 = json.conductors.find((c) => c.id === 'C3')!;
    expect(c3).toMatchObject({ verdict: 'tap-25ft', verdictText: 'tap: 25 ft', rule: 'tap-25ft', ampacityA: 200, ampacity: 200, tapLengthFt: 20, tapLength: 20, lengthFt: 20, size: '3/0', material: 'cu', parallelSets: 1 });
    expect(c3.cites).toEqual({ code: 'NEC', edition: 2023, section: '240.21(B)(2)' });
    expect(c3.upstreamDevice).toEqual({ id: 'CB-F1', kind: 'breaker', label: 'Feeder 1', ratingA: 600 });
    expect(c3.tried.map((t) => t.outcome)).toEqual(['fails', 'holds']);
  });

  it('orders fix and finding keys the same way whatever order the analyzer used', () => {
    const shuffled = {
      ...fixtureReport,
      findings: fixtureReport.findings.map((f) => Object.fromEntries(Object.entries(f).reverse()) as typeof f),
    };
    expect(JSON.stringify(toJsonReport(shuffled))).toBe(JSON.stringify(json));
    expect(Object.keys(json.findings[0]!)).toEqual(['id', 'severity', 'ruleId', 'messageId', 'cites', 'subject', 'related', 'message', 'data', 'fixes']);
    expect(Object.keys(json.findings[0]!.fixes[0]!)).toEqual(['kind', 'label', 'forRule', 'conductorIds', 'size', 'material', 'parallelSets']);
  });

  it('counts every verdict and severity, zeros included', () => {
    expect(Object.keys(json.counts.byVerdict)).toEqual([...VERDICTS]);
    expect(Object.keys(json.counts.bySeverity)).toEqual([...SEVERITIES]);
    expect(json.counts.bySeverity.violation).toBe(1);
    expect(json.counts.byVerdict['tap-25ft']).toBe(1);
  });

  it('survives a JSON round trip unchanged', () => {
    expect(JSON.parse(JSON.stringify(json))).toEqual(json);
  });
});
