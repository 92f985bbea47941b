import type { Project } from '@linewright/core';
import type { EditorStore } from '../editor/store';

const DB = 'linewright';
const STORE = 'drafts';
const KEY = 'current';

export interface Draft {
  savedAt: string;
  project: Project;
}

function openDb(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open(DB, 1);
    req.onupgradeneeded = () => req.result.createObjectStore(STORE);
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
  });
}

async function tx<T>(mode: IDBTransactionMode, fn: (s: IDBObjectStore) => IDBRequest<T>): Promise<T> {
  const db = await openDb();
  try {
    return await new Promise<T>((resolve, reject) => {
      const t = db.transaction(STORE, mode);
      const req = fn(t.objectStore(STORE));
      t.oncomplete = () => resolve(req.result);
      t.onerror = () => reject(t.error);
      t.onabort = () => reject(t.error);
    });
  } finally {
    db.close();
  }
}

/** The last autosaved drawing of this browser, or null. */
export async function loadDraft(): Promise<Draft | null> {
  try {
    const v = await tx<unknown>('readonly', (s) => s.get(KEY));
    if (v && typeof v === 'object' && 'project' in v && 'savedAt' in v) return v as Draft;
    return null;
  } catch {
    return null;
  }
}

export async function saveDraft(project: Project): Promise<string> {
  const savedAt = new Date().toISOString();
  await tx('readwrite', (s) => s.put({ savedAt, project } satisfies Draft, KEY));
  return savedAt;
}

/**
 * Saves the document after every committed edit. The write waits a moment so
 * it does not compete with painting the edit and its verdicts; writes are
 * serialized and a burst of edits coalesces into one write of the newest
 * document.
 */
export function startAutosave(store: EditorStore, onSaved: (savedAt: string) => void, onError: (e: Error) => void, delayMs = 150): () => void {
  let pending: Project | null = null;
  let writing = false;
  let timer: ReturnType<typeof setTimeout> | null = null;
  const flush = async () => {
    if (writing) return;
    writing = true;
    while (pending) {
      const p = pending;
      pending = null;
      try {
        onSaved(await saveDraft(p));
        stats.saves++;
      } catch (e) {
        onError(e as Error);
      }
    }
    writing = false;
  };
  stats.idle = () => timer === null && !writing && pending === null;
  const off = store.onDocumentCommitted((s) => {
    pending = s.doc;
    if (timer !== null) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      void flush();
    }, delayMs);
  });
  // Leaving the page inside the delay still saves: IndexedDB finishes a write started in pagehide.
  const onHide = () => {
    if (timer !== null) {
      clearTimeout(timer);
      timer = null;
      void flush();
    }
  };
  window.addEventListener('pagehide', onHide);
  return () => {
    off();
    window.removeEventListener('pagehide', onHide);
  };
}

export const stats = { saves: 0, idle: () => true };
