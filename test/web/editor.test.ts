import { describe, expect, it } from 'vitest';
import { produceWithPatches } from 'immer';
import { loadProject } from '@linewright/core';
import {
  addEquipment, applyFix, connect, copySelection, deleteSelection, moveNodes, openProject, paste, projectFileText, redo, replaceElement, saveJson, undo,
} from '../../web/src/editor/commands';
import { drawTap, harness } from './harness';

describe('edit history (immer patches)', () => {
  it('undo and redo replay an edit exactly; a no-op leaves no step', () => {
    const h = harness();
    const empty = h.doc();
    addEquipment.run(h.ctx, { kind: 'breaker', position: { x: 10, y: 20 } });
    const one = h.doc();
    expect(one.nodes).toHaveLength(1);
    expect(h.store.getState().history.undoDepth).toBe(1);
    expect(h.store.edit('nothing', () => {})).toBe(false);
    expect(h.store.getState().history.undoDepth).toBe(1);
    undo.run(h.ctx);
    expect(h.doc()).toEqual(empty);
    redo.run(h.ctx);
    expect(h.doc()).toEqual(one);
  });

  it('a merged edit undoes as one step', () => {
    const h = harness();
    h.store.edit('name', (d) => void (d.project.name = 'A'));
    h.store.edit('name', (d) => void (d.project.name = 'AB'), 'merge');
    expect(h.store.getState().history.undoDepth).toBe(1);
    undo.run(h.ctx);
    expect(h.doc().project.name).toBe('Untitled one-line');
  });

  it('a whole-element replacement leaves the document and undo step an immer recipe would, and undoes exactly', () => {
    const h = harness();
    const { tapId, m } = drawTap(h, { lengthFt: 8 });
    const before = h.doc();
    const tap = { ...before.conductors.find((c) => c.id === tapId)!, lengthFt: 12 };
    const breaker = { ...before.nodes.find((n) => n.id === m)!, ratingA: 225 };
    const [expected, redoPatches, undoPatches] = produceWithPatches(before, (d) => {
      d.conductors[d.conductors.findIndex((c) => c.id === tapId)] = tap;
      d.nodes[d.nodes.findIndex((n) => n.id === m)] = breaker;
    });
    expect(h.store.replaceElements('Set', [{ list: 'conductors', value: tap }, { list: 'nodes', value: breaker }])).toBe(true);
    expect(h.doc()).toEqual(expected);
    expect(Object.isFrozen(h.doc().conductors)).toBe(true);
    const step = h.store.historySnapshot().past.at(-1)!;
    expect(new Set(step.redo.map((p) => JSON.stringify(p)))).toEqual(new Set(redoPatches.map((p) => JSON.stringify(p))));
    expect(new Set(step.undo.map((p) => JSON.stringify(p)))).toEqual(new Set(undoPatches.map((p) => JSON.stringify(p))));
    // Untouched elements keep their objects (the canvas and the analysis session read identity).
    expect(h.doc().conductors.filter((c, i) => c === before.conductors[i])).toHaveLength(before.conductors.length - 1);
    undo.run(h.ctx);
    expect(h.doc()).toEqual(before);
    redo.run(h.ctx);
    expect(h.doc()).toEqual(expected);
    expect(h.store.replaceElements('Set', [{ list: 'conductors', value: { ...tap, id: 'NO-SUCH' } }])).toBe(false);
  });

  it('a new edit clears the redo stack', () => {
    const h = harness();
    addEquipment.run(h.ctx, { kind: 'fuse' });
    undo.run(h.ctx);
    expect(redo.canRun(h.ctx)).toBe(true);
    addEquipment.run(h.ctx, { kind: 'load' });
    expect(redo.canRun(h.ctx)).toBe(false);
  });
});

describe('commands', () => {
  it('new equipment gets the schema defaults and a fresh label', () => {
    const h = harness();
    addEquipment.run(h.ctx, { kind: 'breaker' });
    addEquipment.run(h.ctx, { kind: 'breaker' });
    const [a, b] = h.doc().nodes;
    expect(a).toMatchObject({ kind: 'breaker', label: 'CB-1', arrangement: 'single', ratingA: 100 });
    expect(b!.label).toBe('CB-2');
    expect(a!.id).not.toBe(b!.id);
    expect(h.store.getState().view.selection.nodes).toEqual([b!.id]);
  });

  // Defaults for a new conductor: copper, THHN (90 °C), terminations at the project's default (110.14(C)(1);
  // 75 °C for equipment listed for it, common practice for equipment marked 60/75 °C), 30 °C ambient and three current-carrying conductors (the basis of NFPA 70-2023
  // Table 310.16), in raceway. Length and size are left empty so the check asks for them instead of guessing.
  it('a drawn conductor takes the trade defaults and no length or size', () => {
    const h = harness();
    addEquipment.run(h.ctx, { kind: 'breaker' });
    addEquipment.run(h.ctx, { kind: 'load' });
    const [b, l] = h.doc().nodes.map((n) => n.id);
    connect.run(h.ctx, { from: b!, to: l!, as: 'conductor' });
    const c = h.doc().conductors[0]!;
    expect(c).toMatchObject({ from: b, to: l, material: 'cu', insulation: 'THHN', ambientC: 30, currentCarrying: 3, damageProtection: 'raceway', parallelSets: 1 });
    expect(c.lengthFt).toBeUndefined();
    expect(c.size).toBeUndefined();
    expect(c.terminalTempC).toBeUndefined();
    // No size, no ampacity: 240.4 cannot be decided, so the conductor waits for its size (common practice: ask, never guess).
    const r = h.report().conductors[0]!;
    expect(r.verdict).toBe('incomplete');
    expect(r.summary).toMatch(/needs the size/);
    // Once a size is chosen, 1/0 Cu at 75 °C = 150 A (NFPA 70-2023 Table 310.16) ≥ the 100 A default breaker: 240.4 needs no length.
    replaceElement.run(h.ctx, { target: { kind: 'conductor', id: c.id }, value: { ...c, size: '1/0' }, label: 'Size' });
    expect(h.report().conductors[0]!.verdict).toBe('protected');
  });

  it('refuses a connection out of a load or into a source', () => {
    const h = harness();
    // Placed at given spots: no place-and-connect under a selected piece.
    addEquipment.run(h.ctx, { kind: 'utility', position: { x: 0, y: 0 } });
    addEquipment.run(h.ctx, { kind: 'load', position: { x: 0, y: 200 } });
    const [u, l] = h.doc().nodes.map((n) => n.id);
    connect.run(h.ctx, { from: l!, to: u!, as: 'conductor' });
    expect(h.doc().conductors).toHaveLength(0);
    expect(h.store.getState().view.notices.at(-1)?.text).toMatch(/no load-side port/);
  });

  it('invalid values never reach the document', () => {
    const h = harness();
    const { tapId } = drawTap(h, { lengthFt: 8 });
    const before = h.doc();
    const depth = h.store.getState().history.undoDepth;
    const c = before.conductors.find((x) => x.id === tapId)!;
    for (const bad of [{ lengthFt: -4 }, { size: '5/0' }, { parallelSets: 0 }, { ambientC: 200 }]) {
      expect(replaceElement.canRun(h.ctx, { target: { kind: 'conductor', id: tapId }, value: { ...c, ...bad }, label: 'x' })).toBe(false);
      replaceElement.run(h.ctx, { target: { kind: 'conductor', id: tapId }, value: { ...c, ...bad }, label: 'x' });
    }
    expect(h.doc()).toBe(before);
    expect(h.store.getState().history.undoDepth).toBe(depth);
  });

  it('renaming an id carries the conductors with it', () => {
    const h = harness();
    const { f, tapId } = drawTap(h, { lengthFt: 8 });
    const n = h.doc().nodes.find((x) => x.id === f)!;
    replaceElement.run(h.ctx, { target: { kind: 'node', id: f }, value: { ...n, id: 'FEEDER' }, label: 'Set id' });
    expect(h.doc().conductors.filter((c) => c.from === 'FEEDER' || c.to === 'FEEDER')).toHaveLength(2);
    expect(h.doc().conductors.find((c) => c.id === tapId)).toBeTruthy();
    expect(loadProject(h.doc()).ok).toBe(true);
  });

  it('delete takes the attached conductors along, and undo brings all back', () => {
    const h = harness();
    const { s } = drawTap(h, { lengthFt: 8 });
    const before = h.doc();
    h.store.setSelection({ nodes: [s], conductors: [], busLinks: [] });
    deleteSelection.run(h.ctx);
    expect(h.doc().nodes).toHaveLength(3);
    expect(h.doc().conductors).toHaveLength(1);
    undo.run(h.ctx);
    expect(h.doc()).toEqual(before);
  });

  it('copy and paste make new ids and rewire the copied conductors, in one step', () => {
    const h = harness();
    const { s, m } = drawTap(h, { lengthFt: 8 });
    h.store.setSelection({ nodes: [s, m], conductors: [], busLinks: [] });
    copySelection.run(h.ctx);
    const depth = h.store.getState().history.undoDepth;
    paste.run(h.ctx);
    const d = h.doc();
    expect(d.nodes).toHaveLength(6);
    expect(d.conductors).toHaveLength(4);
    const pasted = d.conductors.at(-1)!;
    expect([s, m]).not.toContain(pasted.from);
    expect(new Set(d.nodes.map((n) => n.id)).size).toBe(6);
    expect(h.store.getState().history.undoDepth).toBe(depth + 1);
    expect(loadProject(d).ok).toBe(true);
  });

  it('a move of many nodes is one step', () => {
    const h = harness();
    drawTap(h, { lengthFt: 8 });
    const depth = h.store.getState().history.undoDepth;
    moveNodes.run(h.ctx, new Map(h.doc().nodes.map((n, i) => [n.id, { x: 100 + i, y: 200 }])));
    expect(h.store.getState().history.undoDepth).toBe(depth + 1);
    expect(h.doc().nodes.every((n) => n.position?.y === 200)).toBe(true);
  });
});

// NFPA 70-2023 Table 310.16: 3/0 Cu at 75 °C = 200 A. 240.21(B)(1): ≤ 10 ft and ≥ the 200 A device it ends in.
// 240.21(B)(2): ≤ 25 ft, ≥ 600/3 = 200 A and one device ≤ its ampacity. Past 25 ft indoors no feeder-tap rule applies.
describe('verdicts follow the edits', () => {
  it.each([
    [8, 'tap-10ft'],
    [20, 'tap-25ft'],
    [30, 'unprotected'],
  ])('a %d ft 3/0 Cu tap from a 600 A feeder device into a 200 A breaker: %s', (lengthFt, verdict) => {
    const h = harness();
    const { tapId } = drawTap(h, { lengthFt });
    expect(h.report().conductors.find((c) => c.id === tapId)!.verdict).toBe(verdict);
  });

  it('a fix is one undoable edit', () => {
    const h = harness();
    const { tapId } = drawTap(h, { lengthFt: 30 });
    const r = h.report().conductors.find((c) => c.id === tapId)!;
    expect(r.fixes.length).toBeGreaterThan(0);
    const before = h.doc();
    applyFix.run(h.ctx, r.fixes[0]!);
    expect(h.report().conductors.find((c) => c.id === tapId)?.verdict ?? 'changed').not.toBe('unprotected');
    undo.run(h.ctx);
    expect(h.doc()).toEqual(before);
  });
});

describe('project files', () => {
  it('save then open gives the same document, and opening is undoable', async () => {
    const h = harness();
    drawTap(h, { lengthFt: 20 });
    saveJson.run(h.ctx);
    const text = h.downloads[0]!.data as string;
    expect(text).toBe(projectFileText(h.doc()));
    const drawn = h.doc();
    const other = harness();
    await openProject.run(other.ctx, { fileName: 'tap.json', text });
    expect(other.doc()).toEqual(drawn);
    expect(projectFileText(other.doc())).toBe(text);
    // Frozen through its elements, as an edit leaves a document.
    const opened = other.doc();
    expect(Object.isFrozen(opened) && Object.isFrozen(opened.conductors) && Object.isFrozen(opened.conductors[0]) && Object.isFrozen(opened.nodes[0]!.position)).toBe(true);
    undo.run(other.ctx);
    expect(other.doc().nodes).toHaveLength(0);
    redo.run(other.ctx);
    expect(other.doc()).toBe(opened);
  });

  it('a file that fails to load leaves the drawing untouched and names the path', async () => {
    const h = harness();
    drawTap(h, { lengthFt: 20 });
    const before = h.doc();
    const bad = JSON.parse(projectFileText(before));
    bad.conductors[2].lengthFt = -1;
    await openProject.run(h.ctx, { fileName: 'bad.json', text: JSON.stringify(bad) });
    expect(h.doc()).toBe(before);
    const le = h.store.getState().view.loadErrors!;
    expect(le.fileName).toBe('bad.json');
    expect(le.errors.map((e) => e.path)).toContain('conductors[2].lengthFt');
  });
});

describe('the selection after a commit', () => {
  it('keeps only ids the document still holds, a few ids or many, and stays the same object when nothing went', () => {
    const h = harness();
    for (let i = 0; i < 20; i++) addEquipment.run(h.ctx, { kind: 'load', position: { x: i * 100, y: 0 } });
    const ids = h.doc().nodes.map((n) => n.id);
    // Many: the ids of the list are put in a set.
    h.store.setSelection({ nodes: ids, conductors: [], busLinks: [] });
    h.store.edit('Delete three', (d) => void (d.nodes = d.nodes.filter((n) => !ids.slice(0, 3).includes(n.id))));
    expect(h.store.getState().view.selection.nodes).toEqual(ids.slice(3));
    // A few: each searched for.
    h.store.setSelection({ nodes: [ids[3]!, ids[4]!], conductors: [], busLinks: [] });
    h.store.edit('Delete one', (d) => void (d.nodes = d.nodes.filter((n) => n.id !== ids[4])));
    expect(h.store.getState().view.selection.nodes).toEqual([ids[3]]);
    // An edit that removes nothing selected keeps the selection object.
    const sel = h.store.getState().view.selection;
    h.store.edit('Rename', (d) => void (d.nodes[0]!.label = 'L-A'));
    h.store.edit('Name', (d) => void (d.project.name = 'B'));
    expect(h.store.getState().view.selection).toBe(sel);
  });
});
