import { useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { useReactFlow } from '@xyflow/react';
import {
  COMMENT_MAX_CHARS, COMMENT_STATES, COMMENT_STATE_WORDS, EMPTY_REVIEW, addComment, allowedStates, commentTextProblem, filterComments, isOrphaned,
  pinText, pinnedElementId, replyToComment, setCommentState,
  type CommentPin, type CommentState, type Project, type ReviewComment,
} from '@linewright/core';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { editReview, nowIso, setReviewView, shortTime, useReviewView } from './reviewState';

const MOVE_WORDS: Record<CommentState, string> = { open: 'Reopen', answered: 'Mark answered', closed: 'Close', withdrawn: 'Withdraw' };

/** Node ids to frame for an element id (a conductor is framed by its two ends). */
export function frameIds(doc: Pick<Project, 'conductors' | 'busLinks'>, id: string): string[] {
  const e = doc.conductors.find((c) => c.id === id) ?? doc.busLinks.find((b) => b.id === id);
  return e ? [e.from, e.to] : [id];
}

/** Comments: the list (filtered by state, author and round; arrow keys move, Enter frames), the thread in focus, and a new comment. */
export function CommentsPanel() {
  const ctx = useCommandContext();
  const doc = useEditorState((s) => s.doc);
  const report = useEditorState((s) => s.report);
  const active = useReviewView((v) => v.activeComment);
  const review = doc.review ?? EMPTY_REVIEW;
  const [states, setStates] = useState<ReadonlySet<CommentState>>(new Set(['open', 'answered']));
  const [author, setAuthor] = useState('');
  const [round, setRound] = useState('');
  const listRef = useRef<HTMLUListElement>(null);

  const authors = useMemo(() => [...new Set(review.comments.map((c) => c.author.name))].sort(), [review.comments]);
  const rounds = useMemo(() => [...new Set(review.comments.map((c) => c.round))].sort((a, b) => a - b), [review.comments]);
  const shown = useMemo(
    () => filterComments(review.comments, { states: [...states], author: author || undefined, round: round === '' ? undefined : Number(round) }),
    [review.comments, states, author, round],
  );

  const focus = (c: ReviewComment) => {
    setReviewView({ activeComment: c.number });
    const id = pinnedElementId(c.pin, report);
    if (id && !isOrphaned(c, doc)) ctx.store.requestFrame(frameIds(doc, id));
  };

  const onKey = (e: KeyboardEvent<HTMLUListElement>) => {
    const i = Math.max(0, shown.findIndex((c) => c.number === active));
    let next = i;
    if (e.key === 'ArrowDown') next = Math.min(shown.length - 1, i + 1);
    else if (e.key === 'ArrowUp') next = Math.max(0, i - 1);
    else if (e.key === 'Home') next = 0;
    else if (e.key === 'End') next = shown.length - 1;
    else if (e.key !== 'Enter' && e.key !== ' ') return;
    e.preventDefault();
    const c = shown[next];
    if (!c) return;
    if (e.key === 'Enter' || e.key === ' ') focus(c);
    else setReviewView({ activeComment: c.number });
    listRef.current?.querySelector<HTMLElement>(`[data-number="${c.number}"]`)?.scrollIntoView({ block: 'nearest' });
  };

  const toggle = (s: CommentState) => {
    const n = new Set(states);
    if (n.has(s)) n.delete(s);
    else n.add(s);
    setStates(n);
  };

  const activeComment = review.comments.find((c) => c.number === active) ?? null;
  return (
    <section className="lw-rv-section" data-testid="comments">
      <h2>Comments ({review.comments.length})</h2>
      <div className="lw-rv-filters" role="group" aria-label="Show comments">
        {COMMENT_STATES.map((s) => (
          <label key={s} className="lw-chip">
            <input type="checkbox" checked={states.has(s)} onChange={() => toggle(s)} data-testid={`comment-filter-${s}`} />
            {COMMENT_STATE_WORDS[s]} ({review.comments.filter((c) => c.state === s).length})
          </label>
        ))}
        <select value={author} onChange={(e) => setAuthor(e.target.value)} aria-label="Author" data-testid="comment-filter-author">
          <option value="">anyone</option>
          {authors.map((a) => <option key={a} value={a}>{a}</option>)}
        </select>
        <select value={round} onChange={(e) => setRound(e.target.value)} aria-label="Round" data-testid="comment-filter-round">
          <option value="">any round</option>
          {rounds.map((r) => <option key={r} value={r}>{r === 0 ? 'before round 1' : `round ${r}`}</option>)}
        </select>
      </div>
      {shown.length === 0 ? (
        <p className="lw-muted" data-testid="comments-empty">No comments with these filters.</p>
      ) : (
        <ul ref={listRef} className="lw-rv-list" role="listbox" tabIndex={0} aria-label="Comments" onKeyDown={onKey} data-testid="comments-list" aria-activedescendant={active ? `comment-${active}` : undefined}>
          {shown.map((c) => {
            const orphaned = isOrphaned(c, doc);
            return (
              <li
                key={c.number}
                id={`comment-${c.number}`}
                role="option"
                aria-selected={c.number === active}
                className={`lw-rv-item is-${c.state}${c.number === active ? ' is-active' : ''}`}
                data-testid="comment"
                data-number={c.number}
                data-state={c.state}
                onClick={() => focus(c)}
              >
                <span className="lw-rv-num" aria-hidden="true">{c.number}</span>
                <span className="lw-rv-text">
                  <span className="lw-rv-meta">
                    {COMMENT_STATE_WORDS[c.state]} · {pinText(c.pin)}{orphaned ? ' · element deleted' : ''} · {c.author.name}
                  </span>
                  {c.text.length > 140 ? `${c.text.slice(0, 140)}…` : c.text}
                </span>
              </li>
            );
          })}
        </ul>
      )}
      {activeComment && <CommentThread comment={activeComment} />}
      <NewComment />
    </section>
  );
}

function CommentThread({ comment }: { comment: ReviewComment }) {
  const { store } = useCommandContext();
  const doc = useEditorState((s) => s.doc);
  const author = useReviewView((v) => v.author);
  const [text, setText] = useState('');
  const problem = text === '' ? null : commentTextProblem(text);
  const moves = author ? allowedStates(comment, author.role) : [];
  const canReply = comment.state === 'open' || comment.state === 'answered';
  return (
    <div className="lw-rv-thread" data-testid="comment-thread" data-number={comment.number}>
      <h3>
        Comment {comment.number} · {COMMENT_STATE_WORDS[comment.state]}
      </h3>
      <p className="lw-rv-meta">
        on {pinText(comment.pin)}{isOrphaned(comment, doc) ? ' (element deleted; the comment is kept)' : ''} · round {comment.round}
      </p>
      <ol className="lw-rv-posts">
        <li>
          <span className="lw-rv-meta">{comment.author.name} ({comment.author.role}) · {shortTime(comment.at)}</span>
          <p className="lw-rv-body" data-testid="comment-body">{comment.text}</p>
        </li>
        {comment.replies.map((r, i) => (
          <li key={i} className={`is-${r.author.role}`}>
            <span className="lw-rv-meta">{r.author.name} ({r.author.role}) · {shortTime(r.at)}</span>
            <p className="lw-rv-body" data-testid="comment-reply-body">{r.text}</p>
          </li>
        ))}
      </ol>
      {author && canReply && (
        <form
          onSubmit={(e) => {
            e.preventDefault();
            if (editReview(store, `Reply to comment ${comment.number}`, (r) => replyToComment(r, comment.number, text, author, nowIso()))) setText('');
          }}
        >
          <textarea value={text} rows={3} maxLength={COMMENT_MAX_CHARS + 100} onChange={(e) => setText(e.target.value)} aria-label="Reply" placeholder={author.role === 'designer' ? 'Your response' : 'Reply'} data-testid="comment-reply-text" />
          {problem && <p className="lw-error">{problem}</p>}
          <button type="submit" disabled={text.trim() === '' || problem !== null} data-testid="comment-reply">{author.role === 'designer' ? 'Answer' : 'Reply'}</button>
        </form>
      )}
      <div className="lw-rv-moves">
        {author && moves.map((s) => (
          <button key={s} type="button" onClick={() => editReview(store, `${MOVE_WORDS[s]} comment ${comment.number}`, (r) => setCommentState(r, comment.number, s, author.role))} data-testid={`comment-move-${s}`}>
            {MOVE_WORDS[s]}
          </button>
        ))}
      </div>
    </div>
  );
}

/** What a new comment can be pinned to: the selected element, each of its findings, or the part of the drawing in view. */
function NewComment() {
  const { store } = useCommandContext();
  const rf = useReactFlow();
  const author = useReviewView((v) => v.author);
  const selection = useEditorState((s) => s.view.selection);
  const report = useEditorState((s) => s.report);
  const [target, setTarget] = useState('');
  const [text, setText] = useState('');
  const targets = useMemo(() => {
    const out: { key: string; label: string; pin: CommentPin | null }[] = [];
    for (const id of selection.conductors) out.push({ key: `c:${id}`, label: `conductor ${id}`, pin: { on: 'conductor', id: id as never } });
    for (const id of selection.nodes) out.push({ key: `n:${id}`, label: `equipment ${id}`, pin: { on: 'node', id: id as never } });
    for (const id of selection.busLinks) out.push({ key: `b:${id}`, label: `bus link ${id}`, pin: { on: 'busLink', id: id as never } });
    const ids = new Set([...selection.conductors, ...selection.nodes, ...selection.busLinks]);
    for (const f of report?.findings ?? []) {
      if (f.subject.kind !== 'project' && ids.has(f.subject.id)) out.push({ key: `f:${f.id}`, label: `finding: ${f.message.slice(0, 70)}…`, pin: { on: 'finding', findingId: f.id, subjectId: f.subject.id } });
    }
    out.push({ key: 'area', label: 'the part of the drawing in view', pin: null });
    return out;
  }, [selection, report]);
  const chosen = targets.find((t) => t.key === target) ?? targets[0]!;
  const problem = text === '' ? null : commentTextProblem(text);

  const areaInView = (): CommentPin => {
    const r = document.querySelector('[data-testid="canvas"]')?.getBoundingClientRect();
    if (!r) return { on: 'area', x: 0, y: 0, width: 0, height: 0 };
    const a = rf.screenToFlowPosition({ x: r.left, y: r.top });
    const b = rf.screenToFlowPosition({ x: r.right, y: r.bottom });
    return { on: 'area', x: a.x, y: a.y, width: Math.max(0, b.x - a.x), height: Math.max(0, b.y - a.y) };
  };

  if (!author) return null;
  return (
    <form
      className="lw-rv-new"
      onSubmit={(e) => {
        e.preventDefault();
        const pin = chosen.pin ?? areaInView();
        let number = 0;
        const ok = editReview(store, 'New comment', (r) => {
          const out = addComment(r, pin, text, author, nowIso());
          number = out.comment.number;
          return out.review;
        });
        if (ok) {
          setText('');
          setReviewView({ activeComment: number });
        }
      }}
    >
      <h3>New comment</h3>
      <label className="lw-field">
        <span>On</span>
        <select value={chosen.key} onChange={(e) => setTarget(e.target.value)} data-testid="comment-target">
          {targets.map((t) => <option key={t.key} value={t.key}>{t.label}</option>)}
        </select>
      </label>
      <textarea value={text} rows={3} maxLength={COMMENT_MAX_CHARS + 100} onChange={(e) => setText(e.target.value)} aria-label="Comment text" placeholder="Plain text; no markup" data-testid="comment-text" />
      {problem && <p className="lw-error">{problem}</p>}
      <button type="submit" disabled={text.trim() === '' || problem !== null} data-testid="comment-add">Add comment</button>
    </form>
  );
}
