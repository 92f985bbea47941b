import { BODY_BOTTOM, GREY, M, PAGE_W, SIDE_W, type Sheet } from './sheet';
import { DETAIL_BELOW_SCALE, detailScale, detailSheets, drawOneLine, fit, viewAt } from './drawing';
import { drawLegend } from './legend';
import { drawSummary, drawTitleBlock } from './titleBlock';
import type { PdfContext } from './context';
import { printPositions } from './positions';
import { drawCommentPins, drawRevisionBlock } from './review';

/**
 * Page 1 (the one-line, legend, summary and title block) and, when the drawing is too big to read
 * on one sheet, detail sheets at a legible scale keyed on the overview.
 */
export function drawingSheets(sh: Sheet, ctx: PdfContext): void {
  const { project, report, numbers, generated } = ctx;
  // Page 1: the drawing on the left, legend, summary and title block in the right column.
  const sideX = PAGE_W - M - SIDE_W;
  sh.font(15, 'bold');
  sh.text(`One-line diagram: ${report.projectName}`, M, M + 12);
  sh.font(8, 'normal', GREY);
  sh.text(`Conductor overcurrent protection and tap review, NEC ${report.edition} 240.4 and 240.21. Verdict marks are explained in the legend.`, M, M + 24);
  const box = { x: M, y: M + 32, w: sideX - M - 14, h: BODY_BOTTOM - M - 32 };
  sh.stroke(GREY, 0.6);
  sh.doc.rect(box.x, box.y, box.w, box.h, 'S');
  const { positions, note } = printPositions(project);
  const overview = fit(positions, box);
  drawOneLine(sh, project, report, box, numbers, positions, overview);
  if (note) {
    sh.font(7, 'italic', GREY);
    sh.text(sh.split(note, box.w - 12), box.x + 6, box.y + 10);
  }
  drawCommentPins(sh, ctx, positions, overview);
  // A drawing too big to read on one sheet gets detail sheets at a legible scale, keyed on the overview.
  const detailBox = { x: M, y: M + 32, w: PAGE_W - 2 * M, h: BODY_BOTTOM - M - 32 };
  const details = overview.scale < DETAIL_BELOW_SCALE ? detailSheets(positions, detailBox) : [];
  if (details.length > 0) {
    for (const d of details) {
      const a = overview.map({ x: d.x0, y: d.y0 });
      const z = overview.map({ x: d.x0 + d.w, y: d.y0 + d.h });
      sh.stroke(GREY, 0.6, [3, 2]);
      sh.doc.rect(a.x, a.y, Math.min(z.x, box.x + box.w) - a.x, Math.min(z.y, box.y + box.h) - a.y, 'S');
      sh.font(7, 'bold', GREY);
      sh.text(d.name, a.x + 2, a.y + 8);
    }
    sh.font(8, 'bold');
    sh.text(`Overview at reduced scale: detail sheets ${details[0]!.name}-${details[details.length - 1]!.name} follow, each outlined here.`, box.x + 6, box.y + box.h - 6);
  }
  let y = drawLegend(sh, sideX, M, SIDE_W);
  y = drawSummary(sh, report, sideX, y + 6);
  y = drawRevisionBlock(sh, ctx, sideX, y + 6, SIDE_W);
  const tbH = 172;
  drawTitleBlock(sh, report, project, generated, { x: sideX, y: Math.max(y + 6, BODY_BOTTOM - tbH), w: SIDE_W, h: tbH });

  details.forEach((d, k) => {
    sh.newPage();
    sh.font(15, 'bold');
    sh.text(`One-line diagram, detail sheet ${d.name} (${k + 1} of ${details.length}): ${report.projectName}`, M, M + 12);
    sh.font(8, 'normal', GREY);
    sh.text('Same marks as the legend on page 1. Lines that leave the sheet continue on the neighbouring detail sheet.', M, M + 24);
    sh.stroke(GREY, 0.6);
    sh.doc.rect(detailBox.x, detailBox.y, detailBox.w, detailBox.h, 'S');
    drawOneLine(sh, project, report, detailBox, numbers, positions, viewAt(d.x0, d.y0, detailScale(d, detailBox), detailBox));
  });

}
