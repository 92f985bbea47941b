import type { Fix, Project } from '@linewright/core';
import { coreApplyFix } from '../../analysis/coreApi';
import { placeAhead } from '../placement';
import { defineCommand } from './types';

/** Applies one of the analyzer's fixes as a single undoable edit; the verdict follows from re-analysis. */
export const applyFix = defineCommand<Fix>({
  id: 'apply-fix',
  label: 'Apply fix',
  canRun: () => true,
  run: ({ store }, fix) => {
    const changed = store.edit(fix.label, (d) => {
      const before = new Set(d.nodes.map((n) => n.id));
      coreApplyFix(d as Project, fix);
      // A piece the fix adds takes the place of the one it now feeds, which moves down with what it
      // feeds: nothing lands on another symbol or label.
      for (const n of d.nodes) {
        if (before.has(n.id)) continue;
        const fed = [...d.conductors, ...d.busLinks].find((e) => e.from === n.id);
        if (fed) placeAhead(d, n, fed.to);
      }
    });
    if (!changed) store.notify(`“${fix.label}” changed nothing on the drawing.`);
  },
});
