import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { CAUTION, EMPTY_REVIEW, analyze, loadProject, setDisposition } from '@linewright/core';

/**
 * `linewright diff` and the review-aware parts of `check` on the two review samples (invented
 * rounds of the clinic riser: TAP-L3 goes from 2/0 to 3/0 Cu between them). Exit codes are
 * Linewright's own documented contract (linewright --help).
 */
const ROOT = resolve(import.meta.dirname, '../..');
const R1 = 'samples/review/round-1.json';
const R2 = 'samples/review/round-2.json';
const dir = mkdtempSync(join(tmpdir(), 'lw-diff-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function lw(...args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'core/src/cli/main.ts', ...args], { cwd: ROOT, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('linewright diff', { timeout: 60_000 }, () => {
  it('two revisions: names the edit in plain words, the verdict and finding that changed, and exits 1', () => {
    const r = lw('diff', R1, R2);
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('TAP-L3');
    expect(r.stdout).toContain('size 2/0 → 3/0');
    expect(r.stdout).toContain('TAP-L3 unprotected → tap: 25 ft');
    expect(r.stdout).toMatch(/resolved\s+\[violation\] tap-25ft:TAP-L3:no-rule-fits/);
    expect(r.stdout).toContain(CAUTION);
  });

  it('rounds inside one file, as JSON: comments carried forward, and the same changes', () => {
    const r = lw('diff', `${R2}#1`, `${R2}#2`, '--format', 'json');
    expect(r.code).toBe(1);
    const j = JSON.parse(r.stdout);
    expect(j.caution).toBe(CAUTION);
    expect(j.elements.map((e: { id: string; change: string }) => [e.id, e.change])).toEqual([['TAP-L3', 'changed']]);
    expect(j.findings.resolved.map((f: { id: string }) => f.id)).toEqual(['tap-25ft:TAP-L3:no-rule-fits']);
    expect(j.carriedForward.map((c: { number: number }) => c.number)).toEqual([2]);
    expect(j.matters).toBe(true);
  });

  it('a file against itself: nothing changed, exit 0', () => {
    const r = lw('diff', R1, R1);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('no design changes');
    expect(r.stdout).toContain('Verdicts: none changed');
  });

  it('a moved element is reported but does not matter', () => {
    const p = JSON.parse(readFileSync(join(ROOT, R1), 'utf8'));
    p.nodes[0].position = { x: (p.nodes[0].position?.x ?? 0) + 40, y: p.nodes[0].position?.y ?? 0 };
    const moved = join(dir, 'moved.json');
    writeFileSync(moved, JSON.stringify(p));
    const r = lw('diff', R1, moved);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('(1 only moved)');
  });

  it.each([
    [['diff', R1], /two project files/],
    [['diff', R1, 'no-such.json'], /cannot read no-such\.json: no such file/],
    [['diff', `${R1}#7`, R2], /has no round 7; it has 1 \(Submittal 1\)/],
    [['diff', R1, R2, '--format', 'sarif'], /text or json/],
    [['diff', R1, R2, '--pdf', 'x.pdf'], /does not apply to diff/],
    [['diff', 'package.json', R2], /not a usable Linewright project/],
  ])('%j is bad input: exit 2 with a message', (args, message) => {
    const r = lw(...args);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(message);
  });
});

describe('check with a review', { timeout: 60_000 }, () => {
  it('an AHJ acceptance closes the needs-AHJ finding for --fail-on-ahj; without one the flag fails the check', () => {
    // A clean invented shop: 22 ft of 3/0 Cu (200 A, NFPA 70-2023 Table 310.16, 75 °C) tapped from a 600 A feeder,
    // 200 ≥ 600/3 (240.21(B)(2)), protected from damage only by "other approved means": an AHJ judgement.
    const shop = {
      format: 'linewright-project', version: 2, project: { name: 'Quiet Row tap' },
      nodes: [
        { id: 'U', kind: 'utility', voltsLL: 480, phases: 3 }, { id: 'F', kind: 'breaker', ratingA: 600 },
        { id: 'TB', kind: 'bus', busType: 'tap-box', busRatingA: 600 }, { id: 'M', kind: 'breaker', ratingA: 200 },
        { id: 'L', kind: 'load', currentA: 120 },
      ],
      conductors: [
        { id: 'S', from: 'U', to: 'F', size: '500', parallelSets: 2, lengthFt: 20 },
        { id: 'FDR', from: 'F', to: 'TB', size: '350', parallelSets: 2, lengthFt: 40 },
        { id: 'TAP', from: 'TB', to: 'M', size: '3/0', lengthFt: 22, damageProtection: 'other-approved-means' },
        { id: 'BR', from: 'M', to: 'L', size: '3/0', lengthFt: 30 },
      ],
      busLinks: [],
    };
    const loaded = loadProject(JSON.stringify(shop));
    if (!loaded.ok) throw new Error(loaded.errors.map((e) => e.message).join('; '));
    const report = analyze(loaded.project);
    const ahj = report.findings.find((f) => f.severity === 'needs-ahj')!;
    expect(report.findings.filter((f) => f.severity === 'violation')).toEqual([]);
    const bare = join(dir, 'bare.json');
    writeFileSync(bare, JSON.stringify(shop));
    expect(lw('check', bare).code).toBe(0);
    expect(lw('check', bare, '--fail-on-ahj').code).toBe(1);
    const review = setDisposition(EMPTY_REVIEW, ahj, report, { kind: 'ahj-accepted', ahjName: 'Plan desk', ahjDate: '2026-11-06' }, { name: 'R', role: 'reviewer' }, '2026-11-09T10:00:00Z');
    const accepted = join(dir, 'accepted.json');
    writeFileSync(accepted, JSON.stringify({ ...shop, review }));
    expect(lw('check', accepted, '--fail-on-ahj').code).toBe(0);
  });

  it('JSON carries the review block; SARIF suppresses the accepted finding; text says what is open', () => {
    const j = JSON.parse(lw('check', R2, '--format', 'json').stdout);
    expect(j.review.open).toMatchObject({ 'needs-ahj': 0, accepted: 1 });
    expect(j.review.comments.map((c: { number: number; state: string }) => [c.number, c.state])).toEqual([[1, 'closed'], [2, 'answered']]);
    expect(j.review.dispositions[0]).toMatchObject({ findingId: 'tap-25ft:TAP-L2:other-approved-means', kind: 'ahj-accepted', standing: 'stands' });
    expect(j.review.rounds.map((r: { name: string; stored: string }) => [r.name, r.stored])).toEqual([['Submittal 1', 'drawing'], ['Resubmittal 2', 'changes']]);
    const s = JSON.parse(lw('check', R2, '--format', 'sarif').stdout);
    const suppressed = s.runs[0].results.filter((x: { suppressions?: unknown }) => x.suppressions);
    expect(suppressed.map((x: { partialFingerprints: Record<string, string> }) => x.partialFingerprints['linewrightFindingId/v1'])).toEqual(['tap-25ft:TAP-L2:other-approved-means']);
    expect(lw('check', R2).stdout).toMatch(/Plan review\n {2}Open findings: \d+ violation\(s\), 0 needing AHJ review/);
  });
});
