import { defineCommand } from './types';

export const zoomToFit = defineCommand({
  id: 'zoom-to-fit',
  label: 'Fit drawing',
  shortcut: 'F',
  canRun: (ctx) => ctx.canvas !== null,
  run: (ctx) => ctx.canvas?.fitAll(),
});
