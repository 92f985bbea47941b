/** A point in drawing units (the editor's canvas units: x right, y down). */
export interface Point {
  x: number;
  y: number;
}

export interface LayoutNode {
  id: string;
  position?: Point | undefined;
}

export interface LayoutEdge {
  from: string;
  to: string;
}

export interface LayoutOptions {
  /** Horizontal distance between neighbouring leaves. */
  columnGap?: number;
  /** Vertical distance between layers. */
  layerGap?: number;
}

export const DEFAULT_COLUMN_GAP = 160;
export const DEFAULT_LAYER_GAP = 120;

/**
 * Positions for every node: a node that has a `position` keeps it; the rest get a top-down layered
 * layout (supply at the top, loads at the bottom) placed to the right of the positioned ones.
 *
 * The layout is a tidy tree over a breadth-first spanning forest: layer = distance from a root
 * (a node nothing feeds, or the first node of a cycle), leaves take the next free column and a
 * parent sits over the middle of its children, so subtrees never overlap. One-lines are nearly
 * trees, so this reads like a riser; extra edges (loops, ties) are drawn but do not shape it.
 * Linear in nodes + edges, iterative (deep chains cannot overflow the stack), and a function of the
 * input alone, so the same file always draws the same way.
 */
export function layoutNodes(nodes: readonly LayoutNode[], edges: readonly LayoutEdge[], options: LayoutOptions = {}): Map<string, Point> {
  const colGap = options.columnGap ?? DEFAULT_COLUMN_GAP;
  const layerGap = options.layerGap ?? DEFAULT_LAYER_GAP;
  const out = new Map<string, Point>();
  const index = new Map<string, number>();
  const free: number[] = [];
  for (const n of nodes) {
    if (index.has(n.id)) continue;
    if (n.position) out.set(n.id, { x: n.position.x, y: n.position.y });
    else {
      index.set(n.id, free.length);
      free.push(free.length);
    }
  }
  const count = free.length;
  if (count === 0) return out;
  const ids: string[] = new Array<string>(count);
  for (const [id, i] of index) ids[i] = id;

  // Adjacency in CSR form over the unpositioned nodes only.
  const indeg = new Int32Array(count);
  const start = new Int32Array(count + 1);
  const kept: [number, number][] = [];
  for (const e of edges) {
    const a = index.get(e.from);
    const b = index.get(e.to);
    if (a === undefined || b === undefined || a === b) continue;
    kept.push([a, b]);
    start[a + 1]!++;
    indeg[b]!++;
  }
  for (let i = 0; i < count; i++) start[i + 1]! += start[i]!;
  const adj = new Int32Array(kept.length);
  const fill = start.slice(0, count);
  for (const [a, b] of kept) adj[fill[a]!++] = b;

  // Breadth-first spanning forest: roots first (no feed), then anything left (cycles).
  const parent = new Int32Array(count).fill(-1);
  const layer = new Int32Array(count).fill(-1);
  const order: number[] = [];
  const visit = (root: number) => {
    layer[root] = 0;
    order.push(root);
    for (let q = order.length - 1; q < order.length; q++) {
      const u = order[q]!;
      for (let k = start[u]!; k < start[u + 1]!; k++) {
        const v = adj[k]!;
        if (layer[v] !== -1) continue;
        layer[v] = layer[u]! + 1;
        parent[v] = u;
        order.push(v);
      }
    }
  };
  for (let i = 0; i < count; i++) if (indeg[i] === 0 && layer[i] === -1) visit(i);
  for (let i = 0; i < count; i++) if (layer[i] === -1) visit(i);

  // Children lists in visit order, then x by a post-order pass (reverse BFS order visits children first).
  const childStart = new Int32Array(count + 1);
  for (let i = 0; i < count; i++) if (parent[i]! >= 0) childStart[parent[i]! + 1]!++;
  for (let i = 0; i < count; i++) childStart[i + 1]! += childStart[i]!;
  const children = new Int32Array(count);
  const cfill = childStart.slice(0, count);
  for (const v of order) if (parent[v]! >= 0) children[cfill[parent[v]!]!++] = v;

  // Leaves are numbered left to right in depth-first order so each subtree occupies a contiguous run of columns.
  const col = new Float64Array(count);
  let nextColumn = 0;
  const roots = order.filter((v) => parent[v] === -1);
  const stack: [number, boolean][] = [];
  for (let r = roots.length - 1; r >= 0; r--) stack.push([roots[r]!, false]);
  while (stack.length > 0) {
    const [u, done] = stack.pop()!;
    const a = childStart[u]!;
    const b = childStart[u + 1]!;
    if (a === b) {
      col[u] = nextColumn++;
      continue;
    }
    if (done) {
      col[u] = (col[children[a]!]! + col[children[b - 1]!]!) / 2;
      continue;
    }
    stack.push([u, true]);
    for (let k = b - 1; k >= a; k--) stack.push([children[k]!, false]);
  }

  // Place the computed block to the right of whatever the user already positioned.
  let offsetX = 0;
  let offsetY = 0;
  if (out.size > 0) {
    let maxX = -Infinity;
    let minY = Infinity;
    for (const p of out.values()) {
      maxX = Math.max(maxX, p.x);
      minY = Math.min(minY, p.y);
    }
    offsetX = maxX + colGap;
    offsetY = minY;
  }
  for (let i = 0; i < count; i++) out.set(ids[i]!, { x: offsetX + col[i]! * colGap, y: offsetY + layer[i]! * layerGap });
  return out;
}
