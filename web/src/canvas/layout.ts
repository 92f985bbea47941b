import type ELK from 'elkjs/lib/elk.bundled.js';
import type { Project } from '@linewright/core';
import { conductorLine, kindSpec } from '../editor/equipment';
import { LAYER_GAP, arrivalLeftReach, labelWidth } from './geometry';

let elk: Promise<InstanceType<typeof ELK>> | null = null;

/** elkjs (about 1.5 MB) loads on the first layout, in a chunk of its own, not with the editor. */
function layoutEngine(): Promise<InstanceType<typeof ELK>> {
  elk ??= import('elkjs/lib/elk.bundled.js').then((m) => new m.default());
  return elk;
}

/** Horizontal room between neighbouring pieces, labels included. */
const NODE_GAP = 24;

/**
 * Top-to-bottom layered layout of the whole drawing: supply at the top, loads at the bottom,
 * conductors and bus links as the layering edges. The layout knows the labels: each piece is laid
 * out with the room its arriving conductors' labels take on its left (canvas/geometry.ts places
 * them there), and layers are far enough apart for a label between them, so after arranging no
 * label lies over another label or a piece. Returns the new top-left corner of every node.
 */
export async function layoutTopToBottom(p: Project): Promise<Map<string, { x: number; y: number }>> {
  const widths = new Map<string, number[]>();
  for (const c of p.conductors) {
    const list = widths.get(c.to);
    const w = labelWidth(conductorLine(c));
    if (list) list.push(w);
    else widths.set(c.to, [w]);
  }
  const reach = new Map<string, number>();
  const graph = {
    id: 'root',
    layoutOptions: {
      'elk.algorithm': 'layered',
      'elk.direction': 'DOWN',
      'elk.layered.spacing.nodeNodeBetweenLayers': String(LAYER_GAP),
      'elk.spacing.nodeNode': String(NODE_GAP),
      'elk.spacing.edgeNode': '12',
      'elk.spacing.edgeEdge': '12',
      'elk.layered.nodePlacement.strategy': 'BRANDES_KOEPF',
      'elk.layered.considerModelOrder.strategy': 'NODES_AND_EDGES',
      'elk.separateConnectedComponents': 'true',
      'elk.spacing.componentComponent': '80',
    },
    children: p.nodes.map((n) => {
      const s = kindSpec(n.kind);
      const left = arrivalLeftReach(n.kind, widths.get(n.id) ?? []);
      reach.set(n.id, left);
      // Ports at the wire, fixed, so the layout lines wires up straight rather than box centres.
      return {
        id: n.id, width: left + s.width, height: s.height,
        layoutOptions: { 'elk.portConstraints': 'FIXED_POS' },
        ports: [
          { id: `${n.id}:in`, x: left + s.wireX, y: 0, width: 1, height: 1, layoutOptions: { 'elk.port.side': 'NORTH' } },
          { id: `${n.id}:out`, x: left + s.wireX, y: s.height - 1, width: 1, height: 1, layoutOptions: { 'elk.port.side': 'SOUTH' } },
        ],
      };
    }),
    edges: [
      ...p.conductors.map((c) => ({ id: `c:${c.id}`, from: c.from, to: c.to })),
      ...p.busLinks.map((b) => ({ id: `b:${b.id}`, from: b.from, to: b.to })),
    ]
      .filter((e) => e.from !== e.to && reach.has(e.from) && reach.has(e.to))
      .map((e) => ({ id: e.id, sources: [`${e.from}:out`], targets: [`${e.to}:in`] })),
  };
  const out = await (await layoutEngine()).layout(graph);
  const pos = new Map<string, { x: number; y: number }>();
  for (const c of out.children ?? []) pos.set(c.id, { x: Math.round((c.x ?? 0) + (reach.get(c.id) ?? 0)), y: Math.round(c.y ?? 0) });
  return pos;
}
