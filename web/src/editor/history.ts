import type { Patch } from 'immer';

/** How an edit touches the undo stack (compare excalidraw's captureUpdate). */
export type HistoryIntent = 'record' | 'merge' | 'skip';

export interface HistoryEntry {
  label: string;
  redo: Patch[];
  undo: Patch[];
}

/** The undo and redo stacks as plain data: `past` oldest first, `future` with the next redo last. */
export interface HistorySnapshot {
  past: HistoryEntry[];
  future: HistoryEntry[];
}

/**
 * Undo/redo stacks of immer patches. Merging appends redo patches and
 * prepends undo patches so the merged entry replays as one step.
 */
export class History {
  private past: HistoryEntry[] = [];
  private future: HistoryEntry[] = [];
  constructor(private readonly limit = 500) {}

  push(entry: HistoryEntry, merge = false): void {
    const last = this.past[this.past.length - 1];
    if (merge && last) {
      last.redo = [...last.redo, ...entry.redo];
      last.undo = [...entry.undo, ...last.undo];
    } else {
      this.past.push(entry);
      if (this.past.length > this.limit) this.past.shift();
    }
    this.future = [];
  }

  /** Takes the entry to undo and moves it to the redo stack. */
  takeUndo(): HistoryEntry | undefined {
    const e = this.past.pop();
    if (e) this.future.push(e);
    return e;
  }

  takeRedo(): HistoryEntry | undefined {
    const e = this.future.pop();
    if (e) this.past.push(e);
    return e;
  }

  clear(): void {
    this.past = [];
    this.future = [];
  }

  /** Both stacks, oldest first, for saving beside the document (the entries are not copied). */
  snapshot(): HistorySnapshot {
    return { past: [...this.past], future: [...this.future] };
  }

  /** Replaces both stacks with saved ones (after a reload), keeping the newest within the limit. */
  restore(saved: HistorySnapshot): void {
    this.past = saved.past.slice(-this.limit);
    this.future = saved.future.slice(-this.limit);
  }

  get undoLabel(): string | null {
    return this.past[this.past.length - 1]?.label ?? null;
  }
  get redoLabel(): string | null {
    return this.future[this.future.length - 1]?.label ?? null;
  }
  get undoDepth(): number {
    return this.past.length;
  }
  get redoDepth(): number {
    return this.future.length;
  }
}
