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


/** A straight stroke, in flow coordinates. */
export interface Segment {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}
const barSegment = (b: Bar): Segment => ({ x1: b.x1, y1: b.y, x2: b.x2, y2: b.y });

/** What does not change with a check: positions, geometry, selection. */
export interface OverviewLayout {
  conductors: { id: string; points: Pt[]; badge: Pt }[];
  /** Bus bars drawn on from a bus to a drop, and bus bars of bus nodes. */
  bars: Segment[];
  busLinks: Pt[][];
  /** The wire through each piece of equipment, down to the bar of a bus. */
  stems: Segment[];
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
  flags: { id: string; at: Pt; severity: Severity }[];
  /** Each conductor's family, in the order of the layout's conductors. */
  family: VerdictFamily[];
}

/** The layout of a drawing, from React Flow's elements (positions, geometry, selection). */
export function overviewLayout(nodes: readonly FlowNode[], edges: readonly FlowEdge[]): OverviewLayout {
  const layout: OverviewLayout = { conductors: [], bars: [], busLinks: [], stems: [], flagAt: new Map(), selectedWires: [], selectedBoxes: [] };
  for (const n of nodes) {
    const spec = kindSpec(n.data.node.kind);
    const { x, y } = n.position;
    if (spec.barY !== undefined) {
      layout.bars.push({ x1: x + 4, y1: y + spec.barY, x2: x + spec.width - 4, y2: y + spec.barY });
      layout.stems.push({ x1: x + spec.wireX, y1: y, x2: x + spec.wireX, y2: y + spec.barY });
    } else layout.stems.push({ x1: x + spec.wireX, y1: y, x2: x + spec.wireX, y2: y + spec.height });
    if (n.selected) layout.selectedBoxes.push({ x, y, w: spec.width, h: spec.height });
    layout.flagAt.set(n.id, { x: x + spec.width - 3, y: y + 2 });
  }
  for (const e of edges) {
    const g = (e.data as ConductorEdgeData | BusLinkEdgeData).geometry;
    if (g.bar) layout.bars.push(barSegment(g.bar));
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
  const scene: OverviewScene = { layout, wires: new Map(), badges: new Map(), flags: [], family: new Array<VerdictFamily>(layout.conductors.length) };
  const idx = indexReport(s.report);
  layout.conductors.forEach((c, i) => {
    const family = familyOf(s.report, idx.conductor.get(c.id));
    scene.family[i] = family;
    push(scene.wires, family, c.points);
    push(scene.badges, family, c.badge);
  });
  // Only the pieces with findings, read off the report's index rather than asked of every piece.
  for (const [id, severity] of idx.worstByElement) {
    const at = layout.flagAt.get(id);
    if (at) scene.flags.push({ id, at, severity });
  }
  return scene;
}

/** A box in flow coordinates. */
export type Box = Segment;

/**
 * Where two scenes of one layout differ: the wires and badges of the conductors whose family moved and
 * the pieces whose flag moved (a length edit that keeps every verdict differs nowhere). `pad` covers
 * what is drawn around a point (grown badges, flags, line widths).
 */
export function sceneChanges(before: OverviewScene, after: OverviewScene, pad: number): Box[] {
  const out: Box[] = [];
  after.layout.conductors.forEach((c, i) => {
    if (before.family[i] === after.family[i]) return;
    const b = { x1: c.badge.x, y1: c.badge.y, x2: c.badge.x, y2: c.badge.y };
    for (const p of c.points) {
      b.x1 = Math.min(b.x1, p.x);
      b.y1 = Math.min(b.y1, p.y);
      b.x2 = Math.max(b.x2, p.x);
      b.y2 = Math.max(b.y2, p.y);
    }
    out.push({ x1: b.x1 - pad, y1: b.y1 - pad, x2: b.x2 + pad, y2: b.y2 + pad });
  });
  const was = new Map(before.flags.map((f) => [f.id, f.severity]));
  const now = new Map(after.flags.map((f) => [f.id, f.severity]));
  for (const f of [...before.flags, ...after.flags]) {
    if (was.get(f.id) === now.get(f.id)) continue;
    out.push({ x1: f.at.x - pad, y1: f.at.y - pad, x2: f.at.x + pad, y2: f.at.y + pad });
  }
  return out;
}

function push<K, V>(m: Map<K, V[]>, k: K, v: V): void {
  const list = m.get(k);
  if (list) list.push(v);
  else m.set(k, [v]);
}
