import { defineCommand } from './types';

export type MoveArg = ReadonlyMap<string, { x: number; y: number }>;

/** Commits the end of a drag: every moved node in one undo step. */
export const moveNodes = defineCommand<MoveArg>({
  id: 'move-nodes',
  label: 'Move',
  canRun: (_ctx, m) => m.size > 0,
  run: ({ store }, moved) => {
    store.edit(moved.size === 1 ? 'Move element' : `Move ${moved.size} elements`, (d) => {
      for (const n of d.nodes) {
        const p = moved.get(n.id);
        if (p && (n.position?.x !== p.x || n.position?.y !== p.y)) n.position = { x: p.x, y: p.y };
      }
    });
  },
});
