import { CAUTION_SHORT } from '../analysis/coreApi';
import { VERDICT_TEXT } from '../analysis/verdicts';
import { FAILING_VERDICTS, type Verdict } from '@linewright/core';
import { useCommandContext, useEditorState } from '../editor/useEditor';

/** The caution line, always on screen, and the state of the check and the autosave. */
export function Footer({ savedAt }: { savedAt: string | null }) {
  const { store } = useCommandContext();
  const report = useEditorState((s) => s.report);
  const stale = useEditorState((s) => s.reportVersion !== s.docVersion);
  const edition = useEditorState((s) => s.doc.project.codeEdition);
  const failing = report ? (Object.entries(report.counts.byVerdict) as [Verdict, number][]).filter(([v, n]) => n > 0 && FAILING_VERDICTS.has(v)) : [];
  const incomplete = report?.counts.byVerdict.incomplete ?? 0;
  return (
    <footer className="lw-footer">
      <div className="lw-caution-line" data-testid="caution-line">
        <span aria-hidden="true">⚠</span> {CAUTION_SHORT}{' '}
        <button type="button" className="lw-link" onClick={() => store.setView({ cautionOpen: true })} data-testid="caution-open">
          Read the caution
        </button>
      </div>
      <div className="lw-status" data-testid="check-status" data-stale={stale ? 'yes' : 'no'}>
        {report ? (
          <>
            NEC {edition} · {report.counts.conductors} conductors checked
            {failing.map(([v, n]) => ` · ${n} ${VERDICT_TEXT[v]}`).join('')}
            {incomplete > 0 && ` · ${incomplete} incomplete`}
            {stale && ' · checking…'}
          </>
        ) : (
          'Checking…'
        )}
        {savedAt && <span className="lw-saved"> · saved in this browser {savedAt}</span>}
      </div>
    </footer>
  );
}
