import type { EquipmentNode, Project } from '../../model/schema';
import type { AnalysisReport } from '../../analyze/types';
import { type VerdictClass, conductorText, displayClass, labelStatesRating, lengthText, num, sizeText, verdictText } from '../format';
import type { Point } from '../layout';
import { BLACK, GREY, MIN_TEXT_PT, STYLE, VIOLATION, type DrawBox, type Rect, type Sheet } from './sheet';
import { callout, drawSymbol, polyline, route, type Route } from './symbols';
import { Placer, drawLabel, measure, type Label } from './labels';

/** The one-line drawing: where everything goes on the sheet and the order it is drawn in. */

export function nodeName(n: EquipmentNode): string {
  return n.label || n.id;
}

export function nodeDetail(n: EquipmentNode): string {
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


export interface Placed {
  node: EquipmentNode;
  p: Point;
}

/** Maps layout points into the box, keeping the aspect ratio; returns the scale used. */
export interface View {
  map: (p: Point) => Point;
  scale: number;
}

export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

export function boundsOf(points: Map<string, Point>): Bounds | null {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const p of points.values()) {
    minX = Math.min(minX, p.x);
    maxX = Math.max(maxX, p.x);
    minY = Math.min(minY, p.y);
    maxY = Math.max(maxY, p.y);
  }
  return Number.isFinite(minX) ? { minX, minY, maxX, maxY } : null;
}

/** Scale (pt per layout unit) at which labels print at 6.5 pt: what detail sheets aim for. */
export const LEGIBLE_SCALE = 0.5;
/** Label size at a scale; the smallest line of a label is 0.95 of it. */
const labelFontAt = (scale: number) => Math.min(6.5, scale * 14);
/** Below this scale the smallest label line would print under MIN_TEXT_PT: the view shows no text, detail sheets follow. */
export const DETAIL_BELOW_SCALE = MIN_TEXT_PT / 0.95 / 14;

/** A view of the layout region starting at (x0, y0) at a fixed scale, for a detail sheet. */
export function viewAt(x0: number, y0: number, scale: number, box: DrawBox): View {
  return { map: (p) => ({ x: box.x + 30 + (p.x - x0) * scale, y: box.y + 30 + (p.y - y0) * scale }), scale };
}

export function fit(points: Map<string, Point>, box: DrawBox): View {
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

/** Node text on the drawing: the label, then the rating or size unless the label already says it. */
export function nodeLines(n: EquipmentNode): string[] {
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
export function drawOneLine(sh: Sheet, project: Project, report: AnalysisReport, box: DrawBox, numbers: ReadonlyMap<string, number>, positions: Map<string, Point>, view: View): void {
  const { map, scale } = view;
  const s = Math.max(3, Math.min(13, scale * 38));
  const labelFont = labelFontAt(scale);
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

  const placer = new Placer(Math.max(20, 60 * scale), box);
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
    const cls: VerdictClass = cr ? displayClass(report, cr) : 'incomplete';
    const st = STYLE[cls];
    const r = route(a.p, z.p, s, a.node.kind === 'bus' ? { half: busHalf.get(c.from)! } : null, z.node.kind === 'bus');
    sh.stroke(st.color, st.width * styleScale, st.dash.map((v) => v * styleScale));
    polyline(sh, r.pts);
    obstacle(r.pts);
    const callouts = marksBySubject.get(`conductor:${c.id}`) ?? [];
    const label = measure(sh, {
      lines: [
        { text: `${c.id}: ${cr ? conductorText(cr) : sizeText(c.size)}, ${lengthText(c.lengthFt ?? null)}`, style: 'normal', color: BLACK, size: labelFont },
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
  // A bus bar whose piece lies on another detail sheet but whose bar runs into this one is drawn too
  // (clipped at the frame), so the drops on this sheet hang from a bar; its label is on the other sheet.
  for (const [id, pl] of all) {
    if (pl.node.kind !== 'bus' || placed.has(id)) continue;
    const half = busHalf.get(id)!;
    if (pl.p.y < box.y || pl.p.y > box.y + box.h || pl.p.x + half < box.x || pl.p.x - half > box.x + box.w) continue;
    drawSymbol(sh, pl.node, pl.p.x, pl.p.y, s, half);
    placer.add({ x: pl.p.x - half, y: pl.p.y - s * 0.3, w: 2 * half, h: s * 0.6 });
  }

  // 3. Labels, flagged conductors first so they get the best spots, then equipment, then the rest.
  // Text under the legible floor is never printed: a reduced overview shows structure and callouts only.
  if (scale < DETAIL_BELOW_SCALE) {
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

export interface DetailSheet {
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
export function detailSheets(positions: Map<string, Point>, box: DrawBox): DetailSheet[] {
  const b = boundsOf(positions);
  if (!b) return [];
  const bw = b.maxX - b.minX + 1;
  const bh = b.maxY - b.minY + 1;
  const nx = Math.max(1, Math.ceil(bw / ((box.w - 180) / LEGIBLE_SCALE)));
  const ny = Math.max(1, Math.ceil(bh / ((box.h - 60) / LEGIBLE_SCALE)));
  const tw = bw / nx;
  const th = bh / ny;
  // Only the regions that hold equipment are visited (sorted row by row), so the cost follows the
  // number of pieces, not the area of the grid.
  const used = new Map<string, [number, number]>();
  for (const p of positions.values()) {
    const i = Math.min(nx - 1, Math.floor((p.x - b.minX) / tw));
    const j = Math.min(ny - 1, Math.floor((p.y - b.minY) / th));
    used.set(`${i},${j}`, [i, j]);
  }
  const cells = [...used.values()].sort((a, z) => a[1] - z[1] || a[0] - z[0]);
  return cells.map(([i, j], k) => ({ name: `D${k + 1}`, x0: b.minX + i * tw, y0: b.minY + j * th, w: tw, h: th }));
}

/** The scale a detail sheet draws its region at: as large as fits, never above 1.2. */
export function detailScale(d: DetailSheet, box: DrawBox): number {
  return Math.min((box.w - 180) / d.w, (box.h - 60) / d.h, 1.2);
}
