import { describe, expect, it } from 'vitest';
import { analyze, createAnalysis } from '@linewright/core';
import { FlowDeriver, conductorEdgeId } from '../../web/src/canvas/flowElements';
import { conductorLook, nodeLook } from '../../web/src/canvas/looks';
import { OverviewLayouts, overviewLayout, overviewScene, pickAt, sceneChanges, selectionInBox } from '../../web/src/canvas/overview';
import { addEquipment, connect, replaceElement } from '../../web/src/editor/commands';
import { drawTap, harness } from './harness';

// React Flow rebuilds its lookups over every edge when the edges array changes and re-renders an element
// whose object changed, so the deriver keeps every node and edge object across reports and across edits
// that move nothing; what a check decides is read by id through the looks instead.
describe('React Flow elements derived from the document', () => {
  function setup() {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 8 });
    h.store.setReport(analyze(h.doc()), h.store.getState().docVersion);
    const d = new FlowDeriver();
    return { h, ids, d };
  }
  const setLength = (h: ReturnType<typeof harness>, id: string, lengthFt: number) => {
    const c = h.doc().conductors.find((x) => x.id === id)!;
    replaceElement.run(h.ctx, { target: { kind: 'conductor', id }, value: { ...c, lengthFt }, label: 'Set length' });
  };

  it('nothing changed: the same arrays', () => {
    const { h, d } = setup();
    const n1 = d.nodes(h.store.getState());
    const e1 = d.edges(h.store.getState());
    h.store.notify('a view change only');
    expect(d.nodes(h.store.getState())).toBe(n1);
    expect(d.edges(h.store.getState())).toBe(e1);
    expect(n1).toHaveLength(4);
    expect(e1).toHaveLength(3);
  });

  it('a length edit that moves no line keeps every node and edge object, and the arrays', () => {
    const { h, ids, d } = setup();
    const n1 = d.nodes(h.store.getState());
    const e1 = d.edges(h.store.getState());
    setLength(h, ids.tapId, 20);
    expect(d.nodes(h.store.getState())).toBe(n1);
    expect(d.edges(h.store.getState())).toBe(e1);
    expect(conductorLook(h.store.getState(), ids.tapId)).toMatchObject({ line: '1× 3/0 Cu · 20 ft' });
  });

  it('a new report changes no node or edge object; the edited conductor’s look carries the new verdict', () => {
    const { h, ids, d } = setup();
    setLength(h, ids.tapId, 20);
    const nodes = d.nodes(h.store.getState());
    const edges = d.edges(h.store.getState());
    const looks = h.doc().conductors.map((c) => conductorLook(h.store.getState(), c.id));
    h.store.setReport(analyze(h.doc()), h.store.getState().docVersion);
    const s = h.store.getState();
    expect(d.nodes(s)).toBe(nodes);
    expect(d.edges(s)).toBe(edges);
    // 20 ft of 3/0 Cu from 600 A into a 200 A breaker: NFPA 70-2023 240.21(B)(2), 200 A ≥ 600/3 A.
    expect(conductorLook(s, ids.tapId)).toMatchObject({ verdict: 'tap-25ft', verdictText: '25-ft tap rule', spoken: 'Conductor 1× 3/0 Cu · 20 ft, 25-ft tap rule' });
    // A look is kept while what it shows is the same, so the components of the other conductors do not re-render.
    h.doc().conductors.forEach((c, i) => {
      const look = conductorLook(s, c.id);
      if (c.id === ids.tapId || look?.verdict !== looks[i]?.verdict) return;
      expect(look).toBe(looks[i]);
    });
  });

  it('a look says "checking…" before the first check and "not checked" for a conductor a report leaves out', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 8 });
    expect(conductorLook(h.store.getState(), ids.tapId)).toMatchObject({ verdict: null, verdictText: 'checking…', family: 'pending' });
    const r = analyze(h.doc());
    h.store.setReport({ ...r, conductors: r.conductors.filter((c) => c.id !== ids.tapId) }, h.store.getState().docVersion);
    expect(conductorLook(h.store.getState(), ids.tapId)).toMatchObject({ verdict: null, verdictText: 'not checked', family: 'pending' });
    expect(conductorLook(h.store.getState(), 'no such conductor')).toBeNull();
  });

  it('a node’s finding flag comes from the report by id', () => {
    const { h, ids } = setup();
    const s = h.store.getState();
    const flagged = s.report!.findings.find((f) => f.subject.kind === 'node');
    const id = flagged?.subject.kind === 'node' ? flagged.subject.id : ids.m;
    const look = nodeLook(s, id)!;
    const count = s.report!.findings.filter((f) => [f.subject, ...f.related].some((r) => r.kind !== 'project' && r.id === id)).length;
    expect(look.findingCount).toBe(count);
    expect(look.worst === null).toBe(!flagged);
    expect(nodeLook(s, id)).toBe(look);
  });

  it('a selection change makes a new object of the selected edge only', () => {
    const { h, ids, d } = setup();
    const e1 = d.edges(h.store.getState());
    h.store.setSelection({ nodes: [], conductors: [ids.tapId], busLinks: [] });
    const e2 = d.edges(h.store.getState());
    for (let i = 0; i < e1.length; i++) {
      if (e1[i]!.id === conductorEdgeId(ids.tapId)) expect(e2[i]).toMatchObject({ selected: true });
      else expect(e2[i]).toBe(e1[i]);
    }
  });

  it('edges after selection changes alone equal the edges a fresh derivation gives, and an edit after them too', () => {
    const { h, ids, d } = setup();
    addEquipment.run(h.ctx, { kind: 'bus', position: { x: 300, y: 0 } });
    addEquipment.run(h.ctx, { kind: 'breaker', position: { x: 300, y: 200 } });
    const [bus, br] = h.doc().nodes.slice(-2).map((n) => n.id);
    connect.run(h.ctx, { from: bus!, to: br!, as: 'busLink' });
    const linkId = h.doc().busLinks[0]!.id;
    const conductors = h.doc().conductors.map((c) => c.id);
    const same = () => expect(d.edges(h.store.getState())).toEqual(new FlowDeriver().edges(h.store.getState()));
    same();
    for (const sel of [
      { nodes: [], conductors: [ids.tapId], busLinks: [] },
      { nodes: [ids.m], conductors: [conductors[0]!, ids.tapId], busLinks: [linkId] },
      { nodes: [], conductors: [conductors[1]!], busLinks: [] },
      { nodes: [], conductors: [], busLinks: [] },
    ]) {
      h.store.setSelection(sel);
      same();
    }
    h.store.setSelection({ nodes: [], conductors: [ids.tapId], busLinks: [linkId] });
    setLength(h, ids.tapId, 12);
    same();
    h.store.edit('Move', (doc) => void (doc.nodes.find((n) => n.id === ids.m)!.position = { x: 40, y: 400 }));
    same();
    h.store.setSelection({ nodes: [], conductors: [], busLinks: [] });
    same();
  });
});

describe('the overview far out', () => {
  it('draws each conductor in its look’s family, and a flag on every piece with a finding', () => {
    const h = harness();
    drawTap(h, { lengthFt: 40 });
    h.store.setReport(analyze(h.doc()), h.store.getState().docVersion);
    const s = h.store.getState();
    const d = new FlowDeriver();
    const scene = overviewScene(overviewLayout(d.nodes(s), d.edges(s)), s);
    const drawn = new Map<string, string>();
    for (const [family, lines] of scene.wires) for (const pts of lines) drawn.set(JSON.stringify(pts), family);
    for (const e of d.edges(s)) {
      if (e.type !== 'conductor') continue;
      const data = e.data as { conductorId: string; geometry: { points: unknown } };
      expect(drawn.get(JSON.stringify(data.geometry.points))).toBe(conductorLook(s, data.conductorId)!.family);
    }
    expect([...scene.badges.values()].flat()).toHaveLength(3);
    const flagged = new Set(s.report!.findings.filter((f) => f.subject.kind === 'node').map((f) => (f.subject as { id: string }).id));
    expect(scene.flags).toHaveLength(flagged.size);
  });

  it('after a check, only where a verdict or a flag moved is drawn again', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 20 });
    h.store.setReport(analyze(h.doc()), h.store.getState().docVersion);
    const d = new FlowDeriver();
    const layout = overviewLayout(d.nodes(h.store.getState()), d.edges(h.store.getState()));
    const before = overviewScene(layout, h.store.getState());
    expect(sceneChanges(before, overviewScene(layout, h.store.getState()), 10)).toEqual([]);
    // 20 ft → 40 ft of 3/0 Cu tapped from 600 A: past 240.21(B)(2)'s 25 ft, so the tap's verdict moves.
    const c = h.doc().conductors.find((x) => x.id === ids.tapId)!;
    replaceElement.run(h.ctx, { target: { kind: 'conductor', id: c.id }, value: { ...c, lengthFt: 40 }, label: 'Set length' });
    h.store.setReport(analyze(h.doc()), h.store.getState().docVersion);
    const after = overviewScene(layout, h.store.getState());
    const tap = layout.conductors.findIndex((x) => x.id === ids.tapId);
    expect(after.family[tap]).not.toBe(before.family[tap]);
    const boxes = sceneChanges(before, after, 10);
    expect(boxes.length).toBeGreaterThan(0);
    const badge = layout.conductors[tap]!.badge;
    expect(boxes.some((b) => b.x1 <= badge.x && badge.x <= b.x2 && b.y1 <= badge.y && badge.y <= b.y2)).toBe(true);
  });

  it('a click far out picks the piece under it or the nearest wire within reach; a box takes the pieces inside and their links', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 20 });
    // One below the other, 200 apart (drawTap leaves every piece at the origin).
    h.store.edit('Spread', (doc) => doc.nodes.forEach((n, i) => void (n.position = { x: 0, y: i * 200 })));
    const d = new FlowDeriver();
    const layout = overviewLayout(d.nodes(h.store.getState()), d.edges(h.store.getState()));
    const m = layout.nodes.find((n) => n.id === ids.m)!;
    expect(pickAt(layout, { x: m.x + m.w / 2, y: m.y + m.h / 2 }, 1)).toEqual({ kind: 'node', id: ids.m });
    const tap = layout.links.find((l) => l.id === ids.tapId)!;
    const [a, b] = [tap.points[0]!, tap.points[1]!];
    const mid = { x: (a.x + b.x) / 2 + 0.5, y: (a.y + b.y) / 2 + 0.5 };
    expect(pickAt(layout, mid, 3)).toEqual({ kind: 'conductor', id: ids.tapId });
    expect(pickAt(layout, { x: -10_000, y: -10_000 }, 50)).toBeNull();
    // A box around the whole drawing takes every piece and every link; one around a single piece takes it and what ends there.
    const all = selectionInBox(layout, { x1: -1e6, y1: -1e6, x2: 1e6, y2: 1e6 });
    expect(all.nodes).toHaveLength(h.doc().nodes.length);
    expect(all.conductors).toHaveLength(h.doc().conductors.length);
    const one = selectionInBox(layout, { x1: m.x + m.w + 1, y1: m.y + m.h + 1, x2: m.x - 1, y2: m.y - 1 });
    expect(one.nodes).toEqual([ids.m]);
    expect(one.conductors).toEqual(h.doc().conductors.filter((c) => c.from === ids.m || c.to === ids.m).map((c) => c.id));
  });

  it('a scene made from the one before equals a scene made afresh, edit after edit', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 20 });
    // The editor's path: one analysis session, so unchanged conductors keep their report objects.
    const session = createAnalysis(h.doc());
    h.store.setReport(session.report, h.store.getState().docVersion);
    const d = new FlowDeriver();
    const layout = overviewLayout(d.nodes(h.store.getState()), d.edges(h.store.getState()));
    let scene = overviewScene(layout, h.store.getState());
    const plain = (x: ReturnType<typeof overviewScene>) => ({ family: x.family, wires: [...x.wires].sort(), badges: [...x.badges].sort(), flags: x.flags });
    // 20 → 22 ft keeps every verdict; 22 → 40 ft passes 240.21(B)(2)'s 25 ft; 40 → 10 ft brings it back.
    for (const lengthFt of [22, 40, 10]) {
      const c = h.doc().conductors.find((x) => x.id === ids.tapId)!;
      replaceElement.run(h.ctx, { target: { kind: 'conductor', id: c.id }, value: { ...c, lengthFt }, label: 'Set length' });
      h.store.setReport(session.update(h.doc()), h.store.getState().docVersion);
      const next = overviewScene(layout, h.store.getState(), scene);
      expect(plain(next)).toEqual(plain(overviewScene(layout, h.store.getState())));
      if (lengthFt === 22) expect(next.family).toBe(scene.family);
      else expect(next.family).not.toEqual(scene.family);
      scene = next;
    }
  });

  it('a selection change keeps the layout’s geometry and the scene’s families, and equals a layout and a scene made afresh', () => {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 40 });
    h.store.edit('Spread', (doc) => doc.nodes.forEach((n, i) => void (n.position = { x: 0, y: i * 200 })));
    const session = createAnalysis(h.doc());
    h.store.setReport(session.report, h.store.getState().docVersion);
    const d = new FlowDeriver();
    const layouts = new OverviewLayouts();
    const layoutNow = () => layouts.of(d.nodes(h.store.getState()), d.edges(h.store.getState()));
    const fresh = () => {
      const f = new FlowDeriver();
      return overviewLayout(f.nodes(h.store.getState()), f.edges(h.store.getState()));
    };
    const plain = (x: ReturnType<typeof overviewScene>) => ({ family: x.family, wires: [...x.wires].sort(), badges: [...x.badges].sort(), flags: x.flags, layout: x.layout });
    let layout = layoutNow();
    let scene = overviewScene(layout, h.store.getState());
    for (const sel of [
      { nodes: [ids.m], conductors: [ids.tapId], busLinks: [] },
      { nodes: [], conductors: [h.doc().conductors[0]!.id], busLinks: [] },
      { nodes: [], conductors: [], busLinks: [] },
    ]) {
      h.store.setSelection(sel);
      const next = layoutNow();
      expect(next.conductors).toBe(layout.conductors);
      expect(next).toEqual(fresh());
      expect(next.selectedBoxes).toHaveLength(sel.nodes.length);
      expect(next.selectedWires).toHaveLength(sel.conductors.length);
      const nextScene = overviewScene(next, h.store.getState(), scene);
      expect(nextScene.family).toBe(scene.family);
      expect(plain(nextScene)).toEqual(plain(overviewScene(next, h.store.getState())));
      layout = next;
      scene = nextScene;
    }
    // A move is not a selection change: the geometry is laid out again.
    h.store.edit('Move', (doc) => void (doc.nodes.find((n) => n.id === ids.m)!.position = { x: 60, y: 900 }));
    const moved = layoutNow();
    expect(moved.conductors).not.toBe(layout.conductors);
    expect(moved).toEqual(fresh());
  });
});
