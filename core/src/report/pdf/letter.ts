import type { AnalysisReport } from '../../analyze/types';
import type { Project } from '../../model/schema';
import { CAUTION } from '../../caution';
import { reviewOf } from '../../review/comments';
import { acceptedFindingIds, openCounts } from '../../review/dispositions';
import { letterRows } from '../../review/letter';
import { TOOL_NAME, TOOL_VERSION } from '../version';
import { footers } from './footers';
import { dispositionTable, LETTER_TABLE } from './review';
import { GREY, M, Sheet, pdfSafe } from './sheet';

export interface LetterOptions {
  /** ISO date-time printed on the letter; defaults to now. */
  generatedAt?: string;
  /** Round the letter answers; defaults to the latest frozen round. */
  round?: number;
}

/**
 * The comment-response letter: every comment of a round (and those carried into it) with its
 * element, the finding it cites, the responses and its state, then the dispositions. Same sheet
 * and footer (caution, page numbers) as the permit set. Pure: returns the file's bytes.
 */
export function renderResponseLetterPdf(project: Project, report: AnalysisReport, options: LetterOptions = {}): Uint8Array {
  const generated = (options.generatedAt ?? new Date().toISOString()).replace('T', ' ').replace(/\.\d+Z$/, 'Z');
  const sh = new Sheet();
  sh.doc.setProperties({
    title: pdfSafe(`${report.projectName}: comment-response letter`),
    subject: pdfSafe(`Plan review comments and responses. ${report.caution || CAUTION}`),
    creator: `${TOOL_NAME} ${TOOL_VERSION}`,
  });
  const r = reviewOf(project);
  const { round, rows } = letterRows(project, report, options.round);
  const roundInfo = r.rounds.find((x) => x.number === round);
  sh.heading(`Comment-response letter: ${report.projectName}`);
  sh.font(9, 'normal');
  const lines = [
    round > 0 ? `Round ${round}${roundInfo ? `: ${roundInfo.name}, frozen ${roundInfo.date}` : ''}.` : 'No round frozen yet: every comment so far.',
    `Rounds: ${r.rounds.map((x) => `${x.number} ${x.name} (${x.date})`).join('; ') || 'none'}.`,
  ];
  const open = openCounts(report, acceptedFindingIds(project.review, report));
  lines.push(`Open findings now (NEC ${report.edition}): ${open.violation} violation(s), ${open['needs-ahj']} needing AHJ review, ${open.warning} warning(s); ${open.accepted} accepted by the AHJ, not counted as open.`);
  lines.push(`Comments listed: ${rows.length} (${rows.filter((x) => x.state === 'open').length} open, ${rows.filter((x) => x.state === 'answered').length} answered, ${rows.filter((x) => x.state === 'closed').length} closed, ${rows.filter((x) => x.state === 'withdrawn').length} withdrawn).`);
  for (const l of lines) {
    sh.text(l, M, sh.y + 9);
    sh.y += 13;
  }
  sh.font(8, 'normal', GREY);
  sh.text('C-numbers are the comment numbers on the drawing; they never change between rounds.', M, sh.y + 8);
  sh.y += 16;
  if (rows.length === 0) {
    sh.font(9, 'normal');
    sh.text('No comments in this round.', M, sh.y + 9);
    sh.y += 20;
  } else LETTER_TABLE(sh, rows);
  dispositionTable(sh, { project, report, generated, numbers: new Map() });
  footers(sh, report, generated);
  return new Uint8Array(sh.doc.output('arraybuffer'));
}
