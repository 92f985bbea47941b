import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CONDUCTOR_SIZES, applyChanges, changesBetween, diffDrawings, loadProject, snapshotOf, type DrawingSnapshot } from '@linewright/core';

// The comparison is our own (no outside source): apply random edits to a sample, the diff must name each one and nothing else.
const text = readFileSync(fileURLToPath(new URL('../../samples/demo-clinic.json', import.meta.url)), 'utf8');
const loaded = loadProject(text);
if (!loaded.ok) throw new Error('demo sample did not load');
const base = snapshotOf(loaded.project);
const nC = base.conductors.length;
const nN = base.nodes.length;

type Edit =
  | { op: 'size'; i: number; pick: number }
  | { op: 'length'; i: number; lengthFt: number }
  | { op: 'label'; i: number; label: string }
  | { op: 'remove'; i: number }
  | { op: 'move'; i: number; dx: number }
  | { op: 'add'; n: number };

const edit: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ op: fc.constant('size' as const), i: fc.nat(nC - 1), pick: fc.nat(CONDUCTOR_SIZES.length - 2) }),
  fc.record({ op: fc.constant('length' as const), i: fc.nat(nC - 1), lengthFt: fc.integer({ min: 1, max: 19_000 }) }),
  fc.record({ op: fc.constant('label' as const), i: fc.nat(nN - 1), label: fc.string({ minLength: 1, maxLength: 30 }) }),
  fc.record({ op: fc.constant('remove' as const), i: fc.nat(nC - 1) }),
  fc.record({ op: fc.constant('move' as const), i: fc.nat(nN - 1), dx: fc.integer({ min: 1, max: 500 }) }),
  fc.record({ op: fc.constant('add' as const), n: fc.nat(1000) }),
);

/** Applies the edits (one per element; later edits of a taken element are skipped) and says what the diff must report. */
function applyEdits(edits: Edit[]): { after: DrawingSnapshot; expected: Map<string, { change: string; field?: string; layoutOnly?: boolean }> } {
  const after = structuredClone(base);
  const expected = new Map<string, { change: string; field?: string; layoutOnly?: boolean }>();
  for (const e of edits) {
    if (e.op === 'add') {
      const id = `NEW-${e.n}`;
      if (expected.has(id)) continue;
      after.conductors.push({ ...structuredClone(base.conductors[0]!), id: id as never });
      expected.set(id, { change: 'added' });
      continue;
    }
    const list = e.op === 'label' || e.op === 'move' ? after.nodes : after.conductors;
    const el = list[e.i];
    if (!el || expected.has(el.id)) continue;
    const id = el.id;
    if (e.op === 'size') {
      const c = after.conductors[e.i]!;
      const others = CONDUCTOR_SIZES.filter((s) => s !== c.size);
      c.size = others[e.pick % others.length]!;
      expected.set(id, { change: 'changed', field: 'size' });
    } else if (e.op === 'length') {
      const c = after.conductors[e.i]!;
      if (c.lengthFt === e.lengthFt) continue;
      c.lengthFt = e.lengthFt;
      expected.set(id, { change: 'changed', field: 'lengthFt' });
    } else if (e.op === 'label') {
      const n = after.nodes[e.i]!;
      if (n.label === e.label) continue;
      n.label = e.label;
      expected.set(id, { change: 'changed', field: 'label' });
    } else if (e.op === 'move') {
      const n = after.nodes[e.i]!;
      n.position = { x: (n.position?.x ?? 0) + e.dx, y: n.position?.y ?? 0 };
      expected.set(id, { change: 'changed', field: 'position.x', layoutOnly: true });
    } else {
      after.conductors = after.conductors.filter((c) => c.id !== id);
      expected.set(id, { change: 'removed' });
    }
  }
  return { after, expected };
}

describe('diff of two drawings (property)', () => {
  it('names exactly the elements edited, each with its change and field', () => {
    fc.assert(
      fc.property(fc.array(edit, { maxLength: 12 }), (edits) => {
        const { after, expected } = applyEdits(edits);
        const diff = diffDrawings(base, after);
        expect(new Map(diff.map((d) => [d.id, d.change]))).toEqual(new Map([...expected].map(([id, x]) => [id, x.change])));
        for (const d of diff) {
          const want = expected.get(d.id)!;
          if (want.field) expect(d.fields.map((f) => f.field)).toContain(want.field);
          if (d.change === 'changed') expect(d.layoutOnly).toBe(want.layoutOnly === true);
          expect(d.text.startsWith(d.id)).toBe(true);
        }
      }),
      { numRuns: 150 },
    );
  });

  it('a round stored as changes rebuilds the later drawing exactly', () => {
    fc.assert(
      fc.property(fc.array(edit, { maxLength: 12 }), (edits) => {
        const { after } = applyEdits(edits);
        const rebuilt = applyChanges(base, changesBetween(base, after));
        const byId = <T extends { id: string }>(xs: readonly T[]) => new Map(xs.map((x) => [x.id, x]));
        expect(byId(rebuilt.conductors)).toEqual(byId(after.conductors));
        expect(rebuilt.nodes).toEqual(after.nodes);
        expect(diffDrawings(after, rebuilt)).toEqual([]);
      }),
      { numRuns: 150 },
    );
  });

  it('names a size change in plain words', () => {
    const after = structuredClone(base);
    after.conductors.find((c) => c.id === 'TAP-L3')!.size = '3/0';
    expect(diffDrawings(base, after).map((d) => d.text)).toEqual(['TAP-L3 size 2/0 → 3/0']);
  });
});
