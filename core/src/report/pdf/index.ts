import type { Project } from '../../model/schema';
import type { AnalysisReport } from '../../analyze/types';
import { CAUTION } from '../../caution';
import { numberFindings } from '../format';
import { TOOL_NAME, TOOL_VERSION } from '../version';
import { Sheet, pdfSafe, type SheetSize } from './sheet';
import type { PdfContext, SheetPart } from './context';
import { drawingSheets } from './drawingSheets';
import { findingsPages } from './findingsPages';
import { schedulePages } from './schedulePages';
import { racewaySchedulePages } from './racewaySchedulePages';
import { studyPages } from './studyPages';
import { assumptionsPage, workingPages } from './workingPages';
import { footers } from './footers';
import { reviewPages } from './review';

export { pdfSafe, SHEET_SIZES, SHEET_SIZE_IDS, type SheetSize } from './sheet';
export { unprintableNote, unprintableTexts } from './unprintable';
export { renderResponseLetterPdf, type LetterOptions } from './letter';
export type { PdfContext, SheetPart } from './context';

/**
 * The permit-set PDF: page 1 the one-line drawing (vectors), its legend and title block; then the
 * findings with citations and fixes, the conductor schedule, the working for flagged conductors,
 * and the assumptions. Every page carries the caution and its page number in the footer.
 *
 * Sheet: ANSI B (11 × 17 in) landscape, the smallest common drawing sheet that keeps a riser of a
 * few hundred elements legible; it prints scaled on tabloid/ledger printers. Pure: no fs, no DOM,
 * so the CLI and the browser call the same function.
 *
 * Each part of the set is a `SheetPart` in a file of its own beside this one; `PARTS` lists them in
 * the order they print, and the footers (caution and page numbers) go on every page last.
 */
export interface PdfOptions {
  /** Shown in the title block and footers; ISO date-time. Defaults to now. */
  generatedAt?: string;
  /** Sheet size; ANSI B unless given. */
  sheet?: SheetSize;
}

/** The parts of the set in the order they print; a new part is one file and one line here. */
const PARTS: readonly SheetPart[] = [drawingSheets, findingsPages, reviewPages, schedulePages, racewaySchedulePages, studyPages, workingPages, assumptionsPage];

/** Renders the annotated permit-set PDF; returns the file's bytes. */
export function renderPermitPdf(project: Project, report: AnalysisReport, options: PdfOptions = {}): Uint8Array {
  const generated = (options.generatedAt ?? new Date().toISOString()).replace('T', ' ').replace(/\.\d+Z$/, 'Z');
  const sh = new Sheet(options.sheet);
  sh.doc.setProperties({
    title: pdfSafe(`${report.projectName}: conductor protection review`),
    subject: pdfSafe(`NEC ${report.edition} 240.4 and 240.21 review. ${report.caution || CAUTION}`),
    creator: `${TOOL_NAME} ${TOOL_VERSION}`,
  });
  if (options.generatedAt && !Number.isNaN(Date.parse(options.generatedAt))) sh.doc.setCreationDate(new Date(options.generatedAt));

  const numbers = new Map(numberFindings(report.findings).map((x) => [x.finding.id, x.n]));
  const ctx: PdfContext = { project, report, generated, numbers };
  for (const part of PARTS) part(sh, ctx);
  footers(sh, report, generated);
  return new Uint8Array(sh.doc.output('arraybuffer'));
}
