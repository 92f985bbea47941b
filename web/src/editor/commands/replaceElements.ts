import type { BusLink, Conductor, EquipmentNode } from '@linewright/core';
import { LIST_OF } from '../store';
import { parseElement, type ElementTarget } from './replaceElement';
import { defineCommand } from './types';

export interface ReplaceManyArg {
  /** Each element as it should become (same id), parsed by the core schema before any lands. */
  items: { target: Exclude<ElementTarget, { kind: 'project' }>; value: unknown }[];
  label: string;
}

/** Why the change cannot be made (the first element it would make invalid, named), or null. */
export function replaceManyProblem(a: ReplaceManyArg): string | null {
  for (const it of a.items) {
    const r = parseElement(it.target, it.value);
    if (!r.ok) return `${it.target.id}: ${r.issues.map((i) => i.message).join(' ')}`;
  }
  return null;
}

/**
 * Changes several elements in one undoable step (a field shared by a multiple selection). Either every
 * element takes the change or none does: one invalid element stops the whole step.
 */
export const replaceElements = defineCommand<ReplaceManyArg>({
  id: 'replace-elements',
  label: 'Change selected',
  canRun: (_ctx, a) => a.items.length > 0 && replaceManyProblem(a) === null,
  run: ({ store }, a) => {
    if (a.items.length === 0 || replaceManyProblem(a) !== null) return;
    const parsed = a.items.map((it) => ({ t: it.target, v: (parseElement(it.target, it.value) as { ok: true; value: EquipmentNode | Conductor | BusLink }).value }));
    store.replaceElements(a.label, parsed.flatMap(({ t, v }) => (v.id === t.id ? [{ list: LIST_OF[t.kind], value: v }] : [])));
  },
});
