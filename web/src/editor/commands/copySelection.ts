import { isEmptySelection } from '../store';
import { defineCommand } from './types';

/** Copies the selected equipment and the conductors and bus links that run between them. */
export const copySelection = defineCommand({
  id: 'copy',
  label: 'Copy',
  shortcut: 'Ctrl+C',
  canRun: ({ store }) => store.getState().view.selection.nodes.length > 0,
  run: (ctx) => {
    const { doc, view } = ctx.store.getState();
    if (isEmptySelection(view.selection)) return;
    const ids = new Set(view.selection.nodes);
    ctx.clipboard.fragment = {
      nodes: doc.nodes.filter((n) => ids.has(n.id)),
      conductors: doc.conductors.filter((c) => ids.has(c.from) && ids.has(c.to)),
      busLinks: doc.busLinks.filter((b) => ids.has(b.from) && ids.has(b.to)),
    };
    ctx.clipboard.pasteCount = 0;
    const n = ctx.clipboard.fragment.nodes.length;
    ctx.store.notify(`Copied ${n} ${n === 1 ? 'element' : 'elements'}.`);
  },
});
