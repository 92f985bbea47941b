import { useRef } from 'react';
import { SHEET_SIZES, SHEET_SIZE_IDS, type SheetSize } from '@linewright/core';
import {
  arrangeDrawing, copySelection, deleteSelection, exportPdf, newDrawing, openProject, paste, redo, saveJson, toggleSnap, undo, zoomToFit,
  type Command,
} from '../editor/commands';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { TakeoffButton } from './takeoffOpen';
import { ReviewSwitch } from '../review/ReviewSwitch';

function CmdButton({ cmd, testId, children, what }: { cmd: Command; testId: string; children?: React.ReactNode; what?: string | null }) {
  const ctx = useCommandContext();
  // Re-render when anything a canRun reads may have changed.
  useEditorState((s) => s.history);
  useEditorState((s) => s.view.selection);
  useEditorState((s) => s.report);
  const enabled = cmd.canRun(ctx, undefined);
  return (
    <button type="button" data-testid={testId} disabled={!enabled} onClick={() => void cmd.run(ctx, undefined)} title={`${cmd.label}${what ? `: ${what}` : ''}${cmd.shortcut ? ` (${cmd.shortcut})` : ''}`}>
      {children ?? cmd.label}
    </button>
  );
}

/** Reads a chosen or dropped file and hands it to the open command. */
export async function openFile(ctx: ReturnType<typeof useCommandContext>, file: File): Promise<void> {
  const text = await file.text();
  await openProject.run(ctx, { fileName: file.name, text });
}

export function Toolbar() {
  const ctx = useCommandContext();
  const fileInput = useRef<HTMLInputElement>(null);
  const name = useEditorState((s) => s.doc.project.name);
  const history = useEditorState((s) => s.history);
  const sheet = useEditorState((s) => s.view.pdfSheet);
  return (
    <header className="lw-top">
      <div className="lw-brand">
        <svg className="lw-logo" width={18} height={18} viewBox="0 0 18 18" aria-hidden="true">
          <line x1={9} y1={1} x2={9} y2={17} />
          <line x1={3} y1={6} x2={15} y2={6} />
          <path d="M 9 9 A 4 4 0 0 1 9 15" />
        </svg>
        Linewright
        <span className="lw-project-name" data-testid="project-name" title={name}>{name}</span>
      </div>
      <nav className="lw-tools" aria-label="Commands">
        <div className="lw-tool-group" role="group" aria-label="File">
          <CmdButton cmd={newDrawing} testId="cmd-new">New</CmdButton>
          <button type="button" data-testid="cmd-open" onClick={() => fileInput.current?.click()} title="Open a project file (Ctrl+O); you can also drop one on the window">
            Open…
          </button>
          <input
            ref={fileInput}
            type="file"
            accept=".json,application/json"
            hidden
            data-testid="open-file-input"
            onChange={(e) => {
              const f = e.target.files?.[0];
              e.target.value = '';
              if (f) void openFile(ctx, f);
            }}
          />
          <CmdButton cmd={saveJson} testId="cmd-save">Save file</CmdButton>
          <CmdButton cmd={exportPdf} testId="cmd-pdf">Export PDF</CmdButton>
          <select aria-label="PDF sheet size" title={`Sheet size of the exported PDF: ${SHEET_SIZES[sheet].name}`} value={sheet} onChange={(e) => ctx.store.setView({ pdfSheet: e.target.value as SheetSize })} data-testid="pdf-sheet">
            {SHEET_SIZE_IDS.map((id) => <option key={id} value={id} title={SHEET_SIZES[id].name}>{SHEET_SIZES[id].short}</option>)}
          </select>
          <TakeoffButton />
        </div>
        <div className="lw-tool-group" role="group" aria-label="Edit">
          <CmdButton cmd={undo} testId="cmd-undo" what={history.undoLabel}>Undo</CmdButton>
          <CmdButton cmd={redo} testId="cmd-redo" what={history.redoLabel}>Redo</CmdButton>
          <CmdButton cmd={copySelection} testId="cmd-copy" />
          <CmdButton cmd={paste} testId="cmd-paste" />
          <CmdButton cmd={deleteSelection} testId="cmd-delete" />
        </div>
        <div className="lw-tool-group" role="group" aria-label="View">
          <CmdButton cmd={zoomToFit} testId="cmd-fit" />
          <CmdButton cmd={arrangeDrawing} testId="cmd-arrange">Arrange</CmdButton>
        </div>
      </nav>
      <ReviewSwitch />
      <div className="lw-history-hint" data-testid="history-hint" aria-live="polite">
        {history.undoLabel ? `Undo: ${history.undoLabel}` : 'Nothing to undo'}
      </div>
    </header>
  );
}

/**
 * Drawing tools that sit on the canvas. There is no connection mode: a port-to-port drag adds the
 * connection the two pieces call for, which the details panel can change.
 */
export function DrawingTools() {
  const ctx = useCommandContext();
  const snap = useEditorState((s) => s.view.snapToGrid);
  return (
    <div className="lw-drawing-tools" role="group" aria-label="Drawing tools">
      <span className="lw-tool-caption" title="Drag from a bottom port (load side) to a top port (line side) to connect: a bus and a device in the same equipment get a bus link, anything else a conductor (change it in the details panel). Keys 1–9 add equipment under the selected piece, connected.">
        Drag port to port to connect · keys 1–9 add below the selection
      </span>
      <span className="lw-sep" aria-hidden="true" />
      <label className="lw-toggle" title="Snap moved equipment to a 20-unit grid">
        <input type="checkbox" checked={snap} onChange={() => toggleSnap.run(ctx)} data-testid="toggle-snap" /> snap to grid
      </label>
    </div>
  );
}
