import { analyze, type Project } from '@linewright/core';
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
