import { readFileSync, readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadProject, type Project } from '@linewright/core';
import { layoutTopToBottom } from '../../web/src/canvas/layout';
import { drawingGeometry, type Box, type Pt } from '../../web/src/canvas/geometry';
import { conductorLine, kindSpec } from '../../web/src/editor/equipment';

const dir = new URL('../../samples/', import.meta.url);
const samples = readdirSync(dir).filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json');

function load(name: string): Project {
  const r = loadProject(readFileSync(new URL(name, dir), 'utf8'));
  if (!r.ok) throw new Error(`${name} does not load`);
  return r.project;
}

const overlaps = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** Does the segment p–q pass through the inside of box b (axis-parallel segments only, as the drawing has)? */
function crosses(p: Pt, q: Pt, b: Box): boolean {
  const x1 = Math.min(p.x, q.x);
  const x2 = Math.max(p.x, q.x);
  const y1 = Math.min(p.y, q.y);
  const y2 = Math.max(p.y, q.y);
  return x1 < b.x + b.w && x2 > b.x && y1 < b.y + b.h && y2 > b.y;
}

/** Every clash on a laid-out drawing: label on label, label on a piece, label on a wire, piece on piece. */
export function clashes(p: Project, pos: Map<string, Pt>): string[] {
  const geo = drawingGeometry(p.nodes, p.conductors, p.busLinks, (id) => pos.get(id), conductorLine);
  const nodes = p.nodes.map((n) => {
    const s = kindSpec(n.kind);
    const q = pos.get(n.id)!;
    return { id: n.id, box: { x: q.x, y: q.y, w: s.width, h: s.height } };
  });
  const labels = [...geo.conductors].map(([id, g]) => ({ id, box: g.label }));
  const wires: { id: string; a: Pt; b: Pt }[] = [];
  for (const [id, g] of [...geo.conductors, ...geo.busLinks]) {
    for (let i = 1; i < g.points.length; i++) wires.push({ id, a: g.points[i - 1]!, b: g.points[i]! });
    if (g.bar) wires.push({ id, a: { x: g.bar.x1, y: g.bar.y }, b: { x: g.bar.x2, y: g.bar.y } });
  }
  const out: string[] = [];
  for (let i = 0; i < labels.length; i++) {
    for (let j = i + 1; j < labels.length; j++) if (overlaps(labels[i]!.box, labels[j]!.box)) out.push(`label ${labels[i]!.id} on label ${labels[j]!.id}`);
    for (const n of nodes) if (overlaps(labels[i]!.box, n.box)) out.push(`label ${labels[i]!.id} on ${n.id}`);
    for (const w of wires) if (crosses(w.a, w.b, labels[i]!.box)) out.push(`label ${labels[i]!.id} on the wire of ${w.id}`);
  }
  for (let i = 0; i < nodes.length; i++) for (let j = i + 1; j < nodes.length; j++) if (overlaps(nodes[i]!.box, nodes[j]!.box)) out.push(`${nodes[i]!.id} on ${nodes[j]!.id}`);
  return out;
}

describe('after Arrange, no label lies over another label, a piece or a wire (bounding boxes)', () => {
  it.each(samples)('%s', async (name) => {
    const p = load(name);
    const pos = await layoutTopToBottom(p);
    expect(pos.size).toBe(p.nodes.length);
    expect(clashes(p, pos)).toEqual([]);
  });
});

describe('the check finds clashes where there are some', () => {
  it('a piece moved 20 units under its supply: the pieces overlap and its label lies on the supply', () => {
    const p = load('demo-clinic.json');
    const pos = new Map(p.nodes.map((n) => [n.id, n.position ?? { x: 0, y: 0 }]));
    const c = p.conductors[0]!;
    const s = pos.get(c.from)!;
    pos.set(c.to, { x: s.x, y: s.y + 20 });
    const found = clashes(p, pos);
    expect(found.filter((x) => x === `${c.from} on ${c.to}` || x === `${c.to} on ${c.from}`)).toHaveLength(1);
    expect(found).toContain(`label ${c.id} on ${c.from}`);
  });
});
