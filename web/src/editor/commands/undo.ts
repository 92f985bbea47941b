import { defineCommand } from './types';

export const undo = defineCommand({
  id: 'undo',
  label: 'Undo',
  shortcut: 'Ctrl+Z',
  canRun: ({ store }) => store.getState().history.undoDepth > 0,
  run: ({ store }) => {
    store.undo();
  },
});
