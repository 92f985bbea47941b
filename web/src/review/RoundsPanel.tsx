import { useMemo, useRef, useState } from 'react';
import {
  EMPTY_REVIEW, compareSides, freezeRound, roundDrawing, snapshotOf, suggestRoundName, summarize,
  type ComparisonSide, type Project,
} from '@linewright/core';
import { coreAnalyze, coreLoadProject } from '../analysis/coreApi';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { frameIds } from './CommentsPanel';
import { editReview, setReviewView, useReviewView } from './reviewState';

/** Elements of a comparison that can be shown on the drawing, in list order. */
export function markedElements(c: { elements: readonly { id: string; change: string; list: string; layoutOnly: boolean }[] } | null): { id: string; change: string }[] {
  return (c?.elements ?? []).filter((e) => e.list !== 'project' && e.change !== 'removed' && !e.layoutOnly).map((e) => ({ id: e.id, change: e.change }));
}

const PRESENT = 'present';
const BESIDE = 'beside';

/** Rounds: freeze the drawing as a round, compare any two rounds (or a round, the present drawing, a file opened beside it), step through the changes. */
export function RoundsPanel() {
  const ctx = useCommandContext();
  const { store } = ctx;
  const doc = useEditorState((s) => s.doc);
  const report = useEditorState((s) => s.report);
  const author = useReviewView((v) => v.author);
  const comparison = useReviewView((v) => v.comparison);
  const step = useReviewView((v) => v.step);
  const rounds = (doc.review ?? EMPTY_REVIEW).rounds;
  const next = rounds.reduce((m, r) => Math.max(m, r.number), 0) + 1;
  const [name, setName] = useState('');
  const [date, setDate] = useState(new Date().toISOString().slice(0, 10));
  const [beside, setBeside] = useState<{ name: string; project: Project } | null>(null);
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const fileInput = useRef<HTMLInputElement>(null);

  const options = useMemo(() => {
    const o = rounds.map((r) => ({ key: String(r.number), label: `Round ${r.number}: ${r.name} (${r.date})` }));
    o.push({ key: PRESENT, label: 'The drawing as it is now' });
    if (beside) o.push({ key: BESIDE, label: `File beside: ${beside.name}` });
    return o;
  }, [rounds, beside]);
  const fromKey = from || (rounds.length >= 2 ? String(rounds[rounds.length - 2]!.number) : rounds.length === 1 ? String(rounds[0]!.number) : PRESENT);
  const toKey = to || (rounds.length >= 2 ? String(rounds[rounds.length - 1]!.number) : PRESENT);

  const side = (key: string): ComparisonSide | string => {
    const review = doc.review ?? EMPTY_REVIEW;
    if (key === PRESENT) {
      if (!report) return 'The check is still running; compare again in a moment.';
      return { label: 'the drawing as it is now', drawing: snapshotOf(doc), summary: summarize(report), comments: review.comments };
    }
    if (key === BESIDE) {
      if (!beside) return 'Open a file to compare with first.';
      return { label: beside.name, drawing: snapshotOf(beside.project), summary: summarize(coreAnalyze(beside.project)), comments: beside.project.review?.comments ?? [] };
    }
    const n = Number(key);
    const r = review.rounds.find((x) => x.number === n);
    if (!r) return `There is no round ${key}.`;
    try {
      return { label: `round ${r.number} (${r.name})`, drawing: roundDrawing(review.rounds, n), summary: r.summary, comments: review.comments.filter((c) => c.round <= n) };
    } catch (e) {
      return (e as Error).message;
    }
  };

  const runCompare = () => {
    const a = side(fromKey);
    const b = side(toKey);
    if (typeof a === 'string' || typeof b === 'string') {
      store.notify(typeof a === 'string' ? a : (b as string), 'error');
      return;
    }
    setReviewView({ comparison: compareSides(a, b), step: 0 });
  };

  const marks = markedElements(comparison);
  const goTo = (i: number) => {
    const m = marks[i];
    if (!m) return;
    setReviewView({ step: i });
    store.requestFrame(frameIds(doc, m.id));
  };

  return (
    <section className="lw-rv-section" data-testid="rounds">
      <h2>Rounds ({rounds.length})</h2>
      {rounds.length > 0 && (
        <ol className="lw-rv-rounds" data-testid="rounds-list">
          {rounds.map((r) => (
            <li key={r.number} data-testid="round">
              {r.number}. {r.name} · {r.date}{r.by ? ` · ${r.by.name}` : ''} · {r.summary.findings.filter((f) => f.severity === 'violation').length} violation(s)
            </li>
          ))}
        </ol>
      )}
      <form
        className="lw-rv-freeze"
        onSubmit={(e) => {
          e.preventDefault();
          if (!report) {
            store.notify('The check is still running; freeze the round in a moment.', 'error');
            return;
          }
          const roundName = name.trim() || suggestRoundName(next);
          if (editReview(store, `Freeze ${roundName}`, (r) => freezeRound(doc, report, r, roundName, date, author ?? undefined).review)) {
            setName('');
            store.notify(`Froze the drawing and its check as round ${next}, "${roundName}".`);
          }
        }}
      >
        <h3>Freeze the drawing as round {next}</h3>
        <label className="lw-field"><span>Name</span><input value={name} maxLength={120} placeholder={suggestRoundName(next)} onChange={(e) => setName(e.target.value)} data-testid="round-name" /></label>
        <label className="lw-field"><span>Date</span><input type="date" value={date} onChange={(e) => setDate(e.target.value)} data-testid="round-date" /></label>
        <button type="submit" data-testid="round-freeze">Freeze round</button>
      </form>
      <div className="lw-rv-compare">
        <h3>Compare</h3>
        <label className="lw-field">
          <span>From</span>
          <select value={fromKey} onChange={(e) => setFrom(e.target.value)} data-testid="compare-from">
            {options.map((o) => <option key={o.key} value={o.key}>{o.label}</option>)}
          </select>
        </label>
        <label className="lw-field">
          <span>To</span>
          <select value={toKey} onChange={(e) => setTo(e.target.value)} data-testid="compare-to">
            {options.map((o) => <option key={o.key} value={o.key}>{o.label}</option>)}
          </select>
        </label>
        <div className="lw-rv-moves">
          <button type="button" onClick={runCompare} data-testid="compare-run">Compare</button>
          <button type="button" onClick={() => fileInput.current?.click()} data-testid="compare-open-beside">Open a file beside…</button>
          {comparison && <button type="button" onClick={() => setReviewView({ comparison: null, step: 0 })} data-testid="compare-clear">Clear marks</button>}
        </div>
        <input
          ref={fileInput}
          type="file"
          accept=".json,application/json"
          hidden
          data-testid="compare-file-input"
          onChange={async (e) => {
            const f = e.target.files?.[0];
            e.target.value = '';
            if (!f) return;
            const r = coreLoadProject(await f.text());
            if (!r.ok) {
              store.notify(`${f.name} cannot be compared: ${r.errors[0]?.path ?? ''} ${r.errors[0]?.message ?? ''}`, 'error');
              return;
            }
            setBeside({ name: f.name, project: r.project });
            setFrom(BESIDE);
            setTo(PRESENT);
          }}
        />
      </div>
      {comparison && (
        <div className="lw-rv-result" data-testid="compare-result">
          <p className="lw-rv-meta">From {comparison.from} to {comparison.to}{comparison.matters ? '' : ': no verdict or finding changed'}</p>
          <h4>Drawing</h4>
          {comparison.elements.length === 0 ? <p className="lw-muted">No element changed.</p> : (
            <ul className="lw-rv-changes">
              {comparison.elements.map((e) => {
                const i = marks.findIndex((m) => m.id === e.id);
                return (
                  <li key={`${e.list}:${e.id}`} className={`is-${e.change}${i === step && i >= 0 ? ' is-active' : ''}`} data-testid="compare-change" data-id={e.id} data-change={e.change}>
                    {i >= 0 ? <button type="button" className="lw-link" onClick={() => goTo(i)}>{e.text}</button> : e.text}
                  </li>
                );
              })}
            </ul>
          )}
          {marks.length > 0 && (
            <div className="lw-rv-moves">
              <button type="button" onClick={() => goTo(Math.max(0, step - 1))} disabled={step <= 0} data-testid="compare-prev">Previous change</button>
              <span className="lw-rv-meta" data-testid="compare-step">{Math.min(step + 1, marks.length)} of {marks.length}</span>
              <button type="button" onClick={() => goTo(Math.min(marks.length - 1, step + 1))} disabled={step >= marks.length - 1} data-testid="compare-next">Next change</button>
            </div>
          )}
          <h4>Verdicts</h4>
          {comparison.verdicts.length === 0 ? <p className="lw-muted">None changed.</p> : (
            <ul className="lw-rv-changes">{comparison.verdicts.map((v) => <li key={v.id} data-testid="compare-verdict">{v.text}</li>)}</ul>
          )}
          <h4>Findings</h4>
          <ul className="lw-rv-changes" data-testid="compare-findings">
            {comparison.findings.added.map((f) => <li key={`n${f.id}`} className="is-added">new: {f.message}</li>)}
            {comparison.findings.resolved.map((f) => <li key={`r${f.id}`} className="is-removed" data-testid="compare-resolved">resolved: {f.message}</li>)}
            {comparison.findings.stillOpen.map((f) => <li key={`s${f.id}`}>{f.changed ? 'changed' : 'still open'}: {f.message}</li>)}
          </ul>
          {comparison.carriedForward.length > 0 && (
            <>
              <h4>Comments carried forward</h4>
              <ul className="lw-rv-changes">
                {comparison.carriedForward.map((c) => (
                  <li key={c.number}>
                    <button type="button" className="lw-link" onClick={() => setReviewView({ activeComment: c.number })}>#{c.number} ({c.state})</button> {c.text.slice(0, 100)}
                  </li>
                ))}
              </ul>
            </>
          )}
        </div>
      )}
    </section>
  );
}
