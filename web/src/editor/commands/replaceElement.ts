import { busLink, conductor, equipmentNode, projectSettings } from '@linewright/core';
import type { BusLink, Conductor, EquipmentNode, ProjectSettings } from '@linewright/core';
import { LIST_OF } from '../store';
import { defineCommand } from './types';

export type ElementTarget =
  | { kind: 'node'; id: string }
  | { kind: 'conductor'; id: string }
  | { kind: 'busLink'; id: string }
  | { kind: 'project' };

export interface ReplaceArg {
  target: ElementTarget;
  /** The whole element as the details panel would have it; parsed by the core schema first. */
  value: unknown;
  label: string;
}

export type ParseOutcome = { ok: true; value: EquipmentNode | Conductor | BusLink | ProjectSettings } | { ok: false; issues: { path: string; message: string }[] };

/** Validates an edited element with the same zod schema the project file uses. */
export function parseElement(target: ElementTarget, value: unknown): ParseOutcome {
  const schema = target.kind === 'node' ? equipmentNode : target.kind === 'conductor' ? conductor : target.kind === 'busLink' ? busLink : projectSettings;
  const r = schema.safeParse(value);
  if (r.success) return { ok: true, value: r.data };
  return { ok: false, issues: r.error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: plainMessage(i) })) };
}

/** zod's default range and type messages in plain words; a schema's own message is kept. */
function plainMessage(i: { code: string; message: string; minimum?: unknown; maximum?: unknown; inclusive?: boolean; expected?: unknown }): string {
  const n = (x: unknown) => (typeof x === 'number' ? x.toLocaleString('en-US') : String(x));
  if (i.code === 'too_small' && i.message.startsWith('Too small')) return i.inclusive ? `Must be at least ${n(i.minimum)}.` : `Must be more than ${n(i.minimum)}.`;
  if (i.code === 'too_big' && i.message.startsWith('Too big')) return i.inclusive ? `Must be at most ${n(i.maximum)}.` : `Must be less than ${n(i.maximum)}.`;
  if (i.code === 'invalid_type' && i.message.startsWith('Invalid input')) return i.expected === 'int' ? 'Enter a whole number.' : `Enter a ${String(i.expected)}.`;
  return i.message;
}

/**
 * Replaces one element after validating it. Invalid values never reach the
 * document: the caller shows the issues and keeps its draft.
 */
export const replaceElement = defineCommand<ReplaceArg>({
  id: 'replace-element',
  label: 'Change',
  canRun: (_ctx, a) => parseElement(a.target, a.value).ok,
  run: ({ store }, a) => {
    const parsed = parseElement(a.target, a.value);
    if (!parsed.ok) return;
    const t = a.target;
    const doc = store.getState().doc;
    const current = t.kind === 'project' ? doc.project : (doc[LIST_OF[t.kind]] as readonly { id: string }[]).find((x) => x.id === t.id);
    if (current !== undefined && JSON.stringify(current) === JSON.stringify(parsed.value)) return;
    if (t.kind !== 'project' && (parsed.value as { id: string }).id === t.id) {
      store.replaceElements(a.label, [{ list: LIST_OF[t.kind], value: parsed.value as { id: string } }]);
      return;
    }
    store.edit(a.label, (d) => {
      if (t.kind === 'project') {
        d.project = parsed.value as ProjectSettings;
        return;
      }
      const list = d[LIST_OF[t.kind]] as { id: string }[];
      const i = list.findIndex((x) => x.id === t.id);
      if (i < 0) return;
      // An id change must follow every reference to the element.
      const newId = (parsed.value as { id: string }).id;
      if (newId !== t.id) {
        if (list.some((x) => x.id === newId)) return;
        if (t.kind === 'node') {
          for (const c of d.conductors) {
            if (c.from === t.id) c.from = newId as Conductor['from'];
            if (c.to === t.id) c.to = newId as Conductor['to'];
          }
          for (const b of d.busLinks) {
            if (b.from === t.id) b.from = newId as BusLink['from'];
            if (b.to === t.id) b.to = newId as BusLink['to'];
          }
        }
      }
      list[i] = parsed.value as { id: string };
    });
  },
});
