/**
 * The one place the web reaches into the core analyzer. Everything else in
 * web/ imports core functions from here, so a renamed core export changes one
 * file.
 */
import type * as PermitPdf from '@linewright/core/pdf';

export {
  analyze as coreAnalyze,
  createAnalysis as coreCreateAnalysis,
  applyFix as coreApplyFix,
  sizeConductor as coreSizeConductor,
  loadProject as coreLoadProject,
  CAUTION,
  CAUTION_SHORT,
  SEVERITY_WORDS,
  VERDICT_LABELS,
  VERDICT_COLOURS,
  verdictClass,
  displayClass,
  type VerdictClass,
  type LoadResult,
} from '@linewright/core';

type PermitPdfModule = typeof PermitPdf;

/**
 * The permit-set PDF code (jspdf and the sheet parts, most of the PDF's weight) loads on the first
 * export, in a chunk of its own, so the editor's first paint does not wait for it.
 */
export function loadPermitPdf(): Promise<PermitPdfModule> {
  return import('@linewright/core/pdf');
}
