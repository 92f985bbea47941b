import { describe, expect, it } from 'vitest';
import { CAUTION, SEVERITIES, VERDICTS, analyze, loadProject } from '@linewright/core';
import { toJsonReport } from '../../../core/src/report/json';
import { TOOL_VERSION } from '../../../core/src/report/version';
import { fixtureReport } from './fixture';
import corePackage from '../../../core/package.json';

// The shape is our own contract, documented in docs/report-json.md; these checks keep the two in step.
describe('toJsonReport', () => {
  const json = toJsonReport(fixtureReport);
  const full = toJsonReport(fixtureReport, { detail: 'full' });

  it('has the documented top-level keys in the documented order', () => {
    expect(Object.keys(json)).toEqual(['tool', 'version', 'caution', 'edition', 'projectName', 'assumptions', 'conductors', 'findings', 'counts', 'runs', 'detail']);
    expect(json.detail).toBe('summary');
    expect(json.tool).toBe('Linewright');
    expect(json.version).toBe(corePackage.version);
    expect(TOOL_VERSION).toBe(corePackage.version);
    expect(json.caution).toBe(CAUTION);
    expect(json.edition).toBe(2023);
  });

  it('gives each conductor the documented keys in a stable order', () => {
    expect(Object.keys(json.conductors[0]!)).toEqual([
      'id', 'label', 'from', 'to', 'verdict', 'verdictText', 'rule', 'cites', 'summary', 'role', 'ampacityA', 'ampacity', 'ampacityGovernedBy',
      'upstreamDevice', 'supply', 'tapLengthFt', 'tapLength', 'lengthFt', 'size', 'material', 'parallelSets', 'load', 'run', 'findingIds', 'fixes',
    ]);
    // The full working only when asked for, as the last key.
    expect(Object.keys(full.conductors[0]!).at(-1)).toBe('tried');
    expect(full.detail).toBe('full');
    const c3 = json.conductors.find((c) => c.id === 'C3')!;
    expect(c3).toMatchObject({ verdict: 'tap-25ft', verdictText: 'tap: 25 ft', rule: 'tap-25ft', ampacityA: 200, ampacity: 200, tapLengthFt: 20, tapLength: 20, lengthFt: 20, size: '3/0', material: 'cu', parallelSets: 1 });
    expect(c3.cites).toEqual({ code: 'NEC', edition: 2023, section: '240.21(B)(2)' });
    expect(c3.upstreamDevice).toEqual({ id: 'CB-F1', kind: 'breaker', label: 'Feeder 1', ratingA: 600 });
    expect(full.conductors.find((c) => c.id === 'C3')!.tried!.map((t) => t.outcome)).toEqual(['fails', 'holds']);
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
    expect(JSON.parse(JSON.stringify(full))).toEqual(full);
  });
});

/**
 * A spliced run: a 600 A breaker, a switchboard, then `n` lengths of 3/0 Cu joined at pass-through
 * splices to a 100 A load. 3/0 Cu is 200 A at 75 °C (NFPA 70-2023 Table 310.16), so 240.4 does not
 * protect it on 600 A and no tap rule reaches the run's length once it passes 25 ft: every length is
 * in violation and carries fixes for the whole run, the case that made the report quadratic.
 */
function splicedRun(n: number) {
  const nodes: Record<string, unknown>[] = [
    { id: 'U', kind: 'utility', voltsLL: 480, phases: 3 },
    { id: 'CB', kind: 'breaker', ratingA: 600 },
    { id: 'B', kind: 'bus', busType: 'switchboard', busRatingA: 800 },
  ];
  const conductors: Record<string, unknown>[] = [{ id: 'SVC', from: 'U', to: 'CB', size: '500', parallelSets: 2, lengthFt: 20 }];
  let from = 'B';
  for (let i = 0; i < n; i++) {
    const to = i === n - 1 ? 'L' : `S${i}`;
    nodes.push(i === n - 1 ? { id: to, kind: 'load', currentA: 100 } : { id: to, kind: 'splice' });
    conductors.push({ id: `R${i}`, from, to, size: '3/0', lengthFt: 1 });
    from = to;
  }
  const loaded = loadProject({ format: 'linewright-project', version: 1, project: { name: 'Spliced run' }, nodes, conductors, busLinks: [{ id: 'BL', from: 'CB', to: 'B' }] });
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return analyze(loaded.project);
}

describe('toJsonReport of a spliced run', () => {
  it('lists the run once and names it by id from each of its conductors and fixes', () => {
    const report = splicedRun(40);
    expect(report.conductors.find((c) => c.id === 'R0')!.chain).toHaveLength(40);
    const json = toJsonReport(report);
    expect(json.runs).toEqual([{ id: 'R0', conductorIds: Array.from({ length: 40 }, (_, i) => `R${i}`) }]);
    const runConductors = json.conductors.filter((c) => c.id.startsWith('R'));
    expect(runConductors.every((c) => c.run === 'R0')).toBe(true);
    expect(json.conductors.find((c) => c.id === 'SVC')!.run).toBeNull();
    const fixes = [...json.conductors.flatMap((c) => c.fixes), ...json.findings.flatMap((f) => f.fixes)];
    const runFixes = fixes.filter((f) => f.kind === 'resize' || f.kind === 'shorten');
    expect(runFixes.length).toBeGreaterThan(0);
    for (const f of runFixes) {
      expect(f).not.toHaveProperty('conductorIds');
      expect(f.run).toBe('R0');
    }
  });

  it('grows linearly with the run, not with its square', () => {
    const bytes = (n: number) => JSON.stringify(toJsonReport(splicedRun(n))).length;
    const small = bytes(500);
    const large = bytes(2000);
    // 4x the conductors: linear output is about 4x the bytes; a repeated chain would be about 16x.
    expect(large / small).toBeLessThan(4.5);
  });
});
