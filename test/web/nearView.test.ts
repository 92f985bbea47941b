import { describe, expect, it } from 'vitest';
import { areaNear, elementsNear, viewArea } from '../../web/src/canvas/nearView';

// Up close on a large drawing React Flow is given only what is near the view (web/src/canvas/nearView.ts).
const node = (id: string, x: number, y: number, selected = false) => ({ id, position: { x, y }, width: 40, height: 20, selected });
const edge = (id: string, source: string, target: string, selected = false) => ({ id, source, target, selected });

describe('what React Flow holds up close', () => {
  it('the view of a transform: translate and scale undone', () => {
    expect(viewArea([-200, -100, 2], 800, 600)).toEqual({ x1: 100, y1: 50, x2: 500, y2: 350 });
  });

  it('the area is the view grown by its size each side, kept while the view stays well inside it', () => {
    const view = { x1: 0, y1: 0, x2: 100, y2: 50 };
    const area = areaNear(view, null);
    expect(area).toEqual({ x1: -100, y1: -50, x2: 200, y2: 100 });
    // Half a view to the right: still inside with half a view to spare, the same object.
    expect(areaNear({ x1: 50, y1: 0, x2: 150, y2: 50 }, area)).toBe(area);
    // Further: a new area around the new view.
    expect(areaNear({ x1: 60, y1: 0, x2: 160, y2: 50 }, area)).toEqual({ x1: -40, y1: -50, x2: 260, y2: 100 });
    // Zoomed out so the view is larger than the area allows: a new one.
    expect(areaNear({ x1: -50, y1: -25, x2: 150, y2: 75 }, area)).not.toBe(area);
  });

  it('equipment inside, wires with an end there and their far ends, and whatever is selected', () => {
    const nodes = [node('in', 10, 10), node('far', 5000, 10), node('farther', 9000, 10), node('picked', 20000, 0, true), node('alone', 30000, 0)];
    const edges = [edge('w1', 'in', 'far'), edge('w2', 'far', 'farther'), edge('w3', 'alone', 'farther', true)];
    const near = elementsNear(nodes, edges, { x1: 0, y1: 0, x2: 100, y2: 100 });
    expect(near.nodes.map((n) => n.id)).toEqual(['in', 'far', 'farther', 'picked', 'alone']);
    expect(near.edges.map((e) => e.id)).toEqual(['w1', 'w3']);
    const none = elementsNear(nodes, edges, { x1: 40000, y1: 0, x2: 40100, y2: 100 });
    expect(none.nodes.map((n) => n.id)).toEqual(['farther', 'picked', 'alone']);
    expect(none.edges.map((e) => e.id)).toEqual(['w3']);
  });

  it('a box partly inside counts', () => {
    const near = elementsNear([node('edge-on', -30, -10)], [], { x1: 0, y1: 0, x2: 100, y2: 100 });
    expect(near.nodes).toHaveLength(1);
  });
});
