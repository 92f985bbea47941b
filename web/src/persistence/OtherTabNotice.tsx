import { useState, useSyncExternalStore } from 'react';
import { coreLoadProject } from '../analysis/coreApi';
import type { EditorStore } from '../editor/store';
import { readDraftOf } from './autosave';
import type { LatestSave } from './drafts';

/** The latest save of another tab on the same drawing, while the user has not answered it. */
let pendingOther: LatestSave | null = null;
const listeners = new Set<() => void>();

/** Called by the autosave when another tab saved a later version of this drawing. */
export function reportOtherTab(other: LatestSave): void {
  pendingOther = other;
  for (const l of listeners) l();
}

function answer(): void {
  pendingOther = null;
  for (const l of listeners) l();
}

function clock(ms: number): string {
  return new Date(ms).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit', second: '2-digit' });
}

/**
 * Two tabs on the same drawing each keep their own copy; when the other one saves later, this says so
 * and offers both: open the other tab's version (one undoable step, so Undo returns to this one) or keep
 * this one. Nothing is overwritten either way.
 */
export function OtherTabNotice({ store }: { store: EditorStore }) {
  const other = useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => pendingOther,
  );
  const [busy, setBusy] = useState(false);
  if (!other) return null;
  const openOther = async () => {
    setBusy(true);
    const d = await readDraftOf(other.docId);
    setBusy(false);
    const r = d ? coreLoadProject(d.project) : null;
    if (!r || !r.ok) {
      store.notify("The other tab's version could not be read from this browser's storage; this tab's drawing is unchanged.", 'error');
      answer();
      return;
    }
    store.replaceDocument("Open the other tab's version", r.project);
    store.notify("Opened the other tab's version; Undo returns to this tab's drawing.");
    answer();
  };
  return (
    <div className="lw-notice lw-notice-error lw-other-tab" role="alert" data-testid="other-tab-notice">
      <span>
        Another tab saved a later version of this drawing at {clock(other.savedAtMs)}. Each tab keeps its own copy; nothing was overwritten.
      </span>
      <button type="button" disabled={busy} data-testid="other-tab-open" onClick={() => void openOther()}>
        Open the other tab&apos;s version
      </button>
      <button type="button" data-testid="other-tab-keep" onClick={answer}>
        Keep this one
      </button>
    </div>
  );
}
