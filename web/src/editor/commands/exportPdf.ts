import { loadPermitPdf } from '../../analysis/coreApi';
import { fileBaseName } from './saveJson';
import { defineCommand } from './types';

/** Downloads the core's annotated permit-set PDF for the drawing and its current report. */
export const exportPdf = defineCommand({
  id: 'export-pdf',
  label: 'Export PDF',
  canRun: ({ store }) => store.getState().report !== null,
  run: async (ctx) => {
    // The drawing and its report as they are now; the PDF code loads on first use (see loadPermitPdf).
    const { doc, report, reportVersion, docVersion } = ctx.store.getState();
    if (!report || reportVersion !== docVersion) {
      ctx.store.notify('The check is still running; export again in a moment.', 'error');
      return;
    }
    let renderPermitPdf: Awaited<ReturnType<typeof loadPermitPdf>>['renderPermitPdf'];
    try {
      ({ renderPermitPdf } = await loadPermitPdf());
    } catch (e) {
      ctx.store.notify(`The PDF code could not be loaded (${e instanceof Error ? e.message : String(e)}); reload the page and export again.`, 'error');
      return;
    }
    const bytes = renderPermitPdf(doc, report, { generatedAt: new Date().toISOString(), sheet: ctx.store.getState().view.pdfSheet });
    ctx.download(`${fileBaseName(doc)}.pdf`, 'application/pdf', bytes);
  },
});
