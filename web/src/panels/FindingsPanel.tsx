import { memo, useCallback, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { SEVERITIES, type Finding, type Severity } from '@linewright/core';
import { SEVERITY_LOOK, SEVERITY_TEXT } from '../analysis/verdicts';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import type { Selection } from '../editor/store';
import { citeText } from './cite';
import { SeverityMark } from './FindingItem';
import { IsolatedText } from './IsolatedText';
import { Collapsible } from './Collapsible';
import { ruleName } from '../words';

/** Selection and frame for a finding: its subject and the elements it names. */
export function selectionForFinding(f: Finding, doc: { conductors: readonly { id: string; from: string; to: string }[] }): { selection: Selection; frame: string[] } {
  const nodes = new Set<string>();
  const conductors = new Set<string>();
  const busLinks = new Set<string>();
  const frame = new Set<string>();
  const byId = new Map(doc.conductors.map((c) => [c.id, c]));
  for (const ref of [f.subject, ...f.related]) {
    if (ref.kind === 'node') {
      nodes.add(ref.id);
      frame.add(ref.id);
    } else if (ref.kind === 'conductor') {
      conductors.add(ref.id);
      const c = byId.get(ref.id);
      if (c) {
        frame.add(c.from);
        frame.add(c.to);
      }
    } else if (ref.kind === 'busLink') busLinks.add(ref.id);
  }
  // The subject alone is selected so the details panel shows it; related elements are framed with it.
  const s = f.subject;
  const selection: Selection =
    s.kind === 'node' ? { nodes: [s.id], conductors: [], busLinks: [] }
      : s.kind === 'conductor' ? { nodes: [], conductors: [s.id], busLinks: [] }
        : s.kind === 'busLink' ? { nodes: [], conductors: [], busLinks: [s.id] }
          : { nodes: [...nodes], conductors: [...conductors], busLinks: [...busLinks] };
  return { selection, frame: [...frame] };
}

/** The review list: every finding, filtered by severity and rule; click or Enter selects and frames. */
export const FindingsPanel = memo(function FindingsPanel() {
  const ctx = useCommandContext();
  const report = useEditorState((s) => s.report);
  const error = useEditorState((s) => s.analysisError);
  const [hidden, setHidden] = useState<ReadonlySet<Severity>>(new Set(['info']));
  const [rule, setRule] = useState('');
  const [active, setActive] = useState(0);
  // A big drawing can have thousands of findings; render a page of them and grow on request.
  const [limit, setLimit] = useState(200);
  const listRef = useRef<HTMLUListElement>(null);

  const findings = useMemo(() => report?.findings ?? [], [report]);
  const rules = useMemo(() => [...new Set(findings.map((f) => f.ruleId))].sort(), [findings]);
  const shown = useMemo(
    () =>
      findings
        .filter((f) => !hidden.has(f.severity) && (rule === '' || f.ruleId === rule))
        .sort((a, b) => SEVERITY_LOOK[a.severity].rank - SEVERITY_LOOK[b.severity].rank),
    [findings, hidden, rule],
  );
  const activeIdx = Math.min(active, Math.max(0, shown.length - 1));

  const open = useCallback(
    (f: Finding) => {
      const { selection, frame } = selectionForFinding(f, ctx.store.getState().doc);
      ctx.store.setSelection(selection);
      if (frame.length) ctx.store.requestFrame(frame);
    },
    [ctx],
  );
  const pick = useCallback(
    (f: Finding, i: number) => {
      setActive(i);
      open(f);
    },
    [open],
  );

  const onKey = (e: KeyboardEvent<HTMLUListElement>) => {
    let next: number;
    if (e.key === 'ArrowDown') next = Math.min(shown.length - 1, activeIdx + 1);
    else if (e.key === 'ArrowUp') next = Math.max(0, activeIdx - 1);
    else if (e.key === 'Home') next = 0;
    else if (e.key === 'End') next = shown.length - 1;
    else if (e.key === 'Enter' || e.key === ' ') {
      const f = shown[activeIdx];
      if (f) open(f);
      e.preventDefault();
      return;
    } else return;
    e.preventDefault();
    setActive(next);
    listRef.current?.querySelector<HTMLElement>(`[data-index="${next}"]`)?.scrollIntoView({ block: 'nearest' });
  };

  const toggle = (s: Severity) => {
    const n = new Set(hidden);
    if (n.has(s)) n.delete(s);
    else n.add(s);
    setHidden(n);
  };

  return (
    <Collapsible id="findings" title="Findings" className="lw-review" testId="review">
      {error && <p className="lw-error" role="alert">{error}</p>}
      <div className="lw-review-filters" role="group" aria-label="Show severities">
        {SEVERITIES.map((s) => (
          <label key={s} className="lw-chip" style={{ borderColor: SEVERITY_LOOK[s].colour }}>
            <input type="checkbox" checked={!hidden.has(s)} onChange={() => toggle(s)} data-testid={`filter-${s}`} />
            <span aria-hidden="true" style={{ color: SEVERITY_LOOK[s].colour }}>{SEVERITY_LOOK[s].glyph}</span> {SEVERITY_TEXT[s]} ({report?.counts.bySeverity[s] ?? 0})
          </label>
        ))}
      </div>
      <label className="lw-field lw-rule-filter">
        <span>Rule</span>
        <select value={rule} onChange={(e) => setRule(e.target.value)} data-testid="filter-rule">
          <option value="">all rules</option>
          {rules.map((r) => <option key={r} value={r}>{ruleName(r)}</option>)}
        </select>
      </label>
      {shown.length === 0 ? (
        <p className="lw-muted" data-testid="review-empty">{report ? 'No findings with these filters.' : 'Checking…'}</p>
      ) : (
        <ul
          ref={listRef}
          className="lw-review-list"
          role="listbox"
          tabIndex={0}
          aria-label="Findings"
          aria-activedescendant={`finding-${activeIdx}`}
          onKeyDown={onKey}
          data-testid="review-list"
        >
          {shown.slice(0, Math.max(limit, activeIdx + 1)).map((f, i) => (
            <FindingRow key={f.id} finding={f} index={i} active={i === activeIdx} onPick={pick} />
          ))}
        </ul>
      )}
      {shown.length > limit && (
        <button type="button" className="lw-more" onClick={() => setLimit(limit + 200)} data-testid="review-more">
          Show more ({shown.length - limit} not listed)
        </button>
      )}
    </Collapsible>
  );
});

/**
 * One finding of the list. Memoized: after an edit the incremental check hands back the same finding
 * objects for everything the edit could not change, so only the findings that moved re-render.
 */
const FindingRow = memo(function FindingRow({ finding: f, index: i, active, onPick }: { finding: Finding; index: number; active: boolean; onPick: (f: Finding, i: number) => void }) {
  return (
    <li
      id={`finding-${i}`}
      role="option"
      aria-selected={active}
      data-index={i}
      data-testid="finding"
      data-rule={f.ruleId}
      data-severity={f.severity}
      className={`lw-review-item${active ? ' is-active' : ''}`}
      onClick={() => onPick(f, i)}
    >
      <SeverityMark severity={f.severity} />
      <span className="lw-review-msg"><IsolatedText text={f.message} /></span>
      <span className="lw-cite">{f.cites ? citeText(f.cites) : ruleName(f.ruleId)}</span>
    </li>
  );
});
