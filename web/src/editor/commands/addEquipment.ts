import { equipmentNode, type BusLinkId, type ConductorId, type EquipmentKind, type NodeId } from '@linewright/core';
import { freshId, freshLabel, kindSpec, newConductorFields } from '../equipment';
import { connectionKindFor, freeSpot, spotUnder, type ConnectionKind } from '../placement';
import { defineCommand } from './types';

export interface AddEquipmentArg {
  kind: EquipmentKind;
  /** Top-left corner in drawing coordinates; defaults to below the selected piece or the middle of the view. */
  position?: { x: number; y: number };
}

/**
 * Places new equipment with the kind's defaults, parsed by the core schema, and selects it. With one
 * piece selected that can feed it (and no position given), the new piece goes under it and is
 * connected the way the two kinds call for (placement.connectionKindFor), in the same undo step; so
 * a riser is built top-down from the keyboard. The view then follows the new piece.
 */
export const addEquipment = defineCommand<AddEquipmentArg>({
  id: 'add-equipment',
  label: 'Add equipment',
  canRun: () => true,
  run: (ctx, { kind, position }) => {
    const spec = kindSpec(kind);
    const { doc, view } = ctx.store.getState();
    const sel = !position && view.selection.nodes.length === 1 && view.selection.conductors.length + view.selection.busLinks.length === 0
      ? doc.nodes.find((n) => n.id === view.selection.nodes[0])
      : undefined;
    const feeder = sel && kindSpec(sel.kind).ports.out && spec.ports.in ? sel : undefined;
    const as: ConnectionKind | null = feeder ? connectionKindFor(doc, feeder.id, kind) : null;
    let at = position;
    if (!at) {
      if (feeder && as) at = spotUnder(doc, feeder, kind, as);
      else {
        const c = ctx.canvas?.visibleCentre() ?? { x: 0, y: 0 };
        at = freeSpot(doc, kind, { x: c.x - spec.wireX, y: c.y - spec.height / 2 }, false, 'down');
      }
    }
    const pos = view.snapToGrid ? { x: Math.round(at.x / 20) * 20, y: Math.round(at.y / 20) * 20 } : at;
    let newId = '';
    const what = feeder && as ? `Add ${spec.title.toLowerCase()} under ${feeder.label || feeder.id}` : `Add ${spec.title.toLowerCase()}`;
    ctx.store.edit(what, (d) => {
      newId = freshId(d, `${kind}-`);
      const node = equipmentNode.parse({ ...spec.defaults(), id: newId, label: freshLabel(d, kind), position: pos });
      d.nodes.push(node);
      if (!feeder || !as) return;
      if (as === 'busLink') d.busLinks.push({ id: freshId(d, 'bl-') as BusLinkId, from: feeder.id as NodeId, to: newId as NodeId });
      else d.conductors.push({ id: freshId(d, 'c-') as ConductorId, from: feeder.id as NodeId, to: newId as NodeId, ...newConductorFields() });
    });
    ctx.store.setSelection({ nodes: [newId], conductors: [], busLinks: [] });
    // A piece dropped at a spot is already where the user looks; one placed for them is brought into view.
    if (!position) ctx.canvas?.reveal({ x: pos.x, y: pos.y - 50, w: spec.width, h: spec.height + 50 });
  },
});
