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
    sh.text(sh.split(report.caution || CAUTION, sh.w - 2 * M), M, y + 9);
    sh.font(7, 'normal', GREY);
    sh.text(`${report.projectName} · NEC ${report.edition} · generated ${generated} · for review — not a verdict of acceptance`, M, y + 20);
    sh.font(8, 'bold');
    sh.text(`Page ${p} of ${total}`, sh.w - M, y + 20, { align: 'right' });
  }
}

