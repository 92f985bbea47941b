import { describe, expect, it } from 'vitest';
import { addComment } from '@linewright/core';
import { projectFileText } from '../../web/src/editor/commands';
import { editReview, reviewGuard } from '../../web/src/review/reviewState';
import { drawTap, harness } from './harness';

// Review mode is our own design (no outside source): the drawing is read-only, the review block is not.
const me = { name: 'A. Reviewer', role: 'reviewer' as const };

describe('review mode', () => {
  it('refuses drawing edits, keeps comments undoable, and refuses undoing a drawing edit', () => {
    const h = harness();
    const { tapId } = drawTap(h, { lengthFt: 20 });
    const before = h.doc();
    h.store.guard = reviewGuard;
    expect(h.store.edit('rename', (d) => void (d.project.name = 'Changed'))).toBe(false);
    expect(h.doc()).toBe(before);
    expect(h.store.getState().view.notices.at(-1)?.text).toMatch(/read-only/);
    expect(editReview(h.store, 'New comment', (r) => addComment(r, { on: 'conductor', id: tapId as never }, 'Check the tap.', me, '2026-11-09T10:00:00Z').review)).toBe(true);
    expect(h.doc().review?.comments.map((c) => c.number)).toEqual([1]);
    // The comment can be undone; the drawing edit before it cannot while review mode is on.
    expect(h.store.undo()).toBe(true);
    expect(h.doc().review?.comments ?? []).toEqual([]);
    const depth = h.store.getState().history.undoDepth;
    expect(h.store.undo()).toBe(false);
    expect(h.store.getState().history.undoDepth).toBe(depth);
    h.store.guard = null;
    expect(h.store.undo()).toBe(true);
  });

  it('a bad comment becomes a notice, not an edit; a saved file keeps the review block byte for byte', () => {
    const h = harness();
    const { tapId } = drawTap(h, { lengthFt: 20 });
    expect(editReview(h.store, 'New comment', (r) => addComment(r, { on: 'conductor', id: tapId as never }, '   ', me, 'now').review)).toBe(false);
    expect(h.store.getState().view.notices.at(-1)?.text).toMatch(/Write some text/);
    editReview(h.store, 'New comment', (r) => addComment(r, { on: 'conductor', id: tapId as never }, '<i>not markup</i>', me, '2026-11-09T10:00:00Z').review);
    const text = projectFileText(h.doc());
    expect(JSON.parse(text).review.comments[0].text).toBe('<i>not markup</i>');
    expect(JSON.parse(text).version).toBe(2);
  });
});
