import type { Project } from '../../model/schema';
import type { AnalysisReport } from '../../analyze/types';
import type { Sheet } from './sheet';

/** What every part of the permit set reads: the document, its analysis, and the finding numbers. */
export interface PdfContext {
  readonly project: Project;
  readonly report: AnalysisReport;
  /** Generation time as printed, "YYYY-MM-DD HH:MM:SSZ". */
  readonly generated: string;
  /** Callout number of each violation and needs-AHJ finding, by finding id. */
  readonly numbers: ReadonlyMap<string, number>;
}

/** One part of the set (drawing sheets, findings, schedule...): draws its pages onto the sheet. */
export type SheetPart = (sh: Sheet, ctx: PdfContext) => void;
