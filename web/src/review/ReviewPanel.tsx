import { useState } from 'react';
import { responseLetterCsv, type Finding } from '@linewright/core';
import { loadPermitPdf } from '../analysis/coreApi';
import { fileBaseName } from '../editor/commands/saveJson';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { CommentsPanel } from './CommentsPanel';
import { DispositionForm } from './DispositionForm';
import { IdentityForm } from './IdentityForm';
import { RoundsPanel } from './RoundsPanel';
import { useReviewView } from './reviewState';
import './review.css';

/** The review desk beside the drawing: who is writing, comments, dispositions of the selection's findings, rounds and the response letter. */
export function ReviewPanel() {
  const ctx = useCommandContext();
  const author = useReviewView((v) => v.author);
  const on = useReviewView((v) => v.on);
  const [changingName, setChangingName] = useState(false);
  const selection = useEditorState((s) => s.view.selection);
  const report = useEditorState((s) => s.report);
  const ids = new Set([...selection.conductors, ...selection.nodes, ...selection.busLinks]);
  const findings: Finding[] = (report?.findings ?? []).filter((f) => f.subject.kind !== 'project' && ids.has(f.subject.id) && f.severity !== 'info');

  const letter = async (kind: 'pdf' | 'csv') => {
    const { doc, report: r, reportVersion, docVersion } = ctx.store.getState();
    if (!r || reportVersion !== docVersion) {
      ctx.store.notify('The check is still running; export again in a moment.', 'error');
      return;
    }
    const base = `${fileBaseName(doc)}-comment-responses`;
    if (kind === 'csv') ctx.download(`${base}.csv`, 'text/csv', responseLetterCsv(doc, r));
    else {
      // The PDF code loads on first use, as for the permit set.
      const { renderResponseLetterPdf } = await loadPermitPdf();
      ctx.download(`${base}.pdf`, 'application/pdf', renderResponseLetterPdf(doc, r, { generatedAt: new Date().toISOString() }));
    }
  };

  return (
    <div className={`lw-rv${on ? ' is-review-mode' : ''}`} data-testid="review-desk">
      <section className="lw-rv-section">
        <h2>Plan review</h2>
        {!author || changingName ? (
          <IdentityForm onDone={() => setChangingName(false)} />
        ) : (
          <p className="lw-rv-meta">
            Writing as <strong data-testid="review-author">{author.name}</strong> ({author.role}){' '}
            <button type="button" className="lw-link" onClick={() => setChangingName(true)} data-testid="review-identity-change">change</button>
          </p>
        )}
      </section>
      {findings.length > 0 && (
        <section className="lw-rv-section" data-testid="selection-findings">
          <h2>Findings on the selection</h2>
          {findings.map((f) => (
            <div key={f.id} className="lw-rv-finding">
              <p className="lw-rv-meta">{f.severity === 'needs-ahj' ? 'needs AHJ review' : f.severity} · {f.id}</p>
              <p>{f.message}</p>
              <DispositionForm key={f.id} finding={f} />
            </div>
          ))}
        </section>
      )}
      <CommentsPanel />
      <RoundsPanel />
      <section className="lw-rv-section">
        <h2>Comment-response letter</h2>
        <div className="lw-rv-moves">
          <button type="button" onClick={() => void letter('pdf')} data-testid="letter-pdf">Letter (PDF)</button>
          <button type="button" onClick={() => void letter('csv')} data-testid="letter-csv">Letter (CSV)</button>
        </div>
      </section>
    </div>
  );
}
