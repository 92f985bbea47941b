import type { Fix, Project } from '@linewright/core';
import { coreApplyFix } from '../../analysis/coreApi';
import { defineCommand } from './types';

/** Applies one of the analyzer's fixes as a single undoable edit; the verdict follows from re-analysis. */
export const applyFix = defineCommand<Fix>({
  id: 'apply-fix',
  label: 'Apply fix',
  canRun: () => true,
  run: ({ store }, fix) => {
    const changed = store.edit(fix.label, (d) => coreApplyFix(d as Project, fix));
    if (!changed) store.notify(`“${fix.label}” changed nothing on the drawing.`);
  },
});
