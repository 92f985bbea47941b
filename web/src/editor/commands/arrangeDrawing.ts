import { layoutTopToBottom } from '../../canvas/layout';
import { defineCommand } from './types';

/** Automatic top-to-bottom layout of the whole drawing, one undoable step. */
export const arrangeDrawing = defineCommand({
  id: 'arrange-drawing',
  label: 'Arrange top to bottom',
  canRun: ({ store }) => store.getState().doc.nodes.length > 0,
  run: async (ctx) => {
    const version = ctx.store.getState().docVersion;
    const pos = await layoutTopToBottom(ctx.store.getState().doc);
    if (ctx.store.getState().docVersion !== version) {
      ctx.store.notify('The drawing changed while it was being arranged; arrange again.', 'error');
      return;
    }
    ctx.store.edit('Arrange top to bottom', (d) => {
      for (const n of d.nodes) {
        const p = pos.get(n.id);
        if (p) n.position = p;
      }
    });
    ctx.canvas?.fitAll();
  },
});
