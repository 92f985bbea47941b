import type { Project } from '@linewright/core';
import type { HistoryEntry, HistorySnapshot } from '../editor/history';

/**
 * What the autosave keeps, and the write-ahead copy beside IndexedDB. No DOM globals here: the
 * storages are passed in, so the rules (which copy wins, how big a copy may get) are unit-tested.
 *
 * A drawing saved in this browser is a Draft. Each tab edits its own document (`docId`, kept in the
 * tab's sessionStorage so a reload finds it again); a tab opened later starts from a copy of the newest
 * draft under a new id, with the same `lineage`, so two tabs never write over each other, and each can
 * tell when another tab saved a later version of the same drawing.
 */
export interface Draft {
  docId: string;
  /** The document this one was copied from, through any number of tabs; equal lineages are "the same drawing". */
  lineage: string;
  /** The tab (one page load) that wrote it. */
  tabId: string;
  savedAtMs: number;
  project: Project;
  /** Undo and redo steps, bounded (see boundHistory); absent when they did not fit. */
  history?: HistorySnapshot;
}

/** Who saved last, in any tab: small, so every tab can watch it through the `storage` event. */
export interface LatestSave {
  docId: string;
  lineage: string;
  tabId: string;
  savedAtMs: number;
}

export const WAL_PREFIX = 'linewright.wal.';
export const LATEST_KEY = 'linewright.latest';
export const SESSION_DOC_KEY = 'linewright.docId';
export const SESSION_LINEAGE_KEY = 'linewright.lineage';

/**
 * Largest write-ahead copy kept in localStorage, in UTF-16 characters. Browsers give an origin about
 * 5 M characters there and several tabs share it; a bigger drawing is saved to IndexedDB only.
 */
export const WAL_MAX_CHARS = 1_500_000;
/** Budget of the saved undo history, in characters of JSON, and its most steps. */
export const HISTORY_MAX_CHARS = 400_000;
export const HISTORY_MAX_STEPS = 100;

/** The part of the Web Storage API used here (localStorage, sessionStorage, or a Map in tests). */
export interface KeyValueStore {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
  key(index: number): string | null;
  readonly length: number;
}

export function newId(): string {
  const c = globalThis.crypto;
  if (c && 'randomUUID' in c) return c.randomUUID();
  return `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;
}

/** JSON of a history step, remembered while the step is the same (a merge gives it new patch lists). */
const entryTexts = new WeakMap<HistoryEntry, { label: string; redo: unknown; undo: unknown; text: string }>();
function entryJson(e: HistoryEntry): string {
  const hit = entryTexts.get(e);
  if (hit && hit.label === e.label && hit.redo === e.redo && hit.undo === e.undo) return hit.text;
  const text = JSON.stringify(e);
  entryTexts.set(e, { label: e.label, redo: e.redo, undo: e.undo, text });
  return text;
}

/**
 * JSON of a document's lists and their elements, by object. The editor's documents are immutable and
 * an edit shares every untouched element (and list) with the document before, so a save writes the
 * text of the edited elements and joins the rest: at 10 000 conductors about a millisecond instead of
 * serialising (or structured-cloning, for IndexedDB) the whole drawing on the main thread.
 */
const jsonTexts = new WeakMap<object, string>();
function cachedJson(v: unknown): string {
  if (v === null || typeof v !== 'object') return JSON.stringify(v) ?? 'null';
  let text = jsonTexts.get(v);
  if (text === undefined) {
    text = Array.isArray(v) ? `[${v.map(cachedJson).join(',')}]` : JSON.stringify(v);
    jsonTexts.set(v, text);
  }
  return text;
}

const jsonSizes = new WeakMap<object, number>();

/**
 * The length of `JSON.stringify(v)` for plain data, read off the remembered texts of elements and the
 * remembered sizes of frozen objects, with nothing joined; once it passes `limit` it returns at once
 * with some length past it. The size of a step that replaced a whole 10 000-conductor drawing (an open)
 * is known this way in a millisecond, where its text took 30 ms only to learn it does not fit.
 */
export function jsonSize(v: unknown, limit = Infinity): number {
  if (v === undefined || typeof v === 'function') return 0;
  if (v === null || typeof v !== 'object') return JSON.stringify(v).length;
  const known = jsonTexts.get(v)?.length ?? jsonSizes.get(v);
  if (known !== undefined) return known;
  if (typeof (v as { toJSON?: unknown }).toJSON === 'function') return JSON.stringify(v).length;
  let n = 1;
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const x: unknown = v[i];
      n += (i ? 1 : 0) + (x === undefined || typeof x === 'function' ? 4 : jsonSize(x, limit - n));
      if (n > limit) return n;
    }
  } else {
    let first = true;
    for (const [k, x] of Object.entries(v)) {
      if (x === undefined || typeof x === 'function') continue;
      n += (first ? 0 : 1) + JSON.stringify(k).length + 1 + jsonSize(x, limit - n);
      first = false;
      if (n > limit) return n;
    }
  }
  n += 1;
  // The document and its elements are frozen; a history step's lists are not (a merge replaces them).
  if (Object.isFrozen(v)) jsonSizes.set(v, n);
  return n;
}

/**
 * Writes the texts of the project's elements that have none yet, then the Blob pieces of draftBlob that
 * changed, until `timeUp()` says to stop; true when all are there (projectJson is then a join, draftBlob a
 * composition). A drawing just opened has none: its
 * text is made a slice at a time in idle moments instead of in one task that input would wait behind.
 */
export function cacheProjectJson(p: Project, timeUp: () => boolean): boolean {
  let n = 0;
  for (const value of Object.values(p)) {
    if (!Array.isArray(value) || jsonTexts.has(value)) continue;
    for (const e of value as unknown[]) {
      if (e === null || typeof e !== 'object' || jsonTexts.has(e)) continue;
      jsonTexts.set(e, JSON.stringify(e));
      if (++n % 64 === 0 && timeUp()) return false;
    }
  }
  // Then the pieces of IndexedDB's copy (draftBlob) that changed, one at a time: a Blob is copied out of the page as it is made.
  for (const value of Object.values(p)) {
    if (!Array.isArray(value)) continue;
    for (let i = 0; i < value.length; i += PIECE) {
      if (pieceAt(value, i, false)) continue;
      pieceAt(value, i, true);
      if (timeUp()) return false;
    }
  }
  return true;
}

/** `JSON.stringify(project)`, joined from the texts of the lists and elements it shares with documents saved before. */
export function projectJson(p: Project): string {
  const parts: string[] = [];
  for (const [key, value] of Object.entries(p)) {
    if (value === undefined || typeof value === 'function') continue;
    parts.push(`${JSON.stringify(key)}:${Array.isArray(value) ? cachedJson(value) : JSON.stringify(value)}`);
  }
  return `{${parts.join(',')}}`;
}

/** `JSON.stringify(draft)` (without its history when `withHistory` is false), from the remembered texts. */
export function draftJson(d: Draft, withHistory = true): string {
  const head = JSON.stringify({ docId: d.docId, lineage: d.lineage, tabId: d.tabId, savedAtMs: d.savedAtMs });
  const history = withHistory && d.history ? `,"history":{"past":[${d.history.past.map(entryJson).join(',')}],"future":[${d.history.future.map(entryJson).join(',')}]}` : '';
  return `${head.slice(0, -1)},"project":${projectJson(d.project)}${history}}`;
}

/**
 * A draft as IndexedDB keeps it: its JSON text and the time, read without parsing. The text is a Blob
 * (draftBlob) since a big drawing's joined text cost 40–70 ms of one task to make and copy in; drafts
 * written before keep a string, and both read back.
 */
export interface StoredDraft {
  savedAtMs: number;
  json: string | Blob;
}

export function storedDraft(d: Draft): StoredDraft {
  return { savedAtMs: d.savedAtMs, json: draftBlob(d) };
}

/** Elements of a list whose texts make one Blob piece of the draft. */
const PIECE = 512;
/** A piece of a list's text: the elements it was written from, and the Blob. Found by its first element. */
const pieces = new WeakMap<object, { elements: readonly unknown[]; blob: Blob }>();

/** The Blob of the elements of `list` from `i` (a piece), kept from an earlier draft while they are the same objects; made when `make`. */
function pieceAt(list: readonly unknown[], i: number, make: boolean): Blob | null {
  const end = Math.min(list.length, i + PIECE);
  const first = list[i];
  const key = typeof first === 'object' && first !== null ? first : null;
  const hit = key ? pieces.get(key) : undefined;
  if (hit && hit.elements.length === end - i && hit.elements.every((e, j) => e === list[i + j])) return hit.blob;
  if (!make) return null;
  const elements = list.slice(i, end);
  const blob = new Blob([elements.map(cachedJson).join(',')]);
  if (key) pieces.set(key, { elements, blob });
  return blob;
}

/**
 * `draftJson(d)` as a Blob, composed of pieces of a few hundred elements each: after an edit only the
 * piece holding the edited element is made again, the rest are the Blobs of the draft before (a Blob of
 * Blobs copies nothing), so a save of 10 000 conductors writes about 100 kB of text on the main thread
 * instead of joining 10 MB; IndexedDB copies the Blob into the store off it.
 */
export function draftBlob(d: Draft): Blob {
  const head = JSON.stringify({ docId: d.docId, lineage: d.lineage, tabId: d.tabId, savedAtMs: d.savedAtMs });
  const parts: (string | Blob)[] = [`${head.slice(0, -1)},"project":{`];
  let first = true;
  for (const [key, value] of Object.entries(d.project)) {
    if (value === undefined || typeof value === 'function') continue;
    parts.push(`${first ? '' : ','}${JSON.stringify(key)}:`);
    first = false;
    if (!Array.isArray(value)) {
      parts.push(JSON.stringify(value));
      continue;
    }
    parts.push('[');
    for (let i = 0; i < value.length; i += PIECE) {
      if (i) parts.push(',');
      parts.push(pieceAt(value, i, true)!);
    }
    parts.push(']');
  }
  const history = d.history ? `,"history":{"past":[${d.history.past.map(entryJson).join(',')}],"future":[${d.history.future.map(entryJson).join(',')}]}` : '';
  parts.push(`}${history}}`);
  return new Blob(parts, { type: 'application/json' });
}

/** When a stored value was saved (0 when it is not a draft), without reading the drawing. */
export function savedAtMsOf(v: unknown): number {
  if (!v || typeof v !== 'object') return 0;
  const d = v as { savedAtMs?: unknown; savedAt?: unknown };
  return typeof d.savedAtMs === 'number' ? d.savedAtMs : typeof d.savedAt === 'string' ? Date.parse(d.savedAt) || 0 : 0;
}

/**
 * The newest undo steps (and redo steps) that fit the budget, newest kept first: an old step is worth
 * less than a recent one, and a step that replaced the whole drawing can be large.
 */
export function boundHistory(h: HistorySnapshot, maxChars = HISTORY_MAX_CHARS, maxSteps = HISTORY_MAX_STEPS): HistorySnapshot {
  let budget = maxChars;
  const take = (entries: readonly HistoryEntry[]): HistoryEntry[] => {
    const kept: HistoryEntry[] = [];
    for (let i = entries.length - 1; i >= 0 && kept.length < maxSteps; i--) {
      const size = jsonSize(entries[i], budget);
      if (size > budget) break;
      budget -= size;
      kept.push(entries[i]!);
    }
    return kept.reverse();
  };
  const past = take(h.past);
  // Redo steps only when they continue from the kept undo steps (they always do: they are newer).
  const future = take(h.future);
  return { past, future };
}

/** A stored value read back as a Draft, or null when it is not one (another version, a broken write). */
export function asDraft(v: unknown): Draft | null {
  if (!v || typeof v !== 'object') return null;
  // IndexedDB's copy since drafts are stored as text (StoredDraft; a Blob's text is read by its caller first).
  const json = (v as Partial<StoredDraft>).json;
  if (typeof json === 'string') {
    try {
      return asDraft(JSON.parse(json));
    } catch {
      return null;
    }
  }
  const d = v as Partial<Draft> & { savedAt?: string };
  if (!d.project || typeof d.project !== 'object') return null;
  // Drafts written before tabs had ids: { savedAt, project }.
  const savedAtMs = savedAtMsOf(d);
  const history = d.history && Array.isArray(d.history.past) && Array.isArray(d.history.future) ? d.history : undefined;
  return {
    docId: typeof d.docId === 'string' ? d.docId : 'legacy',
    lineage: typeof d.lineage === 'string' ? d.lineage : typeof d.docId === 'string' ? d.docId : 'legacy',
    tabId: typeof d.tabId === 'string' ? d.tabId : '',
    savedAtMs,
    project: d.project,
    history,
  };
}

/** The newer of two copies of a draft (the write-ahead copy and IndexedDB's). */
export function newer(a: Draft | null, b: Draft | null): Draft | null {
  if (!a) return b;
  if (!b) return a;
  return b.savedAtMs > a.savedAtMs ? b : a;
}

export function readWal(store: KeyValueStore, docId: string): Draft | null {
  try {
    const text = store.getItem(WAL_PREFIX + docId);
    return text ? asDraft(JSON.parse(text)) : null;
  } catch {
    return null;
  }
}

/** When this document's write-ahead copy was saved, read off the head of its text (the whole drawing is not parsed); null when there is none. */
export function walSavedAtMs(store: KeyValueStore, docId: string): number | null {
  try {
    const text = store.getItem(WAL_PREFIX + docId);
    if (!text) return null;
    const head = /^\{"docId":"[^"]*","lineage":"[^"]*","tabId":"[^"]*","savedAtMs":(\d+)[,}]/.exec(text.slice(0, 400));
    return head ? Number(head[1]) : (readWal(store, docId)?.savedAtMs ?? null);
  } catch {
    return null;
  }
}

/**
 * Writes the write-ahead copy synchronously (this is what survives a reload 50 ms after an edit, when an
 * IndexedDB write started in pagehide does not finish). Drops the history, then the whole copy, when it
 * would pass the bound; when the storage is full, older copies of other documents go first.
 * Returns false when no copy could be kept.
 */
export function writeWal(store: KeyValueStore, draft: Draft, maxChars = WAL_MAX_CHARS): boolean {
  // A drawing past the bound on its own is not joined into a text only to be dropped.
  let text = jsonSize(draft.project, maxChars) > maxChars ? '' : draftJson(draft);
  if (text.length > maxChars && draft.history) text = draftJson(draft, false);
  if (text === '' || text.length > maxChars) {
    store.removeItem(WAL_PREFIX + draft.docId);
    return false;
  }
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      store.setItem(WAL_PREFIX + draft.docId, text);
      return true;
    } catch {
      // Quota: make room by dropping other documents' copies (IndexedDB keeps their saved versions).
      for (const key of walKeys(store)) if (key !== WAL_PREFIX + draft.docId) store.removeItem(key);
    }
  }
  return false;
}

export function walKeys(store: KeyValueStore): string[] {
  const keys: string[] = [];
  for (let i = 0; i < store.length; i++) {
    const k = store.key(i);
    if (k?.startsWith(WAL_PREFIX)) keys.push(k);
  }
  return keys;
}

export function readLatest(store: KeyValueStore): LatestSave | null {
  try {
    return parseLatest(store.getItem(LATEST_KEY));
  } catch {
    return null;
  }
}

export function parseLatest(text: string | null): LatestSave | null {
  if (!text) return null;
  try {
    const v = JSON.parse(text) as Partial<LatestSave>;
    if (typeof v.docId !== 'string' || typeof v.lineage !== 'string' || typeof v.tabId !== 'string' || typeof v.savedAtMs !== 'number') return null;
    return v as LatestSave;
  } catch {
    return null;
  }
}

export function writeLatest(store: KeyValueStore, d: Pick<Draft, 'docId' | 'lineage' | 'tabId' | 'savedAtMs'>): void {
  try {
    store.setItem(LATEST_KEY, JSON.stringify({ docId: d.docId, lineage: d.lineage, tabId: d.tabId, savedAtMs: d.savedAtMs } satisfies LatestSave));
  } catch {
    // Full storage: the pointer is a convenience (which draft a new tab opens); the drafts themselves are kept.
  }
}

/** This tab's document: the one it had before a reload, or a new id for a new tab (lineage given by the copy it starts from). */
export interface TabIdentity {
  docId: string;
  lineage: string;
  tabId: string;
  /** True when the tab had a document before (a reload, or a duplicated tab). */
  resumed: boolean;
}

export function tabIdentity(session: KeyValueStore | null): TabIdentity {
  let docId: string | null = null;
  let lineage: string | null = null;
  try {
    docId = session?.getItem(SESSION_DOC_KEY) ?? null;
    lineage = session?.getItem(SESSION_LINEAGE_KEY) ?? null;
  } catch {
    // No session storage: a new document for this tab.
  }
  const resumed = docId !== null;
  const id = docId ?? newId();
  return { docId: id, lineage: lineage ?? id, tabId: newId(), resumed };
}

export function rememberIdentity(session: KeyValueStore | null, id: Pick<TabIdentity, 'docId' | 'lineage'>): void {
  try {
    session?.setItem(SESSION_DOC_KEY, id.docId);
    session?.setItem(SESSION_LINEAGE_KEY, id.lineage);
  } catch {
    // No session storage (private mode quirks): the tab then starts from the newest draft after a reload.
  }
}
