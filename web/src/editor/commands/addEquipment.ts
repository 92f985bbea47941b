import { equipmentNode, type EquipmentKind } from '@linewright/core';
import { freshId, freshLabel, kindSpec } from '../equipment';
import { defineCommand } from './types';

export interface AddEquipmentArg {
  kind: EquipmentKind;
  /** Top-left corner in drawing coordinates; defaults to the middle of the view. */
  position?: { x: number; y: number };
}

/** Places new equipment with the kind's defaults, parsed by the core schema, and selects it. */
export const addEquipment = defineCommand<AddEquipmentArg>({
  id: 'add-equipment',
  label: 'Add equipment',
  canRun: () => true,
  run: (ctx, { kind, position }) => {
    const spec = kindSpec(kind);
    let at = position;
    if (!at) {
      const c = ctx.canvas?.visibleCentre() ?? { x: 0, y: 0 };
      // Stagger repeated placements so new symbols do not stack exactly.
      const n = ctx.store.getState().doc.nodes.length % 6;
      at = { x: c.x - spec.width / 2 + n * 24, y: c.y - spec.height / 2 + n * 24 };
    }
    const snap = ctx.store.getState().view.snapToGrid;
    const pos = snap ? { x: Math.round(at.x / 20) * 20, y: Math.round(at.y / 20) * 20 } : at;
    let newId = '';
    ctx.store.edit(`Add ${spec.title.toLowerCase()}`, (d) => {
      newId = freshId(d, `${kind}-`);
      const node = equipmentNode.parse({ ...spec.defaults(), id: newId, label: freshLabel(d, kind), position: pos });
      d.nodes.push(node);
    });
    ctx.store.setSelection({ nodes: [newId], conductors: [], busLinks: [] });
  },
});
