import { equipmentNode, type EquipmentKind, type EquipmentNode } from '@linewright/core';
import { freshId, freshLabel, kindSpec } from '../equipment';
import { defineCommand } from './types';

export interface AddEquipmentArg {
  kind: EquipmentKind;
  /** Top-left corner in drawing coordinates; defaults to the middle of the view. */
  position?: { x: number; y: number };
}

/** The first spot at or below `at` where a w × h box overlaps no equipment (with a small margin). */
function freeSpot(nodes: readonly EquipmentNode[], at: { x: number; y: number }, w: number, h: number): { x: number; y: number } {
  const m = 16;
  const p = { ...at };
  for (let i = 0; i < 200; i++) {
    const hit = nodes.find((n) => {
      if (!n.position) return false;
      const s = kindSpec(n.kind);
      return p.x < n.position.x + s.width + m && p.x + w + m > n.position.x && p.y < n.position.y + s.height + m && p.y + h + m > n.position.y;
    });
    if (!hit) return p;
    p.y = hit.position!.y + kindSpec(hit.kind).height + 40;
  }
  return p;
}

/** Places new equipment with the kind's defaults, parsed by the core schema, and selects it. */
export const addEquipment = defineCommand<AddEquipmentArg>({
  id: 'add-equipment',
  label: 'Add equipment',
  canRun: () => true,
  run: (ctx, { kind, position }) => {
    const spec = kindSpec(kind);
    const { doc, view } = ctx.store.getState();
    let at = position;
    if (!at) {
      // Below the one selected piece of equipment, on the same wire, so a riser builds top-down by clicks;
      // otherwise in the middle of the view. Then down the sheet until the spot is free.
      const sel = view.selection.nodes.length === 1 ? doc.nodes.find((n) => n.id === view.selection.nodes[0]) : undefined;
      if (sel?.position && spec.ports.in) {
        const s = kindSpec(sel.kind);
        at = { x: sel.position.x + s.wireX - spec.wireX, y: sel.position.y + s.height + 60 };
      } else {
        const c = ctx.canvas?.visibleCentre() ?? { x: 0, y: 0 };
        at = { x: c.x - spec.wireX, y: c.y - spec.height / 2 };
      }
      at = freeSpot(doc.nodes, at, spec.width, spec.height);
    }
    const pos = view.snapToGrid ? { x: Math.round(at.x / 20) * 20, y: Math.round(at.y / 20) * 20 } : at;
    let newId = '';
    ctx.store.edit(`Add ${spec.title.toLowerCase()}`, (d) => {
      newId = freshId(d, `${kind}-`);
      const node = equipmentNode.parse({ ...spec.defaults(), id: newId, label: freshLabel(d, kind), position: pos });
      d.nodes.push(node);
    });
    ctx.store.setSelection({ nodes: [newId], conductors: [], busLinks: [] });
  },
});
