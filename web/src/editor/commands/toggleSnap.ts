import { defineCommand } from './types';

export const toggleSnap = defineCommand({
  id: 'toggle-snap',
  label: 'Snap to grid',
  canRun: () => true,
  run: ({ store }) => store.setView({ snapToGrid: !store.getState().view.snapToGrid }),
});
