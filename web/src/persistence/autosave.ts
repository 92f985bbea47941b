import type { EditorStore } from '../editor/store';
import { whenIdle } from '../idle';
import {
  LATEST_KEY,
  asDraft,
  boundHistory,
  cacheProjectJson,
  newId,
  newer,
  parseLatest,
  readLatest,
  readWal,
  rememberIdentity,
  savedAtMsOf,
  storedDraft,
  tabIdentity,
  walSavedAtMs,
  writeLatest,
  writeWal,
  WAL_PREFIX,
  type Draft,
  type KeyValueStore,
  type LatestSave,
  type TabIdentity,
} from './drafts';

export type { Draft } from './drafts';

const DB = 'linewright';
const STORE = 'drafts';
/** The single key drafts had before each tab kept its own; still read as a fallback. */
const LEGACY_KEY = 'current';
/** Drafts kept in IndexedDB; the oldest beyond this are dropped. */
const MAX_DRAFTS = 12;
/** How long opening the drawing waits for IndexedDB before starting without it. */
export const STORAGE_TIMEOUT_MS = 2500;
/** How long one IndexedDB write may take before autosave says it failed. */
const WRITE_TIMEOUT_MS = 10_000;

class StorageTimeout extends Error {}

function withTimeout<T>(p: Promise<T>, ms: number, what: string): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const t = setTimeout(() => reject(new StorageTimeout(`${what} did not answer within ${Math.round(ms / 1000)} s`)), ms);
    p.then(
      (v) => (clearTimeout(t), resolve(v)),
      (e: unknown) => (clearTimeout(t), reject(e instanceof Error ? e : new Error(String(e)))),
    );
  });
}

let dbPromise: Promise<IDBDatabase> | null = null;

function openDb(): Promise<IDBDatabase> {
  dbPromise ??= new Promise<IDBDatabase>((resolve, reject) => {
    const req = indexedDB.open(DB, 1);
    req.onupgradeneeded = () => req.result.createObjectStore(STORE);
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error ?? new Error('IndexedDB refused to open'));
  });
  // A failed open may succeed later (storage freed): ask again next time.
  dbPromise.catch(() => (dbPromise = null));
  return dbPromise;
}

async function tx<T>(mode: IDBTransactionMode, fn: (s: IDBObjectStore) => IDBRequest<T> | void): Promise<T | undefined> {
  const db = await openDb();
  return new Promise<T | undefined>((resolve, reject) => {
    const t = db.transaction(STORE, mode);
    const req = fn(t.objectStore(STORE));
    t.oncomplete = () => resolve(req ? req.result : undefined);
    t.onerror = () => reject(t.error ?? new Error('IndexedDB transaction failed'));
    t.onabort = () => reject(t.error ?? new Error('IndexedDB transaction aborted'));
  });
}

async function readIdbDraft(docId: string | null): Promise<Draft | null> {
  const v = await tx<unknown>('readonly', (s) => s.get(docId ?? LEGACY_KEY));
  if (v === undefined && docId !== null) return asDraft(await withText(await tx<unknown>('readonly', (s) => s.get(LEGACY_KEY))));
  return asDraft(await withText(v));
}

/** A stored draft whose text is a Blob (StoredDraft), with the text read out. */
async function withText(v: unknown): Promise<unknown> {
  const json = (v as { json?: unknown } | null | undefined)?.json;
  return json instanceof Blob ? { ...(v as object), json: await json.text() } : v;
}

async function writeIdbDraft(d: Draft): Promise<void> {
  const stored = storedDraft(d);
  await tx('readwrite', (s) => {
    s.put(stored, d.docId);
    // Keep the newest MAX_DRAFTS: every tab writes its own, so old tabs' copies would pile up. Only the
    // keys are read on every save; the drafts themselves (each a whole drawing) only when some must go.
    const keys = s.getAllKeys();
    keys.onsuccess = () => {
      if (keys.result.length <= MAX_DRAFTS) return;
      const all = s.getAll();
      // Requests of one transaction answer in order, over the same keys in the same order.
      all.onsuccess = () => {
        const drafts = (all.result as unknown[]).map((v, i) => ({ key: keys.result[i], savedAtMs: savedAtMsOf(v) }));
        drafts.sort((a, b) => b.savedAtMs - a.savedAtMs);
        for (const { key } of drafts.slice(MAX_DRAFTS)) if (key !== undefined && key !== d.docId) s.delete(key);
      };
    };
  });
}

function local(): KeyValueStore | null {
  try {
    return window.localStorage;
  } catch {
    return null;
  }
}

function session(): KeyValueStore | null {
  try {
    return window.sessionStorage;
  } catch {
    return null;
  }
}

export interface Restored {
  identity: TabIdentity;
  /** The drawing to open: this tab's own after a reload, else the newest saved in this browser. */
  draft: Draft | null;
  /** Set when IndexedDB did not answer or failed: the editor says so and starts anyway. */
  storageProblem: string | null;
}

/**
 * Finds the drawing to open. A reload finds its own tab's document (the write-ahead copy or IndexedDB's,
 * whichever is newer); a new tab starts from a copy of the newest draft, under an id of its own. An
 * IndexedDB that never answers costs at most STORAGE_TIMEOUT_MS, then the write-ahead copy (if any) or
 * the demo opens with a notice.
 */
export async function restoreSession(timeoutMs = STORAGE_TIMEOUT_MS): Promise<Restored> {
  const ls = local();
  const identity = tabIdentity(session());
  const source = identity.resumed ? identity.docId : (ls ? readLatest(ls)?.docId : null) ?? null;
  const wal = ls && source ? readWal(ls, source) : null;
  let idb: Draft | null = null;
  let storageProblem: string | null = null;
  try {
    idb = await withTimeout(readIdbDraft(source), timeoutMs, "This browser's storage (IndexedDB)");
  } catch (e) {
    storageProblem = e instanceof Error ? e.message : String(e);
  }
  const draft = newer(wal, idb);
  if (!identity.resumed && draft) identity.lineage = draft.lineage;
  rememberIdentity(session(), identity);
  return { identity, draft, storageProblem };
}

export interface AutosaveEvents {
  onSaved: (savedAtIso: string) => void;
  onError: (e: Error) => void;
  /** Another tab saved a later version of the same drawing. */
  onOtherTab: (other: LatestSave) => void;
}

/** Lets the "other tab" notice open that tab's version. */
export async function readDraftOf(docId: string): Promise<Draft | null> {
  const ls = local();
  const wal = ls ? readWal(ls, docId) : null;
  const idb = await withTimeout(readIdbDraft(docId), STORAGE_TIMEOUT_MS, "This browser's storage (IndexedDB)").catch(() => null);
  return newer(wal, idb);
}

/** Longest a burst of edits may hold the save back: then it is written at the next idle moment anyway. */
const MAX_SAVE_WAIT_MS = 2000;
/** Longest a due save waits for the page to be idle (a big drawing's copy takes tens of milliseconds). */
const IDLE_WAIT_MS = 1000;

/** Longest one idle moment spends writing the text of a drawing's elements before yielding. */
const SLICE_MS = 8;


/**
 * Saves the document after committed edits, with its undo history (bounded), once the editing pauses:
 * nothing of it runs on the input path. Two copies: a write-ahead copy in localStorage, written
 * synchronously, and IndexedDB, the store, written after it (serialized, a burst coalesced). Both are
 * written `delayMs` after the last edit, in an idle moment (a long burst of edits waits at most
 * MAX_SAVE_WAIT_MS), and the write-ahead copy again on pagehide / hidden, which survives a reload or a
 * closed tab that an asynchronous write would not. The write-ahead copy is dropped once IndexedDB
 * holds that version. Watches the other tabs through the `storage` event.
 */
export function startAutosave(store: EditorStore, identity: TabIdentity, events: AutosaveEvents, delayMs = 150): () => void {
  const ls = local();
  let pending: Draft | null = null;
  let writing = false;
  let timer: ReturnType<typeof setTimeout> | null = null;
  // Set from the first unsaved edit until the save that covers it starts.
  let dirtySince: number | null = null;
  let walDirty = false;
  // A drawing whose copy did not fit last time is not stringified on every edit again, only on leaving.
  let walTooBig = false;
  let lastStamp = 0;

  const snapshot = (): Draft => {
    // Strictly increasing, so the newer of two copies is never a tie.
    lastStamp = Math.max(Date.now(), lastStamp + 1);
    const s = store.getState();
    return { docId: identity.docId, lineage: identity.lineage, tabId: identity.tabId, savedAtMs: lastStamp, project: s.doc, history: boundHistory(store.historySnapshot()) };
  };

  /** The unsaved edits become the draft to write (taken now, not at every edit). */
  const takePending = () => {
    if (dirtySince === null) return;
    dirtySince = null;
    pending = snapshot();
    walDirty = true;
  };

  const writeAhead = (force: boolean) => {
    if (!walDirty || !ls || (walTooBig && !force)) return;
    walDirty = false;
    const d = pending ?? snapshot();
    walTooBig = !writeWal(ls, d);
    writeLatest(ls, d);
  };

  const flush = async () => {
    if (writing) return;
    writing = true;
    while (pending) {
      const d = pending;
      pending = null;
      try {
        await withTimeout(writeIdbDraft(d), WRITE_TIMEOUT_MS, "This browser's storage (IndexedDB)");
        stats.saves++;
        if (ls) {
          // IndexedDB now holds this version: the write-ahead copy is only needed if it is newer.
          const walAt = walSavedAtMs(ls, d.docId);
          if (walAt !== null && walAt <= d.savedAtMs) ls.removeItem(WAL_PREFIX + d.docId);
          writeLatest(ls, d);
        }
        events.onSaved(new Date(d.savedAtMs).toISOString());
      } catch (e) {
        events.onError(e instanceof Error ? e : new Error(String(e)));
      }
    }
    writing = false;
  };

  // Set while the text of a drawing's new elements is being made, a slice per idle moment.
  let slicing = false;
  const save = () => {
    timer = null;
    // Slices under way save the drawing as it is when they finish.
    if (slicing) return;
    slicing = true;
    const slice = () => {
      const end = performance.now() + SLICE_MS;
      if (!cacheProjectJson(store.getState().doc, () => performance.now() > end)) return whenIdle(slice, IDLE_WAIT_MS);
      slicing = false;
      takePending();
      writeAhead(false);
      // The IndexedDB copy (the drawing's text joined, then copied into the store) in an idle moment of its own.
      whenIdle(() => void flush(), IDLE_WAIT_MS);
    };
    slice();
  };

  stats.idle = () => timer === null && !slicing && dirtySince === null && !writing && pending === null;

  const off = store.onDocumentCommitted(() => {
    const now = Date.now();
    dirtySince ??= now;
    // Each edit pushes the save back, until the burst has waited long enough.
    if (timer !== null) {
      if (now - dirtySince >= MAX_SAVE_WAIT_MS) return;
      clearTimeout(timer);
    }
    timer = setTimeout(() => whenIdle(save, IDLE_WAIT_MS), delayMs);
  });

  // Leaving the page (reload, navigation, closing the tab): the synchronous copy first, then IndexedDB.
  const onHide = () => {
    takePending();
    writeAhead(true);
    if (timer !== null) {
      clearTimeout(timer);
      timer = null;
    }
    void flush();
  };
  const onVisibility = () => {
    if (document.visibilityState === 'hidden') onHide();
  };

  const onStorage = (e: StorageEvent) => {
    if (e.key !== LATEST_KEY) return;
    const other = parseLatest(e.newValue);
    if (!other || other.tabId === identity.tabId || other.lineage !== identity.lineage) return;
    if (other.docId === identity.docId) {
      // A duplicated tab carries the same document id: this tab forks to its own, so neither overwrites the other.
      identity.docId = newId();
      rememberIdentity(session(), identity);
      dirtySince ??= Date.now();
      takePending();
      writeAhead(true);
      void flush();
    }
    events.onOtherTab(other);
  };

  window.addEventListener('pagehide', onHide);
  document.addEventListener('visibilitychange', onVisibility);
  window.addEventListener('storage', onStorage);
  return () => {
    off();
    window.removeEventListener('pagehide', onHide);
    document.removeEventListener('visibilitychange', onVisibility);
    window.removeEventListener('storage', onStorage);
  };
}

export const stats = { saves: 0, idle: () => true };
