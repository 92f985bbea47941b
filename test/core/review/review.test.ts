import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import {
  COMMENT_MAX_CHARS,
  EMPTY_REVIEW,
  acceptedFindingIds,
  addComment,
  ahjJustifications,
  analyze,
  carriedForward,
  dispositionProblems,
  dispositionStates,
  filterComments,
  fingerprintsOf,
  freezeRound,
  isOrphaned,
  loadProject,
  openCounts,
  replyToComment,
  roundDrawing,
  setCommentState,
  setDisposition,
  snapshotOf,
  toJsonReview,
  toSarif,
  type Project,
} from '@linewright/core';

// Comments, dispositions and rounds are Linewright's own review workflow (no outside source);
// the analysis values quoted come from the sample's expected verdicts (samples/README.md).
const file = fileURLToPath(new URL('../../../samples/review/round-1.json', import.meta.url));
function sample(): Project {
  const r = loadProject(readFileSync(file, 'utf8'));
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('; '));
  return r.project;
}
const reviewer = { name: 'A. Reviewer', role: 'reviewer' as const };
const designer = { name: 'B. Designer', role: 'designer' as const };
const T = '2026-11-09T10:00:00Z';
const AHJ_ID = 'tap-25ft:TAP-L2:other-approved-means';

function withConductor(p: Project, id: string, patch: Record<string, unknown>): Project {
  return { ...p, conductors: p.conductors.map((c) => (c.id === id ? { ...c, ...patch } : c)) };
}

describe('dispositions across re-analysis', () => {
  const p0 = sample();
  const r0 = analyze(p0);
  const finding = r0.findings.find((f) => f.id === AHJ_ID)!;
  const review = setDisposition(p0.review!, finding, r0, { kind: 'ahj-accepted', ahjName: 'Plan desk 3', ahjDate: '2026-11-06', reference: 'Note 114' }, reviewer, T);

  it('the sample has the needs-AHJ finding the review relies on', () => expect(finding.severity).toBe('needs-ahj'));

  it('an unrelated edit leaves the acceptance standing, and the finding no longer counts as open', () => {
    const p1 = withConductor({ ...p0, review }, 'B-LP1-1', { lengthFt: 95 });
    const r1 = analyze(p1);
    expect(dispositionStates(review, r1).map((s) => s.standing)).toEqual(['stands']);
    const accepted = acceptedFindingIds(review, r1);
    expect([...accepted]).toEqual([AHJ_ID]);
    expect(openCounts(r1, accepted)).toMatchObject({ 'needs-ahj': 0, accepted: 1 });
    expect(openCounts(r1, new Set())['needs-ahj']).toBe(1);
  });

  it('new values in the finding ask for a new look and stop counting as accepted', () => {
    const r1 = analyze(withConductor(p0, 'TAP-L2', { lengthFt: 20 }));
    expect(fingerprintsOf(r1).get(AHJ_ID)).not.toBe(fingerprintsOf(r0).get(AHJ_ID));
    expect(dispositionStates(review, r1).map((s) => s.standing)).toEqual(['look-again']);
    expect(acceptedFindingIds(review, r1).size).toBe(0);
  });

  it('a fixed design resolves the finding by change', () => {
    const r1 = analyze(withConductor(p0, 'TAP-L2', { damageProtection: 'raceway' }));
    expect(r1.findings.some((f) => f.id === AHJ_ID)).toBe(false);
    expect(dispositionStates(review, r1).map((s) => s.standing)).toEqual(['resolved-by-change']);
  });

  it('accepted findings become SARIF suppressions with the acceptance as justification (SARIF 2.1.0 §3.35)', () => {
    const log = toSarif(r0, { artifactUri: 'a.json', suppressions: ahjJustifications(review, r0) });
    const res = log.runs[0]!.results.find((x) => x.partialFingerprints['linewrightFindingId/v1'] === AHJ_ID)!;
    expect(res.suppressions).toEqual([{ kind: 'external', status: 'accepted', justification: expect.stringMatching(/Plan desk 3, 2026-11-06, reference Note 114/) }]);
    expect(log.runs[0]!.results.filter((x) => x.suppressions).length).toBe(1);
  });

  it('an acceptance needs who and when, and only a needs-AHJ finding can have one; a dispute needs a reason', () => {
    expect(dispositionProblems({ kind: 'ahj-accepted' }, finding)).toHaveLength(2);
    const violation = r0.findings.find((f) => f.severity === 'violation')!;
    expect(dispositionProblems({ kind: 'ahj-accepted', ahjName: 'x', ahjDate: 'y' }, violation)[0]).toMatch(/Only a finding that needs AHJ review/);
    expect(dispositionProblems({ kind: 'disputed' }, violation)).toEqual(['Why: a dispute needs a reason.']);
    expect(dispositionProblems({ kind: 'deferred' }, violation)).toEqual([]);
    expect(() => setDisposition(EMPTY_REVIEW, violation, r0, { kind: 'disputed', reason: ' ' }, reviewer, T)).toThrow(/reason/);
  });

  it('a second disposition of the same finding replaces the first', () => {
    const again = setDisposition(review, finding, r0, { kind: 'deferred', reason: 'next round' }, reviewer, T);
    expect(again.dispositions).toHaveLength(1);
    expect(again.dispositions[0]).toMatchObject({ kind: 'deferred', reason: 'next round' });
  });
});

describe('comments', () => {
  const p0 = sample();

  it('numbers are stable and never reused; a thread alternates and moves the state', () => {
    let r = addComment(p0.review!, { on: 'conductor', id: 'TAP-L3' as never }, 'Upsize TAP-L3.', reviewer, T).review;
    r = addComment(r, { on: 'node', id: 'LP3-MAIN' as never }, 'Check the main.', reviewer, T).review;
    r = setCommentState(r, 2, 'withdrawn', 'reviewer');
    r = addComment(r, { on: 'area', x: 0, y: 0, width: 10, height: 10 }, 'Title block.', reviewer, T).review;
    expect(r.comments.map((c) => [c.number, c.state, c.round])).toEqual([[1, 'open', 1], [2, 'withdrawn', 1], [3, 'open', 1]]);
    r = replyToComment(r, 1, 'Resized to 3/0.', designer, T);
    expect(r.comments[0]!.state).toBe('answered');
    r = replyToComment(r, 1, 'The label still says 2/0.', reviewer, T);
    expect(r.comments[0]!.state).toBe('open');
    r = replyToComment(r, 1, 'Label fixed.', designer, T);
    r = setCommentState(r, 1, 'closed', 'reviewer');
    expect(r.comments[0]!.replies.map((x) => x.author.role)).toEqual(['designer', 'reviewer', 'designer']);
    expect(() => replyToComment(r, 1, 'more', designer, T)).toThrow(/closed/);
    expect(() => setCommentState(r, 3, 'closed', 'designer')).toThrow(/designer cannot/);
    expect(filterComments(r.comments, { states: ['open'] }).map((c) => c.number)).toEqual([3]);
    expect(filterComments(r.comments, { author: 'Nobody' })).toEqual([]);
    expect(carriedForward(r.comments, 2).map((c) => c.number)).toEqual([3]);
  });

  it('text is kept as plain text: markup is not read, control characters go, the length is capped', () => {
    const r = addComment(EMPTY_REVIEW, { on: 'conductor', id: 'X' as never }, '  <b>bold</b>\u0007 & "q"\r\nline 2 ', reviewer, T);
    expect(r.comment.text).toBe('<b>bold</b> & "q"\nline 2');
    expect(() => addComment(EMPTY_REVIEW, { on: 'conductor', id: 'X' as never }, '   ', reviewer, T)).toThrow(/Write some text/);
    expect(() => addComment(EMPTY_REVIEW, { on: 'conductor', id: 'X' as never }, 'x'.repeat(COMMENT_MAX_CHARS + 1), reviewer, T)).toThrow(/2000 characters/);
    const saved = loadProject(JSON.stringify({ ...p0, review: { ...EMPTY_REVIEW, comments: [{ ...r.comment, text: 'x'.repeat(COMMENT_MAX_CHARS + 1) }] } }));
    expect(!saved.ok && saved.errors[0]!.path).toBe('review.comments[0].text');
  });

  it('a comment on a deleted element stays, marked orphaned', () => {
    const r = addComment(p0.review!, { on: 'conductor', id: 'TAP-L3' as never }, 'Upsize.', reviewer, T).review;
    const onFinding = addComment(r, { on: 'finding', findingId: 'tap-25ft:TAP-L3:no-rule-fits', subjectId: 'TAP-L3' }, 'See finding.', reviewer, T).review;
    const deleted: Project = { ...p0, review: onFinding, conductors: p0.conductors.filter((c) => c.id !== 'TAP-L3') };
    expect(onFinding.comments.map((c) => isOrphaned(c, p0))).toEqual([false, false]);
    expect(onFinding.comments.map((c) => isOrphaned(c, deleted))).toEqual([true, true]);
    const json = toJsonReview(deleted, analyze(deleted));
    expect(json.comments.map((c) => [c.number, c.orphaned])).toEqual([[1, true], [2, true]]);
  });
});

describe('rounds', () => {
  it('the second round stores only what changed, and rebuilds the drawing it froze', () => {
    const p0 = sample();
    expect(p0.review!.rounds[0]!.snapshot).toBeDefined();
    const p1 = withConductor(p0, 'TAP-L3', { size: '3/0' });
    const { review, round } = freezeRound(p1, analyze(p1), p0.review!, 'Resubmittal 2', '2026-11-16', designer);
    expect(round).toMatchObject({ number: 2, name: 'Resubmittal 2' });
    expect(round.snapshot).toBeUndefined();
    expect(round.changes!.conductors.map((c) => [c.id, c.size])).toEqual([['TAP-L3', '3/0']]);
    expect(roundDrawing(review.rounds, 2)).toEqual(snapshotOf(p1));
    expect(roundDrawing(review.rounds, 1)).toEqual(snapshotOf(p0));
    expect(round.summary.verdicts.find((v) => v.id === 'TAP-L3')!.verdict).toBe('tap-25ft');
    expect(() => freezeRound(p1, analyze(p1), review, '  ', 'd')).toThrow(/name/);
  });
});
