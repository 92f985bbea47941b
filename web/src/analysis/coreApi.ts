/**
 * The one place the web reaches into the core analyzer. Everything else in
 * web/ imports core functions from here, so a renamed core export changes one
 * file.
 */
export {
  analyze as coreAnalyze,
  applyFix as coreApplyFix,
  loadProject as coreLoadProject,
  renderPermitPdf as coreRenderPermitPdf,
  CAUTION,
  CAUTION_SHORT,
  SEVERITY_WORDS,
  VERDICT_LABELS,
  VERDICT_COLOURS,
  verdictClass,
  type VerdictClass,
  type LoadResult,
} from '@linewright/core';
