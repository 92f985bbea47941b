import type { AnalysisReport, AnalysisSession, Project } from '@linewright/core';
import type { EditorStore, EditorState } from '../editor/store';
import { coreCreateAnalysis } from './coreApi';

/**
 * A check expected to take less than this runs inside the commit: the edit and
 * its verdicts then cost one render instead of two, which is cheaper than the
 * check itself on big drawings. Slower checks go after the commit.
 */
const INLINE_BUDGET_MS = 60;
/** How many of the last bounded re-checks say what one typically takes. */
const TYPICAL_OF = 5;

/**
 * Re-runs the analysis on every committed document. Drags never commit until
 * release, so the check stays off the drag path. While checks typically take
 * less than INLINE_BUDGET_MS they run inside the commit; slower ones run a
 * few milliseconds after it, so a burst of edits costs one run and the screen
 * shows the edit first. "Typically" follows the session's bounded re-checks
 * (and expects one before there has been any): a whole re-run (an edit of a feeder, of the
 * service, of the topology) is as slow inline as after the commit, and must
 * not send the next few edits of branch circuits, each a millisecond or two,
 * down the slower path of two renders and a timer.
 */
export function startAnalysis(store: EditorStore, debounceMs = 8): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  // One session for the editor's life: an edit of one branch circuit is re-checked on its own and
  // every other conductor keeps its report object (core/src/analyze/incremental.ts).
  let session: AnalysisSession | null = null;
  // The last few bounded re-checks' times, newest last.
  const bounded: number[] = [];
  const check = (doc: Project): { report: AnalysisReport | null; error: string | null } => {
    const t0 = performance.now();
    try {
      const report = session ? session.update(doc) : (session = coreCreateAnalysis(doc)).report;
      stats.lastMs = performance.now() - t0;
      if (session.last.mode !== 'full') {
        bounded.push(stats.lastMs);
        if (bounded.length > TYPICAL_OF) bounded.shift();
      }
      // The lower median, so one slow run (a GC pause, the first re-check building its tables) does not
      // flip the mode; before the first bounded re-check (a drawing just opened) one is expected.
      stats.typicalMs = bounded.length ? [...bounded].sort((a, b) => a - b)[(bounded.length - 1) >> 1]! : 0;
      stats.runs++;
      if (session.last.mode === 'full') settleAfterPaint(report, () => session?.report ?? null);
      return { report, error: null };
    } catch (e) {
      // A crash in the analyzer must not cost the user the drawing: keep editing, say why.
      session = null;
      stats.lastMs = performance.now() - t0;
      return { report: null, error: `The check failed: ${(e as Error).message}` };
    }
  };
  const runLater = () => {
    timer = null;
    const { doc, docVersion, reportVersion } = store.getState();
    if (reportVersion === docVersion) return;
    const r = check(doc);
    store.setReport(r.report, docVersion, r.error);
  };
  store.inlineAnalysis = (doc) => (stats.runs > 0 && stats.typicalMs < INLINE_BUDGET_MS ? check(doc) : null);
  let frame = 0;
  const schedule = (s: EditorState) => {
    if (s.reportVersion === s.docVersion) return;
    if (timer !== null) clearTimeout(timer);
    if (frame !== 0) cancelAnimationFrame(frame);
    frame = 0;
    // A drawing with no report yet (just opened or restored: the store shows it as being checked) is
    // painted first and checked right after that paint; a hidden page paints nothing, so it is not waited for.
    if (s.report === null && document.visibilityState === 'visible') {
      frame = requestAnimationFrame(() => {
        frame = 0;
        timer = setTimeout(runLater, 0);
      });
    } else timer = setTimeout(runLater, debounceMs);
  };
  const off = store.onDocumentCommitted(schedule);
  schedule(store.getState());
  return () => {
    off();
    store.inlineAnalysis = null;
    if (timer !== null) clearTimeout(timer);
    if (frame !== 0) cancelAnimationFrame(frame);
  };
}

/**
 * After a whole analysis, builds the report's study tables right after its verdicts are painted. They are
 * built when first read (core/src/studies/lazyTable.ts), and the first re-check that changes the studies in
 * place must build them first, so the edit after opening a drawing (or after an edit of the service) paid for
 * them: 30–70 ms at 10 000 conductors. Reading them here changes no figure; it moves that work off the next edit.
 */
function settleAfterPaint(report: AnalysisReport, current: () => AnalysisReport | null): void {
  const studies = report.studies;
  if (!studies) return;
  const later = (fn: () => void) => setTimeout(() => current() === report && fn(), 0);
  requestAnimationFrame(() => later(() => {
    void studies.faults.length;
    later(() => void studies.voltageDrop.conductors.length);
  }));
}

export const stats = { runs: 0, lastMs: 0, typicalMs: 0 };
