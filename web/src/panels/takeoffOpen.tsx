import { lazy, Suspense, useRef, useSyncExternalStore } from 'react';
import { useEditorState } from '../editor/useEditor';

/*
 * Whether the takeoff is open, and the toolbar button that opens it. The takeoff view itself (its
 * tables and the takeoff code) loads on the first opening, so the editor's first paint never waits for it.
 */
let open = false;
const listeners = new Set<() => void>();
export function setOpen(v: boolean): void {
  open = v;
  for (const l of listeners) l();
}
const subscribe = (l: () => void) => {
  listeners.add(l);
  return () => listeners.delete(l);
};
export const useOpen = () => useSyncExternalStore(subscribe, () => open);

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
