import type { BusLink, Conductor, EquipmentNode } from '@linewright/core';
import type { EditorStore } from '../store';

/** The part of the canvas a command may drive; the React Flow instance implements it. */
export interface CanvasView {
  /** Centre of the visible drawing area, in drawing coordinates. */
  visibleCentre(): { x: number; y: number };
  /** Frames the whole drawing once the current document has rendered. */
  fitAll(): void;
  /** Pans (never zooms) just enough that this box of the drawing is in view. */
  reveal(box: { x: number; y: number; w: number; h: number }): void;
}

/** Copied elements, kept in the editor (and as JSON text on the system clipboard when allowed). */
export interface Fragment {
  nodes: EquipmentNode[];
  conductors: Conductor[];
  busLinks: BusLink[];
}

export interface CommandContext {
  store: EditorStore;
  canvas: CanvasView | null;
  clipboard: { fragment: Fragment | null; pasteCount: number };
  /** Hands bytes to the user as a file (a browser download). */
  download(fileName: string, mime: string, data: Uint8Array | string): void;
}

/** One command, one shape: menus, shortcuts and the palette all call `run`. */
export interface Command<A = void> {
  id: string;
  label: string;
  /** Shown in tooltips, e.g. 'Ctrl+Z'. */
  shortcut?: string;
  canRun(ctx: CommandContext, arg: A): boolean;
  run(ctx: CommandContext, arg: A): void | Promise<void>;
}

export function defineCommand<A = void>(c: Command<A>): Command<A> {
  return c;
}
