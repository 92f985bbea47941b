import { applyPatches, enableArrayMethods, enablePatches, freeze, produceWithPatches, type Draft, type Patch } from 'immer';
import type { AnalysisReport, LoadError, Project, SheetSize } from '@linewright/core';
import { History, type HistoryIntent, type HistorySnapshot } from './history';

enablePatches();
// Array searches in a recipe (findIndex, some, find) read the base array instead of drafting each
// element they pass: one conductor replaced in a 10 000-conductor drawing costs about 2 ms, not 17.
enableArrayMethods();

/** What is selected on the drawing. View state: never saved, never undone. */
export interface Selection {
  nodes: readonly string[];
  conductors: readonly string[];
  busLinks: readonly string[];
}
export const EMPTY_SELECTION: Selection = Object.freeze({ nodes: [], conductors: [], busLinks: [] });

export type ConnectAs = 'conductor' | 'busLink';

/** The document's lists of elements, each element with an id. */
export type ElementList = 'nodes' | 'conductors' | 'busLinks';

/** The document list each kind of element lives in. */
export const LIST_OF: Record<'node' | 'conductor' | 'busLink', ElementList> = { node: 'nodes', conductor: 'conductors', busLink: 'busLinks' };

export interface Notice {
  id: number;
  tone: 'info' | 'error';
  text: string;
}

export interface ViewState {
  selection: Selection;
  snapToGrid: boolean;
  notices: readonly Notice[];
  /** Errors from the last file that failed to open; the drawing was kept. */
  loadErrors: { fileName: string; errors: LoadError[] } | null;
  cautionOpen: boolean;
  /** Positions of nodes while a drag is in flight; committed as one edit on release. */
  dragPositions: ReadonlyMap<string, { x: number; y: number }> | null;
  /** Sheet size of the exported permit PDF. */
  pdfSheet: SheetSize;
  /** Bumped to ask the canvas to frame these element ids. */
  frameRequest: { seq: number; nodeIds: readonly string[] } | null;
}

export interface EditorState {
  doc: Project;
  /** Bumped by every committed document change (edit, undo, redo, open). */
  docVersion: number;
  view: ViewState;
  report: AnalysisReport | null;
  /** docVersion the report was computed from. */
  reportVersion: number;
  analysisError: string | null;
  history: { undoLabel: string | null; redoLabel: string | null; undoDepth: number; redoDepth: number };
}

type Listener = () => void;

/**
 * The editor's one store: the Project document plus view state beside it.
 * Every document change goes through `edit`, which states its history intent
 * (tldraw's batch `history` option, excalidraw's captureUpdate). No React here,
 * so the same store drives the UI, the unit tests and the bench hook.
 */
export class EditorStore {
  private state: EditorState;
  private readonly history = new History();
  private readonly listeners = new Set<Listener>();
  private readonly docListeners = new Set<(s: EditorState) => void>();
  /**
   * Set by the analysis scheduler: when the check is fast it runs inside the
   * commit, so the edit and its verdicts reach the screen in one render.
   * Returns null to leave this commit to the asynchronous path.
   */
  inlineAnalysis: ((doc: Project) => { report: AnalysisReport | null; error: string | null } | null) | null = null;
  /**
   * Set while the document is read-only (review mode): given an edit's patches, returns why it is
   * refused, or null to let it through. Undo and redo ask it too.
   */
  guard: ((patches: readonly Patch[]) => string | null) | null = null;
  private noticeSeq = 0;
  private frameSeq = 0;

  constructor(doc: Project) {
    this.state = {
      doc,
      docVersion: 1,
      view: {
        selection: EMPTY_SELECTION,
        snapToGrid: true,
        notices: [],
        loadErrors: null,
        cautionOpen: false,
        dragPositions: null,
        frameRequest: null,
        pdfSheet: 'ansi-b',
      },
      report: null,
      reportVersion: 0,
      analysisError: null,
      history: this.historySummary(),
    };
  }

  getState = (): EditorState => this.state;

  subscribe = (l: Listener): (() => void) => {
    this.listeners.add(l);
    return () => this.listeners.delete(l);
  };

  /** Called after every committed document change (not for view changes). */
  onDocumentCommitted(l: (s: EditorState) => void): () => void {
    this.docListeners.add(l);
    return () => this.docListeners.delete(l);
  }

  private set(next: EditorState, docChanged: boolean): void {
    this.state = next;
    for (const l of this.listeners) l();
    if (docChanged) for (const l of this.docListeners) l(next);
  }

  private historySummary(): EditorState['history'] {
    return {
      undoLabel: this.history.undoLabel,
      redoLabel: this.history.redoLabel,
      undoDepth: this.history.undoDepth,
      redoDepth: this.history.redoDepth,
    };
  }

  /**
   * The one way to change the document. A recipe that changes nothing leaves
   * no undo step. Returns true when the document changed.
   */
  edit(label: string, recipe: (d: Draft<Project>) => void, intent: HistoryIntent = 'record'): boolean {
    const [next, redo, undo] = produceWithPatches(this.state.doc, recipe);
    if (redo.length === 0) return false;
    if (this.refused(redo)) return false;
    if (intent !== 'skip') this.history.push({ label, redo, undo }, intent === 'merge');
    this.commitDoc(next, undefined, replacesWhole(redo));
    return true;
  }

  /**
   * Replaces whole elements, each found by its id in its list: the same document, patches and undo step
   * as an `edit` whose recipe assigns `d[list][i] = value`, built without drafting. Immer's draft of a
   * 10 000-element list costs a copy, a patch pass and a freeze of every element slot (about 2 ms per
   * edit, and garbage); this costs one array copy per list touched. An element not in its list is
   * skipped; an id change is not a replacement (use `edit`, which carries the references). Returns true
   * when the document changed.
   */
  replaceElements(label: string, items: readonly { list: ElementList; value: { id: string } }[], intent: HistoryIntent = 'record'): boolean {
    const doc = this.state.doc;
    const copies: Partial<Record<ElementList, { id: string }[]>> = {};
    const redo: Patch[] = [];
    const undo: Patch[] = [];
    for (const { list, value } of items) {
      const base = doc[list] as readonly { id: string }[];
      const i = base.findIndex((x) => x.id === value.id);
      const copy = (copies[list] ??= base.slice());
      if (i < 0 || copy[i] === value) continue;
      undo.unshift({ op: 'replace', path: [list, i], value: copy[i] });
      redo.push({ op: 'replace', path: [list, i], value: freeze(value, true) });
      copy[i] = value;
    }
    if (redo.length === 0) return false;
    if (this.refused(redo)) return false;
    const next = { ...doc } as Record<string, unknown>;
    for (const [list, copy] of Object.entries(copies)) next[list] = Object.freeze(copy);
    if (intent !== 'skip') this.history.push({ label, redo, undo }, intent === 'merge');
    this.commitDoc(Object.freeze(next) as unknown as Project);
    return true;
  }

  /**
   * Commits a new document. A whole new document (a file opened, a drawing restored, the undo of either)
   * is drawn first with no report, every verdict shown as being checked, and checked after that paint:
   * its check is a whole analysis, which would otherwise hold back the drawing. Every other edit may be
   * checked inside the commit (inlineAnalysis).
   */
  private commitDoc(doc: Project, extra?: Partial<EditorState>, whole = false): void {
    const s = this.state;
    const docVersion = s.docVersion + 1;
    const view = { ...s.view, selection: pruneSelection(s.view.selection, doc, s.doc), dragPositions: null };
    const checked = whole ? null : this.inlineAnalysis?.(doc);
    const report = checked ? { report: checked.report, reportVersion: docVersion, analysisError: checked.error } : whole ? { report: null, analysisError: null } : {};
    this.set({ ...s, ...extra, ...report, doc, docVersion, view, history: this.historySummary() }, true);
  }

  private refused(patches: readonly Patch[]): boolean {
    const why = this.guard?.(patches);
    if (!why) return false;
    this.notify(why, 'error');
    if (this.state.view.dragPositions) this.setView({ dragPositions: null });
    return true;
  }

  undo(): boolean {
    const e = this.history.takeUndo();
    if (!e) return false;
    if (this.refused(e.undo)) {
      this.history.takeRedo();
      return false;
    }
    this.commitDoc(applyPatches(this.state.doc, e.undo), undefined, replacesWhole(e.undo));
    return true;
  }

  redo(): boolean {
    const e = this.history.takeRedo();
    if (!e) return false;
    if (this.refused(e.redo)) {
      this.history.takeUndo();
      return false;
    }
    this.commitDoc(applyPatches(this.state.doc, e.redo), undefined, replacesWhole(e.redo));
    return true;
  }

  /**
   * Replace the whole document (open a file, new drawing) as one undoable step: the step an `edit` whose
   * recipe returns `doc` records, built without immer's produce, whose finalize pass over every object of
   * the new document cost 100–170 ms at 10 000 conductors in Node (about half a second in the page) before
   * the drawing could be painted. The document is deep-frozen as produce would leave it (30 ms there).
   */
  replaceDocument(label: string, doc: Project, intent: HistoryIntent = 'record'): void {
    const before = this.state.doc;
    if (doc !== before) {
      const redo: Patch[] = [{ op: 'replace', path: [], value: doc }];
      const undo: Patch[] = [{ op: 'replace', path: [], value: before }];
      if (this.refused(redo)) return;
      freeze(doc, true);
      if (intent !== 'skip') this.history.push({ label, redo, undo }, intent === 'merge');
      this.commitDoc(doc, undefined, true);
    }
    this.setSelection(EMPTY_SELECTION);
  }

  /** Start afresh (first load, restore from autosave), with no history or the history saved with the document. */
  resetDocument(doc: Project, history?: HistorySnapshot): void {
    this.history.clear();
    if (history) this.history.restore(history);
    this.commitDoc(doc, { view: { ...this.state.view, selection: EMPTY_SELECTION } }, true);
  }

  /** The undo and redo stacks, for the autosave to keep beside the document. */
  historySnapshot(): HistorySnapshot {
    return this.history.snapshot();
  }

  setView(patch: Partial<ViewState>): void {
    this.set({ ...this.state, view: { ...this.state.view, ...patch } }, false);
  }

  setSelection(selection: Selection): void {
    const cur = this.state.view.selection;
    if (sameSelection(cur, selection)) return;
    this.setView({ selection });
  }

  setReport(report: AnalysisReport | null, forVersion: number, error: string | null = null): void {
    this.set({ ...this.state, report, reportVersion: forVersion, analysisError: error }, false);
  }

  notify(text: string, tone: Notice['tone'] = 'info'): number {
    const id = ++this.noticeSeq;
    this.setView({ notices: [...this.state.view.notices, { id, tone, text }].slice(-4) });
    return id;
  }

  dismissNotice(id: number): void {
    this.setView({ notices: this.state.view.notices.filter((n) => n.id !== id) });
  }

  requestFrame(nodeIds: readonly string[]): void {
    this.setView({ frameRequest: { seq: ++this.frameSeq, nodeIds } });
  }
}

/** True when the patches replace the whole document (open, restore, or the undo of one). */
function replacesWhole(patches: readonly Patch[]): boolean {
  return patches.some((p) => p.path.length === 0);
}

function sameList(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((x, i) => x === b[i]);
}

export function sameSelection(a: Selection, b: Selection): boolean {
  return sameList(a.nodes, b.nodes) && sameList(a.conductors, b.conductors) && sameList(a.busLinks, b.busLinks);
}

/** Past this many selected ids in one list, their list's ids are put in a set once rather than searched for each. */
const SEARCH_AT_MOST = 16;

/**
 * Drop selected ids that no longer exist (after delete, undo). A list the commit left as it was (the same
 * array as in `before`) is not read, and a few ids are searched for where they are: the usual edit of the
 * selected element made sets of every id of the drawing on each commit (40 000 ids at 10 000 conductors).
 */
function pruneSelection(sel: Selection, doc: Project, before: Project): Selection {
  if (sel.nodes.length + sel.conductors.length + sel.busLinks.length === 0) return sel;
  const kept = (ids: readonly string[], list: readonly { id: string }[], was: readonly { id: string }[]): readonly string[] => {
    if (ids.length === 0 || list === was) return ids;
    if (ids.length <= SEARCH_AT_MOST) return ids.filter((id) => list.some((x) => x.id === id));
    const all = new Set(list.map((x) => x.id));
    return ids.filter((id) => all.has(id));
  };
  const next = {
    nodes: kept(sel.nodes, doc.nodes, before.nodes),
    conductors: kept(sel.conductors, doc.conductors, before.conductors),
    busLinks: kept(sel.busLinks, doc.busLinks, before.busLinks),
  };
  return sameSelection(next, sel) ? sel : next;
}

export function isEmptySelection(s: Selection): boolean {
  return s.nodes.length === 0 && s.conductors.length === 0 && s.busLinks.length === 0;
}
