import { lazy, Suspense, useRef } from 'react';
import { uiValue } from '../editor/uiValue';
import { useEditorState } from '../editor/useEditor';

/*
 * Whether the takeoff is open, and the toolbar button that opens it. The takeoff view itself (its
 * tables and the takeoff code) loads on the first opening, so the editor's first paint never waits for it.
 */
const open = uiValue(false);
export const setOpen = open.set;
export const useOpen = open.use;

/** Toolbar button that opens the takeoff. */
export function TakeoffButton() {
  const report = useEditorState((s) => s.report);
  return (
    <button type="button" data-testid="cmd-takeoff" disabled={report === null} onClick={() => setOpen(true)} title="Takeoff: wire, raceway, devices and equipment counted from the checked drawing">
      Takeoff
    </button>
  );
}

const TakeoffView = lazy(() => import('./TakeoffView').then((m) => ({ default: m.TakeoffView })));

/** The takeoff view, loaded when first opened and kept mounted after (its dialog opens and closes itself). */
export function TakeoffHost() {
  const isOpen = useOpen();
  const opened = useRef(false);
  if (isOpen) opened.current = true;
  if (!opened.current) return null;
  return (
    <Suspense fallback={null}>
      <TakeoffView />
    </Suspense>
  );
}
