import type { Point } from '../layout';
import { reviewOf } from '../../review/comments';
import { acceptedFindingIds, dispositionStates, DISPOSITION_WORDS, STANDING_WORDS } from '../../review/dispositions';
import { letterRows, type LetterRow } from '../../review/letter';
import type { PdfContext } from './context';
import type { View } from './drawing';
import { BLACK, GREY, LIGHT, M, MIN_TEXT_PT, type DrawBox, type Rgb, type Sheet } from './sheet';
import { table } from './table';

/** Our own comment-pin look on paper: a numbered tag, blue (distinct from the circles and triangles of findings). */
const PIN: Rgb = [0, 90, 160];

/**
 * Numbered comment pins beside the elements they are on (open and answered comments only; closed ones are
 * in the table). With `clip` (a detail sheet's region) only the pins of elements inside it are drawn.
 */
export function drawCommentPins(sh: Sheet, ctx: PdfContext, positions: Map<string, Point>, view: View, clip?: DrawBox): void {
  const r = reviewOf(ctx.project);
  if (r.comments.length === 0) return;
  const edges = new Map<string, { from: string; to: string }>([...ctx.project.conductors, ...ctx.project.busLinks].map((e) => [e.id as string, e]));
  const findings = new Map(ctx.report.findings.map((f) => [f.id, f]));
  // The pin's number prints at 0.8 of its size: never under the 6 pt floor of the drawing sheets.
  const size = Math.max(MIN_TEXT_PT / 0.8, Math.min(10, view.scale * 20));
  const inside = (p: Point) => !clip || (p.x >= clip.x && p.x <= clip.x + clip.w && p.y >= clip.y && p.y <= clip.y + clip.h);
  const stacked = new Map<string, number>();
  for (const c of r.comments) {
    if (c.state !== 'open' && c.state !== 'answered') continue;
    let id: string | null = null;
    if (c.pin.on === 'finding') {
      const f = findings.get(c.pin.findingId);
      id = f && f.subject.kind !== 'project' ? f.subject.id : (c.pin.subjectId ?? null);
    } else if (c.pin.on !== 'area') id = c.pin.id;
    let at: Point | null = null;
    if (c.pin.on === 'area') at = null;
    else if (id !== null) {
      const e = edges.get(id);
      const a = e ? positions.get(e.from) : positions.get(id);
      const b = e ? positions.get(e.to) : undefined;
      if (a && b) {
        const pa = view.map(a);
        const pb = view.map(b);
        const mid = { x: (pa.x + pb.x) / 2, y: (pa.y + pb.y) / 2 };
        if (inside(mid)) at = { x: mid.x - size * 2.2, y: mid.y };
      } else if (a && !e) {
        const p = view.map(a);
        if (inside(p)) at = { x: p.x - size * 2.6, y: p.y - size };
      }
    }
    if (!at || id === null) continue;
    const k = stacked.get(id) ?? 0;
    stacked.set(id, k + 1);
    const x = at.x - k * (size * 1.9);
    sh.fill([255, 255, 255]);
    sh.stroke(PIN, 0.9);
    sh.doc.roundedRect(x - size * 0.85, at.y - size * 0.6, size * 1.7, size * 1.2, 1.2, 1.2, 'FD');
    sh.font(size * 0.8, 'bold', PIN);
    sh.text(`C${c.number}`, x, at.y + size * 0.28, { align: 'center' });
  }
}

/**
 * The revision block of the title column: one line per round, the latest that fit in `maxH` (at most six).
 * Returns the y below it; draws nothing without rounds.
 */
export function drawRevisionBlock(sh: Sheet, ctx: PdfContext, x: number, y: number, w: number, maxH = Infinity): number {
  const rounds = reviewOf(ctx.project).rounds;
  const accepted = acceptedFindingIds(ctx.project.review, ctx.report).size;
  if (rounds.length === 0 && accepted === 0) return y;
  const rowH = 11;
  const fits = Math.floor((maxH - 14 - rowH - (accepted > 0 ? rowH : 0) - 4) / rowH);
  if (fits < Math.min(1, rounds.length)) return y;
  const shown = rounds.slice(-Math.min(6, fits));
  const d = sh.doc;
  sh.stroke(BLACK, 1);
  const h = 14 + rowH * (shown.length + 1) + (accepted > 0 ? rowH : 0) + 4;
  d.rect(x, y, w, h, 'S');
  sh.fill(LIGHT);
  d.rect(x, y, w, 12, 'F');
  sh.font(7, 'bold');
  sh.text(shown.length < rounds.length ? `REVISIONS (LATEST ${shown.length} OF ${rounds.length} REVIEW ROUNDS)` : 'REVISIONS (REVIEW ROUNDS)', x + 6, y + 8.5);
  let yy = y + 14;
  sh.font(6.5, 'bold', GREY);
  sh.text('NO.', x + 6, yy + 7);
  sh.text('ROUND', x + 28, yy + 7);
  sh.text('DATE', x + w - 60, yy + 7);
  yy += rowH;
  sh.font(7.5, 'normal');
  for (const r of shown) {
    sh.text(String(r.number), x + 6, yy + 7);
    sh.text(sh.split(`${r.name}${r.by ? ` (${r.by.name})` : ''}`, w - 100)[0] ?? '', x + 28, yy + 7);
    sh.text(r.date, x + w - 60, yy + 7);
    yy += rowH;
  }
  if (accepted > 0) {
    sh.font(7, 'normal');
    sh.text(`${accepted} needs-AHJ finding(s) accepted by the AHJ: not counted as open.`, x + 6, yy + 7);
  }
  return y + h;
}

export const LETTER_TABLE = (sh: Sheet, rows: readonly LetterRow[]) =>
  table(
    sh,
    [
      { head: 'No.', width: 34, cell: (r) => `C${r.number}`, bold: () => true },
      { head: 'State', width: 62, cell: (r) => `${r.state}${r.carried ? '\n(carried)' : ''}`, bold: (r) => r.state === 'open' },
      { head: 'On', width: 120, cell: (r) => `${r.on}${r.orphaned ? '\n(element deleted)' : ''}` },
      { head: 'Finding', width: 230, cell: (r) => (r.findingId ? `${r.findingId}\n${r.finding}` : '-') },
      { head: 'Comment', width: 300, cell: (r) => `${r.comment}\n— ${r.commentBy}` },
      { head: 'Responses', width: sh.w - 2 * M - 746, cell: (r) => r.responses.join('\n') || '(no response yet)' },
    ],
    rows,
    7.5,
  );

/** Dispositions of findings, with how each stands against this analysis. */
export function dispositionTable(sh: Sheet, ctx: PdfContext): void {
  const states = dispositionStates(ctx.project.review, ctx.report);
  if (states.length === 0) return;
  sh.need(60);
  sh.font(11, 'bold');
  sh.text('Dispositions of findings', M, sh.y + 11);
  sh.y += 18;
  table(
    sh,
    [
      { head: 'Finding', width: 260, cell: (s) => s.disposition.findingId },
      { head: 'Disposition', width: 130, cell: (s) => DISPOSITION_WORDS[s.disposition.kind], bold: () => true },
      {
        head: 'Details',
        width: 420,
        cell: (s) => {
          const d = s.disposition;
          return d.kind === 'ahj-accepted' ? `by ${d.ahjName ?? '?'} on ${d.ahjDate ?? '?'}${d.reference ? `, reference ${d.reference}` : ''}` : (d.reason ?? '');
        },
      },
      { head: 'Now', width: sh.w - 2 * M - 810, cell: (s) => `${STANDING_WORDS[s.standing]}; recorded by ${s.disposition.by.name}` },
    ],
    states,
    7.5,
  );
}

/** Permit set: a page of the review's comments (this round and those carried into it) and dispositions, when the file has any. */
export function reviewPages(sh: Sheet, ctx: PdfContext): void {
  const r = reviewOf(ctx.project);
  if (r.comments.length === 0 && r.dispositions.length === 0) return;
  const { round, rows } = letterRows(ctx.project, ctx.report);
  sh.newPage();
  const name = r.rounds.find((x) => x.number === round)?.name;
  sh.heading(`Plan review comments${round > 0 ? `: round ${round}${name ? ` (${name})` : ''}` : ''}`);
  sh.font(8, 'normal', GREY);
  sh.text('C-numbers match the comment tags on the drawing. Comments from earlier rounds still open or answered are carried forward.', M, sh.y);
  sh.y += 8;
  if (rows.length > 0) LETTER_TABLE(sh, rows);
  dispositionTable(sh, ctx);
}
