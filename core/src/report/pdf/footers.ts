import type { AnalysisReport } from '../../analyze/types';
import { CAUTION } from '../../caution';
import { FOOTER_H, GREY, M, MIN_TEXT_PT, pdfSafe, type Sheet } from './sheet';

export function footers(sh: Sheet, report: AnalysisReport, generated: string): void {
  const total = sh.doc.getNumberOfPages();
  for (let p = 1; p <= total; p++) {
    sh.doc.setPage(p);
    const y = sh.h - M - FOOTER_H + 8;
    sh.stroke(GREY, 0.5);
    sh.doc.line(M, y, sh.w - M, y);
    sh.font(6.5, 'normal');
    // One line at 6.5 pt fits the standard caution; a longer one shrinks, never below the 6 pt legible floor.
    let size = 6.5;
    while (size > MIN_TEXT_PT && sh.doc.getTextWidth(pdfSafe(report.caution || CAUTION)) > sh.w - 2 * M) sh.font((size -= 0.5), 'normal');
    const caution = sh.split(report.caution || CAUTION, sh.w - 2 * M);
    sh.text(caution, M, y + 9);
    // A caution that still wraps pushes the line below it down (into the margin), never over it.
    const below = y + 20 + (caution.length - 1) * size * 1.15;
    sh.font(8, 'bold');
    const page = `Page ${p} of ${total}`;
    const pageW = sh.doc.getTextWidth(page);
    sh.text(page, sh.w - M, below, { align: 'right' });
    sh.font(7, 'normal', GREY);
    const line = sh.split(`${report.projectName} · NEC ${report.edition} · generated ${generated} · for review — not a verdict of acceptance`, sh.w - 2 * M - pageW - 12)[0] ?? '';
    sh.text(line, M, below);
  }
}

