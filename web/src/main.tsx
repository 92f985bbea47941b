import '@xyflow/react/dist/style.css';
import './styles.css';
import { StrictMode, useSyncExternalStore } from 'react';
import { createRoot } from 'react-dom/client';
import demoSample from '../../samples/demo-clinic.json';
import { coreLoadProject } from './analysis/coreApi';
import { startAnalysis } from './analysis/scheduler';
import { App } from './App';
import { emptyProject, type CommandContext } from './editor/commands';
import { EditorStore } from './editor/store';
import { CAUTION_SEEN_KEY } from './panels/Dialogs';
import { restoreSession, startAutosave } from './persistence/autosave';
import { OtherTabNotice, reportOtherTab } from './persistence/OtherTabNotice';
import { downloadFile } from './persistence/download';
import { installTestHook } from './testHook';

/** Time as a reader wants it in a notice: 22:41:03. */
function clock(iso: string): string {
  return new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit', second: '2-digit' });
}

async function boot() {
  const store = new EditorStore(emptyProject());
  const ctx: CommandContext = { store, canvas: null, clipboard: { fragment: null, pasteCount: 0 }, download: downloadFile };

  // Restore this tab's drawing (after a reload) or the newest one saved in this browser; otherwise open on
  // the demo so a newcomer sees a checked one-line. Storage that never answers costs a few seconds, not the page.
  const { identity, draft, storageProblem } = await restoreSession();
  let restored = false;
  if (draft) {
    const r = coreLoadProject(draft.project);
    if (r.ok) {
      // The undo history comes back with the drawing it was saved with.
      store.resetDocument(r.project, draft.history);
      store.notify(`Restored your drawing from this browser (autosaved ${clock(new Date(draft.savedAtMs).toISOString())}).`);
      restored = true;
    } else {
      store.notify(`The drawing autosaved in this browser could not be read (${r.errors[0]?.message ?? 'unknown problem'}); opened the demo instead.`, 'error');
    }
  }
  if (!restored) {
    const r = coreLoadProject(demoSample);
    if (r.ok) store.resetDocument(r.project);
    else store.notify(`The demo project did not load: ${r.errors.map((e) => `${e.path} ${e.message}`).join('; ')}`, 'error');
  }
  if (storageProblem) {
    store.notify(
      `${storageProblem}, so Linewright started ${restored ? 'on the copy kept in this tab' : 'on the demo'}. Autosave keeps a copy in this tab while storage is unavailable; use Save file to keep your work.`,
      'error',
    );
  }

  let seen: boolean;
  try {
    seen = localStorage.getItem(CAUTION_SEEN_KEY) === '1';
  } catch {
    seen = false;
  }
  if (!seen) store.setView({ cautionOpen: true });

  startAnalysis(store);
  let savedAt: string | null = draft && restored ? clock(new Date(draft.savedAtMs).toISOString()) : null;
  const savedListeners = new Set<() => void>();
  let autosaveFailed = false;
  startAutosave(store, identity, {
    onSaved: (iso) => {
      savedAt = clock(iso);
      for (const l of savedListeners) l();
    },
    onError: (e) => {
      // Say it once; repeating it on every edit would bury the drawing in notices.
      if (!autosaveFailed) store.notify(`Autosave in this browser failed (${e.message}). Use Save file to keep your work.`, 'error');
      autosaveFailed = true;
    },
    onOtherTab: reportOtherTab,
  });
  installTestHook(ctx);

  function Root() {
    const s = useSyncExternalStore(
      (l) => {
        savedListeners.add(l);
        return () => savedListeners.delete(l);
      },
      () => savedAt,
    );
    return (
      <>
        <App ctx={ctx} savedAt={s} />
        <OtherTabNotice store={store} />
      </>
    );
  }

  createRoot(document.getElementById('root')!).render(
    <StrictMode>
      <Root />
    </StrictMode>,
  );
}

void boot();
