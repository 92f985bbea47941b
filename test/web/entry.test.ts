import { describe, expect, it } from 'vitest';
import { analyze, type Project } from '@linewright/core';
import { addEquipment, applyFix, convertConnection, insertIntoConductor, replaceElement } from '../../web/src/editor/commands';
import { drawingGeometry, type Box } from '../../web/src/canvas/geometry';
import { conductorLine, kindSpec } from '../../web/src/editor/equipment';
import { drawTap, harness } from './harness';

const select = (h: ReturnType<typeof harness>, id: string) => h.store.setSelection({ nodes: [id], conductors: [], busLinks: [] });
const selected = (h: ReturnType<typeof harness>) => h.store.getState().view.selection.nodes[0]!;

/** Boxes of pieces and labels after an edit; none may overlap another. */
function overlapsIn(p: Project): string[] {
  const pos = new Map(p.nodes.map((n) => [n.id, n.position!]));
  const geo = drawingGeometry(p.nodes, p.conductors, p.busLinks, (id) => pos.get(id as (typeof p.nodes)[number]['id']), conductorLine);
  const boxes: { id: string; b: Box }[] = [
    ...p.nodes.map((n) => ({ id: n.id, b: { ...n.position!, w: kindSpec(n.kind).width, h: kindSpec(n.kind).height } })),
    ...[...geo.conductors].map(([id, g]) => ({ id: `label ${id}`, b: g.label })),
  ];
  const out: string[] = [];
  for (let i = 0; i < boxes.length; i++)
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i]!.b;
      const b = boxes[j]!.b;
      if (a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h) out.push(`${boxes[i]!.id} / ${boxes[j]!.id}`);
    }
  return out;
}

describe('place and connect: a riser from the keyboard', () => {
  it('utility, main breaker, bus, two feeder breakers and loads: each below its supply, joined as the kinds call for', () => {
    const h = harness();
    addEquipment.run(h.ctx, { kind: 'utility' });
    const util = selected(h);
    addEquipment.run(h.ctx, { kind: 'breaker' });
    const main = selected(h);
    addEquipment.run(h.ctx, { kind: 'bus' });
    const bus = selected(h);
    addEquipment.run(h.ctx, { kind: 'breaker' });
    const cb1 = selected(h);
    addEquipment.run(h.ctx, { kind: 'load' });
    select(h, bus);
    addEquipment.run(h.ctx, { kind: 'breaker' });
    const cb2 = selected(h);
    addEquipment.run(h.ctx, { kind: 'load' });
    const d = h.doc();
    const link = (a: string, b: string) => (d.conductors.some((c) => c.from === a && c.to === b) ? 'conductor' : d.busLinks.some((x) => x.from === a && x.to === b) ? 'busLink' : 'none');
    // Common practice: service conductors from the utility; a main breaker and feeder breakers are bus-linked inside the board.
    expect(link(util, main)).toBe('conductor');
    expect(link(main, bus)).toBe('busLink');
    expect(link(bus, cb1)).toBe('busLink');
    expect(link(bus, cb2)).toBe('busLink');
    expect(d.conductors).toHaveLength(3);
    const y = (id: string) => d.nodes.find((n) => n.id === id)!.position!.y;
    const x = (id: string) => d.nodes.find((n) => n.id === id)!.position!.x;
    expect(y(main)).toBeGreaterThan(y(util));
    expect(y(bus)).toBeGreaterThan(y(main));
    expect(y(cb2)).toBe(y(cb1));
    expect(x(cb2)).toBeGreaterThan(x(cb1));
    expect(overlapsIn(d)).toEqual([]);
    // One undo step per piece: the last undo removes the load and its conductor together.
    h.store.undo();
    expect(h.doc().nodes).toHaveLength(6);
    expect(h.doc().conductors).toHaveLength(2);
  });
});

describe('insert a device into a conductor', () => {
  it('a breaker into a 60 ft feeder at 15 ft: 15 ft keeps the id and facts, 45 ft goes to a copy; the load moves down', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 8 });
    for (const n of h.doc().nodes) replaceElement.run(h.ctx, { target: { kind: 'node', id: n.id }, value: { ...n, position: { x: 0, y: h.doc().nodes.indexOf(n) * 200 } }, label: 'Place' });
    const feeder = h.doc().conductors.find((c) => c.from === ids.f)!;
    const yBefore = h.doc().nodes.find((n) => n.id === ids.s)!.position!.y;
    insertIntoConductor.run(h.ctx, { conductorId: feeder.id, kind: 'breaker', supplySideFt: 15 });
    const d = h.doc();
    const cb = selected(h);
    const a = d.conductors.find((c) => c.id === feeder.id)!;
    const b = d.conductors.find((c) => c.from === cb)!;
    expect([a.from, a.to, a.lengthFt]).toEqual([ids.f, cb, 15]);
    expect([b.to, b.lengthFt, b.size, b.parallelSets, b.material]).toEqual([ids.s, 45, feeder.size, feeder.parallelSets, feeder.material]);
    expect(d.nodes.find((n) => n.id === ids.s)!.position!.y).toBeGreaterThan(yBefore);
    expect(overlapsIn(d)).toEqual([]);
  });

  it('a split past the end is refused with the conductor named and the drawing kept', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 8 });
    const before = h.doc();
    insertIntoConductor.run(h.ctx, { conductorId: ids.tapId, kind: 'fuse', supplySideFt: 9 });
    expect(h.doc()).toBe(before);
    expect(h.store.getState().view.notices.at(-1)!.text).toContain(`supply end of ${ids.tapId}: at most its whole length, 8 ft`);
  });
});

describe('connection kind can be changed', () => {
  it('a conductor made a bus link and back keeps its ends', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 8 });
    convertConnection.run(h.ctx, { kind: 'conductor', id: ids.tapId });
    const b = h.doc().busLinks.at(-1)!;
    expect([b.from, b.to]).toEqual([ids.s, ids.m]);
    expect(h.doc().conductors.some((c) => c.id === ids.tapId)).toBe(false);
    convertConnection.run(h.ctx, { kind: 'busLink', id: b.id });
    const c = h.doc().conductors.at(-1)!;
    expect([c.from, c.to, c.lengthFt]).toEqual([ids.s, ids.m, undefined]);
  });
});

describe('a fix that adds a breaker lands without overlap', () => {
  it('a 20 ft tap of 1 AWG Cu from 600 A fails 240.21(B)(2); adding the breaker keeps every piece and label clear', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 20, size: '1' });
    for (const n of h.doc().nodes) replaceElement.run(h.ctx, { target: { kind: 'node', id: n.id }, value: { ...n, position: { x: 0, y: h.doc().nodes.indexOf(n) * 180 } }, label: 'Place' });
    const r = analyze(h.doc()).conductors.find((c) => c.id === ids.tapId)!;
    const fix = r.fixes.find((f) => f.kind === 'add-ocpd');
    expect(fix, 'an add-breaker fix is offered').toBeDefined();
    applyFix.run(h.ctx, fix!);
    expect(h.doc().nodes).toHaveLength(5);
    expect(overlapsIn(h.doc())).toEqual([]);
  });
});
