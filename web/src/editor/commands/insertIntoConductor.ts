import { equipmentNode, type ConductorId, type EquipmentKind, type NodeId } from '@linewright/core';
import { formatNum, freshId, freshLabel, kindSpec } from '../equipment';
import { placeAhead } from '../placement';
import { defineCommand } from './types';

export interface InsertArg {
  conductorId: string;
  kind: EquipmentKind;
  /** Length of the supply-side part, ft; the rest goes to the load side. Defaults to half. */
  supplySideFt?: number;
}

/** Kinds that can sit in a run: they have a supply side and a load side. */
export const INSERTABLE_KINDS: readonly EquipmentKind[] = ['breaker', 'fuse', 'disconnect', 'splice', 'transformer'];

/** Why the insertion cannot be done, or null. */
export function insertProblem(doc: { conductors: readonly { id: string; lengthFt?: number | undefined; label?: string | undefined }[] }, a: InsertArg): string | null {
  const c = doc.conductors.find((x) => x.id === a.conductorId);
  if (!c) return `There is no conductor ${a.conductorId} on the drawing.`;
  if (!INSERTABLE_KINDS.includes(a.kind)) return `A ${kindSpec(a.kind).title.toLowerCase()} cannot sit in a conductor: it needs a supply side and a load side.`;
  if (a.supplySideFt !== undefined) {
    const name = c.label ? `${c.id} (${c.label})` : c.id;
    if (!Number.isFinite(a.supplySideFt) || a.supplySideFt < 0) return `Length from the supply end of ${name}: enter a number of feet, 0 or more.`;
    if (c.lengthFt !== undefined && a.supplySideFt > c.lengthFt) return `Length from the supply end of ${name}: at most its whole length, ${formatNum(c.lengthFt)} ft.`;
  }
  return null;
}

/**
 * Splits a conductor with a device or splice: the supply-side part keeps the conductor's id and all
 * its facts, the load-side part is a copy with the rest of the length, and the new piece takes the
 * place of the load, which moves down (with what it feeds) to make room. One undoable step.
 */
export const insertIntoConductor = defineCommand<InsertArg>({
  id: 'insert-into-conductor',
  label: 'Insert into the conductor',
  canRun: (ctx, a) => insertProblem(ctx.store.getState().doc, a) === null,
  run: (ctx, a) => {
    const problem = insertProblem(ctx.store.getState().doc, a);
    if (problem) {
      ctx.store.notify(problem, 'error');
      return;
    }
    const spec = kindSpec(a.kind);
    let newId = '';
    ctx.store.edit(`Insert ${spec.title.toLowerCase()} into ${a.conductorId}`, (d) => {
      const c = d.conductors.find((x) => x.id === a.conductorId)!;
      const total = c.lengthFt;
      const before = a.supplySideFt ?? (total === undefined ? undefined : Math.round((total / 2) * 10) / 10);
      newId = freshId(d, `${a.kind}-`);
      const node = equipmentNode.parse({ ...spec.defaults(), id: newId, label: freshLabel(d, a.kind) });
      d.nodes.push(node);
      const rest = total === undefined || before === undefined ? undefined : Math.round((total - before) * 10) / 10;
      const second = { ...c, id: freshId(d, `${c.id}-`) as ConductorId, from: newId as NodeId };
      if (rest === undefined) delete second.lengthFt;
      else second.lengthFt = rest;
      if (c.label) second.label = `${c.label}, load side`;
      d.conductors.push(second);
      c.to = newId as NodeId;
      if (before === undefined) delete c.lengthFt;
      else c.lengthFt = before;
      placeAhead(d, d.nodes[d.nodes.length - 1]!, second.to);
    });
    ctx.store.setSelection({ nodes: [newId], conductors: [], busLinks: [] });
  },
});
