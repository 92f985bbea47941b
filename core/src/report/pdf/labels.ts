import { callout } from './symbols';
import { pdfSafe, type Rect, type Rgb, type Sheet } from './sheet';

/**
 * Greedy label placement: obstacles (symbols, lines, placed labels) go into a uniform grid, and
 * each label takes the first candidate spot that overlaps nothing, or else the one that overlaps
 * least. Good enough for risers of a few hundred elements and linear in practice.
 */
export class Placer {
  private readonly cells = new Map<string, Rect[]>();
  constructor(private readonly cell: number) {}

  private keys(r: Rect): string[] {
    const out: string[] = [];
    const x0 = Math.floor(r.x / this.cell), x1 = Math.floor((r.x + r.w) / this.cell);
    const y0 = Math.floor(r.y / this.cell), y1 = Math.floor((r.y + r.h) / this.cell);
    for (let i = x0; i <= x1; i++) for (let j = y0; j <= y1; j++) out.push(`${i},${j}`);
    return out;
  }

  add(r: Rect): void {
    for (const k of this.keys(r)) {
      const list = this.cells.get(k);
      if (list) list.push(r);
      else this.cells.set(k, [r]);
    }
  }

  overlap(r: Rect): number {
    let area = 0;
    const seen = new Set<Rect>();
    for (const k of this.keys(r)) {
      for (const o of this.cells.get(k) ?? []) {
        if (seen.has(o)) continue;
        seen.add(o);
        const w = Math.min(r.x + r.w, o.x + o.w) - Math.max(r.x, o.x);
        const h = Math.min(r.y + r.h, o.y + o.h) - Math.max(r.y, o.y);
        if (w > 0 && h > 0) area += w * h;
      }
    }
    return area;
  }

  /** Picks the first free candidate inside `bounds`, else the least crowded one; records it. */
  place(candidates: Rect[], bounds: Rect): Rect {
    let best = candidates[0]!;
    let bestScore = Infinity;
    for (const c of candidates) {
      const outside = c.x < bounds.x || c.y < bounds.y || c.x + c.w > bounds.x + bounds.w || c.y + c.h > bounds.y + bounds.h;
      const score = this.overlap(c) + (outside ? 1e6 : 0);
      if (score === 0) {
        best = c;
        break;
      }
      if (score < bestScore) {
        best = c;
        bestScore = score;
      }
    }
    this.add(best);
    return best;
  }
}

export interface Label {
  lines: { text: string; style: 'normal' | 'bold' | 'italic'; color: Rgb; size: number }[];
  callouts: { kind: 'violation' | 'needs-ahj'; n: number }[];
  w: number;
  h: number;
}

export function measure(sh: Sheet, label: Omit<Label, 'w' | 'h'>): Label {
  let w = 0;
  let h = 0;
  for (const l of label.lines) {
    sh.font(l.size, l.style);
    w = Math.max(w, sh.doc.getTextWidth(pdfSafe(l.text)));
    h += l.size * 1.18;
  }
  const size = label.lines[0]?.size ?? 6;
  if (label.callouts.length > 0) w += label.callouts.length * size * 2 + 2;
  return { ...label, w: w + 3, h: h + 2 };
}

/** Draws a placed label: a white ground so lines beneath do not cross the words, callouts first. */
export function drawLabel(sh: Sheet, label: Label, at: Rect): void {
  sh.fill([255, 255, 255]);
  sh.doc.rect(at.x, at.y, at.w, at.h, 'F');
  let x = at.x + 1.5;
  const size = label.lines[0]?.size ?? 6;
  const r = size * 0.85;
  for (const c of label.callouts) {
    callout(sh, c.kind, c.n, x + r, at.y + at.h / 2, r);
    x += size * 2;
  }
  let y = at.y + 1;
  for (const l of label.lines) {
    sh.font(l.size, l.style, l.color);
    sh.text(l.text, x, y + l.size * 0.9);
    y += l.size * 1.18;
  }
}
