import { FAMILY_LOOK, SEVERITY_LOOK } from '../analysis/verdicts';
import type { Pt } from './geometry';
import type { OverviewScene } from './overview';

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

/** Draws the scene for one view; everything outside the view (with a margin) is skipped. */
export function drawOverview(g: CanvasRenderingContext2D, scene: OverviewScene, v: View): void {
  g.setTransform(1, 0, 0, 1, 0, 0);
  g.clearRect(0, 0, g.canvas.width, g.canvas.height);
  g.setTransform(v.dpr * v.zoom, 0, 0, v.dpr * v.zoom, v.dpr * v.x, v.dpr * v.y);
  // The view in flow coordinates, with room for the grown badges.
  const grow = Math.max(1, 0.85 / v.zoom);
  const pad = 12 * grow;
  const left = -v.x / v.zoom - pad;
  const top = -v.y / v.zoom - pad;
  const right = (v.width - v.x) / v.zoom + pad;
  const bottom = (v.height - v.y) / v.zoom + pad;
  const inView = (pts: readonly Pt[]) => {
    let x1 = Infinity, x2 = -Infinity, y1 = Infinity, y2 = -Infinity;
    for (const p of pts) {
      if (p.x < x1) x1 = p.x;
      if (p.x > x2) x2 = p.x;
      if (p.y < y1) y1 = p.y;
      if (p.y > y2) y2 = p.y;
    }
    return x2 >= left && x1 <= right && y2 >= top && y1 <= bottom;
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
  g.beginPath();
  for (const s of scene.layout.stems) {
    if (s.x < left || s.x > right || s.y2 < top || s.y1 > bottom) continue;
    g.moveTo(s.x, s.y1);
    g.lineTo(s.x, s.y2);
  }
  g.strokeStyle = INK;
  g.lineWidth = 2;
  g.stroke();
  g.beginPath();
  for (const b of scene.layout.bars) {
    if (b.x2 < left || b.x1 > right || b.y < top || b.y > bottom) continue;
    g.moveTo(b.x1, b.y);
    g.lineTo(b.x2, b.y);
  }
  g.lineWidth = 7;
  g.stroke();

  // Conductors in their family's pen.
  for (const [family, lines] of scene.wires) {
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
  for (const [family, centres] of scene.badges) {
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
