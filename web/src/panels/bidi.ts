import type { Project } from '@linewright/core';

/**
 * Right-to-left letters (Hebrew, Arabic and their presentation forms, and the RTL scripts of the
 * supplementary planes) and the invisible bidi controls (marks, embeddings, overrides, isolates). A label
 * holding one of these can reorder the text around it (an override U+202E reverses the rest of a
 * sentence), so it is shown as a Unicode bidi isolate (UAX #9; the HTML <bdi> element).
 */
const BIDI_HAZARD = /[\u0590-\u08FF\uFB1D-\uFDFF\uFE70-\uFEFF\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]|\uD802[\uDC00-\uDFFF]|\uD803[\uDC00-\uDE7F]|\uD83A[\uDC00-\uDFFF]|\uD83B[\uDC00-\uDEFF]/;
export const BIDI_CONTROL = /[\u202A-\u202E\u2066-\u2069]/;

type Labelled = { id: string; label?: string };

/** Hazardous ids and labels of one element list, kept per list: an edit of one list leaves the others' answers. */
const listHazards = new WeakMap<readonly unknown[], readonly string[]>();
/** The last list answered in each slot (nodes, conductors, bus links), so the next one (the same list with an element or two replaced) is answered from it. */
const lastLists: ({ list: readonly Labelled[]; found: readonly string[] } | null)[] = [null, null, null];

const hazardous = (e: Labelled) => BIDI_HAZARD.test(e.id) || (!!e.label && BIDI_HAZARD.test(e.label));

function hazardsIn(list: readonly Labelled[], slot: number): readonly string[] {
  let found = listHazards.get(list) ?? sameAnswer(lastLists[slot] ?? null, list);
  if (!found) {
    const out: string[] = [];
    for (const e of list) {
      if (BIDI_HAZARD.test(e.id)) out.push(e.id);
      if (e.label && BIDI_HAZARD.test(e.label)) out.push(e.label);
    }
    found = out;
  }
  listHazards.set(list, found);
  lastLists[slot] = { list, found };
  return found;
}

/**
 * The last list's answer when `list` differs from it only in elements replaced in place, none of them
 * (before or after) hazardous: a length edit in a 10 000-conductor drawing is answered by one pass of
 * identity checks instead of testing every id and label again.
 */
function sameAnswer(last: { list: readonly Labelled[]; found: readonly string[] } | null, list: readonly Labelled[]): readonly string[] | null {
  if (!last || last.list.length !== list.length) return null;
  for (let i = 0; i < list.length; i++) {
    const a = last.list[i]!;
    const b = list[i]!;
    if (a !== b && (hazardous(a) || hazardous(b))) return null;
  }
  return last.found;
}

/** Labels and ids of the drawing that could reorder a message they appear in; usually none. */
export function bidiHazards(doc: Project): string[] {
  const found = new Set<string>();
  if (doc.project.name && BIDI_HAZARD.test(doc.project.name)) found.add(doc.project.name);
  [doc.nodes, doc.conductors, doc.busLinks].forEach((list, slot) => {
    for (const s of hazardsIn(list, slot)) found.add(s);
  });
  // Longest first, so a label containing another is isolated whole.
  return [...found].sort((a, b) => b.length - a.length);
}

const byDoc = new WeakMap<Project, readonly string[]>();
let lastHazards: readonly string[] = [];

/**
 * bidiHazards, worked out once per document for every message on screen, and the same array while
 * the answer stays the same, so a message re-renders only when its isolation can change.
 */
export function sharedHazards(doc: Project): readonly string[] {
  let h = byDoc.get(doc);
  if (h) return h;
  const next = bidiHazards(doc);
  h = next.length === lastHazards.length && next.every((x, i) => x === lastHazards[i]) ? lastHazards : next;
  lastHazards = h;
  byDoc.set(doc, h);
  return h;
}

export interface Segment {
  text: string;
  isolate: boolean;
}

/**
 * Splits a message so each occurrence of a hazardous label is its own isolate. Any bidi control left
 * outside them (a label the message quotes in part) isolates its whole segment, so it still cannot reach
 * the words after it.
 */
export function isolateSegments(text: string, hazards: readonly string[]): Segment[] {
  let parts: Segment[] = [{ text, isolate: false }];
  for (const h of hazards) {
    const next: Segment[] = [];
    for (const p of parts) {
      if (p.isolate || !p.text.includes(h)) {
        next.push(p);
        continue;
      }
      const pieces = p.text.split(h);
      pieces.forEach((piece, i) => {
        if (i > 0) next.push({ text: h, isolate: true });
        if (piece) next.push({ text: piece, isolate: false });
      });
    }
    parts = next;
  }
  return parts.map((p) => (p.isolate || !BIDI_CONTROL.test(p.text) ? p : { text: p.text, isolate: true }));
}

