import type { Project } from '../../model/schema';
import type { AnalysisReport } from '../../analyze/types';
import { CAUTION } from '../../caution';
import { TOOL_NAME, TOOL_VERSION } from '../version';
import { BLACK, GREY, LIGHT, type DrawBox, type Sheet } from './sheet';

/** Height the title block needs: project, rows, seal area, the caution. */
export const TITLE_BLOCK_H = 300;

/**
 * The title block of a drawing sheet: project, sheet number, revision, date, preparer, a blank area
 * for a professional seal, and the caution.
 */
export function drawTitleBlock(sh: Sheet, report: AnalysisReport, project: Project, generated: string, box: DrawBox, sheet: { n: number; of: number }): void {
  const d = sh.doc;
  sh.stroke(BLACK, 1.2);
  d.rect(box.x, box.y, box.w, box.h, 'S');
  const x = box.x + 8;
  const w = box.w - 16;
  let y = box.y + 6;
  sh.font(6.5, 'normal', GREY);
  sh.text('PROJECT', x, y + 6);
  y += 9;
  sh.font(11, 'bold');
  // A long name (up to 200 characters) wraps to at most three lines and is cut with an ellipsis, so it stays inside the block.
  const name = fitLines(sh, report.projectName || project.project.name, w, 3);
  sh.text(name, x, y + 10);
  y += 13 * name.length + 2;
  const rows: [string, string][] = [
    ['SHEET', `${sheet.n} of ${sheet.of} (one-line diagram)`],
    ['REVISION', ''],
    ['DATE', generated.slice(0, 10)],
    ['CODE EDITION', `NFPA 70 (NEC) ${report.edition}`],
    ['PREPARED BY', project.project.preparedBy ?? 'not stated'],
    ['GENERATED', generated],
    ['SCALE', 'not to scale (one-line diagram)'],
    ['PRODUCED WITH', `${TOOL_NAME} ${TOOL_VERSION}`],
  ];
  for (const [k, v] of rows) {
    sh.stroke(GREY, 0.4);
    d.line(box.x, y, box.x + box.w, y);
    sh.font(6.5, 'normal', GREY);
    sh.text(k, x, y + 8);
    sh.font(8, 'normal');
    sh.text(fitLines(sh, v, w - 72, 1), x + 72, y + 8.5);
    y += 13;
  }
  d.line(box.x, y, box.x + box.w, y);
  // Left blank for the seal and signature of the professional who takes responsibility.
  const sealH = 96;
  sh.font(6.5, 'normal', GREY);
  sh.text('PROFESSIONAL SEAL AND SIGNATURE', x, y + 8);
  sh.stroke(GREY, 0.4, [2, 2]);
  d.rect(box.x + box.w / 2 - sealH / 2 + 10, y + 12, sealH - 20, sealH - 20, 'S');
  y += sealH;
  sh.stroke(GREY, 0.4);
  d.line(box.x, y, box.x + box.w, y);
  sh.fill(LIGHT);
  d.rect(box.x, y, box.w, 16, 'F');
  sh.font(8.5, 'bold');
  sh.text('FOR REVIEW — NOT A VERDICT OF ACCEPTANCE', box.x + box.w / 2, y + 11, { align: 'center' });
  y += 20;
  sh.font(6.5, 'normal');
  const caution = sh.split(report.caution || CAUTION, w);
  sh.text(caution, x, y + 6);
}

/** `text` wrapped to `width` in the current font, at most `max` lines, the last cut with an ellipsis when more would follow. */
function fitLines(sh: Sheet, text: string, width: number, max: number): string[] {
  const lines = sh.split(text, width);
  if (lines.length <= max) return lines;
  const kept = lines.slice(0, max);
  let last = kept[max - 1]!;
  while (last.length > 1 && sh.doc.getTextWidth(`${last}…`) > width) last = last.slice(0, -1);
  kept[max - 1] = `${last.trimEnd()}…`;
  return kept;
}

export function drawSummary(sh: Sheet, report: AnalysisReport, x: number, y: number): number {
  const sev = report.counts.bySeverity;
  sh.font(11, 'bold');
  sh.text('Summary', x, y + 11);
  y += 22;
  sh.font(8, 'normal');
  const lines = [
    `${report.conductors.length} conductors checked`,
    `violations: ${sev.violation ?? 0} (numbered circles)`,
    `needs AHJ review: ${sev['needs-ahj'] ?? 0} (numbered triangles)`,
    `warnings: ${sev.warning ?? 0}, info: ${sev.info ?? 0} (findings pages)`,
  ];
  for (const l of lines) {
    sh.text(l, x, y);
    y += 11;
  }
  return y;
}
