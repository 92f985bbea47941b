import type { AnalysisReport, Severity } from '../analyze/types';
import type { CommentPin, CommentReply, CommentState, DispositionKind, Project, ReviewAuthor } from '../model/schema';
import { isOrphaned, reviewOf } from './comments';
import { acceptedFindingIds, dispositionStates, DISPOSITION_WORDS, openCounts, STANDING_WORDS, type DispositionStanding } from './dispositions';

/** The `review` object of the JSON report (docs/report-json.md, "Plan review"). */
export interface JsonReview {
  open: Record<Severity, number> & { accepted: number };
  comments: {
    number: number;
    state: CommentState;
    round: number;
    author: ReviewAuthor;
    at: string;
    pin: CommentPin;
    orphaned: boolean;
    text: string;
    replies: CommentReply[];
  }[];
  dispositions: {
    findingId: string;
    kind: DispositionKind;
    standing: DispositionStanding;
    by: ReviewAuthor;
    at: string;
    ahjName: string | null;
    ahjDate: string | null;
    reference: string | null;
    reason: string | null;
  }[];
  rounds: { number: number; name: string; date: string; by: ReviewAuthor | null; stored: 'drawing' | 'changes'; conductors: number; findings: number }[];
}

export function toJsonReview(p: Project, report: Pick<AnalysisReport, 'findings' | 'conductors'>): JsonReview {
  const r = reviewOf(p);
  const accepted = acceptedFindingIds(r, report);
  return {
    open: openCounts(report, accepted),
    comments: [...r.comments]
      .sort((a, b) => a.number - b.number)
      .map((c) => ({ number: c.number, state: c.state, round: c.round, author: c.author, at: c.at, pin: c.pin, orphaned: isOrphaned(c, p), text: c.text, replies: c.replies })),
    dispositions: dispositionStates(r, report).map(({ disposition: d, standing }) => ({
      findingId: d.findingId,
      kind: d.kind,
      standing,
      by: d.by,
      at: d.at,
      ahjName: d.ahjName ?? null,
      ahjDate: d.ahjDate ?? null,
      reference: d.reference ?? null,
      reason: d.reason ?? null,
    })),
    rounds: r.rounds.map((x) => ({
      number: x.number,
      name: x.name,
      date: x.date,
      by: x.by ?? null,
      stored: x.snapshot ? 'drawing' : 'changes',
      conductors: x.summary.verdicts.length,
      findings: x.summary.findings.length,
    })),
  };
}

/** Lines for the end of the text report: what is open once the review is counted. */
export function reviewSummaryLines(p: Project, report: Pick<AnalysisReport, 'findings' | 'conductors'>): string[] {
  const r = reviewOf(p);
  if (r.comments.length + r.dispositions.length + r.rounds.length === 0) return [];
  const j = toJsonReview(p, report);
  const byState = (s: CommentState) => j.comments.filter((c) => c.state === s).length;
  const lines = [
    'Plan review',
    `  Open findings: ${j.open.violation} violation(s), ${j.open['needs-ahj']} needing AHJ review, ${j.open.warning} warning(s); ${j.open.accepted} accepted by the AHJ (not counted as open).`,
    `  Comments: ${j.comments.length} (${byState('open')} open, ${byState('answered')} answered, ${byState('closed')} closed, ${byState('withdrawn')} withdrawn)${j.comments.some((c) => c.orphaned) ? `; ${j.comments.filter((c) => c.orphaned).length} on elements since deleted` : ''}.`,
  ];
  for (const d of j.dispositions) {
    const who = d.kind === 'ahj-accepted' ? ` by ${d.ahjName ?? '?'} on ${d.ahjDate ?? '?'}${d.reference ? `, ref. ${d.reference}` : ''}` : d.reason ? `: ${d.reason}` : '';
    lines.push(`  ${d.findingId}: ${DISPOSITION_WORDS[d.kind]}${who} (${STANDING_WORDS[d.standing]}).`);
  }
  if (j.rounds.length > 0) lines.push(`  Rounds: ${j.rounds.map((x) => `${x.number} ${x.name} (${x.date})`).join('; ')}.`);
  return lines;
}
