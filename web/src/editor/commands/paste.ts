import type { BusLinkId, ConductorId, NodeId } from '@linewright/core';
import { allIds, freshId, freshLabel } from '../equipment';
import { defineCommand } from './types';

const STEP = 40;

/** Pastes the copied elements with new ids and labels, offset so they do not hide the originals. */
export const paste = defineCommand({
  id: 'paste',
  label: 'Paste',
  shortcut: 'Ctrl+V',
  canRun: (ctx) => ctx.clipboard.fragment !== null && ctx.clipboard.fragment.nodes.length > 0,
  run: (ctx) => {
    const frag = ctx.clipboard.fragment;
    if (!frag) return;
    const k = ++ctx.clipboard.pasteCount;
    const newIds: string[] = [];
    ctx.store.edit(`Paste ${frag.nodes.length} elements`, (d) => {
      const taken = allIds(d);
      const labels = new Set(d.nodes.map((n) => n.label ?? ''));
      const map = new Map<string, NodeId>();
      for (const n of frag.nodes) {
        const id = freshId(d, `${n.kind}-`, taken) as NodeId;
        map.set(n.id, id);
        newIds.push(id);
        const pos = n.position ?? { x: 0, y: 0 };
        d.nodes.push({
          ...structuredClone(n),
          id,
          label: n.label ? freshLabel(d, n.kind, labels) : undefined,
          position: { x: pos.x + STEP * k, y: pos.y + STEP * k },
        });
      }
      for (const c of frag.conductors) {
        d.conductors.push({ ...structuredClone(c), id: freshId(d, 'c-', taken) as ConductorId, from: map.get(c.from)!, to: map.get(c.to)! });
      }
      for (const b of frag.busLinks) {
        d.busLinks.push({ ...structuredClone(b), id: freshId(d, 'bl-', taken) as BusLinkId, from: map.get(b.from)!, to: map.get(b.to)! });
      }
    });
    ctx.store.setSelection({ nodes: newIds, conductors: [], busLinks: [] });
  },
});
