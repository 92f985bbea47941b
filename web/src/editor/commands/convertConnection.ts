import type { BusLinkId, ConductorId } from '@linewright/core';
import { freshId, newConductorFields } from '../equipment';
import { defineCommand } from './types';

export interface ConvertArg {
  kind: 'conductor' | 'busLink';
  id: string;
}

/**
 * Turns a conductor into a bus link or back, keeping its ends (and its name); a conductor made from
 * a bus link starts with the trade defaults and no length, so the check asks for one. One undo step.
 */
export const convertConnection = defineCommand<ConvertArg>({
  id: 'convert-connection',
  label: 'Change the connection kind',
  canRun: (ctx, a) => {
    const d = ctx.store.getState().doc;
    return a.kind === 'conductor' ? d.conductors.some((c) => c.id === a.id) : d.busLinks.some((b) => b.id === a.id);
  },
  run: (ctx, a) => {
    let id = '';
    ctx.store.edit(a.kind === 'conductor' ? `Make ${a.id} a bus link` : `Make ${a.id} a conductor`, (d) => {
      if (a.kind === 'conductor') {
        const i = d.conductors.findIndex((c) => c.id === a.id);
        if (i < 0) return;
        const c = d.conductors[i]!;
        d.conductors.splice(i, 1);
        id = freshId(d, 'bl-');
        d.busLinks.push({ id: id as BusLinkId, from: c.from, to: c.to, ...(c.label ? { label: c.label } : {}) });
      } else {
        const i = d.busLinks.findIndex((b) => b.id === a.id);
        if (i < 0) return;
        const b = d.busLinks[i]!;
        d.busLinks.splice(i, 1);
        id = freshId(d, 'c-');
        d.conductors.push({ id: id as ConductorId, from: b.from, to: b.to, ...newConductorFields(), ...(b.label ? { label: b.label } : {}) });
      }
    });
    if (id) ctx.store.setSelection(a.kind === 'conductor' ? { nodes: [], conductors: [], busLinks: [id] } : { nodes: [], conductors: [id], busLinks: [] });
  },
});
