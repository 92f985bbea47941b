import { PROJECT_FORMAT, PROJECT_VERSION, type Project } from '@linewright/core';
import { defineCommand } from './types';

export function emptyProject(name = 'Untitled one-line'): Project {
  return {
    format: PROJECT_FORMAT,
    version: PROJECT_VERSION,
    project: { name, codeEdition: 2023, units: 'imperial', qualifiedMaintenance: false, industrialInstallation: false, terminationDefault: 'listed-75' },
    nodes: [],
    conductors: [],
    busLinks: [],
  };
}

/** Starts an empty drawing; undo brings the previous one back. */
export const newDrawing = defineCommand({
  id: 'new-drawing',
  label: 'New drawing',
  canRun: () => true,
  run: ({ store, canvas }) => {
    store.replaceDocument('New drawing', emptyProject());
    canvas?.fitAll();
  },
});
