import type { Project } from '@linewright/core';
import { defineCommand } from './types';

/** The project file text: the document exactly as held, two-space indented. */
export function projectFileText(p: Project): string {
  return JSON.stringify(p, null, 2) + '\n';
}

export function fileBaseName(p: Project): string {
  const base = p.project.name.trim().replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '');
  return base || 'one-line';
}

export const saveJson = defineCommand({
  id: 'save-json',
  label: 'Save project file',
  shortcut: 'Ctrl+S',
  canRun: () => true,
  run: (ctx) => {
    const doc = ctx.store.getState().doc;
    ctx.download(`${fileBaseName(doc)}.linewright.json`, 'application/json', projectFileText(doc));
  },
});
