import { describe, expect, it } from 'vitest';
import { analyze } from '@linewright/core';
import { FlowDeriver, conductorEdgeId } from '../../web/src/canvas/flowElements';
import { replaceElement } from '../../web/src/editor/commands';
import { drawTap, harness } from './harness';

// The canvas re-renders only elements whose object changed (memoized components, React Flow lookups by
// identity), so the deriver must keep every untouched node and edge object across edits and reports.
describe('React Flow elements derived from the document', () => {
  function setup() {
    const h = harness();
    const ids = drawTap(h, { lengthFt: 8 });
    h.store.setReport(analyze(h.doc()), h.store.getState().docVersion);
    const d = new FlowDeriver();
    return { h, ids, d };
  }

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

  it('one conductor edited: only its edge is a new object, the nodes array is kept', () => {
    const { h, ids, d } = setup();
    const n1 = d.nodes(h.store.getState());
    const e1 = d.edges(h.store.getState());
    const c = h.doc().conductors.find((x) => x.id === ids.tapId)!;
    replaceElement.run(h.ctx, { target: { kind: 'conductor', id: c.id }, value: { ...c, lengthFt: 20 }, label: 'Set length' });
    const e2 = d.edges(h.store.getState());
    expect(d.nodes(h.store.getState())).toBe(n1);
    for (let i = 0; i < e1.length; i++) {
      if (e1[i]!.id === conductorEdgeId(ids.tapId)) expect(e2[i]).not.toBe(e1[i]);
      else expect(e2[i]).toBe(e1[i]);
    }
    expect(e2.find((e) => e.id === conductorEdgeId(ids.tapId))!.data).toMatchObject({ line: '1× 3/0 Cu · 20 ft' });
  });

  it('a new report that moves one verdict changes that edge only', () => {
    const { h, ids, d } = setup();
    const c = h.doc().conductors.find((x) => x.id === ids.tapId)!;
    replaceElement.run(h.ctx, { target: { kind: 'conductor', id: c.id }, value: { ...c, lengthFt: 20 }, label: 'Set length' });
    const before = d.edges(h.store.getState());
    h.store.setReport(analyze(h.doc()), h.store.getState().docVersion);
    const after = d.edges(h.store.getState());
    const tap = conductorEdgeId(ids.tapId);
    // 20 ft of 3/0 Cu from 600 A into a 200 A breaker: NFPA 70-2023 240.21(B)(2), 200 A ≥ 600/3 A.
    expect(after.find((e) => e.id === tap)!.data).toMatchObject({ verdict: 'tap-25ft', verdictText: '25-ft tap rule' });
    for (let i = 0; i < after.length; i++) if (after[i]!.id !== tap) expect(after[i]).toBe(before[i]);
  });
});
