import { coreLoadProject } from '../../analysis/coreApi';
import { layoutTopToBottom } from '../../canvas/layout';
import { defineCommand } from './types';

export interface OpenArg {
  fileName: string;
  text: string;
}

/**
 * Opens a project file. A file that fails to load shows the core's errors and
 * leaves the current drawing untouched; a good one replaces it as one undoable
 * step. Equipment without positions is arranged first.
 */
export const openProject = defineCommand<OpenArg>({
  id: 'open-project',
  label: 'Open project file',
  shortcut: 'Ctrl+O',
  canRun: () => true,
  run: async (ctx, { fileName, text }) => {
    let r: ReturnType<typeof coreLoadProject>;
    try {
      r = coreLoadProject(text);
    } catch (e) {
      // A bug of ours must still say so and keep the drawing, never fail silently.
      const why = e instanceof Error ? e.message : String(e);
      r = { ok: false, errors: [{ path: '', message: `Linewright could not read this file (internal error: ${why}). Your drawing is unchanged; please report this with the file.` }] };
    }
    if (!r.ok) {
      ctx.store.setView({ loadErrors: { fileName, errors: r.errors } });
      return;
    }
    let doc = r.project;
    if (doc.nodes.some((n) => !n.position)) {
      const pos = await layoutTopToBottom(doc);
      doc = { ...doc, nodes: doc.nodes.map((n) => (n.position ? n : { ...n, position: pos.get(n.id) ?? { x: 0, y: 0 } })) };
    }
    ctx.store.setView({ loadErrors: null });
    ctx.store.replaceDocument(`Open ${fileName}`, doc);
    ctx.store.notify(`Opened ${fileName}: ${doc.nodes.length} equipment, ${doc.conductors.length} conductors.${r.notices.length ? ' ' + r.notices.join(' ') : ''}`);
    ctx.canvas?.fitAll();
  },
});
