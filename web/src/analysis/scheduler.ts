import type { EditorStore, EditorState } from '../editor/store';
import { coreAnalyze } from './coreApi';

/**
 * Re-runs the analysis on every committed document, a few milliseconds after
 * the commit so a burst of edits costs one run. Drags never commit until
 * release, so the check stays off the drag path.
 */
export function startAnalysis(store: EditorStore, debounceMs = 8): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  const run = () => {
    timer = null;
    const { doc, docVersion } = store.getState();
    const t0 = performance.now();
    try {
      const report = coreAnalyze(doc);
      stats.lastMs = performance.now() - t0;
      stats.runs++;
      store.setReport(report, docVersion);
    } catch (e) {
      // A crash in the analyzer must not cost the user the drawing: keep editing, say why.
      store.setReport(null, docVersion, `The check failed: ${(e as Error).message}`);
    }
  };
  const schedule = (_s: EditorState) => {
    if (timer !== null) clearTimeout(timer);
    timer = setTimeout(run, debounceMs);
  };
  const off = store.onDocumentCommitted(schedule);
  schedule(store.getState());
  return () => {
    off();
    if (timer !== null) clearTimeout(timer);
  };
}

export const stats = { runs: 0, lastMs: 0 };
