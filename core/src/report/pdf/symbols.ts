import type { jsPDF } from 'jspdf';
import type { EquipmentNode } from '../../model/schema';
import type { Point } from '../layout';
import { MIN_TEXT_PT, AHJ, BLACK, VIOLATION, type Sheet } from './sheet';

/** IEEE Std 315 style symbols, conductor routes and the numbered callouts of findings. */

/** A switching device's leads and two contact circles of radius r, the contacts at ± reach × s. */
export function twoContacts(d: jsPDF, x: number, y: number, s: number, r: number, reach: number): void {
  d.line(x, y - s, x, y - s * reach);
  d.circle(x, y - s * reach + r, r, 'S');
  d.circle(x, y + s * reach - r, r, 'S');
  d.line(x, y + s * reach, x, y + s);
}

/** IEEE Std 315 style symbols of our own drawing, centred on (x, y), terminals at y - s and y + s. */
export function drawSymbol(sh: Sheet, n: EquipmentNode, x: number, y: number, s: number, busHalfWidth: number): void {
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
      if (s * 0.9 >= MIN_TEXT_PT) {
        sh.font(s * 0.9, 'bold');
        sh.text('G', x, y, { align: 'center', baseline: 'middle' });
      }
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

export interface Route {
  pts: Point[];
  /** Where the label goes: the middle of the last vertical run. */
  labelAt: Point;
}

export function route(from: Point, to: Point, s: number, fromBus: { half: number } | null, toBus: boolean): Route {
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

export function polyline(sh: Sheet, pts: Point[]): void {
  for (let i = 1; i < pts.length; i++) sh.doc.line(pts[i - 1]!.x, pts[i - 1]!.y, pts[i]!.x, pts[i]!.y);
}

export function callout(sh: Sheet, kind: 'violation' | 'needs-ahj', n: number, x: number, y: number, rAsked: number): void {
  const d = sh.doc;
  // Large enough that its number prints at the legible floor.
  const r = Math.max(rAsked, (String(n).length > 1 ? MIN_TEXT_PT / 0.95 : MIN_TEXT_PT / 1.2) + 0.01);
  sh.stroke(kind === 'violation' ? VIOLATION : AHJ, Math.max(0.8, r / 6));
  sh.fill([255, 255, 255]);
  if (kind === 'violation') d.circle(x, y, r, 'FD');
  else d.triangle(x, y - r * 1.1, x - r * 1.05, y + r * 0.75, x + r * 1.05, y + r * 0.75, 'FD');
  sh.font(r * (String(n).length > 1 ? 0.95 : 1.2), 'bold');
  sh.text(String(n), x, kind === 'violation' ? y : y + r * 0.15, { align: 'center', baseline: 'middle' });
}
