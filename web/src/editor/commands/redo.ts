import { defineCommand } from './types';

export const redo = defineCommand({
  id: 'redo',
  label: 'Redo',
  shortcut: 'Ctrl+Shift+Z',
  canRun: ({ store }) => store.getState().history.redoDepth > 0,
  run: ({ store }) => {
    store.redo();
  },
});
