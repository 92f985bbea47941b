import { useState } from 'react';
import {
  DISPOSITION_KINDS, DISPOSITION_WORDS, STANDING_WORDS, clearDisposition, dispositionProblems, dispositionStates, setDisposition,
  type DispositionKind, type Finding,
} from '@linewright/core';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { editReview, nowIso, useReviewView } from './reviewState';

/** Records how a finding is dispositioned: accepted by the AHJ (who, when, reference), disputed (why) or deferred. */
export function DispositionForm({ finding }: { finding: Finding }) {
  const { store } = useCommandContext();
  const author = useReviewView((v) => v.author);
  const review = useEditorState((s) => s.doc.review);
  const report = useEditorState((s) => s.report);
  const current = report ? dispositionStates(review, report).find((x) => x.disposition.findingId === finding.id) : undefined;
  const [kind, setKind] = useState<DispositionKind>(finding.severity === 'needs-ahj' ? 'ahj-accepted' : 'disputed');
  const [ahjName, setAhjName] = useState('');
  const [ahjDate, setAhjDate] = useState(new Date().toISOString().slice(0, 10));
  const [reference, setReference] = useState('');
  const [reason, setReason] = useState('');
  const input = { kind, ahjName, ahjDate, reference, reason };
  const problems = dispositionProblems(input, finding);
  const kinds = DISPOSITION_KINDS.filter((k) => k !== 'ahj-accepted' || finding.severity === 'needs-ahj');
  return (
    <div className="lw-rv-dispo" data-testid="disposition" data-finding={finding.id}>
      {current && (
        <p className={`lw-rv-standing is-${current.standing}`} data-testid="disposition-current" data-standing={current.standing}>
          {DISPOSITION_WORDS[current.disposition.kind]}
          {current.disposition.kind === 'ahj-accepted' ? ` (${current.disposition.ahjName ?? ''}, ${current.disposition.ahjDate ?? ''}${current.disposition.reference ? `, ${current.disposition.reference}` : ''})` : current.disposition.reason ? `: ${current.disposition.reason}` : ''}
          {' · '}
          <strong>{STANDING_WORDS[current.standing]}</strong>
          <button type="button" className="lw-link" onClick={() => editReview(store, `Clear disposition of ${finding.id}`, (r) => clearDisposition(r, finding.id))} data-testid="disposition-clear">
            clear
          </button>
        </p>
      )}
      <form
        onSubmit={(e) => {
          e.preventDefault();
          if (!author || !report || problems.length > 0) return;
          editReview(store, `${DISPOSITION_WORDS[kind]}: ${finding.id}`, (r) => setDisposition(r, finding, report, input, author, nowIso()));
        }}
      >
        <label className="lw-field">
          <span>Disposition</span>
          <select value={kind} onChange={(e) => setKind(e.target.value as DispositionKind)} data-testid="disposition-kind">
            {kinds.map((k) => <option key={k} value={k}>{DISPOSITION_WORDS[k]}</option>)}
          </select>
        </label>
        {kind === 'ahj-accepted' ? (
          <>
            <label className="lw-field"><span>Accepted by</span><input value={ahjName} maxLength={120} onChange={(e) => setAhjName(e.target.value)} placeholder="AHJ name or office" data-testid="disposition-ahj-name" /></label>
            <label className="lw-field"><span>On</span><input type="date" value={ahjDate} onChange={(e) => setAhjDate(e.target.value)} data-testid="disposition-ahj-date" /></label>
            <label className="lw-field"><span>Reference</span><input value={reference} maxLength={200} onChange={(e) => setReference(e.target.value)} placeholder="letter, permit or meeting note" data-testid="disposition-reference" /></label>
          </>
        ) : (
          <label className="lw-field"><span>{kind === 'disputed' ? 'Reason' : 'Until'}</span><input value={reason} maxLength={2000} onChange={(e) => setReason(e.target.value)} data-testid="disposition-reason" /></label>
        )}
        {problems.length > 0 && <p className="lw-muted">{problems.join(' ')}</p>}
        <button type="submit" disabled={!author || problems.length > 0} data-testid="disposition-save">Record</button>
      </form>
    </div>
  );
}
