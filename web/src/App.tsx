import { useEffect, useState } from 'react';
import { ReactFlowProvider } from '@xyflow/react';
import { Canvas } from './canvas/Canvas';
import { EQUIPMENT_KINDS, type EquipmentKind } from '@linewright/core';
import {
  INSERTABLE_KINDS, addEquipment, copySelection, deleteSelection, insertIntoConductor, paste, redo, saveJson, selectAll, undo, zoomToFit, type CommandContext,
} from './editor/commands';
import { EMPTY_SELECTION } from './editor/store';
import { EditorContext } from './editor/useEditor';
import { DetailsPanel } from './panels/DetailsPanel';
import { CautionDialog, LoadErrorsDialog, Notices } from './panels/Dialogs';
import { FindingsPanel } from './panels/FindingsPanel';
import { Footer } from './panels/Footer';
import { Legend, Palette } from './panels/Palette';
import { Toolbar, openFile } from './panels/Toolbar';
import { TakeoffHost } from './panels/takeoffOpen';
import { ReviewOverlay } from './review/ReviewOverlay';
import { ReviewPanel } from './review/ReviewPanel';
import { ImportDialog } from './import/ImportDialog';
import { Schedules } from './schedules/Schedules';

function isTyping(t: EventTarget | null): boolean {
  const el = t as HTMLElement | null;
  if (!el || !el.tagName) return false;
  // A schedule handles its own keys (arrows, Enter, typing, paste) like a spreadsheet.
  return el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable || el.closest?.('[data-schedule]') != null;
}

/** A digit key: insert into the one selected conductor when the kind can sit in a run, else add (and connect). */
function addByKey(ctx: CommandContext, kind: EquipmentKind): void {
  const sel = ctx.store.getState().view.selection;
  if (sel.conductors.length === 1 && sel.nodes.length === 0 && sel.busLinks.length === 0 && INSERTABLE_KINDS.includes(kind)) {
    insertIntoConductor.run(ctx, { conductorId: sel.conductors[0]!, kind });
  } else addEquipment.run(ctx, { kind });
}

/** Alt+arrows walk the drawing: up to the supply, down to the first load, left and right among siblings. */
function walkSelection(ctx: CommandContext, dir: 'up' | 'down' | 'left' | 'right'): void {
  const { doc, view } = ctx.store.getState();
  const id = view.selection.nodes[0];
  if (!id) return;
  const links = [...doc.conductors, ...doc.busLinks];
  const xOf = (n: string) => doc.nodes.find((x) => x.id === n)?.position?.x ?? 0;
  let next: string | undefined;
  if (dir === 'up') next = links.find((l) => l.to === id)?.from;
  else if (dir === 'down') next = links.filter((l) => l.from === id).map((l) => l.to).sort((a, b) => xOf(a) - xOf(b))[0];
  else {
    const supply = links.find((l) => l.to === id)?.from;
    const sibs: string[] = supply ? links.filter((l) => l.from === supply).map((l) => String(l.to)).sort((a, b) => xOf(a) - xOf(b)) : [];
    next = sibs[sibs.indexOf(id) + (dir === 'left' ? -1 : 1)];
  }
  if (!next) return;
  ctx.store.setSelection({ nodes: [next], conductors: [], busLinks: [] });
  ctx.store.requestFrame([next]);
}

/** Keyboard shortcuts; all of them call the same commands as the buttons. */
function useShortcuts(ctx: CommandContext, openPicker: () => void) {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const mod = e.ctrlKey || e.metaKey;
      const k = e.key.toLowerCase();
      if (mod && k === 's') {
        e.preventDefault();
        saveJson.run(ctx);
        return;
      }
      if (mod && k === 'o') {
        e.preventDefault();
        openPicker();
        return;
      }
      if (isTyping(e.target) || document.querySelector('dialog[open]')) return;
      if (mod && k === 'z' && !e.shiftKey) undo.run(ctx);
      else if (mod && ((k === 'z' && e.shiftKey) || k === 'y')) redo.run(ctx);
      else if (mod && k === 'c') copySelection.run(ctx);
      else if (mod && k === 'v') paste.run(ctx);
      else if (mod && k === 'a') selectAll.run(ctx);
      else if (!mod && (e.key === 'Delete' || e.key === 'Backspace')) deleteSelection.run(ctx);
      else if (!mod && k === 'f') zoomToFit.run(ctx);
      else if (!mod && !e.altKey && /^[1-9]$/.test(e.key)) addByKey(ctx, EQUIPMENT_KINDS[Number(e.key) - 1]!);
      else if (e.altKey && !mod && e.key.startsWith('Arrow')) walkSelection(ctx, e.key.slice(5).toLowerCase() as 'up' | 'down' | 'left' | 'right');
      else if (e.key === 'Escape') ctx.store.setSelection(EMPTY_SELECTION);
      else return;
      e.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [ctx, openPicker]);
}

/** Drop a project file anywhere on the window to open it. */
function useFileDrop(ctx: CommandContext): boolean {
  const [over, setOver] = useState(false);
  useEffect(() => {
    const hasFiles = (e: DragEvent) => e.dataTransfer?.types.includes('Files') ?? false;
    const onOver = (e: DragEvent) => {
      if (!hasFiles(e)) return;
      e.preventDefault();
      setOver(true);
    };
    const onLeave = (e: DragEvent) => {
      if (e.relatedTarget === null) setOver(false);
    };
    const onDrop = (e: DragEvent) => {
      if (!hasFiles(e)) return;
      e.preventDefault();
      setOver(false);
      const f = e.dataTransfer?.files[0];
      if (f) void openFile(ctx, f);
    };
    window.addEventListener('dragover', onOver);
    window.addEventListener('dragleave', onLeave);
    window.addEventListener('drop', onDrop);
    return () => {
      window.removeEventListener('dragover', onOver);
      window.removeEventListener('dragleave', onLeave);
      window.removeEventListener('drop', onDrop);
    };
  }, [ctx]);
  return over;
}

/** A side panel folds to a narrow strip with one button, giving the drawing the width. */
function useSide(key: string, initial: boolean): [boolean, () => void] {
  const [open, setOpen] = useState<boolean>(() => {
    try {
      const v = window.localStorage.getItem(`linewright.side.${key}`);
      return v === null ? initial : v === '1';
    } catch {
      return initial;
    }
  });
  const toggle = () => {
    setOpen(!open);
    try {
      window.localStorage.setItem(`linewright.side.${key}`, open ? '0' : '1');
    } catch {
      // Not remembered; still toggled.
    }
  };
  return [open, toggle];
}

function SideToggle({ open, onToggle, side, what }: { open: boolean; onToggle: () => void; side: 'left' | 'right'; what: string }) {
  const mark = (side === 'left') === open ? '«' : '»';
  return (
    <button type="button" className={`lw-side-toggle lw-side-toggle-${side}`} onClick={onToggle} aria-expanded={open} data-testid={`side-${side}`} title={`${open ? 'Hide' : 'Show'} the ${what}`}>
      <span aria-hidden="true">{mark}</span>
      {!open && <span className="lw-side-caption">{what}</span>}
    </button>
  );
}

export function App({ ctx, savedAt }: { ctx: CommandContext; savedAt: string | null }) {
  const dropping = useFileDrop(ctx);
  const [leftOpen, toggleLeft] = useSide('left', true);
  const [rightOpen, toggleRight] = useSide('right', true);
  useShortcuts(ctx, () => document.querySelector<HTMLInputElement>('[data-testid="open-file-input"]')?.click());
  return (
    <EditorContext.Provider value={ctx}>
      <ReactFlowProvider>
        <div className={`lw-app${leftOpen ? '' : ' no-left'}${rightOpen ? '' : ' no-right'}`}>
          <Toolbar />
          <aside className="lw-left" aria-label="Equipment and findings">
            <SideToggle open={leftOpen} onToggle={toggleLeft} side="left" what="equipment and findings" />
            {leftOpen && (
              <>
                <Palette />
                <FindingsPanel />
                <Legend />
              </>
            )}
          </aside>
          <main className="lw-main">
            <div className="lw-drawing-area">
              <Canvas />
              <ReviewOverlay />
            </div>
            <Schedules />
          </main>
          <aside className="lw-right" aria-label="Details">
            <SideToggle open={rightOpen} onToggle={toggleRight} side="right" what="details" />
            {rightOpen && <DetailsPanel />}
            {rightOpen && <ReviewPanel />}
          </aside>
          <Footer savedAt={savedAt} />
        </div>
        {dropping && <div className="lw-drop-overlay" data-testid="drop-overlay">Drop a Linewright project file to open it</div>}
        <Notices />
        <CautionDialog />
        <LoadErrorsDialog />
        <TakeoffHost />
        <ImportDialog />
      </ReactFlowProvider>
    </EditorContext.Provider>
  );
}
