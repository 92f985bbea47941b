import type { AnalysisReport } from '../analyze/types';
import {
  COMMENT_MAX_CHARS,
  type CommentPin,
  type CommentState,
  type Project,
  type ReviewAuthor,
  type ReviewBlock,
  type ReviewComment,
} from '../model/schema';

export const EMPTY_REVIEW: ReviewBlock = Object.freeze({ comments: [], dispositions: [], rounds: [] }) as unknown as ReviewBlock;

/** The review block of a document; an empty one when the file has none yet. */
export function reviewOf(p: Pick<Project, 'review'>): ReviewBlock {
  return p.review ?? EMPTY_REVIEW;
}

export const COMMENT_STATE_WORDS: Readonly<Record<CommentState, string>> = {
  open: 'open',
  answered: 'answered',
  closed: 'closed',
  withdrawn: 'withdrawn',
};

/**
 * Who may move a comment where. The reviewer raises, closes or withdraws, and may reopen an
 * answered or closed comment; the designer answers an open one. Replies by the designer answer
 * it; a reply by the reviewer on an answered comment reopens it.
 */
const MOVES: Readonly<Record<ReviewAuthor['role'], Readonly<Partial<Record<CommentState, readonly CommentState[]>>>>> = {
  reviewer: { open: ['closed', 'withdrawn'], answered: ['closed', 'open', 'withdrawn'], closed: ['open'] },
  designer: { open: ['answered'] },
};

export function allowedStates(c: Pick<ReviewComment, 'state'>, role: ReviewAuthor['role']): readonly CommentState[] {
  return MOVES[role][c.state] ?? [];
}

/** Plain text only: the text is shown as text everywhere, control characters go, lines are kept. */
export function cleanCommentText(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/\r\n?/g, '\n').replace(/[\u0000-\u0008\u000b-\u001f\u007f]/g, '').trim();
}

/** Why a text cannot be a comment or reply, naming the fix; null when it can. */
export function commentTextProblem(text: string): string | null {
  const t = cleanCommentText(text);
  if (t === '') return 'Write some text first.';
  if (t.length > COMMENT_MAX_CHARS) return `Keep it to ${COMMENT_MAX_CHARS} characters (this is ${t.length}); split it into two comments.`;
  return null;
}

export function nextCommentNumber(review: ReviewBlock): number {
  let max = 0;
  for (const c of review.comments) if (c.number > max) max = c.number;
  return max + 1;
}

/** Number of the round under review: the latest frozen round, or 0 before the first. */
export function currentRoundNumber(review: ReviewBlock): number {
  return review.rounds.reduce((m, r) => Math.max(m, r.number), 0);
}

function checkedText(text: string): string {
  const problem = commentTextProblem(text);
  if (problem) throw new Error(problem);
  return cleanCommentText(text);
}

/** The review with a new open comment; its number is one past the highest ever given, so numbers never repeat. */
export function addComment(review: ReviewBlock, pin: CommentPin, text: string, author: ReviewAuthor, at: string): { review: ReviewBlock; comment: ReviewComment } {
  const comment: ReviewComment = {
    number: nextCommentNumber(review),
    pin,
    author,
    at,
    text: checkedText(text),
    state: 'open',
    round: currentRoundNumber(review),
    replies: [],
  };
  return { review: { ...review, comments: [...review.comments, comment] }, comment };
}

function update(review: ReviewBlock, number: number, change: (c: ReviewComment) => ReviewComment): ReviewBlock {
  let found = false;
  const comments = review.comments.map((c) => {
    if (c.number !== number) return c;
    found = true;
    return change(c);
  });
  if (!found) throw new Error(`There is no comment ${number}.`);
  return { ...review, comments };
}

/** A reply in the thread; a designer's reply answers an open comment, a reviewer's reply reopens an answered one. */
export function replyToComment(review: ReviewBlock, number: number, text: string, author: ReviewAuthor, at: string): ReviewBlock {
  const body = checkedText(text);
  return update(review, number, (c) => {
    if (c.state === 'closed' || c.state === 'withdrawn') throw new Error(`Comment ${number} is ${c.state}; reopen it before replying.`);
    let state = c.state;
    if (author.role === 'designer' && c.state === 'open') state = 'answered';
    else if (author.role === 'reviewer' && c.state === 'answered') state = 'open';
    return { ...c, state, replies: [...c.replies, { author, at, text: body }] };
  });
}

export function setCommentState(review: ReviewBlock, number: number, state: CommentState, role: ReviewAuthor['role']): ReviewBlock {
  return update(review, number, (c) => {
    if (c.state === state) return c;
    if (!allowedStates(c, role).includes(state)) throw new Error(`A ${role} cannot move comment ${number} from ${c.state} to ${state}.`);
    return { ...c, state };
  });
}

/** The element a pin points at, as an id on the drawing; for a finding, its subject when the report has it. */
export function pinnedElementId(pin: CommentPin, report: Pick<AnalysisReport, 'findings'> | null): string | null {
  switch (pin.on) {
    case 'node':
    case 'conductor':
    case 'busLink':
      return pin.id;
    case 'finding': {
      const f = report?.findings.find((x) => x.id === pin.findingId);
      if (f && f.subject.kind !== 'project') return f.subject.id;
      return pin.subjectId ?? null;
    }
    case 'area':
      return null;
  }
}

/**
 * A comment whose element was deleted is orphaned: it stays, marked, and is never dropped.
 * A comment on a finding that no longer arises is not orphaned (the finding was resolved) unless its element is gone too.
 */
export function isOrphaned(c: Pick<ReviewComment, 'pin'>, doc: Pick<Project, 'nodes' | 'conductors' | 'busLinks'>): boolean {
  const pin = c.pin;
  const has = (list: readonly { id: string }[], id: string) => list.some((x) => x.id === id);
  switch (pin.on) {
    case 'node':
      return !has(doc.nodes, pin.id);
    case 'conductor':
      return !has(doc.conductors, pin.id);
    case 'busLink':
      return !has(doc.busLinks, pin.id);
    case 'finding':
      return pin.subjectId !== undefined && !has(doc.nodes, pin.subjectId) && !has(doc.conductors, pin.subjectId) && !has(doc.busLinks, pin.subjectId);
    case 'area':
      return false;
  }
}

/** Where a comment sits, in words: "conductor TAP-L3", "finding tap-25ft:TAP-L3:no-rule-fits", "area at (120, 340)". */
export function pinText(pin: CommentPin): string {
  switch (pin.on) {
    case 'node':
      return `equipment ${pin.id}`;
    case 'conductor':
      return `conductor ${pin.id}`;
    case 'busLink':
      return `bus link ${pin.id}`;
    case 'finding':
      return `finding ${pin.findingId}`;
    case 'area':
      return `area at (${Math.round(pin.x)}, ${Math.round(pin.y)})`;
  }
}

export interface CommentFilter {
  states?: readonly CommentState[];
  author?: string;
  round?: number;
}

/** Comments that pass the filter, by number. */
export function filterComments(comments: readonly ReviewComment[], filter: CommentFilter): ReviewComment[] {
  return comments
    .filter((c) => (filter.states === undefined || filter.states.includes(c.state)) && (filter.author === undefined || c.author.name === filter.author) && (filter.round === undefined || c.round === filter.round))
    .sort((a, b) => a.number - b.number);
}

/** Comments a new round carries forward: written in an earlier round and still open or answered. */
export function carriedForward(comments: readonly ReviewComment[], round: number): ReviewComment[] {
  return comments.filter((c) => c.round < round && (c.state === 'open' || c.state === 'answered')).sort((a, b) => a.number - b.number);
}
