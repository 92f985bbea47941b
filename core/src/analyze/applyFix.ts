import type { BusLinkId, Conductor, EquipmentNode, NodeId, Project } from '../model/schema';
import type { Fix } from './types';

/**
 * Applies a suggested fix to a project in place. Call it inside immer's
 * `produce` (the editor does, so a fix is one undoable edit) or on a copy.
 * Throws only when the fix names elements the project does not have, which
 * means the fix belongs to another version of the drawing.
 */
export function applyFix(draft: Project, fix: Fix): void {
  switch (fix.kind) {
    case 'resize':
      for (const id of fix.conductorIds) {
        const c = conductorById(draft, id);
        c.size = fix.size;
        c.material = fix.material;
        c.parallelSets = fix.parallelSets;
      }
      return;
    case 'shorten': {
      const members = fix.conductorIds.map((id) => conductorById(draft, id));
      const total = members.reduce((sum, c) => sum + (c.lengthFt ?? 0), 0);
      if (total <= fix.maxLengthFt) return;
      // Scale each segment so the run's total is the allowed length, keeping their proportions.
      const k = fix.maxLengthFt / total;
      for (const c of members) if (c.lengthFt !== undefined) c.lengthFt = Math.floor(c.lengthFt * k * 10) / 10;
      return;
    }
    case 'add-ocpd': {
      const c = conductorById(draft, fix.conductorId);
      const from = draft.nodes.find((n) => n.id === c.from);
      const to = draft.nodes.find((n) => n.id === c.to);
      const id = freshId(draft, `${c.id}-ocpd`) as NodeId;
      const position =
        from?.position && to?.position
          ? { x: from.position.x + (to.position.x - from.position.x) / 3, y: from.position.y + (to.position.y - from.position.y) / 3 }
          : from?.position
            ? { x: from.position.x, y: from.position.y + 60 }
            : undefined;
      const breaker: EquipmentNode = {
        id,
        kind: 'breaker',
        label: `${fix.ratingA} A tap breaker`,
        ratingA: fix.ratingA,
        arrangement: 'single',
        atDisconnectingMeans: false,
        ...(position ? { position } : {}),
      };
      draft.nodes.push(breaker);
      draft.busLinks.push({ id: freshId(draft, `${c.id}-ocpd-link`) as BusLinkId, from: c.from, to: id });
      c.from = id;
      return;
    }
    case 'add-main': {
      const bus = draft.nodes.find((n) => n.id === fix.busId);
      if (!bus) throw new Error(`The fix refers to equipment "${fix.busId}", which is not in the drawing.`);
      const incoming = [...draft.conductors, ...draft.busLinks].filter((x) => x.to === bus.id);
      if (incoming.length !== 1) throw new Error(`"${fix.busId}" is fed from ${incoming.length} places; a main breaker needs exactly one.`);
      const id = freshId(draft, `${bus.id}-main`) as NodeId;
      const main: EquipmentNode = {
        id,
        kind: 'breaker',
        label: `${fix.ratingA} A main`,
        ratingA: fix.ratingA,
        arrangement: 'single',
        atDisconnectingMeans: false,
        ...(bus.position ? { position: { x: bus.position.x, y: bus.position.y - 50 } } : {}),
      };
      draft.nodes.push(main);
      incoming[0]!.to = id;
      draft.busLinks.push({ id: freshId(draft, `${id}-link`) as BusLinkId, from: id, to: bus.id });
      return;
    }
    case 'set-field': {
      const ref = fix.ref;
      const target: Record<string, unknown> | undefined =
        ref.kind === 'conductor'
          ? conductorById(draft, ref.id)
          : ref.kind === 'node'
            ? draft.nodes.find((n) => n.id === ref.id)
            : ref.kind === 'busLink'
              ? draft.busLinks.find((b) => b.id === ref.id)
              : draft.project;
      if (!target) throw new Error(`The fix refers to ${ref.kind} that is not in the drawing.`);
      target[fix.field] = fix.value;
      return;
    }
  }
}

function conductorById(p: Project, id: string): Conductor {
  const c = p.conductors.find((x) => x.id === id);
  if (!c) throw new Error(`The fix refers to conductor "${id}", which is not in the drawing.`);
  return c;
}

/** `base`, or `base-2`, `base-3`… whichever no element uses yet. */
export function freshId(p: Project, base: string): string {
  const used = new Set<string>([...p.nodes.map((n) => n.id), ...p.conductors.map((c) => c.id), ...p.busLinks.map((b) => b.id)]);
  if (!used.has(base)) return base;
  for (let i = 2; ; i++) if (!used.has(`${base}-${i}`)) return `${base}-${i}`;
}
