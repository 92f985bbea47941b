import { useState } from 'react';
import type { Project, SizingCandidate, SizingResult } from '@linewright/core';
import { CAUTION_SHORT, coreApplyFix, coreSizeConductor } from '../analysis/coreApi';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import './sizing.css';

interface Search {
  /** The drawing the result belongs to; an edit makes it stale and hides it. */
  doc: Project;
  conductorId: string;
  result: SizingResult | null;
  error: string | null;
}

const amps = (a: number | null) => (a === null ? 'no ampacity' : `${a} A`);

/**
 * "Size this conductor": the cheapest configurations of the selected conductor's run that the
 * analyzer accepts (core/src/sizing), why each passes and why cheaper ones fail; one click
 * applies a choice as one undoable edit.
 */
export function SizingAssistant({ conductorId }: { conductorId: string }) {
  const ctx = useCommandContext();
  const doc = useEditorState((s) => s.doc);
  const [search, setSearch] = useState<Search | null>(null);
  const [busy, setBusy] = useState(false);
  const shown = search && search.doc === doc && search.conductorId === conductorId ? search : null;

  const run = () => {
    const d = ctx.store.getState().doc;
    setBusy(true);
    // Let the busy state paint before the search (a few whole re-analyses) holds the main thread.
    window.requestAnimationFrame(() =>
      window.setTimeout(() => {
        try {
          setSearch({ doc: d, conductorId, result: coreSizeConductor(d, conductorId), error: null });
        } catch (e) {
          setSearch({ doc: d, conductorId, result: null, error: e instanceof Error ? e.message : String(e) });
        } finally {
          setBusy(false);
        }
      }, 0),
    );
  };

  const apply = (c: SizingCandidate) => {
    const label = `Size ${conductorId}: ${c.label}`;
    const changed = ctx.store.edit(label, (draft) => {
      for (const f of c.fixes) coreApplyFix(draft as Project, f);
    });
    if (!changed) ctx.store.notify(`“${label}” changed nothing on the drawing.`);
  };

  return (
    <section className="lw-sizing" data-testid="sizing">
      <h3>Sizing</h3>
      {!shown && (
        <button type="button" data-testid="size-conductor" onClick={run} disabled={busy} title="Search sizes, materials, parallel sets and the branch device for the cheapest the check accepts">
          {busy ? 'Searching…' : 'Size this conductor'}
        </button>
      )}
      {busy && <p className="lw-muted" data-testid="sizing-busy">Trying sizes, materials and parallel sets against the rules, then re-checking the drawing with each…</p>}
      {shown?.error && <p className="lw-error" data-testid="sizing-error">{shown.error}</p>}
      {shown?.result && <SizingResultView result={shown.result} onApply={apply} onClose={() => setSearch(null)} />}
    </section>
  );
}

function SizingResultView({ result: r, onApply, onClose }: { result: SizingResult; onApply: (c: SizingCandidate) => void; onClose: () => void }) {
  return (
    <div data-testid="sizing-result" data-candidates={r.candidates.length}>
      <p className="lw-sizing-present" data-testid="sizing-present" data-passes={r.present.passes ? 'yes' : 'no'}>
        As drawn: <strong>{r.present.label}</strong>, {amps(r.present.ampacityA)}: {r.present.passes ? 'the check accepts it.' : 'not accepted.'}
        {r.present.binding && <span className="lw-muted"> {r.present.binding.section ? `${r.present.binding.section}: ` : ''}{r.present.binding.text}</span>}
      </p>
      {r.problem && <p className="lw-error" data-testid="sizing-problem">{r.problem}</p>}
      {r.candidates.length > 0 && (
        <ol className="lw-sizing-list">
          {r.candidates.map((c, i) => (
            <li key={`${c.label}-${i}`} data-testid="sizing-candidate" data-size={c.config.size} data-material={c.config.material} data-sets={c.config.parallelSets}>
              <div className="lw-sizing-head">
                <strong>{c.label}</strong> · {amps(c.ampacityA)} · relative cost {c.cost}
                {c.present ? (
                  <span className="lw-muted"> (as drawn)</span>
                ) : (
                  <button type="button" className="lw-fix" data-testid="sizing-apply" onClick={() => onApply(c)} title="Apply as one edit; Undo takes it back">
                    Use this
                  </button>
                )}
              </div>
              <ul className="lw-sizing-why">
                {c.reasons.map((why) => (
                  <li key={why}>✓ {why}</li>
                ))}
                {c.smallerFails && (
                  <li className="lw-sizing-miss" data-testid="sizing-smaller-fails">
                    ✗ {c.smallerFails.label}: {c.smallerFails.binding.section ? `${c.smallerFails.binding.section}, ` : ''}
                    {c.smallerFails.binding.text}
                  </li>
                )}
              </ul>
            </li>
          ))}
        </ol>
      )}
      {r.rejected.length > 0 && (
        <details className="lw-sizing-rejected" data-testid="sizing-rejected">
          <summary>Cheaper, not accepted ({r.rejected.length})</summary>
          <ul>
            {r.rejected.map((x) => (
              <li key={x.label}>
                ✗ <strong>{x.label}</strong> (relative cost {x.cost}): {x.binding.section ? `${x.binding.section}, ` : ''}
                {x.binding.text}
              </li>
            ))}
          </ul>
        </details>
      )}
      <p className="lw-muted" data-testid="sizing-basis">{r.costBasis}</p>
      <details className="lw-sizing-notes">
        <summary>What the search assumed</summary>
        <ul>
          {r.notes.slice(1).map((n) => (
            <li key={n}>{n}</li>
          ))}
          <li>
            {r.screened} configurations tried on the rules; {r.analyses} confirmed by re-checking the whole drawing.
          </li>
        </ul>
      </details>
      <p className="lw-muted lw-sizing-caution">⚠ {CAUTION_SHORT}</p>
      <button type="button" data-testid="sizing-close" onClick={onClose}>
        Close the sizing
      </button>
    </div>
  );
}
