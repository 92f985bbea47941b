import { jsPDF } from 'jspdf';
import type { EquipmentNode, Project } from '../model/schema';
import type { AnalysisReport, ConductorReport } from '../analyze/types';
import { CAUTION } from '../caution';
import {
  ROLE_WORDS,
  SEVERITY_WORDS,
  VERDICT_WORDS,
  type VerdictClass,
  ampsText,
  citationText,
  conductorText,
  deviceText,
  fixText,
  labelStatesRating,
  lengthText,
  num,
  numberFindings,
  refText,
  verdictClass,
  verdictText,
  VERDICT_COLOURS,
  hexToRgb,
} from './format';
import { layoutNodes, type Point } from './layout';
import { TOOL_NAME, TOOL_VERSION } from './version';

/**
 * The permit-set PDF: page 1 the one-line drawing (vectors), its legend and title block; then the
 * findings with citations and fixes, the conductor schedule, the working for flagged conductors,
 * and the assumptions. Every page carries the caution and its page number in the footer.
 *
 * Sheet: ANSI B (11 × 17 in) landscape, the smallest common drawing sheet that keeps a riser of a
 * few hundred elements legible; it prints scaled on tabloid/ledger printers. Pure: no fs, no DOM,
 * so the CLI and the browser call the same function.
 */
export interface PdfOptions {
  /** Shown in the title block and footers; ISO date-time. Defaults to now. */
  generatedAt?: string;
}

const PAGE_W = 1224;
const PAGE_H = 792;
const M = 36;
const FOOTER_H = 30;
const BODY_BOTTOM = PAGE_H - M - FOOTER_H;
const SIDE_W = 270;
const FONT = 'helvetica';

type Rgb = [number, number, number];
// Okabe–Ito colour-blind-safe palette; every colour is paired with a line style and words.
const BLACK: Rgb = [0, 0, 0];
const GREY: Rgb = [110, 110, 110];
const LIGHT: Rgb = [235, 235, 235];
const STYLE: Record<VerdictClass, { color: Rgb; width: number; dash: number[]; legend: string }> = {
  protected: { color: hexToRgb(VERDICT_COLOURS.protected), width: 1, dash: [], legend: 'solid: protected at its ampacity (240.4), service, generator' },
  'tap-rule': { color: hexToRgb(VERDICT_COLOURS['tap-rule']), width: 1.2, dash: [7, 3], legend: 'dashed: meets a tap or secondary rule (240.21(B)/(C))' },
  failing: { color: hexToRgb(VERDICT_COLOURS.failing), width: 2.4, dash: [9, 2.5, 2, 2.5], legend: 'heavy dash-dot: no rule makes it acceptable' },
  incomplete: { color: hexToRgb(VERDICT_COLOURS.incomplete), width: 1, dash: [1.5, 2.5], legend: 'dotted: incomplete, data missing' },
};
const VIOLATION: Rgb = [213, 94, 0];
const AHJ: Rgb = [230, 159, 0];

/** Characters of WinAnsiEncoding beyond Latin-1 (0x80–0x9F), which jsPDF's standard fonts print. */
const WIN_ANSI_EXTRA = '€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ';

/** jsPDF's standard fonts are WinAnsi only: spell out what they cannot print (≥, √, Ω...). */
export function pdfSafe(text: string): string {
  return text
    .replace(/ ?≥ ?/g, ' at least ')
    .replace(/ ?≤ ?/g, ' at most ')
    .replace(/√/g, 'sqrt ')
    .replace(/ ?Ω/g, ' ohm')
    .replace(/ ?→ ?/g, ' -> ')
    .replace(/[^\n\x20-\x7e\u00a0-\u00ff]/g, (ch) => (WIN_ANSI_EXTRA.includes(ch) ? ch : '?'));
}

function nodeName(n: EquipmentNode): string {
  return n.label || n.id;
}

function nodeDetail(n: EquipmentNode): string {
  switch (n.kind) {
    case 'utility':
      return `utility ${num(n.voltsLL)} V ${n.phases}ph${n.availableFaultKA ? `, ${num(n.availableFaultKA)} kA` : ''}`;
    case 'generator':
      return `generator ${num(n.kva)} kVA ${num(n.voltsLL)} V`;
    case 'bus':
      return `${n.busType}${n.busRatingA ? ` ${num(n.busRatingA)} A` : ''}`;
    case 'breaker':
      return `breaker ${n.ratingA ? `${num(n.ratingA)} A` : 'rating ?'}${n.adjustableTrip ? ' adj.' : ''}`;
    case 'fuse':
      return `fuse ${n.ratingA ? `${num(n.ratingA)} A` : 'rating ?'}`;
    case 'disconnect':
      return `disconnect${n.ratingA ? ` ${num(n.ratingA)} A` : ''} (unfused)`;
    case 'splice':
      return 'splice';
    case 'transformer':
      return `${num(n.kva)} kVA ${num(n.primaryVoltsLL)}-${num(n.secondaryVoltsLL)} V`;
    case 'load':
      return `load ${n.currentA ? `${num(n.currentA)} A` : n.kva ? `${num(n.kva)} kVA` : '?'}${n.continuous ? ' cont.' : ''}`;
  }
}

class Sheet {
  readonly doc: jsPDF;
  y = M;

  constructor() {
    this.doc = new jsPDF({ orientation: 'landscape', unit: 'pt', format: [PAGE_W, PAGE_H], compress: true });
    this.doc.setFont(FONT, 'normal');
  }

  stroke(color: Rgb, width: number, dash: number[] = []): void {
    this.doc.setDrawColor(color[0], color[1], color[2]);
    this.doc.setLineWidth(width);
    this.doc.setLineDashPattern(dash, 0);
  }

  fill(color: Rgb): void {
    this.doc.setFillColor(color[0], color[1], color[2]);
  }

  font(size: number, style: 'normal' | 'bold' | 'italic' = 'normal', color: Rgb = BLACK): void {
    this.doc.setFont(FONT, style);
    this.doc.setFontSize(size);
    this.doc.setTextColor(color[0], color[1], color[2]);
  }

  text(s: string | string[], x: number, y: number, opts: { align?: 'left' | 'center' | 'right'; baseline?: 'top' | 'middle' | 'bottom' | 'alphabetic' } = {}): void {
    this.doc.text(Array.isArray(s) ? s.map(pdfSafe) : pdfSafe(s), x, y, { baseline: opts.baseline ?? 'alphabetic', align: opts.align ?? 'left' });
  }

  split(s: string, width: number): string[] {
    return this.doc.splitTextToSize(pdfSafe(s), width) as string[];
  }

  newPage(): void {
    this.doc.addPage([PAGE_W, PAGE_H], 'landscape');
    this.y = M;
  }

  /** Starts a new page when `h` more points would run into the footer. */
  need(h: number, onNewPage?: () => void): void {
    if (this.y + h > BODY_BOTTOM) {
      this.newPage();
      onNewPage?.();
    }
  }

  heading(s: string): void {
    this.need(40);
    this.font(14, 'bold');
    this.text(s, M, this.y + 14);
    this.y += 24;
  }
}

// ---------------------------------------------------------------- drawing

interface Placed {
  node: EquipmentNode;
  p: Point;
}

interface DrawBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Maps layout points into the box, keeping the aspect ratio; returns the scale used. */
interface View {
  map: (p: Point) => Point;
  scale: number;
}

interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

function boundsOf(points: Map<string, Point>): Bounds | null {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const p of points.values()) {
    minX = Math.min(minX, p.x);
    maxX = Math.max(maxX, p.x);
    minY = Math.min(minY, p.y);
    maxY = Math.max(maxY, p.y);
  }
  return Number.isFinite(minX) ? { minX, minY, maxX, maxY } : null;
}

/** Scale (pt per layout unit) at which labels print at about 6.5 pt: what detail sheets aim for. */
const LEGIBLE_SCALE = 0.5;
/** Below this overview scale labels fall under about 4 pt on an 11 × 17 sheet: detail sheets follow. */
const DETAIL_BELOW_SCALE = 0.3;

/** A view of the layout region starting at (x0, y0) at a fixed scale, for a detail sheet. */
function viewAt(x0: number, y0: number, scale: number, box: DrawBox): View {
  return { map: (p) => ({ x: box.x + 30 + (p.x - x0) * scale, y: box.y + 30 + (p.y - y0) * scale }), scale };
}

function fit(points: Map<string, Point>, box: DrawBox): View {
  const b = boundsOf(points);
  if (!b) return { map: (p) => p, scale: 1 };
  const { minX, minY, maxX, maxY } = b;
  // Room on the right for labels beside symbols and lines.
  const padR = 120;
  const padB = 10;
  const bw = Math.max(maxX - minX, 1);
  const bh = Math.max(maxY - minY, 1);
  const scale = Math.min((box.w - padR - 20) / bw, (box.h - padB - 30) / bh, 1.4);
  const usedW = bw * scale;
  const usedH = bh * scale;
  const ox = box.x + 20 + Math.max(0, (box.w - padR - 20 - usedW) / 2);
  const oy = box.y + 20 + Math.max(0, (box.h - padB - 30 - usedH) / 4);
  return { map: (p) => ({ x: ox + (p.x - minX) * scale, y: oy + (p.y - minY) * scale }), scale };
}

/** A switching device's leads and two contact circles of radius r, the contacts at ± reach × s. */
function twoContacts(d: jsPDF, x: number, y: number, s: number, r: number, reach: number): void {
  d.line(x, y - s, x, y - s * reach);
  d.circle(x, y - s * reach + r, r, 'S');
  d.circle(x, y + s * reach - r, r, 'S');
  d.line(x, y + s * reach, x, y + s);
}

/** IEEE Std 315 style symbols of our own drawing, centred on (x, y), terminals at y - s and y + s. */
function drawSymbol(sh: Sheet, n: EquipmentNode, x: number, y: number, s: number, busHalfWidth: number): void {
  const d = sh.doc;
  sh.stroke(BLACK, Math.max(0.5, s / 12));
  switch (n.kind) {
    case 'utility': {
      d.circle(x, y, s * 0.9, 'S');
      // A sine wave inside: an alternating-current source.
      const wave: Point[] = [];
      for (let i = 0; i <= 12; i++) wave.push({ x: x - s * 0.55 + (1.1 * s * i) / 12, y: y - Math.sin((2 * Math.PI * i) / 12) * s * 0.3 });
      polyline(sh, wave);
      d.line(x, y + s * 0.9, x, y + s);
      break;
    }
    case 'generator':
      d.circle(x, y, s * 0.9, 'S');
      sh.font(Math.max(3, s * 0.9), 'bold');
      sh.text('G', x, y, { align: 'center', baseline: 'middle' });
      d.line(x, y + s * 0.9, x, y + s);
      break;
    case 'bus':
      sh.stroke(BLACK, Math.max(1.5, s / 3.5));
      d.line(x - busHalfWidth, y, x + busHalfWidth, y);
      sh.stroke(BLACK, Math.max(0.5, s / 12));
      d.line(x, y - s, x, y);
      break;
    case 'breaker': {
      const r = s * 0.16;
      twoContacts(d, x, y, s, r, 0.55);
      // The arc over the contacts, bulging to the left: a half ellipse from contact to contact.
      const rr = s * 0.55 - r;
      const arc: Point[] = [];
      for (let i = 0; i <= 10; i++) {
        const t = (Math.PI * i) / 10;
        arc.push({ x: x - r - Math.sin(t) * rr * 0.8, y: y - Math.cos(t) * rr });
      }
      polyline(sh, arc);
      break;
    }
    case 'fuse':
      d.line(x, y - s, x, y + s);
      d.rect(x - s * 0.28, y - s * 0.6, s * 0.56, s * 1.2, 'S');
      break;
    case 'disconnect': {
      const r = s * 0.14;
      twoContacts(d, x, y, s, r, 0.6);
      // An open blade from the lower contact.
      d.line(x, y + s * 0.6 - 2 * r, x + s * 0.55, y - s * 0.45);
      break;
    }
    case 'splice':
      sh.fill(BLACK);
      d.circle(x, y, Math.max(1.2, s * 0.28), 'F');
      d.line(x, y - s, x, y + s);
      break;
    case 'transformer': {
      const r = s * 0.5;
      d.circle(x, y - r * 0.8, r, 'S');
      d.circle(x, y + r * 0.8, r, 'S');
      d.line(x, y - s, x, y - r * 1.8);
      d.line(x, y + r * 1.8, x, y + s);
      break;
    }
    case 'load':
      d.line(x, y - s, x, y + s * 0.2);
      sh.fill(BLACK);
      d.triangle(x - s * 0.4, y + s * 0.2, x + s * 0.4, y + s * 0.2, x, y + s, 'F');
      break;
  }
}

interface Route {
  pts: Point[];
  /** Where the label goes: the middle of the last vertical run. */
  labelAt: Point;
}

function route(from: Point, to: Point, s: number, fromBus: { half: number } | null, toBus: boolean): Route {
  const startX = fromBus ? Math.max(from.x - fromBus.half, Math.min(from.x + fromBus.half, to.x)) : from.x;
  const start = { x: startX, y: fromBus ? from.y : from.y + s };
  const end = { x: to.x, y: toBus ? to.y - s : to.y - s };
  if (end.y <= start.y + 2 || Math.abs(start.x - end.x) < 0.5) {
    return { pts: [start, end], labelAt: { x: (start.x + end.x) / 2, y: (start.y + end.y) / 2 } };
  }
  const midY = start.y + (end.y - start.y) * 0.3;
  return {
    pts: [start, { x: start.x, y: midY }, { x: end.x, y: midY }, end],
    labelAt: { x: end.x, y: (midY + end.y) / 2 },
  };
}

function polyline(sh: Sheet, pts: Point[]): void {
  for (let i = 1; i < pts.length; i++) sh.doc.line(pts[i - 1]!.x, pts[i - 1]!.y, pts[i]!.x, pts[i]!.y);
}

function callout(sh: Sheet, kind: 'violation' | 'needs-ahj', n: number, x: number, y: number, r: number): void {
  const d = sh.doc;
  sh.stroke(kind === 'violation' ? VIOLATION : AHJ, Math.max(0.8, r / 6));
  sh.fill([255, 255, 255]);
  if (kind === 'violation') d.circle(x, y, r, 'FD');
  else d.triangle(x, y - r * 1.1, x - r * 1.05, y + r * 0.75, x + r * 1.05, y + r * 0.75, 'FD');
  sh.font(Math.max(3, r * (String(n).length > 1 ? 0.95 : 1.2)), 'bold');
  sh.text(String(n), x, kind === 'violation' ? y : y + r * 0.15, { align: 'center', baseline: 'middle' });
}

interface Rect {
  x: number;
  y: number;
  w: number;
  h: number;
}

/**
 * Greedy label placement: obstacles (symbols, lines, placed labels) go into a uniform grid, and
 * each label takes the first candidate spot that overlaps nothing, or else the one that overlaps
 * least. Good enough for risers of a few hundred elements and linear in practice.
 */
class Placer {
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

interface Label {
  lines: { text: string; style: 'normal' | 'bold' | 'italic'; color: Rgb; size: number }[];
  callouts: { kind: 'violation' | 'needs-ahj'; n: number }[];
  w: number;
  h: number;
}

function measure(sh: Sheet, label: Omit<Label, 'w' | 'h'>): Label {
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
function drawLabel(sh: Sheet, label: Label, at: Rect): void {
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

/** Node text on the drawing: the label, then the rating or size unless the label already says it. */
function nodeLines(n: EquipmentNode): string[] {
  const name = nodeName(n);
  const detail = nodeDetail(n);
  const rating = 'ratingA' in n && typeof n.ratingA === 'number' ? n.ratingA : null;
  const redundant =
    (rating !== null && labelStatesRating(name, rating)) ||
    (n.kind === 'transformer' && /kva/i.test(name)) ||
    (n.kind === 'load' && /\d\s?(kva|a)\b/i.test(name)) ||
    n.kind === 'splice';
  return redundant ? [name] : [name, detail];
}

/**
 * Draws the one-line (or the part of it the view shows) inside `box`, clipped to it. Lines that
 * leave the box run off its edge; symbols and labels are drawn for the elements inside it.
 */
function drawOneLine(sh: Sheet, project: Project, report: AnalysisReport, box: DrawBox, numbers: Map<string, number>, positions: Map<string, Point>, view: View): void {
  const { map, scale } = view;
  const s = Math.max(3, Math.min(13, scale * 38));
  const labelFont = Math.max(2.5, Math.min(6.5, scale * 14));
  const margin = 2 * s;
  const inBox = (p: Point) => p.x >= box.x - margin && p.x <= box.x + box.w + margin && p.y >= box.y - margin && p.y <= box.y + box.h + margin;
  const all = new Map<string, Placed>();
  for (const node of project.nodes) {
    const p = positions.get(node.id);
    if (p && !all.has(node.id)) all.set(node.id, { node, p: map(p) });
  }
  const placed = new Map<string, Placed>();
  for (const [id, pl] of all) if (inBox(pl.p)) placed.set(id, pl);
  sh.doc.saveGraphicsState();
  sh.doc.rect(box.x, box.y, box.w, box.h, null);
  sh.doc.clip();
  sh.doc.discardPath();
  try {
    drawClipped();
  } finally {
    sh.doc.restoreGraphicsState();
  }

  function drawClipped(): void {
  if (all.size === 0) {
    sh.font(12, 'italic', GREY);
    sh.text('The project has no equipment to draw.', box.x + box.w / 2, box.y + box.h / 2, { align: 'center' });
    return;
  }

  // A bus bar spans the conductors it feeds, as a switchboard does on a riser.
  const busHalf = new Map<string, number>();
  const edgesOut = new Map<string, string[]>();
  for (const e of [...project.conductors, ...project.busLinks]) {
    const list = edgesOut.get(e.from);
    if (list) list.push(e.to);
    else edgesOut.set(e.from, [e.to]);
  }
  for (const [id, pl] of all) {
    if (pl.node.kind !== 'bus') continue;
    let half = s * 1.5;
    for (const to of edgesOut.get(id) ?? []) {
      const q = all.get(to);
      if (q && q.p.y > pl.p.y) half = Math.max(half, Math.abs(q.p.x - pl.p.x) + s * 0.6);
    }
    busHalf.set(id, half);
  }

  const reports = new Map(report.conductors.map((c) => [c.id as string, c]));
  const marksBySubject = new Map<string, { kind: 'violation' | 'needs-ahj'; n: number }[]>();
  for (const f of report.findings) {
    if ((f.severity !== 'violation' && f.severity !== 'needs-ahj') || f.subject.kind === 'project') continue;
    const key = `${f.subject.kind}:${f.subject.id}`;
    const list = marksBySubject.get(key) ?? [];
    list.push({ kind: f.severity === 'violation' ? 'violation' : 'needs-ahj', n: numbers.get(f.id)! });
    marksBySubject.set(key, list);
  }

  const placer = new Placer(Math.max(20, 60 * scale));
  const obstacle = (pts: Point[]) => {
    for (let i = 1; i < pts.length; i++) {
      const a = pts[i - 1]!, b = pts[i]!;
      placer.add({ x: Math.min(a.x, b.x) - 0.8, y: Math.min(a.y, b.y) - 0.8, w: Math.abs(a.x - b.x) + 1.6, h: Math.abs(a.y - b.y) + 1.6 });
    }
  };

  // 1. Lines: bus links heavy and plain, conductors in their verdict's style.
  for (const b of project.busLinks) {
    const a = all.get(b.from);
    const z = all.get(b.to);
    if (!a || !z || (!placed.has(b.from) && !placed.has(b.to))) continue;
    const r = route(a.p, z.p, s, a.node.kind === 'bus' ? { half: busHalf.get(b.from)! } : null, z.node.kind === 'bus');
    sh.stroke(BLACK, Math.max(0.8, s / 6));
    polyline(sh, r.pts);
    obstacle(r.pts);
  }
  const conductorLabels: { c: (typeof project.conductors)[number]; r: Route; label: Label; urgent: boolean }[] = [];
  const styleScale = Math.max(0.4, Math.min(1, scale * 1.5));
  for (const c of project.conductors) {
    const a = all.get(c.from);
    const z = all.get(c.to);
    if (!a || !z || (!placed.has(c.from) && !placed.has(c.to))) continue;
    const cr = reports.get(c.id);
    const cls: VerdictClass = cr ? verdictClass(cr.verdict) : 'incomplete';
    const st = STYLE[cls];
    const r = route(a.p, z.p, s, a.node.kind === 'bus' ? { half: busHalf.get(c.from)! } : null, z.node.kind === 'bus');
    sh.stroke(st.color, st.width * styleScale, st.dash.map((v) => v * styleScale));
    polyline(sh, r.pts);
    obstacle(r.pts);
    const callouts = marksBySubject.get(`conductor:${c.id}`) ?? [];
    const label = measure(sh, {
      lines: [
        { text: `${c.id}: ${cr ? conductorText(cr) : c.size}, ${lengthText(c.lengthFt ?? null)}`, style: 'normal', color: BLACK, size: labelFont },
        { text: cr ? verdictText(cr) : 'not analyzed', style: cls === 'failing' ? 'bold' : 'italic', color: cls === 'failing' ? VIOLATION : BLACK, size: labelFont },
      ],
      callouts,
    });
    if (inBox(r.labelAt)) conductorLabels.push({ c, r, label, urgent: callouts.length > 0 || cls === 'failing' });
  }

  // 2. Symbols, which labels must not cover.
  for (const [id, pl] of placed) {
    const half = busHalf.get(id) ?? 0;
    drawSymbol(sh, pl.node, pl.p.x, pl.p.y, s, half);
    if (pl.node.kind === 'bus') placer.add({ x: pl.p.x - half, y: pl.p.y - s * 0.3, w: 2 * half, h: s * 0.6 });
    else placer.add({ x: pl.p.x - s, y: pl.p.y - s, w: 2 * s, h: 2 * s });
  }

  // 3. Labels, flagged conductors first so they get the best spots, then equipment, then the rest.
  // Under about 2.5 pt text is unreadable: a reduced overview shows structure and callouts only.
  if (labelFont * 1.0 < 2.6 || scale < 0.16) {
    for (const cl of conductorLabels) {
      if (cl.label.callouts.length === 0) continue;
      cl.label.callouts.forEach((m, i) => callout(sh, m.kind, m.n, cl.r.labelAt.x + 5 + i * 9, cl.r.labelAt.y, 4));
    }
    return;
  }
  const gap = labelFont * 0.5;
  const placeConductor = ({ r, label }: { r: Route; label: Label }) => {
    const seg = r.pts.length >= 2 ? { a: r.pts[r.pts.length - 2]!, b: r.pts[r.pts.length - 1]! } : { a: r.labelAt, b: r.labelAt };
    const cands: Rect[] = [];
    for (const t of [0.5, 0.3, 0.7, 0.15, 0.85, 0.05, 0.95]) {
      const x = seg.a.x + (seg.b.x - seg.a.x) * t;
      const y = seg.a.y + (seg.b.y - seg.a.y) * t - label.h / 2;
      cands.push({ x: x + gap, y, w: label.w, h: label.h }, { x: x - gap - label.w, y, w: label.w, h: label.h });
    }
    return { label, at: placer.place(cands, box) };
  };
  // Flagged labels choose their spots first but are painted last, so nothing covers them.
  const urgentDrawn = conductorLabels.filter((cl) => cl.urgent).map(placeConductor);
  for (const [id, pl] of placed) {
    const [name, detail] = nodeLines(pl.node);
    const callouts = marksBySubject.get(`node:${id}`) ?? [];
    const lines: Label['lines'] = [{ text: name!, style: 'bold', color: BLACK, size: labelFont * 1.05 }];
    if (detail) lines.push({ text: detail, style: 'normal', color: GREY, size: labelFont * 0.95 });
    const label = measure(sh, { lines, callouts });
    const half = pl.node.kind === 'bus' ? busHalf.get(id)! : s;
    const { x, y } = pl.p;
    const cands: Rect[] =
      pl.node.kind === 'bus'
        ? [
            { x: x + half + gap, y: y - label.h / 2, w: label.w, h: label.h },
            { x: x - half - gap - label.w, y: y - label.h / 2, w: label.w, h: label.h },
            { x: x - half, y: y - s * 0.4 - label.h, w: label.w, h: label.h },
            { x: x + half - label.w, y: y - s * 0.4 - label.h, w: label.w, h: label.h },
            { x: x - half, y: y + s * 0.4, w: label.w, h: label.h },
          ]
        : [
            { x: x + s + gap, y: y - label.h / 2, w: label.w, h: label.h },
            { x: x - s - gap - label.w, y: y - label.h / 2, w: label.w, h: label.h },
            { x: x + s + gap, y: y - s - label.h * 0.6, w: label.w, h: label.h },
            { x: x + s + gap, y: y + s - label.h * 0.4, w: label.w, h: label.h },
            { x: x - s - gap - label.w, y: y - s - label.h * 0.6, w: label.w, h: label.h },
            { x: x - s - gap - label.w, y: y + s - label.h * 0.4, w: label.w, h: label.h },
          ];
    // A second ring further out, used only when every near spot is taken.
    const near = cands.length;
    for (let i = 0; i < near; i++) {
      const c = cands[i]!;
      cands.push({ ...c, y: c.y + label.h * 1.1 }, { ...c, y: c.y - label.h * 1.1 });
    }
    drawLabel(sh, label, placer.place(cands, box));
  }
  for (const cl of conductorLabels) if (!cl.urgent) {
    const { label, at } = placeConductor(cl);
    drawLabel(sh, label, at);
  }
  for (const { label, at } of urgentDrawn) drawLabel(sh, label, at);
  }
}

interface DetailSheet {
  name: string;
  x0: number;
  y0: number;
  w: number;
  h: number;
}

/**
 * Splits the layout into an even grid of regions, each small enough to draw at LEGIBLE_SCALE or
 * larger, and keeps the regions that hold equipment. Even splits keep cuts away from sheet edges.
 */
function detailSheets(positions: Map<string, Point>, box: DrawBox): DetailSheet[] {
  const b = boundsOf(positions);
  if (!b) return [];
  const bw = b.maxX - b.minX + 1;
  const bh = b.maxY - b.minY + 1;
  const nx = Math.max(1, Math.ceil(bw / ((box.w - 180) / LEGIBLE_SCALE)));
  const ny = Math.max(1, Math.ceil(bh / ((box.h - 60) / LEGIBLE_SCALE)));
  const tw = bw / nx;
  const th = bh / ny;
  const used = new Set<number>();
  for (const p of positions.values()) {
    const i = Math.min(nx - 1, Math.floor((p.x - b.minX) / tw));
    const j = Math.min(ny - 1, Math.floor((p.y - b.minY) / th));
    used.add(j * nx + i);
  }
  const out: DetailSheet[] = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      if (!used.has(j * nx + i)) continue;
      out.push({ name: `D${out.length + 1}`, x0: b.minX + i * tw, y0: b.minY + j * th, w: tw, h: th });
    }
  }
  return out;
}

/** The scale a detail sheet draws its region at: as large as fits, never above 1.2. */
function detailScale(d: DetailSheet, box: DrawBox): number {
  return Math.min((box.w - 180) / d.w, (box.h - 60) / d.h, 1.2);
}

function drawLegend(sh: Sheet, x: number, y: number, w: number): number {
  const d = sh.doc;
  sh.font(11, 'bold');
  sh.text('Legend', x, y + 11);
  y += 20;
  sh.font(7.5, 'bold');
  sh.text('Conductor marks (line style and words; colour only repeats them)', x, y);
  y += 10;
  for (const cls of ['protected', 'tap-rule', 'failing', 'incomplete'] as VerdictClass[]) {
    const st = STYLE[cls];
    sh.stroke(st.color, st.width, st.dash);
    d.line(x, y - 2.5, x + 34, y - 2.5);
    sh.font(7, 'normal');
    const lines = sh.split(st.legend, w - 42);
    sh.text(lines, x + 40, y);
    y += 9 * lines.length + 3;
  }
  callout(sh, 'violation', 1, x + 17, y, 5);
  sh.font(7, 'normal');
  sh.text('numbered circle: violation, see Findings', x + 40, y + 2.5);
  y += 14;
  callout(sh, 'needs-ahj', 2, x + 17, y, 5);
  sh.font(7, 'normal');
  sh.text('numbered triangle: needs AHJ review', x + 40, y + 2.5);
  y += 14;
  sh.font(7, 'normal');
  const words = sh.split(`Verdict words under each conductor: ${Object.values(VERDICT_WORDS).join(' / ')}; the section in brackets is the rule relied on.`, w);
  sh.text(words, x, y);
  y += 8.5 * words.length + 6;

  sh.font(7.5, 'bold');
  sh.text('Symbols (IEEE Std 315 style)', x, y);
  y += 6;
  const kinds: [EquipmentNode, string][] = [
    [{ kind: 'utility', id: 'u', voltsLL: 480, phases: 3 } as EquipmentNode, 'utility source'],
    [{ kind: 'generator', id: 'g', voltsLL: 480, phases: 3, kva: 1, overloadPreventedByDesign: false } as EquipmentNode, 'generator'],
    [{ kind: 'breaker', id: 'b', arrangement: 'single', atDisconnectingMeans: false } as EquipmentNode, 'circuit breaker'],
    [{ kind: 'fuse', id: 'f', arrangement: 'single', atDisconnectingMeans: false, currentLimiting: false } as EquipmentNode, 'fuse'],
    [{ kind: 'disconnect', id: 'd' } as EquipmentNode, 'unfused disconnect'],
    [{ kind: 'transformer', id: 't', kva: 1, primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3, connection: 'delta-wye' } as EquipmentNode, 'transformer'],
    [{ kind: 'bus', id: 'bb', busType: 'panelboard' } as EquipmentNode, 'bus bar'],
    [{ kind: 'splice', id: 's' } as EquipmentNode, 'splice or tap point'],
    [{ kind: 'load', id: 'l', powerFactor: 0.9, continuous: false } as EquipmentNode, 'load'],
  ];
  const colW = w / 2;
  kinds.forEach(([n, label], i) => {
    const cx = x + (i % 2) * colW + 10;
    const cy = y + 14 + Math.floor(i / 2) * 24;
    drawSymbol(sh, n, cx, cy, 8, 12);
    sh.font(7, 'normal');
    sh.text(label, cx + 16, cy + 2.5);
  });
  return y + 14 + Math.ceil(kinds.length / 2) * 24;
}

function drawTitleBlock(sh: Sheet, report: AnalysisReport, project: Project, generated: string, box: DrawBox): void {
  const d = sh.doc;
  sh.stroke(BLACK, 1.2);
  d.rect(box.x, box.y, box.w, box.h, 'S');
  const x = box.x + 8;
  const w = box.w - 16;
  let y = box.y + 6;
  sh.font(6.5, 'normal', GREY);
  sh.text('PROJECT', x, y + 6);
  y += 9;
  sh.font(11, 'bold');
  const name = sh.split(report.projectName || project.project.name, w);
  sh.text(name, x, y + 10);
  y += 13 * name.length + 2;
  const rows: [string, string][] = [
    ['CODE EDITION', `NFPA 70 (NEC) ${report.edition}`],
    ['PREPARED BY', project.project.preparedBy ?? 'not stated'],
    ['GENERATED', generated],
    ['SCALE', 'not to scale (one-line diagram)'],
    ['PRODUCED WITH', `${TOOL_NAME} ${TOOL_VERSION}`],
  ];
  for (const [k, v] of rows) {
    sh.stroke(GREY, 0.4);
    d.line(box.x, y, box.x + box.w, y);
    sh.font(6.5, 'normal', GREY);
    sh.text(k, x, y + 8);
    sh.font(8, 'normal');
    sh.text(v, x + 72, y + 8.5);
    y += 13;
  }
  d.line(box.x, y, box.x + box.w, y);
  sh.fill(LIGHT);
  d.rect(box.x, y, box.w, 16, 'F');
  sh.font(8.5, 'bold');
  sh.text('FOR REVIEW — NOT A VERDICT OF ACCEPTANCE', box.x + box.w / 2, y + 11, { align: 'center' });
  y += 20;
  sh.font(6.8, 'normal');
  const caution = sh.split(report.caution || CAUTION, w);
  sh.text(caution, x, y + 6);
}

function drawSummary(sh: Sheet, report: AnalysisReport, x: number, y: number): number {
  const sev = report.counts.bySeverity;
  sh.font(11, 'bold');
  sh.text('Summary', x, y + 11);
  y += 22;
  sh.font(8, 'normal');
  const lines = [
    `${report.conductors.length} conductors checked`,
    `violations: ${sev.violation ?? 0} (numbered circles)`,
    `needs AHJ review: ${sev['needs-ahj'] ?? 0} (numbered triangles)`,
    `warnings: ${sev.warning ?? 0}, info: ${sev.info ?? 0} (findings pages)`,
  ];
  for (const l of lines) {
    sh.text(l, x, y);
    y += 11;
  }
  return y;
}

// ---------------------------------------------------------------- tables

interface TableColumn<T> {
  head: string;
  width: number;
  cell: (row: T) => string;
  bold?: (row: T) => boolean;
}

function table<T>(sh: Sheet, columns: TableColumn<T>[], rows: readonly T[], fontSize = 7.5): void {
  const lineH = fontSize * 1.22;
  const header = () => {
    sh.fill(LIGHT);
    sh.doc.rect(M, sh.y, PAGE_W - 2 * M, lineH + 5, 'F');
    sh.font(fontSize, 'bold');
    let x = M + 3;
    for (const col of columns) {
      sh.text(col.head, x, sh.y + lineH);
      x += col.width;
    }
    sh.y += lineH + 7;
  };
  header();
  rows.forEach((row, i) => {
    // Measure in the font the cell is drawn in, or the wrap width is wrong.
    const cells = columns.map((col) => {
      sh.font(fontSize, col.bold?.(row) ? 'bold' : 'normal');
      return sh.split(col.cell(row), col.width - 6);
    });
    const h = Math.max(...cells.map((c) => c.length)) * lineH + 4;
    if (sh.y + h > BODY_BOTTOM) {
      sh.newPage();
      header();
    }
    if (i % 2 === 1) {
      sh.fill([247, 247, 247]);
      sh.doc.rect(M, sh.y - 1, PAGE_W - 2 * M, h, 'F');
    }
    let x = M + 3;
    columns.forEach((col, k) => {
      sh.font(fontSize, col.bold?.(row) ? 'bold' : 'normal');
      sh.text(cells[k]!, x, sh.y + fontSize);
      x += col.width;
    });
    sh.y += h;
  });
  sh.y += 8;
}

function findingsPages(sh: Sheet, report: AnalysisReport): void {
  sh.newPage();
  sh.heading('Findings');
  sh.font(8, 'normal', GREY);
  sh.text('# is the number of the callout on the drawing (violations and AHJ review items). Grouped by severity.', M, sh.y);
  sh.y += 8;
  const numbered = numberFindings(report.findings);
  if (numbered.length === 0) {
    sh.font(9, 'normal');
    sh.text('No findings.', M, sh.y + 9);
    sh.y += 20;
    return;
  }
  table(
    sh,
    [
      { head: '#', width: 30, cell: (r) => String(r.n), bold: () => true },
      { head: 'Severity', width: 90, cell: (r) => SEVERITY_WORDS[r.finding.severity], bold: (r) => r.finding.severity === 'violation' },
      { head: 'Element', width: 140, cell: (r) => refText(r.finding.subject) },
      { head: 'Citation', width: 130, cell: (r) => citationText(r.finding.cites) || '-' },
      { head: 'Rule', width: 110, cell: (r) => r.finding.ruleId },
      {
        head: 'Finding and fixes',
        width: PAGE_W - 2 * M - 500,
        cell: (r) => [r.finding.message, ...r.finding.fixes.map((f) => `Fix: ${fixText(f)}`)].join('\n'),
      },
    ],
    numbered,
    8,
  );
}

function schedulePages(sh: Sheet, project: Project, report: AnalysisReport): void {
  const facts = new Map(project.conductors.map((c) => [c.id as string, c]));
  sh.newPage();
  sh.heading('Conductor schedule');
  if (report.conductors.length === 0) {
    sh.font(9, 'normal');
    sh.text('The project has no conductors.', M, sh.y + 9);
    sh.y += 20;
    return;
  }
  const cols: TableColumn<ConductorReport>[] = [
    { head: 'Conductor', width: 70, cell: (c) => c.id, bold: () => true },
    { head: 'Label', width: 110, cell: (c) => c.label },
    { head: 'From - to', width: 100, cell: (c) => `${c.from} - ${c.to}` },
    { head: 'Role', width: 70, cell: (c) => ROLE_WORDS[c.role] },
    { head: 'Size', width: 95, cell: (c) => conductorText(c) },
    {
      head: 'Insulation, terminals',
      width: 80,
      cell: (c) => {
        const f = facts.get(c.id);
        return f ? `${f.insulation}, ${f.terminalTempC} °C terminals${f.ambientC !== 30 ? `, ${f.ambientC} °C ambient` : ''}` : '?';
      },
    },
    { head: 'Length', width: 45, cell: (c) => lengthText(c.lengthFt) },
    { head: 'Ampacity', width: 95, cell: (c) => (c.ampacity ? `${ampsText(c.ampacity.ampacityA)} (${c.ampacity.governedBy.replace(/-/g, ' ')})` : '?') },
    { head: 'Upstream OCPD', width: 110, cell: (c) => deviceText(c.upstreamDevice) },
    { head: 'Tap length', width: 50, cell: (c) => (c.tapLengthFt === null ? '-' : lengthText(c.tapLengthFt)) },
    { head: 'Calc. load', width: 50, cell: (c) => (c.load ? ampsText(c.load.calculatedA) : '?') },
    { head: 'Verdict', width: 130, cell: (c) => verdictText(c), bold: (c) => verdictClass(c.verdict) === 'failing' },
  ];
  const used = cols.reduce((a, c) => a + c.width, 0);
  cols.push({ head: 'Why', width: PAGE_W - 2 * M - used, cell: (c) => c.summary });
  table(sh, cols, report.conductors, 7);
}

function workingPages(sh: Sheet, report: AnalysisReport): void {
  const flagged = report.conductors.filter((c) => c.findingIds.length > 0 || verdictClass(c.verdict) !== 'protected');
  if (flagged.length === 0) return;
  sh.newPage();
  sh.heading('Working for taps, secondaries and flagged conductors');
  for (const c of flagged) {
    const steps = c.ampacity ? c.ampacity.steps.map((s) => s.text) : ['ampacity not worked out: data missing'];
    sh.need(40);
    sh.font(9, 'bold');
    sh.text(`${c.id}${c.label ? ` (${c.label})` : ''}: ${verdictText(c)}`, M, sh.y + 9);
    sh.y += 14;
    sh.font(7.5, 'normal');
    for (const line of sh.split(`Ampacity: ${steps.join('; ')}`, PAGE_W - 2 * M - 20)) {
      sh.need(10);
      sh.text(line, M + 10, sh.y + 7.5);
      sh.y += 9.5;
    }
    for (const t of c.tried) {
      sh.need(12);
      sh.font(7.5, 'bold');
      sh.text(`${t.title} (${citationText(t.cites)}): ${t.outcome}`, M + 10, sh.y + 7.5);
      sh.y += 10;
      sh.font(7.5, 'normal');
      for (const cond of t.conditions) {
        for (const line of sh.split(`[${cond.status}] ${cond.text}`, PAGE_W - 2 * M - 40)) {
          sh.need(10);
          sh.text(line, M + 24, sh.y + 7.5);
          sh.y += 9.5;
        }
      }
    }
    sh.y += 6;
  }
}

function assumptionsPage(sh: Sheet, report: AnalysisReport): void {
  sh.need(80);
  sh.y += 8;
  sh.heading('Assumptions');
  sh.font(9, 'normal');
  const items = report.assumptions.length > 0 ? report.assumptions : ['None stated by the analysis.'];
  for (const a of items) {
    const lines = sh.split(`- ${a}`, PAGE_W - 2 * M - 20);
    sh.need(lines.length * 11 + 2);
    sh.text(lines, M + 6, sh.y + 9);
    sh.y += lines.length * 11 + 3;
  }
  sh.y += 10;
  sh.heading('Caution');
  sh.font(9, 'normal');
  const lines = sh.split(report.caution || CAUTION, PAGE_W - 2 * M - 20);
  sh.need(lines.length * 11);
  sh.text(lines, M + 6, sh.y + 9);
  sh.y += lines.length * 11;
}

function footers(sh: Sheet, report: AnalysisReport, generated: string): void {
  const total = sh.doc.getNumberOfPages();
  for (let p = 1; p <= total; p++) {
    sh.doc.setPage(p);
    const y = PAGE_H - M - FOOTER_H + 8;
    sh.stroke(GREY, 0.5);
    sh.doc.line(M, y, PAGE_W - M, y);
    sh.font(6.5, 'normal');
    // One line at 6.5 pt fits the standard caution; a longer one shrinks rather than being cut.
    let size = 6.5;
    while (size > 4 && sh.doc.getTextWidth(pdfSafe(report.caution || CAUTION)) > PAGE_W - 2 * M) sh.font((size -= 0.5), 'normal');
    sh.text(sh.split(report.caution || CAUTION, PAGE_W - 2 * M), M, y + 9);
    sh.font(7, 'normal', GREY);
    sh.text(`${report.projectName} · NEC ${report.edition} · generated ${generated} · for review — not a verdict of acceptance`, M, y + 20);
    sh.font(8, 'bold');
    sh.text(`Page ${p} of ${total}`, PAGE_W - M, y + 20, { align: 'right' });
  }
}

/** Renders the annotated permit-set PDF; returns the file's bytes. */
export function renderPermitPdf(project: Project, report: AnalysisReport, options: PdfOptions = {}): Uint8Array {
  const generated = (options.generatedAt ?? new Date().toISOString()).replace('T', ' ').replace(/\.\d+Z$/, 'Z');
  const sh = new Sheet();
  sh.doc.setProperties({
    title: pdfSafe(`${report.projectName}: conductor protection review`),
    subject: pdfSafe(`NEC ${report.edition} 240.4 and 240.21 review. ${report.caution || CAUTION}`),
    creator: `${TOOL_NAME} ${TOOL_VERSION}`,
  });
  if (options.generatedAt && !Number.isNaN(Date.parse(options.generatedAt))) sh.doc.setCreationDate(new Date(options.generatedAt));

  const numbered = numberFindings(report.findings);
  const numbers = new Map(numbered.map((x) => [x.finding.id, x.n]));

  // Page 1: the drawing on the left, legend, summary and title block in the right column.
  const sideX = PAGE_W - M - SIDE_W;
  sh.font(15, 'bold');
  sh.text(`One-line diagram: ${report.projectName}`, M, M + 12);
  sh.font(8, 'normal', GREY);
  sh.text(`Conductor overcurrent protection and tap review, NEC ${report.edition} 240.4 and 240.21. Verdict marks are explained in the legend.`, M, M + 24);
  const box = { x: M, y: M + 32, w: sideX - M - 14, h: BODY_BOTTOM - M - 32 };
  sh.stroke(GREY, 0.6);
  sh.doc.rect(box.x, box.y, box.w, box.h, 'S');
  const positions = layoutNodes(project.nodes, [...project.conductors, ...project.busLinks]);
  const overview = fit(positions, box);
  drawOneLine(sh, project, report, box, numbers, positions, overview);
  // A drawing too big to read on one sheet gets detail sheets at a legible scale, keyed on the overview.
  const detailBox = { x: M, y: M + 32, w: PAGE_W - 2 * M, h: BODY_BOTTOM - M - 32 };
  const details = overview.scale < DETAIL_BELOW_SCALE ? detailSheets(positions, detailBox) : [];
  if (details.length > 0) {
    for (const d of details) {
      const a = overview.map({ x: d.x0, y: d.y0 });
      const z = overview.map({ x: d.x0 + d.w, y: d.y0 + d.h });
      sh.stroke(GREY, 0.6, [3, 2]);
      sh.doc.rect(a.x, a.y, Math.min(z.x, box.x + box.w) - a.x, Math.min(z.y, box.y + box.h) - a.y, 'S');
      sh.font(7, 'bold', GREY);
      sh.text(d.name, a.x + 2, a.y + 8);
    }
    sh.font(8, 'bold');
    sh.text(`Overview at reduced scale: detail sheets ${details[0]!.name}-${details[details.length - 1]!.name} follow, each outlined here.`, box.x + 6, box.y + box.h - 6);
  }
  let y = drawLegend(sh, sideX, M, SIDE_W);
  y = drawSummary(sh, report, sideX, y + 6);
  const tbH = 172;
  drawTitleBlock(sh, report, project, generated, { x: sideX, y: Math.max(y + 6, BODY_BOTTOM - tbH), w: SIDE_W, h: tbH });

  details.forEach((d, k) => {
    sh.newPage();
    sh.font(15, 'bold');
    sh.text(`One-line diagram, detail sheet ${d.name} (${k + 1} of ${details.length}): ${report.projectName}`, M, M + 12);
    sh.font(8, 'normal', GREY);
    sh.text('Same marks as the legend on page 1. Lines that leave the sheet continue on the neighbouring detail sheet.', M, M + 24);
    sh.stroke(GREY, 0.6);
    sh.doc.rect(detailBox.x, detailBox.y, detailBox.w, detailBox.h, 'S');
    drawOneLine(sh, project, report, detailBox, numbers, positions, viewAt(d.x0, d.y0, detailScale(d, detailBox), detailBox));
  });

  findingsPages(sh, report);
  schedulePages(sh, project, report);
  workingPages(sh, report);
  assumptionsPage(sh, report);
  footers(sh, report, generated);
  return new Uint8Array(sh.doc.output('arraybuffer'));
}
