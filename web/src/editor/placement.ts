import type { EquipmentKind, EquipmentNode, Project } from '@linewright/core';
import { LAYER_GAP, arrivalLeftReach, labelWidth } from '../canvas/geometry';
import { conductorLine, kindSpec, newConductorFields } from './equipment';

/** Connection kinds a drawing has. */
export type ConnectionKind = 'conductor' | 'busLink';

const DEVICE_KINDS: ReadonlySet<EquipmentKind> = new Set(['breaker', 'fuse', 'disconnect']);

/**
 * The connection two pieces call for, as the trade draws it: a bus and a device inside the same
 * equipment are joined by a bus link (a branch or feeder device under its bus; a main device over
 * the bus it feeds); anything else by a conductor. A device already hanging from a bus is a feeder
 * device, so what it feeds lies elsewhere and takes a conductor (common practice).
 */
export function connectionKindFor(doc: Pick<Project, 'nodes' | 'busLinks'>, fromId: string, toKind: EquipmentKind): ConnectionKind {
  const from = doc.nodes.find((n) => n.id === fromId);
  if (!from) return 'conductor';
  if (from.kind === 'bus' && DEVICE_KINDS.has(toKind)) return 'busLink';
  if (DEVICE_KINDS.has(from.kind) && toKind === 'bus') {
    const fedFromBus = doc.busLinks.some((b) => b.to === fromId && doc.nodes.find((n) => n.id === b.from)?.kind === 'bus');
    return fedFromBus ? 'conductor' : 'busLink';
  }
  return 'conductor';
}

interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** The room a piece takes on the drawing: its box and, on its left, the labels of what arrives at it. */
function footprint(kind: EquipmentKind, at: { x: number; y: number }, arrivingLabels: number[]): Box {
  const s = kindSpec(kind);
  const reach = arrivalLeftReach(kind, arrivingLabels);
  return { x: at.x - reach, y: at.y - (arrivingLabels.length ? LAYER_GAP - 20 : 0), w: reach + s.width, h: s.height + (arrivingLabels.length ? LAYER_GAP - 20 : 0) };
}

function footprints(doc: Pick<Project, 'nodes' | 'conductors'>, skip?: string): Box[] {
  const labels = new Map<string, number[]>();
  for (const c of doc.conductors) (labels.get(c.to) ?? labels.set(c.to, []).get(c.to)!).push(labelWidth(conductorLine(c)));
  const out: Box[] = [];
  for (const n of doc.nodes) if (n.position && n.id !== skip) out.push(footprint(n.kind, n.position, labels.get(n.id) ?? []));
  return out;
}

const hits = (a: Box, b: Box, m: number) => a.x < b.x + b.w + m && a.x + a.w + m > b.x && a.y < b.y + b.h + m && a.y + a.h + m > b.y;

/** The first spot from `at` (moving right, or down) where the piece and its label overlap nothing. */
export function freeSpot(doc: Pick<Project, 'nodes' | 'conductors'>, kind: EquipmentKind, at: { x: number; y: number }, withLabel: boolean, step: 'right' | 'down'): { x: number; y: number } {
  const taken = footprints(doc);
  const labels = withLabel ? [labelWidth(conductorLine({ ...newConductorFields(), lengthFt: undefined }))] : [];
  const p = { ...at };
  for (let i = 0; i < 400; i++) {
    const me = footprint(kind, p, labels);
    const hit = taken.find((b) => hits(me, b, 12));
    if (!hit) return p;
    if (step === 'right') p.x = hit.x + hit.w + 24 + (p.x - me.x);
    else p.y = hit.y + hit.h + 24 + (p.y - me.y);
  }
  return p;
}

/**
 * Where a new piece goes under `from`: beside the last piece `from` already feeds (a new branch on a
 * bus goes to the right of the others), or straight below it on the same wire.
 */
export function spotUnder(doc: Pick<Project, 'nodes' | 'conductors' | 'busLinks'>, from: EquipmentNode, kind: EquipmentKind, as: ConnectionKind): { x: number; y: number } {
  const fs = kindSpec(from.kind);
  const ks = kindSpec(kind);
  const fp = from.position ?? { x: 0, y: 0 };
  const fed = [...doc.conductors, ...doc.busLinks].filter((e) => e.from === from.id).map((e) => doc.nodes.find((n) => n.id === e.to)).filter((n): n is EquipmentNode => !!n?.position);
  const withLabel = as === 'conductor';
  if (fed.length > 0) {
    const last = fed.reduce((a, b) => (b.position!.x > a.position!.x ? b : a));
    return freeSpot(doc, kind, { x: last.position!.x + kindSpec(last.kind).width + 24, y: last.position!.y }, withLabel, 'right');
  }
  return freeSpot(doc, kind, { x: fp.x + fs.wireX - ks.wireX, y: fp.y + fs.height + LAYER_GAP }, withLabel, 'down');
}

/** Every piece fed, directly or further down, from `id` (not `id` itself). */
export function downstreamOf(doc: Pick<Project, 'conductors' | 'busLinks'>, id: string): Set<string> {
  const out = new Map<string, string[]>();
  for (const e of [...doc.conductors, ...doc.busLinks]) (out.get(e.from) ?? out.set(e.from, []).get(e.from)!).push(e.to);
  const seen = new Set<string>();
  const stack = [id];
  while (stack.length) {
    for (const next of out.get(stack.pop()!) ?? []) {
      if (next === id || seen.has(next)) continue;
      seen.add(next);
      stack.push(next);
    }
  }
  return seen;
}

/** Moves `ids` down by `dy` (inside an edit), making room for something inserted above them. */
export function shiftDown(nodes: EquipmentNode[], ids: ReadonlySet<string>, dy: number): void {
  if (dy <= 0) return;
  for (const n of nodes) if (ids.has(n.id) && n.position) n.position = { x: n.position.x, y: n.position.y + dy };
}

/**
 * Places `node`, just inserted ahead of `toId`, where `toId` stood, and moves `toId` and everything it
 * feeds down by the room the new piece takes, so nothing lands on anything (inside an edit).
 */
export function placeAhead(d: Pick<Project, 'nodes' | 'conductors' | 'busLinks'>, node: EquipmentNode, toId: string): void {
  const to = d.nodes.find((n) => n.id === toId);
  if (!to?.position) return;
  const s = kindSpec(node.kind);
  const ts = kindSpec(to.kind);
  node.position = { x: to.position.x + ts.wireX - s.wireX, y: to.position.y };
  const moved = downstreamOf(d, node.id);
  moved.delete(node.id);
  shiftDown(d.nodes, moved, s.height + LAYER_GAP);
}
