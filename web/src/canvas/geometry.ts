import type { EquipmentKind } from '@linewright/core';
import { kindSpec } from '../editor/equipment';

/**
 * Where every line and label of the drawing goes, as plain numbers. The canvas draws from it, the
 * layout reserves room from it and the overlap test checks it, so the three cannot disagree.
 *
 * The drawing's conventions (common practice for one-lines):
 * - a connection leaves its supply at the bottom port and turns just below it (FAN), so feeders
 *   from one device fan out like a riser; from a bus it leaves the bus bar itself, the bar
 *   drawn on to the point above the load (a bus, not a dog-leg);
 * - conductors arriving at the same piece run side by side, LANE apart, not on top of each other;
 * - a conductor's label sits just above the piece it feeds, left of its wire, inside the gap
 *   between layers, which the layout keeps tall enough for it.
 */

/** Label text is monospace 11 px: its width is known without measuring (0.6 em per character). */
export const CHAR_W = 6.6;
export const LINE_H = 14;
export const LABEL_H = LINE_H * 2 + 6;
/** Room between a label and the piece under it, and between a label and its wire. */
export const LABEL_GAP = 6;
export const LABEL_WIRE_GAP = 8;
/** Distance below a supply port where a connection turns towards its load. */
export const FAN = 18;
/** Spacing of conductors that arrive side by side. */
export const LANE = 10;
/** Vertical room a layer gap needs: turn, label and the margins around it. */
export const LAYER_GAP = FAN + 10 + LABEL_H + LABEL_GAP + 4;
/** Longest verdict word allowed on the drawing (the words are ours, see analysis/verdicts.ts). */
export const VERDICT_CHARS_MAX = 24;

export interface Pt {
  x: number;
  y: number;
}
export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Width of a conductor label: its facts line, or the room the longest verdict word needs beside its badge. */
export function labelWidth(line: string): number {
  return Math.max(line.length, VERDICT_CHARS_MAX + 3) * CHAR_W + 10;
}

/** Offsets of `n` lanes side by side, centred on the port. */
export function laneOffset(k: number, n: number): number {
  return (k - (n - 1) / 2) * LANE;
}

/** y of the bus bar below a bus node's top edge. */
export function busBarY(kind: EquipmentKind): number | null {
  const s = kindSpec(kind);
  return s.barY ?? null;
}

export interface RouteInput {
  /** Supply port (bottom centre of the wire of the supply piece). */
  s: Pt;
  /** Load port (top of the wire of the load piece). */
  t: Pt;
  /** Lane offset, same at both ends. */
  dx: number;
  /** When the supply is a bus: how far above its bottom port the bar runs. */
  barRise: number | null;
}

/**
 * The wire as a polyline; `bar` is the stretch of bus bar drawn on from the bus to the drop, when the
 * supply is a bus.
 */
export function route(r: RouteInput): { points: Pt[]; bar: { x1: number; x2: number; y: number } | null } {
  const tx = r.t.x + r.dx;
  if (r.barRise !== null) {
    const y = r.s.y - r.barRise;
    return { points: [{ x: tx, y }, { x: tx, y: r.t.y }], bar: { x1: Math.min(r.s.x, tx), x2: Math.max(r.s.x, tx), y } };
  }
  const sx = r.s.x + r.dx;
  if (Math.abs(sx - tx) < 0.5) return { points: [{ x: sx, y: r.s.y }, { x: tx, y: r.t.y }], bar: null };
  const turn = r.s.y + FAN;
  return { points: [{ x: sx, y: r.s.y }, { x: sx, y: turn }, { x: tx, y: turn }, { x: tx, y: r.t.y }], bar: null };
}

export function pathOf(points: readonly Pt[]): string {
  return points.map((p, i) => `${i ? 'L' : 'M'} ${p.x} ${p.y}`).join(' ');
}

/**
 * Labels of the conductors arriving at one piece: a row left of the leftmost wire, in the
 * order of the wires, just above the piece. `widths` in lane order; returns each label's box.
 */
export function arrivalLabelBoxes(t: Pt, widths: readonly number[]): Box[] {
  const n = widths.length;
  const right0 = t.x + laneOffset(0, n) - LABEL_WIRE_GAP;
  const y = t.y - LABEL_GAP - LABEL_H;
  const out: Box[] = new Array<Box>(n);
  let right = right0;
  for (let k = n - 1; k >= 0; k--) {
    const w = widths[k]!;
    out[k] = { x: right - w, y, w, h: LABEL_H };
    right -= w + 4;
  }
  return out;
}

/** How far the labels arriving at a piece reach left of the piece's own box (0 when they fit within). */
export function arrivalLeftReach(kind: EquipmentKind, widths: readonly number[]): number {
  if (widths.length === 0) return 0;
  const wireX = kindSpec(kind).wireX;
  const boxes = arrivalLabelBoxes({ x: wireX, y: 0 }, widths);
  return Math.max(0, -boxes[0]!.x);
}

export interface Bar {
  x1: number;
  x2: number;
  y: number;
}
export interface ConductorGeometry {
  points: Pt[];
  bar: Bar | null;
  label: Box;
}
export interface BusLinkGeometry {
  points: Pt[];
  bar: Bar | null;
}

interface GeoNode {
  id: string;
  kind: EquipmentKind;
}
interface GeoLink {
  id: string;
  from: string;
  to: string;
}

/** Supply (bottom) and load (top) port of a piece placed at `p`. */
export function ports(kind: EquipmentKind, p: Pt): { out: Pt; in: Pt } {
  const s = kindSpec(kind);
  return { out: { x: p.x + s.wireX, y: p.y + s.height }, in: { x: p.x + s.wireX, y: p.y } };
}

/**
 * Every wire and label of a drawing from the positions of its pieces. `lineOf` gives a conductor's facts
 * line (its label width follows from it). Links to missing pieces are left out.
 */
export function drawingGeometry<C extends GeoLink>(
  nodes: readonly GeoNode[],
  conductors: readonly C[],
  busLinks: readonly GeoLink[],
  posOf: (id: string) => Pt | undefined,
  lineOf: (c: C) => string,
): { conductors: Map<string, ConductorGeometry>; busLinks: Map<string, BusLinkGeometry> } {
  const kind = new Map<string, EquipmentKind>();
  for (const n of nodes) kind.set(n.id, n.kind);
  const arrivals = new Map<string, C[]>();
  for (const c of conductors) {
    if (!kind.has(c.from) || !kind.has(c.to)) continue;
    const list = arrivals.get(c.to);
    if (list) list.push(c);
    else arrivals.set(c.to, [c]);
  }
  const outC = new Map<string, ConductorGeometry>();
  for (const [to, list] of arrivals) {
    const tp = posOf(to);
    if (!tp) continue;
    const t = ports(kind.get(to)!, tp).in;
    const boxes = arrivalLabelBoxes(t, list.map((c) => labelWidth(lineOf(c))));
    list.forEach((c, k) => {
      const fk = kind.get(c.from)!;
      const sp = posOf(c.from);
      if (!sp) return;
      const r = route({ s: ports(fk, sp).out, t, dx: laneOffset(k, list.length), barRise: barRise(fk) });
      outC.set(c.id, { ...r, label: boxes[k]! });
    });
  }
  const outB = new Map<string, BusLinkGeometry>();
  for (const b of busLinks) {
    const fk = kind.get(b.from);
    const tk = kind.get(b.to);
    const sp = posOf(b.from);
    const tp = posOf(b.to);
    if (!fk || !tk || !sp || !tp) continue;
    const into = busBarY(tk);
    const s = ports(fk, sp).out;
    if (into !== null && barRise(fk) === null) {
      // Into a bus: straight down onto the bar, the bar drawn on to meet the link if it lands beyond it.
      const spec = kindSpec(tk);
      const y = tp.y + into;
      const x1 = tp.x + 4;
      const x2 = tp.x + spec.width - 4;
      const bar = s.x < x1 ? { x1: s.x, x2: x1, y } : s.x > x2 ? { x1: x2, x2: s.x, y } : null;
      outB.set(b.id, { points: [s, { x: s.x, y: y - 3.5 }], bar });
    } else outB.set(b.id, route({ s, t: ports(tk, tp).in, dx: 0, barRise: barRise(fk) }));
  }
  return { conductors: outC, busLinks: outB };
}

/** How far a bus bar runs above the bus's supply-side port, or null when the piece is no bus. */
export function barRise(kind: EquipmentKind): number | null {
  const y = busBarY(kind);
  return y === null ? null : kindSpec(kind).height - y;
}
