import type { BusLinkId, ConductorId, EquipmentKind, NodeId } from '@linewright/core';
import { kindSpec, newConductorFields, freshId } from '../equipment';
import type { ConnectAs } from '../store';
import { defineCommand } from './types';

export interface ConnectArg {
  /** Supply side: the node whose load (or secondary) port the connection leaves. */
  from: string;
  /** Load side: the node whose line (or primary) port it reaches. */
  to: string;
  as: ConnectAs;
}

/** Why two nodes cannot be connected this way, or null when they can. */
export function connectProblem(doc: { nodes: readonly { id: string; kind: EquipmentKind }[] }, a: ConnectArg): string | null {
  if (a.from === a.to) return 'A connection needs two different pieces of equipment.';
  const from = doc.nodes.find((n) => n.id === a.from);
  const to = doc.nodes.find((n) => n.id === a.to);
  if (!from || !to) return 'Both ends must be equipment on the drawing.';
  if (!kindSpec(from.kind).ports.out) return `${kindSpec(from.kind).title} has no load-side port.`;
  if (!kindSpec(to.kind).ports.in) return `${kindSpec(to.kind).title} has no supply-side port.`;
  return null;
}

/** Connects load port to line port with a new conductor (trade defaults) or a bus link. */
export const connect = defineCommand<ConnectArg>({
  id: 'connect',
  label: 'Connect',
  canRun: (ctx, a) => connectProblem(ctx.store.getState().doc, a) === null,
  run: (ctx, a) => {
    const problem = connectProblem(ctx.store.getState().doc, a);
    if (problem) {
      ctx.store.notify(problem, 'error');
      return;
    }
    let id = '';
    if (a.as === 'busLink') {
      ctx.store.edit('Add bus link', (d) => {
        id = freshId(d, 'bl-');
        d.busLinks.push({ id: id as BusLinkId, from: a.from as NodeId, to: a.to as NodeId });
      });
      ctx.store.setSelection({ nodes: [], conductors: [], busLinks: [id] });
    } else {
      ctx.store.edit('Add conductor', (d) => {
        id = freshId(d, 'c-');
        d.conductors.push({ id: id as ConductorId, from: a.from as NodeId, to: a.to as NodeId, ...newConductorFields() });
      });
      ctx.store.setSelection({ nodes: [], conductors: [id], busLinks: [] });
    }
  },
});
