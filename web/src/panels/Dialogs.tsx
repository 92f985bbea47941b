import { useEffect, type ReactNode } from 'react';
import { useModalDialog } from './useModalDialog';
import { CAUTION } from '../analysis/coreApi';
import { useCommandContext, useEditorState } from '../editor/useEditor';

export const CAUTION_SEEN_KEY = 'linewright.caution-seen';

function Modal({ open, onClose, title, children, testId }: { open: boolean; onClose: () => void; title: string; children: ReactNode; testId: string }) {
  const ref = useModalDialog(open);
  return (
    <dialog ref={ref} className="lw-dialog" onClose={onClose} onCancel={onClose} data-testid={testId} aria-labelledby={`${testId}-title`}>
      <h2 id={`${testId}-title`}>{title}</h2>
      {children}
    </dialog>
  );
}

/** The caution: shown on first start, reachable from the footer at any time. */
export function CautionDialog() {
  const { store } = useCommandContext();
  const open = useEditorState((s) => s.view.cautionOpen);
  const close = () => {
    try {
      localStorage.setItem(CAUTION_SEEN_KEY, '1');
    } catch {
      // Private mode without storage: the dialog simply shows again next time.
    }
    store.setView({ cautionOpen: false });
  };
  return (
    <Modal open={open} onClose={close} title="Before you rely on a result" testId="caution-dialog">
      <p className="lw-caution-text">{CAUTION}</p>
      <p>
        Verdicts on the drawing say which rule the check found to fit, or that none did. They are not an approval: that word
        belongs to the authority having jurisdiction.
      </p>
      <form method="dialog">
        <button type="submit" className="lw-primary" data-testid="caution-ok" autoFocus>
          I understand
        </button>
      </form>
    </Modal>
  );
}

/** Errors from a file that failed to open; the drawing on screen was not changed. */
export function LoadErrorsDialog() {
  const { store } = useCommandContext();
  const le = useEditorState((s) => s.view.loadErrors);
  return (
    <Modal open={le !== null} onClose={() => store.setView({ loadErrors: null })} title="The file could not be opened" testId="load-errors">
      {le && (
        <>
          <p>
            <strong>{le.fileName}</strong> has {le.errors.length === 1 ? 'a problem' : `${le.errors.length} problems`}. Your drawing
            was not changed.
          </p>
          <ul className="lw-load-errors" data-testid="load-error-list">
            {le.errors.map((e, i) => (
              <li key={i}>
                <code>{e.path || '(whole file)'}</code> {e.message}
              </li>
            ))}
          </ul>
        </>
      )}
      <form method="dialog">
        <button type="submit" className="lw-primary" data-testid="load-errors-close">Close</button>
      </form>
    </Modal>
  );
}

/** Short messages: restored drawing, copy, errors. */
export function Notices() {
  const { store } = useCommandContext();
  const notices = useEditorState((s) => s.view.notices);
  // Information fades after a while; errors stay until dismissed.
  useEffect(() => {
    const timers = notices.filter((n) => n.tone === 'info').map((n) => setTimeout(() => store.dismissNotice(n.id), 10_000));
    return () => timers.forEach(clearTimeout);
  }, [notices, store]);
  return (
    <div className="lw-notices" aria-live="polite" data-testid="notices">
      {notices.map((n) => (
        <div key={n.id} className={`lw-notice lw-notice-${n.tone}`} role={n.tone === 'error' ? 'alert' : 'status'} data-testid="notice">
          <span>{n.text}</span>
          <button type="button" aria-label="Dismiss" onClick={() => store.dismissNotice(n.id)}>×</button>
        </div>
      ))}
    </div>
  );
}
