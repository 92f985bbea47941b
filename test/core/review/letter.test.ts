import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { CAUTION, analyze, letterRows, loadProject, renderPermitPdf, renderResponseLetterPdf, responseLetterCsv } from '@linewright/core';

// The letter is our own layout (no outside source); the values are the review sample's (samples/review/round-2.json).
const loaded = loadProject(readFileSync(fileURLToPath(new URL('../../../samples/review/round-2.json', import.meta.url)), 'utf8'));
if (!loaded.ok) throw new Error('review sample did not load');
const project = loaded.project;
const report = analyze(project);
const dir = mkdtempSync(join(tmpdir(), 'lw-letter-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const textOf = (bytes: Uint8Array, name: string) => {
  const f = join(dir, name);
  writeFileSync(f, bytes);
  return execFileSync('pdftotext', ['-layout', f, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
};

describe('comment-response letter', () => {
  it('lists the comments of the round answered, with element, finding, responses and state', () => {
    const { round, rows } = letterRows(project, report);
    expect(round).toBe(1);
    expect(rows.map((r) => [r.number, r.state, r.on, r.findingId])).toEqual([
      [1, 'closed', 'conductor TAP-L3', ''],
      [2, 'answered', 'element TAP-L2', 'tap-25ft:TAP-L2:other-approved-means'],
    ]);
    expect(rows[0]!.responses[0]).toMatch(/^K\. Lindqvist \(designer\): Resized TAP-L3 to 3\/0/);
    // Round 2 carries forward only what is still open or answered.
    expect(letterRows(project, report, 2).rows.map((r) => [r.number, r.carried])).toEqual([[2, true]]);
  });

  it('CSV: a header, one row per comment, CRLF, and a comment that looks like a formula stays text', () => {
    const csv = responseLetterCsv(project, report);
    const lines = csv.split('\r\n');
    expect(lines[0]).toBe('number,round,carried_forward,state,on,element_deleted,finding_id,finding,comment,comment_by,responses');
    expect(lines[1]).toMatch(/^1,1,no,closed,conductor TAP-L3,no,,,/);
    const hostile = { ...project, review: { ...project.review!, comments: [{ ...project.review!.comments[0]!, text: '=HYPERLINK("x")' }] } };
    expect(responseLetterCsv(hostile, report)).toContain(`"'=HYPERLINK(""x"")"`);
  });

  it('PDF letter and permit set carry the comments, the dispositions, the rounds and the caution (pdftotext)', () => {
    const letter = textOf(renderResponseLetterPdf(project, report, { generatedAt: '2026-11-20T09:00:00Z' }), 'letter.pdf');
    expect(letter).toContain('Comment-response letter');
    expect(letter).toContain('Resized TAP-L3 to 3/0 Cu');
    expect(letter).toContain('accepted by the AHJ');
    expect(letter).toContain(CAUTION.replace(/\s+/g, ' '));
    const permit = textOf(renderPermitPdf(project, report, { generatedAt: '2026-11-20T09:00:00Z' }), 'permit.pdf');
    expect(permit).toContain('REVISIONS (REVIEW ROUNDS)');
    expect(permit).toContain('Resubmittal 2');
    expect(permit).toContain('Plan review comments');
    expect(permit).toContain('Steel cover over the tray at Level 2');
    expect(permit).toMatch(/\bC2\b/);
  });
});
