import { FAMILY_LOOK, SEVERITY_LOOK, type VerdictFamily } from '../analysis/verdicts';
import type { Pt } from './geometry';
import { boundsOf, type Box, type OverviewScene, type Segment } from './overview';

/** The pens of styles.css the overview draws with (--ink, --sel, .lw-edge-halo, .lw-buslink-outer). */
const INK = '#1d232b';
const SEL = 'rgba(11, 87, 208, 0.28)';
const SEL_SOLID = '#0b57d0';
const BUSLINK_OUTER = '#2b2f36';

export interface View {
  /** React Flow's transform: translate x, y and zoom. */
  x: number;
  y: number;
  zoom: number;
  width: number;
  height: number;
  /** Device pixels per CSS pixel. */
  dpr: number;
}

/** Families in one drawing order, so a box drawn again blends its overlaps as the whole view did. */
const FAMILIES = Object.keys(FAMILY_LOOK) as VerdictFamily[];

/** How far around a point the overview draws at a zoom (the grown badges and flags), in flow units. */
export function overviewPad(zoom: number): number {
  return 12 * 2.6 * Math.max(1, 0.85 / zoom);
}

/**
 * Draws the scene for one view; everything outside the view (with a margin) is skipped. With `only`, just
 * that box of the bitmap is cleared and drawn again, everything else kept.
 */
export function drawOverview(g: CanvasRenderingContext2D, scene: OverviewScene, v: View, only?: Box): void {
  g.setTransform(1, 0, 0, 1, 0, 0);
  if (!only) g.clearRect(0, 0, g.canvas.width, g.canvas.height);
  g.save();
  if (only) {
    // Clip and clear on whole device pixels, so no half-cleared pixel is drawn over twice at the border.
    const k = v.dpr * v.zoom;
    const x1 = Math.floor(only.x1 * k + v.dpr * v.x);
    const y1 = Math.floor(only.y1 * k + v.dpr * v.y);
    const x2 = Math.ceil(only.x2 * k + v.dpr * v.x);
    const y2 = Math.ceil(only.y2 * k + v.dpr * v.y);
    g.beginPath();
    g.rect(x1, y1, x2 - x1, y2 - y1);
    g.clip();
    g.clearRect(x1, y1, x2 - x1, y2 - y1);
  }
  g.setTransform(v.dpr * v.zoom, 0, 0, v.dpr * v.zoom, v.dpr * v.x, v.dpr * v.y);
  // The view in flow coordinates, with room for the grown badges.
  const grow = Math.max(1, 0.85 / v.zoom);
  const pad = overviewPad(v.zoom);
  const left = only ? only.x1 - pad : -v.x / v.zoom - pad;
  const top = only ? only.y1 - pad : -v.y / v.zoom - pad;
  const right = only ? only.x2 + pad : (v.width - v.x) / v.zoom + pad;
  const bottom = only ? only.y2 + pad : (v.height - v.y) / v.zoom + pad;
  const inView = (pts: readonly Pt[]) => {
    const b = boundsOf(pts);
    return b.x2 >= left && b.x1 <= right && b.y2 >= top && b.y1 <= bottom;
  };
  const polylines = (lines: readonly (readonly Pt[])[]) => {
    g.beginPath();
    for (const pts of lines) {
      if (pts.length === 0 || !inView(pts)) continue;
      g.moveTo(pts[0]!.x, pts[0]!.y);
      for (let i = 1; i < pts.length; i++) g.lineTo(pts[i]!.x, pts[i]!.y);
    }
  };
  g.lineCap = 'butt';
  g.setLineDash([]);

  // Selection halo under everything, as .lw-edge-halo.
  polylines(scene.layout.selectedWires);
  g.strokeStyle = SEL;
  g.lineWidth = 10;
  g.stroke();

  // Bus links: a double bar (.lw-buslink-outer / -inner).
  polylines(scene.layout.busLinks);
  g.strokeStyle = BUSLINK_OUTER;
  g.lineWidth = 6;
  g.stroke();
  g.strokeStyle = '#fff';
  g.lineWidth = 2;
  g.stroke();

  // Equipment: the wire through each symbol and the bus bars (.lw-symbol, .lw-busbar).
  const segments = (list: readonly Segment[], width: number) => {
    g.beginPath();
    for (const s of list) {
      if (Math.max(s.x1, s.x2) < left || Math.min(s.x1, s.x2) > right || Math.max(s.y1, s.y2) < top || Math.min(s.y1, s.y2) > bottom) continue;
      g.moveTo(s.x1, s.y1);
      g.lineTo(s.x2, s.y2);
    }
    g.strokeStyle = INK;
    g.lineWidth = width;
    g.stroke();
  };
  segments(scene.layout.stems, 2);
  segments(scene.layout.bars, 7);

  // Conductors in their family's pen.
  for (const family of FAMILIES) {
    const lines = scene.wires.get(family);
    if (!lines) continue;
    const look = FAMILY_LOOK[family];
    polylines(lines);
    g.strokeStyle = look.colour;
    g.lineWidth = look.strokeWidth;
    const dash = look.dash ? look.dash.split(' ').map(Number) : [];
    const period = dash.reduce((a, b) => a + b, 0);
    // A dash pattern finer than a few device pixels cannot be seen, only its share of ink: drawn as a
    // solid line that light, instead of millions of sub-pixel dashes.
    if (period * v.zoom * v.dpr < 4) {
      g.setLineDash([]);
      g.globalAlpha = period ? dash.filter((_, i) => i % 2 === 0).reduce((a, b) => a + b, 0) / period : 1;
    } else g.setLineDash(dash);
    g.stroke();
    g.globalAlpha = 1;
  }
  g.setLineDash([]);

  for (const b of scene.layout.selectedBoxes) {
    g.strokeStyle = SEL_SOLID;
    g.lineWidth = 2 / v.zoom;
    g.strokeRect(b.x, b.y, b.w, b.h);
  }

  // Verdict badges, grown as on the drawing far out (.lw-lod-grow): shape and colour by family, one path each.
  const r = (11 / 2) * grow;
  for (const family of FAMILIES) {
    const centres = scene.badges.get(family);
    if (!centres) continue;
    const look = FAMILY_LOOK[family];
    g.beginPath();
    for (const c of centres) {
      if (c.x < left || c.x > right || c.y < top || c.y > bottom) continue;
      badgePath(g, look.badge, c.x, c.y, r, grow);
    }
    if (look.badge === 'none') {
      g.strokeStyle = look.colour;
      g.lineWidth = 1.2 * grow;
      g.stroke();
    } else {
      g.fillStyle = look.colour;
      g.fill();
      g.strokeStyle = '#000';
      g.lineWidth = 0.6 * grow;
      g.stroke();
    }
  }

  // Finding flags: the severity's colour, at the size the far-out flag has (.lw-far .lw-node-flag).
  const flag = 12 * Math.min(grow, 2.6);
  for (const f of scene.flags) {
    const { x, y } = f.at;
    if (x < left || x > right || y < top || y > bottom) continue;
    g.fillStyle = SEVERITY_LOOK[f.severity].colour;
    g.fillRect(x - flag, y, flag, flag);
  }
  g.restore();
}

/** The badge outline of analysis/verdicts.ts's shapes (edges/VerdictBadge.tsx), added to the current path. */
function badgePath(g: CanvasRenderingContext2D, shape: string, x: number, y: number, r: number, grow: number): void {
  const k = grow;
  switch (shape) {
    case 'diamond':
      g.moveTo(x, y - r - k);
      g.lineTo(x + r + k, y);
      g.lineTo(x, y + r + k);
      g.lineTo(x - r - k, y);
      g.closePath();
      return;
    case 'triangle':
      g.moveTo(x, y - r - k);
      g.lineTo(x + r + k, y + r);
      g.lineTo(x - r - k, y + r);
      g.closePath();
      return;
    case 'square':
      g.rect(x - r, y - r, 2 * r, 2 * r);
      return;
    default:
      g.moveTo(x + r, y);
      g.arc(x, y, r, 0, 2 * Math.PI);
  }
}
