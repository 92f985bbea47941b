import { describe, expect, it } from 'vitest';
import { layoutNodes, DEFAULT_COLUMN_GAP, DEFAULT_LAYER_GAP } from '../../../core/src/report/layout';

// Layout is our own design (no outside source); these are its stated properties.
describe('layoutNodes', () => {
  const edges = [
    { from: 'U', to: 'M' },
    { from: 'M', to: 'A' },
    { from: 'M', to: 'B' },
    { from: 'A', to: 'A1' },
    { from: 'A', to: 'A2' },
  ];
  const nodes = ['U', 'M', 'A', 'B', 'A1', 'A2'].map((id) => ({ id }));

  it('puts the supply on top and each layer one gap lower', () => {
    const p = layoutNodes(nodes, edges);
    expect(p.get('U')!.y).toBe(0);
    expect(p.get('M')!.y).toBe(DEFAULT_LAYER_GAP);
    expect(p.get('A')!.y).toBe(2 * DEFAULT_LAYER_GAP);
    expect(p.get('A1')!.y).toBe(3 * DEFAULT_LAYER_GAP);
  });

  it('centres a parent over its children and keeps leaves a column apart', () => {
    const p = layoutNodes(nodes, edges);
    expect(p.get('A')!.x).toBe((p.get('A1')!.x + p.get('A2')!.x) / 2);
    expect(p.get('A2')!.x - p.get('A1')!.x).toBe(DEFAULT_COLUMN_GAP);
    expect(p.get('B')!.x).toBeGreaterThan(p.get('A2')!.x);
    const seen = new Set([...p.values()].map((q) => `${q.x},${q.y}`));
    expect(seen.size).toBe(nodes.length);
  });

  it('keeps given positions and places the rest to their right', () => {
    const p = layoutNodes([{ id: 'X', position: { x: 500, y: 40 } }, ...nodes], edges);
    expect(p.get('X')).toEqual({ x: 500, y: 40 });
    for (const id of ['U', 'A1']) expect(p.get(id)!.x).toBeGreaterThan(500);
    expect(p.get('U')!.y).toBe(40);
  });

  it('survives cycles, self-loops, edges to missing nodes and duplicate ids', () => {
    const p = layoutNodes(
      [{ id: 'a' }, { id: 'b' }, { id: 'c' }, { id: 'a' }],
      [{ from: 'a', to: 'b' }, { from: 'b', to: 'c' }, { from: 'c', to: 'a' }, { from: 'a', to: 'a' }, { from: 'a', to: 'zz' }],
    );
    expect([...p.keys()].sort()).toEqual(['a', 'b', 'c']);
    expect(new Set([...p.values()].map((q) => q.y)).size).toBe(3);
  });

  it('handles a chain of 30 000 nodes without recursion', () => {
    const n = 30_000;
    const many = Array.from({ length: n }, (_, i) => ({ id: `n${i}` }));
    const chain = Array.from({ length: n - 1 }, (_, i) => ({ from: `n${i}`, to: `n${i + 1}` }));
    const p = layoutNodes(many, chain);
    expect(p.get(`n${n - 1}`)!.y).toBe((n - 1) * DEFAULT_LAYER_GAP);
  });

  it('gives the same answer for the same input', () => {
    expect([...layoutNodes(nodes, edges)]).toEqual([...layoutNodes(nodes, edges)]);
  });
});
