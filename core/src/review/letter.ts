import type { AnalysisReport } from '../analyze/types';
import type { Project, ReviewComment } from '../model/schema';
import { csvField } from '../report/csv';
import { carriedForward, COMMENT_STATE_WORDS, currentRoundNumber, isOrphaned, pinText, reviewOf } from './comments';

/** One row of the comment-response letter: a comment, what it is on, the finding it cites, the answers and its state. */
export interface LetterRow {
  number: number;
  /** The round it was written in; carried-forward comments come from earlier rounds. */
  round: number;
  carried: boolean;
  state: string;
  on: string;
  orphaned: boolean;
  findingId: string;
  finding: string;
  comment: string;
  commentBy: string;
  /** Every reply, oldest first, as "name (role): text". */
  responses: string[];
}

/**
 * The comments of a round and those carried into it (earlier and still open or answered), by
 * number. Without a round: the latest round any comment was written in (the round being
 * answered), or the latest frozen round. Round 0 (no round frozen yet) takes every comment.
 */
export function letterComments(p: Pick<Project, 'review'>, round?: number): { round: number; comments: ReviewComment[]; carried: Set<number> } {
  const r = reviewOf(p);
  const n = round ?? (r.comments.length > 0 ? Math.max(...r.comments.map((c) => c.round)) : currentRoundNumber(r));
  if (n === 0) return { round: 0, comments: [...r.comments].sort((a, b) => a.number - b.number), carried: new Set() };
  const own = r.comments.filter((c) => c.round === n);
  const carried = carriedForward(r.comments, n);
  const all = [...own, ...carried].sort((a, b) => a.number - b.number);
  return { round: n, comments: all, carried: new Set(carried.map((c) => c.number)) };
}

export function letterRows(p: Project, report: Pick<AnalysisReport, 'findings'>, round?: number): { round: number; rows: LetterRow[] } {
  const { round: n, comments, carried } = letterComments(p, round);
  const findings = new Map(report.findings.map((f) => [f.id, f]));
  const rows = comments.map((c): LetterRow => {
    const fid = c.pin.on === 'finding' ? c.pin.findingId : '';
    const f = fid ? findings.get(fid) : undefined;
    return {
      number: c.number,
      round: c.round,
      carried: carried.has(c.number),
      state: COMMENT_STATE_WORDS[c.state],
      on: c.pin.on === 'finding' ? (c.pin.subjectId ? `element ${c.pin.subjectId}` : 'the project') : pinText(c.pin),
      orphaned: isOrphaned(c, p),
      findingId: fid,
      finding: fid ? (f ? f.message : 'no longer raised (resolved by change)') : '',
      comment: c.text,
      commentBy: `${c.author.name} (${c.author.role})`,
      responses: c.replies.map((x) => `${x.author.name} (${x.author.role}): ${x.text}`),
    };
  });
  return { round: n, rows };
}

export const LETTER_COLUMNS = ['number', 'round', 'carried_forward', 'state', 'on', 'element_deleted', 'finding_id', 'finding', 'comment', 'comment_by', 'responses'] as const;

/** The comment-response letter as RFC 4180 CSV (CRLF), every cell through the shared spreadsheet guard. */
export function responseLetterCsv(p: Project, report: Pick<AnalysisReport, 'findings'>, round?: number): string {
  const { rows } = letterRows(p, report, round);
  const lines = [LETTER_COLUMNS.join(',')];
  for (const r of rows) {
    lines.push(
      [r.number, r.round, r.carried ? 'yes' : 'no', r.state, r.on, r.orphaned ? 'yes' : 'no', r.findingId, r.finding, r.comment, r.commentBy, r.responses.join('\n')].map(csvField).join(','),
    );
  }
  return `${lines.join('\r\n')}\r\n`;
}
