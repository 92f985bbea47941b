import { useSyncExternalStore } from 'react';
import type { Draft, Patch } from 'immer';
import type { Comparison, Project, ReviewAuthor, ReviewBlock } from '@linewright/core';
import { EMPTY_REVIEW } from '@linewright/core';
import type { EditorStore } from '../editor/store';

/**
 * Review view state: the review-mode switch, who is writing (set once per browser), the comment
 * in focus and the comparison on show. View state only: never saved in the document, never undone.
 */
export interface ReviewView {
  on: boolean;
  author: ReviewAuthor | null;
  activeComment: number | null;
  comparison: Comparison | null;
  /** Index into the comparison's marked elements the list has stepped to. */
  step: number;
}

export const AUTHOR_KEY = 'linewright.review.author';

/** The browser's storage when there is one (unit tests run without it). */
function storage(): { getItem(k: string): string | null; setItem(k: string, v: string): void } | null {
  return (globalThis as { localStorage?: { getItem(k: string): string | null; setItem(k: string, v: string): void } }).localStorage ?? null;
}

function readAuthor(): ReviewAuthor | null {
  try {
    const raw = storage()?.getItem(AUTHOR_KEY);
    if (!raw) return null;
    const a = JSON.parse(raw) as Partial<ReviewAuthor>;
    return typeof a.name === 'string' && a.name.trim() !== '' && (a.role === 'reviewer' || a.role === 'designer') ? { name: a.name.slice(0, 80), role: a.role } : null;
  } catch {
    return null;
  }
}

let state: ReviewView = { on: false, author: readAuthor(), activeComment: null, comparison: null, step: 0 };
const listeners = new Set<() => void>();

export function reviewView(): ReviewView {
  return state;
}

export function setReviewView(patch: Partial<ReviewView>): void {
  state = { ...state, ...patch };
  for (const l of listeners) l();
}

export function useReviewView<T>(select: (v: ReviewView) => T): T {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => select(state),
  );
}

export function saveAuthor(author: ReviewAuthor): void {
  try {
    storage()?.setItem(AUTHOR_KEY, JSON.stringify(author));
  } catch {
    // Private windows may refuse storage; the name still holds for this visit.
  }
  setReviewView({ author });
}

/** Review mode makes the drawing read-only: only the review block (comments, dispositions, rounds) may change. Opening a file stays allowed. */
export function reviewGuard(patches: readonly Patch[]): string | null {
  for (const p of patches) if (p.path.length > 0 && p.path[0] !== 'review') return 'Review mode: the drawing is read-only; only comments and dispositions can change. Switch review mode off to edit.';
  return null;
}

export function setReviewMode(store: EditorStore, on: boolean): void {
  store.guard = on ? reviewGuard : null;
  setReviewView({ on });
}

/** Changes the document's review block as one undoable edit; a refusal (bad text, wrong move) becomes a notice. */
export function editReview(store: EditorStore, label: string, change: (r: ReviewBlock) => ReviewBlock): boolean {
  let next: ReviewBlock;
  try {
    next = change(store.getState().doc.review ?? EMPTY_REVIEW);
  } catch (e) {
    store.notify(e instanceof Error ? e.message : String(e), 'error');
    return false;
  }
  return store.edit(label, (d: Draft<Project>) => {
    d.review = next as Draft<ReviewBlock>;
  });
}

/** Now, as ISO 8601 text. */
export function nowIso(): string {
  return new Date().toISOString();
}

/** A time as a reader wants it beside a comment: 2026-11-09 15:20. */
export function shortTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}
