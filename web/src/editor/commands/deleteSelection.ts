import { isEmptySelection } from '../store';
import { defineCommand } from './types';

/** Deletes the selected elements; conductors and bus links of a deleted node go with it. */
export const deleteSelection = defineCommand({
  id: 'delete-selection',
  label: 'Delete',
  shortcut: 'Delete',
  canRun: ({ store }) => !isEmptySelection(store.getState().view.selection),
  run: ({ store }) => {
    const sel = store.getState().view.selection;
    const nodes = new Set(sel.nodes);
    const conductors = new Set(sel.conductors);
    const links = new Set(sel.busLinks);
    const count = nodes.size + conductors.size + links.size;
    store.edit(count === 1 ? 'Delete element' : `Delete ${count} elements`, (d) => {
      d.nodes = d.nodes.filter((n) => !nodes.has(n.id));
      d.conductors = d.conductors.filter((c) => !conductors.has(c.id) && !nodes.has(c.from) && !nodes.has(c.to));
      d.busLinks = d.busLinks.filter((b) => !links.has(b.id) && !nodes.has(b.from) && !nodes.has(b.to));
    });
  },
});
