import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { CAUTION } from '@linewright/core';

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
    expect(lw('check', R2, '--fail-on-ahj').code).toBe(0);
    expect(lw('check', R2).code).toBe(0);
    const p = JSON.parse(readFileSync(join(ROOT, R2), 'utf8'));
    p.review.dispositions = [];
    const bare = join(dir, 'bare.json');
    writeFileSync(bare, JSON.stringify(p));
    expect(lw('check', bare).code).toBe(0);
    expect(lw('check', bare, '--fail-on-ahj').code).toBe(1);
  });

  it('JSON carries the review block; SARIF suppresses the accepted finding; text says what is open', () => {
    const j = JSON.parse(lw('check', R2, '--format', 'json').stdout);
    expect(j.review.open).toMatchObject({ violation: 0, 'needs-ahj': 0, accepted: 1 });
    expect(j.review.comments.map((c: { number: number; state: string }) => [c.number, c.state])).toEqual([[1, 'closed'], [2, 'answered']]);
    expect(j.review.dispositions[0]).toMatchObject({ findingId: 'tap-25ft:TAP-L2:other-approved-means', kind: 'ahj-accepted', standing: 'stands' });
    expect(j.review.rounds.map((r: { name: string; stored: string }) => [r.name, r.stored])).toEqual([['Submittal 1', 'drawing'], ['Resubmittal 2', 'changes']]);
    const s = JSON.parse(lw('check', R2, '--format', 'sarif').stdout);
    const suppressed = s.runs[0].results.filter((x: { suppressions?: unknown }) => x.suppressions);
    expect(suppressed.map((x: { partialFingerprints: Record<string, string> }) => x.partialFingerprints['linewrightFindingId/v1'])).toEqual(['tap-25ft:TAP-L2:other-approved-means']);
    expect(lw('check', R2).stdout).toMatch(/Plan review\n {2}Open findings: 0 violation\(s\), 0 needing AHJ review/);
  });
});
