import { callout } from './symbols';
import { pdfSafe, type Rect, type Rgb, type Sheet } from './sheet';

/**
 * Greedy label placement: obstacles (symbols, lines, placed labels) go into a uniform grid, and
 * each label takes the first candidate spot that overlaps nothing, or else the one that overlaps
 * least.
 *
 * Its cost is bounded by the number of labels, not by coordinates or crowding: rectangles are clipped
 * to the drawing area before they are gridded (a line to a far-away point covers the cells of the sheet,
 * not millions beyond it), and a cell that already holds CELL_CAP rectangles counts as full instead of
 * being scanned again (4 000 pieces stacked at one point, or 4 000 parallel conductors on one line,
 * would otherwise make every label scan every other one).
 */
export class Placer {
  private readonly cells = new Map<string, Rect[]>();
  private readonly full = new Set<string>();
  static readonly CELL_CAP = 24;
  constructor(
    private readonly cell: number,
    private readonly area: Rect,
  ) {}

  private keys(r: Rect): string[] {
    // Only the part inside the drawing area matters: labels are placed there.
    const ax = Math.max(r.x, this.area.x), ay = Math.max(r.y, this.area.y);
    const bx = Math.min(r.x + r.w, this.area.x + this.area.w), by = Math.min(r.y + r.h, this.area.y + this.area.h);
    if (!(bx >= ax && by >= ay)) return [];
    const out: string[] = [];
    const x0 = Math.floor(ax / this.cell), x1 = Math.floor(bx / this.cell);
    const y0 = Math.floor(ay / this.cell), y1 = Math.floor(by / this.cell);
    for (let i = x0; i <= x1; i++) for (let j = y0; j <= y1; j++) out.push(`${i},${j}`);
    return out;
  }

  add(r: Rect): void {
    for (const k of this.keys(r)) {
      if (this.full.has(k)) continue;
      const list = this.cells.get(k);
      if (!list) this.cells.set(k, [r]);
      else if (list.length < Placer.CELL_CAP) list.push(r);
      else this.full.add(k);
    }
  }

  overlap(r: Rect): number {
    let area = 0;
    const seen = new Set<Rect>();
    for (const k of this.keys(r)) {
      // A full cell is as good as covered: a spot there overlaps at least a cell's worth.
      if (this.full.has(k)) area += this.cell * this.cell;
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
    // Every near spot is taken: look a little further out, ring by ring, before printing over anything.
    if (bestScore > 0) {
      const c0 = candidates[0]!;
      search: for (let ring = 1; ring <= 4; ring++) {
        for (const [dx, dy] of [[0, 1], [0, -1], [1, 0], [-1, 0], [1, 1], [-1, 1], [1, -1], [-1, -1]] as const) {
          const c = { ...c0, x: c0.x + dx * ring * (c0.w * 0.5 + 2), y: c0.y + dy * ring * (c0.h + 1) };
          const outside = c.x < bounds.x || c.y < bounds.y || c.x + c.w > bounds.x + bounds.w || c.y + c.h > bounds.y + bounds.h;
          if (!outside && this.overlap(c) === 0) {
            best = c;
            break search;
          }
        }
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
