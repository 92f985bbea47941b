import { coreRenderPermitPdf } from '../../analysis/coreApi';
import { fileBaseName } from './saveJson';
import { defineCommand } from './types';

/** Downloads the core's annotated permit-set PDF for the drawing and its current report. */
export const exportPdf = defineCommand({
  id: 'export-pdf',
  label: 'Export PDF',
  canRun: ({ store }) => store.getState().report !== null,
  run: (ctx) => {
    const { doc, report, reportVersion, docVersion } = ctx.store.getState();
    if (!report || reportVersion !== docVersion) {
      ctx.store.notify('The check is still running; export again in a moment.', 'error');
      return;
    }
    const bytes = coreRenderPermitPdf(doc, report, { generatedAt: new Date().toISOString() });
    ctx.download(`${fileBaseName(doc)}.pdf`, 'application/pdf', bytes);
  },
});
