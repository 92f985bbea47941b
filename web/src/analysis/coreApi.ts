/**
 * The one place the web reaches into the core analyzer. Everything else in
 * web/ imports core functions from here, so a renamed core export changes one
 * file.
 *
 * The report renderers (permit PDF, verdict classes) are not yet re-exported
 * by the core package root, so they come from the core's report index
 * directly; switch the second import to '@linewright/core' once it is.
 */
export { analyze as coreAnalyze, applyFix as coreApplyFix, loadProject as coreLoadProject, CAUTION, CAUTION_SHORT, VERDICT_LABELS } from '@linewright/core';
export type { LoadResult } from '@linewright/core';
export { renderPermitPdf as coreRenderPermitPdf, SEVERITY_WORDS, verdictClass, type VerdictClass } from '../../../core/src/report/index';
