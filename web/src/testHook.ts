import type { Project } from '@linewright/core';
import { stats as analysisStats } from './analysis/scheduler';
import { drawingGeometry } from './canvas/geometry';
import { portsOf } from './canvas/ports';
import { openProject, replaceElement, type CommandContext } from './editor/commands';
import { conductorLine, kindSpec } from './editor/equipment';
import { stats as saveStats } from './persistence/autosave';

/**
 * A small window hook for the e2e suite and the benchmark: read the state,
 * open a project, make an edit through the same commands as the UI, and wait
 * until the check of that edit is on screen. It never changes the document
 * by any other path.
 */
export interface TestHook {
  docVersion(): number;
  reportVersion(): number;
  doc(): Project;
  open(text: string, fileName?: string): Promise<void>;
  setConductorLength(id: string, lengthFt: number): number;
  /**
   * Where the drawing puts each piece (its box, and its ports as React Flow is told them before it draws the
   * piece, relative to the box) and each conductor (its wire), in flow coordinates.
   */
  geometry(): {
    nodes: { id: string; x: number; y: number; w: number; h: number; ports: { id: string | null; x: number; y: number; width: number; height: number }[] }[];
    conductors: { id: string; points: { x: number; y: number }[] }[];
  };
  /** What is selected now. */
  selection(): { nodes: readonly string[]; conductors: readonly string[]; busLinks: readonly string[] };
  /** Selects elements, as a click on the drawing would. */
  select(sel: { nodes?: string[]; conductors?: string[]; busLinks?: string[] }): void;
  /** Resolves after the report for `version` (or a later one) has been rendered and painted. */
  whenChecked(version: number): Promise<void>;
  stats(): { analysisRuns: number; lastAnalysisMs: number; saves: number; saveIdle: boolean };
}

declare global {
  interface Window {
    __linewright?: TestHook;
  }
}

export function installTestHook(ctx: CommandContext): void {
  const { store } = ctx;
  window.__linewright = {
    docVersion: () => store.getState().docVersion,
    reportVersion: () => store.getState().reportVersion,
    doc: () => store.getState().doc,
    open: (text, fileName = 'bench.json') => Promise.resolve(openProject.run(ctx, { fileName, text })),
    setConductorLength: (id, lengthFt) => {
      const c = store.getState().doc.conductors.find((x) => x.id === id);
      if (!c) throw new Error(`no conductor ${id}`);
      replaceElement.run(ctx, { target: { kind: 'conductor', id }, value: { ...c, lengthFt }, label: 'Set length' });
      return store.getState().docVersion;
    },
    geometry: () => {
      const { nodes, conductors, busLinks } = store.getState().doc;
      const pos = new Map<string, { x: number; y: number }>(nodes.map((n) => [n.id, n.position ?? { x: 0, y: 0 }]));
      const geo = drawingGeometry(nodes, conductors, busLinks, (id) => pos.get(id), conductorLine);
      return {
        nodes: nodes.map((n) => ({
          id: n.id, ...pos.get(n.id)!, w: kindSpec(n.kind).width, h: kindSpec(n.kind).height,
          ports: portsOf(n.kind).map((p) => ({ id: p.id ?? null, x: p.x, y: p.y, width: p.width ?? 0, height: p.height ?? 0 })),
        })),
        conductors: [...geo.conductors].map(([id, g]) => ({ id, points: g.points })),
      };
    },
    selection: () => store.getState().view.selection,
    select: (sel) => store.setSelection({ nodes: sel.nodes ?? [], conductors: sel.conductors ?? [], busLinks: sel.busLinks ?? [] }),
    whenChecked: (version) =>
      new Promise<void>((resolve) => {
        const painted = () => requestAnimationFrame(() => requestAnimationFrame(() => resolve()));
        if (store.getState().reportVersion >= version) return painted();
        const off = store.subscribe(() => {
          if (store.getState().reportVersion >= version) {
            off();
            painted();
          }
        });
      }),
    stats: () => ({ analysisRuns: analysisStats.runs, lastAnalysisMs: analysisStats.lastMs, saves: saveStats.saves, saveIdle: saveStats.idle() }),
  };
}
