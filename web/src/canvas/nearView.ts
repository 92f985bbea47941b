/** A rectangle in the drawing's coordinates. */
export interface Area {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

/** What of a React Flow node or edge the choice reads. */
interface Placed {
  id: string;
  position: { x: number; y: number };
  width?: number;
  height?: number;
  selected?: boolean;
}
interface Wire {
  source: string;
  target: string;
  selected?: boolean;
}

/** The part of the drawing a view of `width` × `height` screen pixels shows at `transform` ([x, y, zoom], React Flow's). */
export function viewArea(transform: readonly [number, number, number], width: number, height: number): Area {
  const [tx, ty, zoom] = transform;
  const x1 = -tx / zoom;
  const y1 = -ty / zoom;
  return { x1, y1, x2: x1 + width / zoom, y2: y1 + height / zoom };
}

/**
 * The area of a large drawing React Flow is given while the view shows it up close: the view grown by
 * its own size on every side. It is kept (the same object) while the view, grown by half its size,
 * still lies inside it, so a pan within it changes nothing React Flow holds, and the elements a pan
 * brings into view are already drawn.
 */
export function areaNear(view: Area, held: Area | null): Area {
  const w = view.x2 - view.x1;
  const h = view.y2 - view.y1;
  if (held && view.x1 - w / 2 >= held.x1 && view.y1 - h / 2 >= held.y1 && view.x2 + w / 2 <= held.x2 && view.y2 + h / 2 <= held.y2) return held;
  return { x1: view.x1 - w, y1: view.y1 - h, x2: view.x2 + w, y2: view.y2 + h };
}

/**
 * The elements of a large drawing near `area`: the equipment at least partly inside it, every wire
 * with an end there and the equipment at its other end (so the wire is drawn whole), and whatever is
 * selected (a drag moves all of it). React Flow builds its lookups for what it is given: handing it
 * 40 000 elements on the first zoom in to a 10 000-conductor drawing froze the page for most of a second.
 */
export function elementsNear<N extends Placed, E extends Wire>(nodes: readonly N[], edges: readonly E[], area: Area): { nodes: N[]; edges: E[] } {
  const held = new Set<string>();
  for (const n of nodes) {
    const { x, y } = n.position;
    if (n.selected || (x <= area.x2 && y <= area.y2 && x + (n.width ?? 0) >= area.x1 && y + (n.height ?? 0) >= area.y1)) held.add(n.id);
  }
  const near: E[] = [];
  const ends = new Set<string>();
  for (const e of edges) {
    if (!e.selected && !held.has(e.source) && !held.has(e.target)) continue;
    near.push(e);
    ends.add(e.source).add(e.target);
  }
  return { nodes: nodes.filter((n) => held.has(n.id) || ends.has(n.id)), edges: near };
}
