import { analyze, type Conductor, type Project } from '@linewright/core';
import { addEquipment, connect, replaceElement } from '../../web/src/editor/commands';
import type { CommandContext } from '../../web/src/editor/commands/types';
import { emptyProject } from '../../web/src/editor/commands/newDrawing';
import { EditorStore } from '../../web/src/editor/store';

/** A command context without a browser: downloads are collected, there is no canvas. */
export function harness(doc: Project = emptyProject()) {
  const store = new EditorStore(doc);
  const downloads: { fileName: string; mime: string; data: Uint8Array | string }[] = [];
  const ctx: CommandContext = {
    store,
    canvas: null,
    clipboard: { fragment: null, pasteCount: 0 },
    download: (fileName, mime, data) => downloads.push({ fileName, mime, data }),
  };
  return { store, ctx, downloads, doc: () => store.getState().doc, report: () => analyze(store.getState().doc) };
}

/** Utility → 600 A breaker → splice → tap → 200 A breaker, drawn with the editor's commands. */
export function drawTap(h: ReturnType<typeof harness>, tap: Partial<Conductor>) {
  const { ctx } = h;
  for (const kind of ['utility', 'breaker', 'splice', 'breaker'] as const) addEquipment.run(ctx, { kind, position: { x: 0, y: 0 } });
  const [u, f, s, m] = h.doc().nodes.map((n) => n.id);
  const rating = (id: string, ratingA: number) => {
    const n = h.doc().nodes.find((x) => x.id === id)!;
    replaceElement.run(ctx, { target: { kind: 'node', id }, value: { ...n, ratingA }, label: 'Set rating' });
  };
  rating(f!, 600);
  rating(m!, 200);
  const wire = (from: string, to: string, patch: Partial<Conductor>) => {
    connect.run(ctx, { from, to, as: 'conductor' });
    const c = h.doc().conductors.at(-1)!;
    replaceElement.run(ctx, { target: { kind: 'conductor', id: c.id }, value: { ...c, ...patch }, label: 'Set' });
    return c.id;
  };
  wire(u!, f!, { size: '350', parallelSets: 2, lengthFt: 20 });
  wire(f!, s!, { size: '350', parallelSets: 2, lengthFt: 60 });
  const tapId = wire(s!, m!, { size: '3/0', ...tap });
  return { u: u!, f: f!, s: s!, m: m!, tapId };
}

