import type { Severity } from '@linewright/core';
import type { VerdictFamily } from '../analysis/verdicts';
import type { EditorState } from '../editor/store';
import { kindSpec } from '../editor/equipment';
import type { FlowEdge, FlowNode } from './flowElements';
import type { BusLinkEdgeData, ConductorEdgeData } from './flowTypes';
import type { Bar, Pt } from './geometry';
import { familyOf } from './looks';
import { indexReport } from '../analysis/reportIndex';

/**
 * The drawing far out, as one bitmap. Below OVERVIEW_ZOOM the names, facts and tags of a large
 * drawing are under 2–3 px on screen: what reads is the wiring, the bus bars and the verdict badges
 * (grown to stay near 9 px) and the finding flags. Drawn as thousands of SVG and HTML elements, the
 * browser spent hundreds of milliseconds per frame compositing them; drawn here, in the same pens
 * (colours, widths, dashes and badge shapes of analysis/verdicts.ts and styles.css), a frame costs
 * a few milliseconds. The scene is plain numbers in flow coordinates, built from the React Flow
 * elements and the looks, so what the overview shows is what the elements show up close.
 */
export const OVERVIEW_ZOOM = 0.1;


/** What does not change with a check: positions, geometry, selection. */
export interface OverviewLayout {
  conductors: { id: string; points: Pt[]; badge: Pt }[];
  /** Bus bars drawn on from a bus to a drop, and bus bars of bus nodes. */
  bars: Bar[];
  busLinks: Pt[][];
  /** The wire through each piece of equipment that is not a bus: x, top, bottom. */
  stems: { x: number; y1: number; y2: number }[];
  /** Where each piece's finding flag goes (its top right corner). */
  flagAt: Map<string, Pt>;
  selectedWires: Pt[][];
  selectedBoxes: { x: number; y: number; w: number; h: number }[];
}

export interface OverviewScene {
  layout: OverviewLayout;
  /** Wire polylines by the family they are drawn in. */
  wires: Map<VerdictFamily, Pt[][]>;
  /** Verdict badge centres by family (flow coordinates). */
  badges: Map<VerdictFamily, Pt[]>;
  flags: { at: Pt; severity: Severity }[];
}

/** The layout of a drawing, from React Flow's elements (positions, geometry, selection). */
export function overviewLayout(nodes: readonly FlowNode[], edges: readonly FlowEdge[]): OverviewLayout {
  const layout: OverviewLayout = { conductors: [], bars: [], busLinks: [], stems: [], flagAt: new Map(), selectedWires: [], selectedBoxes: [] };
  for (const n of nodes) {
    const spec = kindSpec(n.data.node.kind);
    const { x, y } = n.position;
    if (spec.barY !== undefined) {
      layout.bars.push({ x1: x + 4, x2: x + spec.width - 4, y: y + spec.barY });
      layout.stems.push({ x: x + spec.wireX, y1: y, y2: y + spec.barY });
    } else layout.stems.push({ x: x + spec.wireX, y1: y, y2: y + spec.height });
    if (n.selected) layout.selectedBoxes.push({ x, y, w: spec.width, h: spec.height });
    layout.flagAt.set(n.id, { x: x + spec.width - 3, y: y + 2 });
  }
  for (const e of edges) {
    const g = (e.data as ConductorEdgeData | BusLinkEdgeData).geometry;
    if (g.bar) layout.bars.push(g.bar);
    if (e.selected) layout.selectedWires.push(g.points);
    if (e.type === 'busLink') layout.busLinks.push(g.points);
    else {
      const label = (g as ConductorEdgeData['geometry']).label;
      layout.conductors.push({ id: (e.data as ConductorEdgeData).conductorId, points: g.points, badge: { x: label.x + label.w - 9, y: label.y + label.h / 2 } });
    }
  }
  return layout;
}

/** The scene: the layout in each element's look (its verdict family, its finding flag). */
export function overviewScene(layout: OverviewLayout, s: EditorState): OverviewScene {
  const scene: OverviewScene = { layout, wires: new Map(), badges: new Map(), flags: [] };
  const idx = indexReport(s.report);
  for (const c of layout.conductors) {
    const family = familyOf(s.report, idx.conductor.get(c.id));
    push(scene.wires, family, c.points);
    push(scene.badges, family, c.badge);
  }
  // Only the pieces with findings, read off the report's index rather than asked of every piece.
  for (const [id, severity] of indexReport(s.report).worstByElement) {
    const at = layout.flagAt.get(id);
    if (at) scene.flags.push({ at, severity });
  }
  return scene;
}

function push<K, V>(m: Map<K, V[]>, k: K, v: V): void {
  const list = m.get(k);
  if (list) list.push(v);
  else m.set(k, [v]);
}
