import { BLACK, GREY, M, SIDE_W, type DrawBox, type Sheet } from './sheet';
import { DETAIL_BELOW_SCALE, detailScale, detailSheets, drawOneLine, fit, viewAt, type DetailSheet } from './drawing';
import { drawLegend } from './legend';
import { drawSummary, drawTitleBlock, titleBlockHeights } from './titleBlock';
import type { PdfContext } from './context';
import { printPositions } from './positions';
import { unprintableNote } from './unprintable';
import { drawCommentPins, drawRevisionBlock } from './review';

/**
 * Page 1 (the one-line, legend, summary, revisions and title block) and, when the drawing is too big to
 * print its text at the legible floor on one sheet, detail sheets at a legible scale keyed on the overview,
 * each with match lines naming the sheet that continues it and a title block of its own.
 */
export function drawingSheets(sh: Sheet, ctx: PdfContext): void {
  const { project, report, numbers, generated } = ctx;
  // Page 1: the drawing on the left, legend, summary, revisions and title block in the right column.
  const sideX = sh.w - M - SIDE_W;
  const box = { x: M, y: M + 32, w: sideX - M - 14, h: sh.bodyBottom - M - 32 };
  const { positions, note } = printPositions(project);
  const overview = fit(positions, box);
  const details = overview.scale < DETAIL_BELOW_SCALE ? detailSheets(positions, box) : [];
  const sheets = 1 + details.length;

  sh.font(15, 'bold');
  sh.text(`One-line diagram: ${report.projectName}`, M, M + 12);
  sh.font(8, 'normal', GREY);
  sh.text(`Conductor overcurrent protection and tap review, NEC ${report.edition} 240.4 and 240.21. Verdict marks are explained in the legend.`, M, M + 24);
  sh.stroke(GREY, 0.6);
  sh.doc.rect(box.x, box.y, box.w, box.h, 'S');
  drawOneLine(sh, project, report, box, numbers, positions, overview);
  const notes = [note, unprintableNote(project)].filter((n) => n !== null);
  if (notes.length > 0) {
    sh.font(7, 'italic', GREY);
    sh.text(sh.split(notes.join(' '), box.w - 12), box.x + 6, box.y + 10);
  }
  // On a key plan the pins go on the detail sheets, where they print beside legible text.
  if (details.length === 0) drawCommentPins(sh, ctx, positions, overview);
  if (details.length > 0) {
    for (const d of details) {
      const a = overview.map({ x: d.x0, y: d.y0 });
      const z = overview.map({ x: d.x0 + d.w, y: d.y0 + d.h });
      sh.stroke(GREY, 0.6, [3, 2]);
      sh.doc.rect(a.x, a.y, Math.min(z.x, box.x + box.w) - a.x, Math.min(z.y, box.y + box.h) - a.y, 'S');
      sh.font(7, 'bold', GREY);
      sh.text(d.name, a.x + 2, a.y + 8);
    }
    // Above the frame, right-aligned on the subtitle's line: inside it the note would print over the drawing.
    sh.font(8, 'bold');
    sh.text(`Key plan at reduced scale, text left out: detail sheets ${details[0]!.name}-${details[details.length - 1]!.name} follow at a legible scale, each outlined here.`, box.x + box.w, M + 24, { align: 'right' });
  }
  let y = drawLegend(sh, sideX, M, SIDE_W);
  y = drawSummary(sh, report, sideX, y + 6);
  // The revisions take what the title block (at its most compact) leaves; the title block the rest, up to its full height.
  const tb = titleBlockHeights(sh, report, project, generated, SIDE_W);
  y = drawRevisionBlock(sh, ctx, sideX, y + 6, SIDE_W, sh.bodyBottom - tb.least - y - 12);
  const tbH = Math.max(tb.least, Math.min(tb.full, sh.bodyBottom - y - 6));
  drawTitleBlock(sh, report, project, generated, { x: sideX, y: sh.bodyBottom - tbH, w: SIDE_W, h: tbH }, { n: 1, of: sheets });

  details.forEach((d, k) => {
    sh.newPage();
    sh.font(15, 'bold');
    sh.text(`One-line diagram, detail sheet ${d.name} (${k + 1} of ${details.length}): ${report.projectName}`, M, M + 12);
    sh.font(8, 'normal', GREY);
    sh.text('Same marks as the legend on sheet 1. Lines that cross a match line continue on the sheet it names.', M, M + 24);
    sh.stroke(GREY, 0.6);
    sh.doc.rect(box.x, box.y, box.w, box.h, 'S');
    const view = viewAt(d.x0, d.y0, detailScale(d, box), box);
    // Only the region is drawn, clipped at its edges: what lies beyond a match line is on the sheet it names.
    const a = view.map({ x: d.x0, y: d.y0 });
    const z = view.map({ x: d.x0 + d.w, y: d.y0 + d.h });
    const region = { x: a.x, y: a.y, w: Math.min(z.x, box.x + box.w - 14) - a.x, h: Math.min(z.y, box.y + box.h - 14) - a.y };
    // An edge with no sheet beyond it is the drawing's own edge: there the clip opens to the frame, so a
    // symbol or label on that edge prints whole.
    const n = neighbours(d, details);
    const x1 = n.left ? region.x : box.x + 1;
    const y1 = n.above ? region.y : box.y + 1;
    const x2 = n.right ? region.x + region.w : box.x + box.w - 1;
    const y2 = n.below ? region.y + region.h : box.y + box.h - 1;
    const clip = { x: x1, y: y1, w: x2 - x1, h: y2 - y1 };
    drawOneLine(sh, project, report, clip, numbers, positions, view);
    drawCommentPins(sh, ctx, positions, view, region);
    matchLines(sh, n, region);
    drawTitleBlock(sh, report, project, generated, { x: sideX, y: sh.bodyBottom - tb.full, w: SIDE_W, h: tb.full }, { n: k + 2, of: sheets });
  });
}

interface Neighbours {
  right?: DetailSheet;
  left?: DetailSheet;
  below?: DetailSheet;
  above?: DetailSheet;
}

/** The detail sheets that continue `d` on each side (regions of the same grid sharing an edge). */
function neighbours(d: DetailSheet, all: readonly DetailSheet[]): Neighbours {
  const near = (a: number, b: number) => Math.abs(a - b) < 1e-6 * Math.max(1, Math.abs(a));
  return {
    right: all.find((o) => near(o.x0, d.x0 + d.w) && near(o.y0, d.y0)),
    left: all.find((o) => near(o.x0 + o.w, d.x0) && near(o.y0, d.y0)),
    below: all.find((o) => near(o.y0, d.y0 + d.h) && near(o.x0, d.x0)),
    above: all.find((o) => near(o.y0 + o.h, d.y0) && near(o.x0, d.x0)),
  };
}

/**
 * Heavy dash-dot lines on the edges a detail region shares with another, each naming the sheet that
 * continues the drawing there (the drafting convention for a drawing split across sheets).
 */
function matchLines(sh: Sheet, n: Neighbours, r: DrawBox): void {
  const x1 = r.x;
  const x2 = r.x + r.w;
  const y1 = r.y;
  const y2 = r.y + r.h;
  // Each note sits outside the region, in the margin beside its line, so it covers nothing drawn.
  const sides: { other: DetailSheet | undefined; line: [number, number, number, number]; at: { x: number; y: number }; vertical: boolean }[] = [
    { other: n.right, line: [x2, y1, x2, y2], at: { x: x2 + 11, y: (y1 + y2) / 2 }, vertical: true },
    { other: n.left, line: [x1, y1, x1, y2], at: { x: x1 - 5, y: (y1 + y2) / 2 }, vertical: true },
    { other: n.below, line: [x1, y2, x2, y2], at: { x: (x1 + x2) / 2, y: y2 + 10 }, vertical: false },
    { other: n.above, line: [x1, y1, x2, y1], at: { x: (x1 + x2) / 2, y: y1 - 4 }, vertical: false },
  ];
  for (const s of sides) {
    if (!s.other) continue;
    sh.stroke(BLACK, 1.6, [14, 3, 3, 3]);
    sh.doc.line(...s.line);
    sh.font(8, 'bold');
    const text = `MATCH LINE - SEE SHEET ${s.other.name}`;
    if (s.vertical) sh.doc.text(text, s.at.x, s.at.y + sh.doc.getTextWidth(text) / 2, { angle: 90 });
    else sh.text(text, s.at.x, s.at.y, { align: 'center' });
  }
}
