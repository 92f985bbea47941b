import { describe, expect, it } from 'vitest';
import { emptyProject } from '../../web/src/editor/commands/newDrawing';
import { EditorStore } from '../../web/src/editor/store';
import {
  LATEST_KEY,
  WAL_PREFIX,
  asDraft,
  boundHistory,
  cacheProjectJson,
  draftBlob,
  draftJson,
  jsonSize,
  projectJson,
  savedAtMsOf,
  storedDraft,
  walSavedAtMs,
  newer,
  readLatest,
  readWal,
  tabIdentity,
  rememberIdentity,
  writeLatest,
  writeWal,
  type Draft,
  type KeyValueStore,
} from '../../web/src/persistence/drafts';
import { harness, drawTap } from './harness';
import { addEquipment } from '../../web/src/editor/commands';

/** Web Storage over a Map, with an optional quota in characters like a browser's. */
function memoryStorage(quota = Infinity): KeyValueStore & { map: Map<string, string> } {
  const map = new Map<string, string>();
  return {
    map,
    getItem: (k) => map.get(k) ?? null,
    setItem: (k, v) => {
      let used = 0;
      for (const [key, val] of map) if (key !== k) used += key.length + val.length;
      if (used + k.length + v.length > quota) throw new Error('QuotaExceededError');
      map.set(k, v);
    },
    removeItem: (k) => void map.delete(k),
    key: (i) => [...map.keys()][i] ?? null,
    get length() {
      return map.size;
    },
  };
}

const draft = (over: Partial<Draft> = {}): Draft => ({ docId: 'd1', lineage: 'd1', tabId: 't1', savedAtMs: 1000, project: emptyProject(), ...over });

describe('write-ahead copy of the drawing (localStorage)', () => {
  it('round-trips a draft with its undo history, and the newer of two copies wins', () => {
    const ls = memoryStorage();
    const h = harness();
    drawTap(h, { lengthFt: 20 });
    const d = draft({ project: h.doc(), history: boundHistory(h.store.historySnapshot()) });
    expect(writeWal(ls, d)).toBe(true);
    const back = readWal(ls, 'd1')!;
    expect(back.project).toEqual(h.doc());
    expect(back.history!.past.length).toBe(h.store.getState().history.undoDepth);
    expect(newer(back, { ...back, savedAtMs: 999 })).toBe(back);
    expect(newer({ ...back, savedAtMs: 999 }, back)).toBe(back);
    expect(newer(null, back)).toBe(back);
  });

  it('is written from remembered texts: the same JSON as a whole serialisation, before and after an edit', async () => {
    const ls = memoryStorage();
    const h = harness();
    const { tapId } = drawTap(h, { lengthFt: 20 });
    const d = draft({ project: h.doc(), history: boundHistory(h.store.historySnapshot()) });
    expect(JSON.parse(draftJson(d))).toEqual(JSON.parse(JSON.stringify(d)));
    expect(projectJson(h.doc())).toBe(JSON.stringify(h.doc()));
    const tap = { ...h.doc().conductors.find((c) => c.id === tapId)!, lengthFt: 31 };
    h.store.replaceElements('Set length', [{ list: 'conductors', value: tap }]);
    expect(projectJson(h.doc())).toBe(JSON.stringify(h.doc()));
    const later = draft({ project: h.doc(), history: boundHistory(h.store.historySnapshot()), savedAtMs: 2000 });
    expect(writeWal(ls, later)).toBe(true);
    expect(walSavedAtMs(ls, 'd1')).toBe(2000);
    expect(readWal(ls, 'd1')!.project.conductors.find((c) => c.id === tapId)!.lengthFt).toBe(31);
    // IndexedDB's copy is the same text, as a Blob; drafts stored as a string or as objects before still read.
    const stored = storedDraft(later);
    expect(savedAtMsOf(stored)).toBe(2000);
    expect(stored.json).toBeInstanceOf(Blob);
    const text = await (stored.json as Blob).text();
    expect(text).toBe(draftJson(later));
    expect(asDraft({ ...stored, json: text })).toEqual(asDraft(JSON.parse(JSON.stringify(later))));
    expect(asDraft(later)!.project).toBe(later.project);
    expect(asDraft({ savedAtMs: 5, json: '{broken' })).toBeNull();
  });

  it('the IndexedDB copy is composed of pieces kept between saves, and is always the whole serialisation', async () => {
    const h = harness();
    for (let i = 0; i < 1100; i++) addEquipment.run(h.ctx, { kind: 'load' });
    const texts = async () => (await draftBlob(draft({ project: h.doc() })).text());
    expect(await texts()).toBe(draftJson(draft({ project: h.doc() })));
    // An element changed in the first piece, in the last (short) piece, one added, one removed: each save is the whole text.
    const nodes = h.doc().nodes;
    for (const at of [3, 1050]) {
      const renamed = { ...nodes[at]!, label: `L-${at}` };
      h.store.replaceElements('Rename', [{ list: 'nodes', value: renamed }]);
      expect(await texts()).toBe(JSON.stringify(draft({ project: h.doc() })));
    }
    addEquipment.run(h.ctx, { kind: 'load' });
    expect(await texts()).toBe(JSON.stringify(draft({ project: h.doc() })));
    h.store.undo();
    h.store.undo();
    expect(await texts()).toBe(JSON.stringify(draft({ project: h.doc() })));
    expect(JSON.parse(await texts()).project.nodes).toHaveLength(1100);
  });

  it('the text of a drawing just opened is made in slices, and the slices add up to the whole serialisation', () => {
    const h = harness();
    for (let i = 0; i < 200; i++) addEquipment.run(h.ctx, { kind: 'load' });
    const doc = h.doc();
    let slices = 0;
    // Time is up after every 64 elements and after each Blob piece of 512: 200 pieces take four slices of texts, the fourth ending with their one piece.
    while (!cacheProjectJson(doc, () => true)) slices++;
    expect(slices).toBe(4);
    expect(cacheProjectJson(doc, () => true)).toBe(true);
    expect(projectJson(doc)).toBe(JSON.stringify(doc));
  });

  it('the restored history undoes the edits it was saved with, step by step', () => {
    const h = harness();
    const { tapId } = drawTap(h, { lengthFt: 20 });
    const saved = JSON.parse(JSON.stringify({ doc: h.doc(), history: boundHistory(h.store.historySnapshot()) }));
    const fresh = new EditorStore(emptyProject());
    fresh.resetDocument(saved.doc, saved.history);
    expect(fresh.getState().history.undoDepth).toBe(h.store.getState().history.undoDepth);
    fresh.undo();
    h.store.undo();
    expect(fresh.getState().doc).toEqual(h.doc());
    while (fresh.undo()) h.store.undo();
    expect(fresh.getState().doc.conductors.find((c) => c.id === tapId)).toBeUndefined();
    expect(fresh.getState().doc).toEqual(h.doc());
    expect(fresh.redo()).toBe(true);
  });

  it('is bounded: history is dropped first, then the whole copy, never past the limit', () => {
    const ls = memoryStorage();
    const h = harness();
    drawTap(h, { lengthFt: 20 });
    const d = draft({ project: h.doc(), history: boundHistory(h.store.historySnapshot()) });
    const full = JSON.stringify(d).length;
    const bare = JSON.stringify({ ...d, history: undefined }).length;
    expect(writeWal(ls, d, bare + 10)).toBe(true);
    expect(readWal(ls, 'd1')!.history).toBeUndefined();
    expect(full).toBeGreaterThan(bare);
    expect(writeWal(ls, d, bare - 1)).toBe(false);
    expect(ls.map.has(`${WAL_PREFIX}d1`)).toBe(false);
  });

  it('a full storage gives up other documents’ copies before this one', () => {
    const size = JSON.stringify(draft()).length + `${WAL_PREFIX}d1`.length;
    const ls = memoryStorage(size + 900);
    ls.setItem(`${WAL_PREFIX}old`, 'x'.repeat(1000));
    expect(writeWal(ls, draft())).toBe(true);
    expect(ls.map.has(`${WAL_PREFIX}old`)).toBe(false);
    expect(readWal(ls, 'd1')).not.toBeNull();
  });

  it('knows the length of a step’s or a drawing’s JSON without writing it, and stops counting past a limit', () => {
    const h = harness();
    drawTap(h, { lengthFt: 20 });
    const doc = h.doc();
    // Before and after the elements' texts are remembered, over the document, its undo steps and odd values.
    for (const v of [doc, h.store.historySnapshot(), { a: undefined, b: [undefined, 1, 'q"\u00e9'], c: null, d: 2.5e-7 }]) expect(jsonSize(v)).toBe(JSON.stringify(v).length);
    cacheProjectJson(doc, () => false);
    expect(jsonSize(doc)).toBe(JSON.stringify(doc).length);
    const opened = new EditorStore(emptyProject());
    opened.replaceDocument('Open', doc);
    const step = opened.historySnapshot().past[0]!;
    expect(jsonSize(step)).toBe(JSON.stringify(step).length);
    const cut = jsonSize(step, 100);
    expect(cut).toBeGreaterThan(100);
    expect(cut).toBeLessThan(JSON.stringify(step).length);
    expect(boundHistory(opened.historySnapshot(), 100).past).toEqual([]);
  });

  it('keeps the newest undo steps within the step and size budgets', () => {
    const entry = (n: number) => ({ label: `e${n}`, redo: [{ op: 'replace' as const, path: ['x'], value: 'y'.repeat(100) }], undo: [] });
    const past = Array.from({ length: 300 }, (_, i) => entry(i));
    const b = boundHistory({ past, future: [] }, 1_000_000, 100);
    expect(b.past.map((e) => e.label)).toEqual(past.slice(-100).map((e) => e.label));
    const small = boundHistory({ past, future: [] }, 1000, 100);
    expect(small.past.length).toBeLessThan(10);
    expect(small.past.at(-1)!.label).toBe('e299');
  });
});

describe('tab identity and the latest-save pointer', () => {
  it('a reload keeps the tab’s document id; a new tab gets its own', () => {
    const session = memoryStorage();
    const first = tabIdentity(session);
    expect(first.resumed).toBe(false);
    rememberIdentity(session, first);
    const reloaded = tabIdentity(session);
    expect(reloaded.resumed).toBe(true);
    expect(reloaded.docId).toBe(first.docId);
    expect(reloaded.tabId).not.toBe(first.tabId);
    const other = tabIdentity(memoryStorage());
    expect(other.docId).not.toBe(first.docId);
  });

  it('the pointer names who saved last and ignores junk', () => {
    const ls = memoryStorage();
    writeLatest(ls, draft({ savedAtMs: 42 }));
    expect(readLatest(ls)).toEqual({ docId: 'd1', lineage: 'd1', tabId: 't1', savedAtMs: 42 });
    ls.setItem(LATEST_KEY, '{"docId":1}');
    expect(readLatest(ls)).toBeNull();
  });
});
