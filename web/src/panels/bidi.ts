import type { Project } from '@linewright/core';

/**
 * Right-to-left letters (Hebrew, Arabic and their presentation forms, and the RTL scripts of the
 * supplementary planes) and the invisible bidi controls (marks, embeddings, overrides, isolates). A label
 * holding one of these can reorder the text around it (an override U+202E reverses the rest of a
 * sentence), so it is shown as a Unicode bidi isolate (UAX #9; the HTML <bdi> element).
 */
const BIDI_HAZARD = /[\u0590-\u08FF\uFB1D-\uFDFF\uFE70-\uFEFF\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]|\uD802[\uDC00-\uDFFF]|\uD803[\uDC00-\uDE7F]|\uD83A[\uDC00-\uDFFF]|\uD83B[\uDC00-\uDEFF]/;
export const BIDI_CONTROL = /[\u202A-\u202E\u2066-\u2069]/;

/** Labels and ids of the drawing that could reorder a message they appear in; usually none. */
export function bidiHazards(doc: Project): string[] {
  const found = new Set<string>();
  const consider = (s: string | undefined) => {
    if (s && BIDI_HAZARD.test(s)) found.add(s);
  };
  consider(doc.project.name);
  for (const list of [doc.nodes, doc.conductors, doc.busLinks] as const) {
    for (const e of list) {
      consider(e.id);
      consider((e as { label?: string }).label);
    }
  }
  // Longest first, so a label containing another is isolated whole.
  return [...found].sort((a, b) => b.length - a.length);
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

