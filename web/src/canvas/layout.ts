import type ELK from 'elkjs/lib/elk.bundled.js';
import type { Project } from '@linewright/core';
import { kindSpec } from '../editor/equipment';

let elk: Promise<InstanceType<typeof ELK>> | null = null;

/** elkjs (about 1.5 MB) loads on the first layout, in a chunk of its own, not with the editor. */
function layoutEngine(): Promise<InstanceType<typeof ELK>> {
  elk ??= import('elkjs/lib/elk.bundled.js').then((m) => new m.default());
  return elk;
}

/**
 * Top-to-bottom layered layout of the whole drawing: supply at the top, loads
 * at the bottom, conductors and bus links as the layering edges. Returns the
 * new top-left corner of every node.
 */
export async function layoutTopToBottom(p: Project): Promise<Map<string, { x: number; y: number }>> {
  const graph = {
    id: 'root',
    layoutOptions: {
      'elk.algorithm': 'layered',
      'elk.direction': 'DOWN',
      'elk.layered.spacing.nodeNodeBetweenLayers': '56',
      'elk.spacing.nodeNode': '36',
      'elk.layered.nodePlacement.strategy': 'BRANDES_KOEPF',
      'elk.layered.considerModelOrder.strategy': 'NODES_AND_EDGES',
      'elk.separateConnectedComponents': 'true',
      'elk.spacing.componentComponent': '80',
    },
    children: p.nodes.map((n) => {
      const s = kindSpec(n.kind);
      return { id: n.id, width: s.width, height: s.height };
    }),
    edges: [
      ...p.conductors.map((c) => ({ id: `c:${c.id}`, sources: [c.from], targets: [c.to] })),
      ...p.busLinks.map((b) => ({ id: `b:${b.id}`, sources: [b.from], targets: [b.to] })),
    ].filter((e) => e.sources[0] !== e.targets[0]),
  };
  const out = await (await layoutEngine()).layout(graph);
  const pos = new Map<string, { x: number; y: number }>();
  for (const c of out.children ?? []) pos.set(c.id, { x: Math.round(c.x ?? 0), y: Math.round(c.y ?? 0) });
  return pos;
}
