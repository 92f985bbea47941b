/**
 * The one place the web reaches into the core analyzer. Everything else in
 * web/ imports core functions from here, so a renamed core export changes one
 * file. The permit PDF writer is looked up by name so a core build without it
 * still runs (the export button then says so).
 */
import * as core from '@linewright/core';
import type { AnalysisReport, Project } from '@linewright/core';

export { analyze as coreAnalyze, applyFix as coreApplyFix, loadProject as coreLoadProject, CAUTION, CAUTION_SHORT } from '@linewright/core';
export type { LoadResult } from '@linewright/core';

type RenderPermitPdf = (project: Project, report: AnalysisReport, options?: { generatedAt?: string }) => Uint8Array;
export const coreRenderPermitPdf: RenderPermitPdf | undefined = (core as unknown as { renderPermitPdf?: RenderPermitPdf }).renderPermitPdf;
