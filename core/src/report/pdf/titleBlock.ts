import type { Project } from '../../model/schema';
import type { AnalysisReport } from '../../analyze/types';
import { CAUTION } from '../../caution';
import { currentRoundNumber, reviewOf } from '../../review/comments';
import { TOOL_NAME, TOOL_VERSION } from '../version';
import { BLACK, GREY, LIGHT, type DrawBox, type Sheet } from './sheet';

/** Height the title block takes when there is room: project, rows, seal area, the caution. */
export const TITLE_BLOCK_H = 300;

const ROW_H = 13;
const COMPACT_ROW_H = 11;
const SEAL_H = 96;
/** The smallest seal area left blank when a sheet's side column is crowded (about 1 in square inside it). */
const MIN_SEAL_H = 72;

interface TitleRows {
  name: string[];
  rows: [string, string][];
  caution: string[];
}

function titleRows(sh: Sheet, report: AnalysisReport, project: Project, generated: string, w: number, sheet: { n: number; of: number }, compact: boolean): TitleRows {
  sh.font(11, 'bold');
  // A long name (up to 200 characters) wraps to at most three lines and is cut with an ellipsis, so it stays inside the block.
  const name = fitLines(sh, report.projectName || project.project.name, w, 3);
  const rows: [string, string][] = [
    ['SHEET', `${sheet.n} of ${sheet.of} (one-line diagram)`],
    ['REVISION', revisionText(project)],
    ['DATE', generated.slice(0, 10)],
    ['CODE EDITION', `NFPA 70 (NEC) ${report.edition}`],
    ['PREPARED BY', project.project.preparedBy ?? 'not stated'],
    // When crowded, the time of generation is left to the footer, which prints it on every page.
    ...(compact ? [] : [['GENERATED', generated] as [string, string]]),
    ['SCALE', 'not to scale (one-line diagram)'],
    ['PRODUCED WITH', `${TOOL_NAME} ${TOOL_VERSION}`],
  ];
  sh.font(compact ? 6 : 6.5, 'normal');
  return { name, rows, caution: sh.split(report.caution || CAUTION, w) };
}

function heightOf(t: TitleRows, compact: boolean, sealH: number): number {
  const size = compact ? 6 : 6.5;
  return 9 + 13 * t.name.length + 2 + t.rows.length * (compact ? COMPACT_ROW_H : ROW_H) + sealH + 20 + 6 + t.caution.length * size * 1.15 + 4;
}

/**
 * The heights the title block can take at width `w`: `full` when there is room, `least` the most compact
 * (tighter rows, the generation time left to the footer, a smaller seal area). The caller gives a box at
 * least `least` tall so nothing in the block runs out of it.
 */
export function titleBlockHeights(sh: Sheet, report: AnalysisReport, project: Project, generated: string, w: number): { full: number; least: number } {
  const one = { n: 1, of: 1 };
  return {
    full: Math.max(TITLE_BLOCK_H, heightOf(titleRows(sh, report, project, generated, w - 16, one, false), false, SEAL_H)),
    least: heightOf(titleRows(sh, report, project, generated, w - 16, one, true), true, MIN_SEAL_H),
  };
}

/**
 * The title block of a drawing sheet: project, sheet number, revision, date, preparer, a blank area
 * for a professional seal, and the caution. In a box shorter than its full height it draws compact.
 */
export function drawTitleBlock(sh: Sheet, report: AnalysisReport, project: Project, generated: string, box: DrawBox, sheet: { n: number; of: number }): void {
  const d = sh.doc;
  const x = box.x + 8;
  const w = box.w - 16;
  const full = titleRows(sh, report, project, generated, w, sheet, false);
  const compact = box.h < heightOf(full, false, SEAL_H);
  const t = compact ? titleRows(sh, report, project, generated, w, sheet, true) : full;
  const sealH = compact ? Math.max(MIN_SEAL_H, Math.min(SEAL_H, box.h - heightOf(t, true, 0))) : SEAL_H;
  const rowH = compact ? COMPACT_ROW_H : ROW_H;
  sh.stroke(BLACK, 1.2);
  d.rect(box.x, box.y, box.w, box.h, 'S');
  let y = box.y + 6;
  sh.font(6.5, 'normal', GREY);
  sh.text('PROJECT', x, y + 6);
  y += 9;
  sh.font(11, 'bold');
  sh.text(t.name, x, y + 10);
  y += 13 * t.name.length + 2;
  for (const [k, v] of t.rows) {
    sh.stroke(GREY, 0.4);
    d.line(box.x, y, box.x + box.w, y);
    sh.font(6.5, 'normal', GREY);
    sh.text(k, x, y + rowH - 5);
    sh.font(8, 'normal');
    sh.text(fitLines(sh, v, w - 72, 1), x + 72, y + rowH - 4.5);
    y += rowH;
  }
  d.line(box.x, y, box.x + box.w, y);
  // Left blank for the seal and signature of the professional who takes responsibility.
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
  sh.font(compact ? 6 : 6.5, 'normal');
  sh.text(t.caution, x, y + 6);
}

/** The latest frozen review round, as the sheet's revision; blank (for the pen) before the first round. */
function revisionText(project: Project): string {
  const review = reviewOf(project);
  const n = currentRoundNumber(review);
  const round = review.rounds.find((r) => r.number === n);
  return round ? `${n} (${round.date})` : '';
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
