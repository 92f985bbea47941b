import { defineCommand } from './types';

export const selectAll = defineCommand({
  id: 'select-all',
  label: 'Select all',
  shortcut: 'Ctrl+A',
  canRun: ({ store }) => store.getState().doc.nodes.length > 0,
  run: ({ store }) => {
    const d = store.getState().doc;
    store.setSelection({ nodes: d.nodes.map((n) => n.id), conductors: d.conductors.map((c) => c.id), busLinks: d.busLinks.map((b) => b.id) });
  },
});
