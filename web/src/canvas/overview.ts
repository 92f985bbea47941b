import type { AnalysisReport, Finding, Severity } from '@linewright/core';
import type { VerdictFamily } from '../analysis/verdicts';
import type { EditorState, Selection } from '../editor/store';
import { kindSpec } from '../editor/equipment';
import type { FlowEdge, FlowNode } from './flowElements';
import type { BusLinkEdgeData, ConductorEdgeData } from './flowTypes';
import type { Bar, Pt } from './geometry';
import { familyOf } from './looks';
import { indexReport } from '../analysis/reportIndex';
import { segmentDistance } from './pointDistance';

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

/** A conductor or bus link as the overview picks it: its ends and its wire. */
export interface OverviewLink {
  kind: 'conductor' | 'busLink';
  id: string;
  from: string;
  to: string;
  points: Pt[];
}

/** What does not change with a check: positions, geometry, selection. */
export interface OverviewLayout {
  /** Each piece of equipment's box, for picking. */
  nodes: { id: string; x: number; y: number; w: number; h: number }[];
  /** Every conductor and bus link, for picking. */
  links: OverviewLink[];
  conductors: { id: string; points: Pt[]; badge: Pt }[];
  /** Where each conductor id sits in `conductors`. */
  conductorAt: Map<string, number>;
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
  /** The report the looks were read from. */
  report: AnalysisReport | null;
  /** Wire polylines by the family they are drawn in. */
  wires: Map<VerdictFamily, Pt[][]>;
  /** Verdict badge centres by family (flow coordinates). */
  badges: Map<VerdictFamily, Pt[]>;
  flags: { id: string; at: Pt; severity: Severity }[];
  /** Each conductor's family, in the order of the layout's conductors. */
  family: VerdictFamily[];
}

/**
 * Layouts one after another, as the canvas asks for them. When the elements differ from the last layout's
 * only in what is selected (each element the same object, or a copy with the same data and place), that
 * layout's geometry is kept and only the selected boxes and wires are read again: the scene drawn from it
 * then keeps its families too (overviewScene), so a click far out on 10 000 conductors no longer lays out
 * and colours the whole drawing again.
 */
export class OverviewLayouts {
  private last: { nodes: readonly FlowNode[]; edges: readonly FlowEdge[]; layout: OverviewLayout } | null = null;

  of(nodes: readonly FlowNode[], edges: readonly FlowEdge[]): OverviewLayout {
    const last = this.last;
    const layout = last && onlySelectionDiffers(last, nodes, edges) ? reselected(last.layout, nodes, edges) : overviewLayout(nodes, edges);
    this.last = { nodes, edges, layout };
    return layout;
  }
}

function onlySelectionDiffers(last: { nodes: readonly FlowNode[]; edges: readonly FlowEdge[] }, nodes: readonly FlowNode[], edges: readonly FlowEdge[]): boolean {
  if (last.nodes.length !== nodes.length || last.edges.length !== edges.length) return false;
  for (let i = 0; i < nodes.length; i++) {
    const a = last.nodes[i]!;
    const b = nodes[i]!;
    if (a !== b && (a.data !== b.data || a.position.x !== b.position.x || a.position.y !== b.position.y)) return false;
  }
  for (let i = 0; i < edges.length; i++) {
    const a = last.edges[i]!;
    const b = edges[i]!;
    if (a !== b && (a.data !== b.data || a.source !== b.source || a.target !== b.target)) return false;
  }
  return true;
}

function reselected(layout: OverviewLayout, nodes: readonly FlowNode[], edges: readonly FlowEdge[]): OverviewLayout {
  const selectedBoxes: OverviewLayout['selectedBoxes'] = [];
  const selectedWires: OverviewLayout['selectedWires'] = [];
  for (const n of nodes) {
    if (!n.selected) continue;
    const spec = kindSpec(n.data.node.kind);
    selectedBoxes.push({ x: n.position.x, y: n.position.y, w: spec.width, h: spec.height });
  }
  for (const e of edges) if (e.selected) selectedWires.push((e.data as ConductorEdgeData | BusLinkEdgeData).geometry.points);
  return { ...layout, selectedBoxes, selectedWires };
}

/** The layout of a drawing, from React Flow's elements (positions, geometry, selection). */
export function overviewLayout(nodes: readonly FlowNode[], edges: readonly FlowEdge[]): OverviewLayout {
  const layout: OverviewLayout = { nodes: [], links: [], conductors: [], conductorAt: new Map(), bars: [], busLinks: [], stems: [], flagAt: new Map(), selectedWires: [], selectedBoxes: [] };
  for (const n of nodes) {
    const spec = kindSpec(n.data.node.kind);
    const { x, y } = n.position;
    if (spec.barY !== undefined) {
      layout.bars.push({ x1: x + 4, y1: y + spec.barY, x2: x + spec.width - 4, y2: y + spec.barY });
      layout.stems.push({ x1: x + spec.wireX, y1: y, x2: x + spec.wireX, y2: y + spec.barY });
    } else layout.stems.push({ x1: x + spec.wireX, y1: y, x2: x + spec.wireX, y2: y + spec.height });
    layout.nodes.push({ id: n.id, x, y, w: spec.width, h: spec.height });
    if (n.selected) layout.selectedBoxes.push({ x, y, w: spec.width, h: spec.height });
    layout.flagAt.set(n.id, { x: x + spec.width - 3, y: y + 2 });
  }
  for (const e of edges) {
    const g = (e.data as ConductorEdgeData | BusLinkEdgeData).geometry;
    if (g.bar) layout.bars.push(barSegment(g.bar));
    if (e.selected) layout.selectedWires.push(g.points);
    if (e.type === 'busLink') {
      layout.busLinks.push(g.points);
      layout.links.push({ kind: 'busLink', id: (e.data as BusLinkEdgeData).busLinkId, from: e.source, to: e.target, points: g.points });
    } else {
      const label = (g as ConductorEdgeData['geometry']).label;
      const id = (e.data as ConductorEdgeData).conductorId;
      layout.links.push({ kind: 'conductor', id, from: e.source, to: e.target, points: g.points });
      layout.conductorAt.set(id, layout.conductors.length);
      layout.conductors.push({ id, points: g.points, badge: { x: label.x + label.w - 9, y: label.y + label.h / 2 } });
    }
  }
  return layout;
}

/**
 * The scene: the layout in each element's look (its verdict family, its finding flag). Given the scene
 * of the report before, only the conductors whose report line moved (or whose findings changed between
 * violation and not) are asked again, and the wires are regrouped only when a family moved: after a
 * length edit that keeps every verdict, the scene is the one before with the new report.
 */
export function overviewScene(layout: OverviewLayout, s: Pick<EditorState, 'report'>, before?: OverviewScene | null): OverviewScene {
  const report = s.report;
  const idx = indexReport(report);
  // Only the pieces with findings, read off the report's index rather than asked of every piece.
  const flags: OverviewScene['flags'] = [];
  for (const [id, severity] of idx.worstByElement) {
    const at = layout.flagAt.get(id);
    if (at) flags.push({ id, at, severity });
  }
  // A layout that differs from the scene's only in its selection keeps the scene's conductors, so their families.
  const family = (before && before.layout.conductors === layout.conductors && familiesAfter(before, report)) || layout.conductors.map((c) => familyOf(report, idx.conductor.get(c.id)));
  if (before && family === before.family) return { ...before, layout, report, flags };
  const scene: OverviewScene = { layout, report, wires: new Map(), badges: new Map(), flags, family };
  layout.conductors.forEach((c, i) => {
    push(scene.wires, family[i]!, c.points);
    push(scene.badges, family[i]!, c.badge);
  });
  return scene;
}

/** The families after `report` from the scene before (the same array when none moved), or null when the conductors differ. */
function familiesAfter(before: OverviewScene, report: AnalysisReport | null): VerdictFamily[] | null {
  const was = before.report;
  if (!was || !report || was.conductors.length !== report.conductors.length) return null;
  const flipped = violationFlips(was, report);
  let family = before.family;
  for (let i = 0; i < report.conductors.length; i++) {
    const c = report.conductors[i]!;
    const old = was.conductors[i]!;
    if (c === old && (flipped.size === 0 || !c.findingIds.some((id) => flipped.has(id)))) continue;
    if (c.id !== old.id) return null;
    const at = before.layout.conductorAt.get(c.id);
    if (at === undefined) continue;
    const f = familyOf(report, c);
    if (f === family[at]) continue;
    if (family === before.family) family = family.slice();
    family[at] = f;
  }
  return family;
}

/** Ids of the findings that are a violation in one report and not in the other. */
function violationFlips(a: AnalysisReport, b: AnalysisReport): Set<string> {
  if (a.findings === b.findings) return new Set();
  const va = violationIds(a.findings);
  const vb = violationIds(b.findings);
  const out = new Set<string>();
  for (const id of va) if (!vb.has(id)) out.add(id);
  for (const id of vb) if (!va.has(id)) out.add(id);
  return out;
}

const violations = new WeakMap<readonly Finding[], Set<string>>();
function violationIds(findings: readonly Finding[]): Set<string> {
  let ids = violations.get(findings);
  if (!ids) violations.set(findings, (ids = new Set(findings.flatMap((f) => (f.severity === 'violation' ? [f.id] : [])))));
  return ids;
}

/** A box in flow coordinates. */
export type Box = Segment;

/** The smallest box holding every point (an empty box, x1 > x2, when there are none). */
export function boundsOf(pts: readonly Pt[]): Box {
  const b = { x1: Infinity, y1: Infinity, x2: -Infinity, y2: -Infinity };
  for (const p of pts) {
    if (p.x < b.x1) b.x1 = p.x;
    if (p.x > b.x2) b.x2 = p.x;
    if (p.y < b.y1) b.y1 = p.y;
    if (p.y > b.y2) b.y2 = p.y;
  }
  return b;
}

/**
 * Where two scenes of one layout differ: the wires and badges of the conductors whose family moved and
 * the pieces whose flag moved (a length edit that keeps every verdict differs nowhere). `pad` covers
 * what is drawn around a point (grown badges, flags, line widths).
 */
export function sceneChanges(before: OverviewScene, after: OverviewScene, pad: number): Box[] {
  const out: Box[] = [];
  if (before.family !== after.family) after.layout.conductors.forEach((c, i) => {
    if (before.family[i] === after.family[i]) return;
    const b = boundsOf([c.badge, ...c.points]);
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

/** What a click far out picked. */
export interface OverviewHit {
  kind: 'node' | 'conductor' | 'busLink';
  id: string;
}

/**
 * The element nearest to `p` (flow coordinates) within `reach`: a piece of equipment when `p` is on its
 * box, else the nearest piece, conductor or bus link (a conductor also by its verdict badge, drawn grown
 * far out). Null when nothing is that close.
 */
export function pickAt(layout: OverviewLayout, p: Pt, reach: number): OverviewHit | null {
  let best: OverviewHit | null = null;
  let bestD = reach;
  for (const n of layout.nodes) {
    const dx = Math.max(n.x - p.x, 0, p.x - (n.x + n.w));
    const dy = Math.max(n.y - p.y, 0, p.y - (n.y + n.h));
    const d = Math.hypot(dx, dy);
    if (d === 0) return { kind: 'node', id: n.id };
    if (d < bestD) [best, bestD] = [{ kind: 'node', id: n.id }, d];
  }
  for (const l of layout.links) {
    for (let i = 1; i < l.points.length; i++) {
      const d = segmentDistance(p, l.points[i - 1]!, l.points[i]!);
      if (d < bestD) [best, bestD] = [{ kind: l.kind, id: l.id }, d];
    }
  }
  for (const c of layout.conductors) {
    const d = Math.hypot(p.x - c.badge.x, p.y - c.badge.y);
    if (d < bestD) [best, bestD] = [{ kind: 'conductor', id: c.id }, d];
  }
  return best;
}

/**
 * What a selection box (flow coordinates) takes far out, as it does up close: the equipment wholly
 * inside it, and every conductor and bus link with an end at one of those pieces.
 */
export function selectionInBox(layout: OverviewLayout, box: Box): Selection {
  const x1 = Math.min(box.x1, box.x2);
  const x2 = Math.max(box.x1, box.x2);
  const y1 = Math.min(box.y1, box.y2);
  const y2 = Math.max(box.y1, box.y2);
  const nodes = new Set<string>();
  for (const n of layout.nodes) if (n.x >= x1 && n.y >= y1 && n.x + n.w <= x2 && n.y + n.h <= y2) nodes.add(n.id);
  const conductors: string[] = [];
  const busLinks: string[] = [];
  for (const l of layout.links) if (nodes.has(l.from) || nodes.has(l.to)) (l.kind === 'conductor' ? conductors : busLinks).push(l.id);
  return { nodes: [...nodes], conductors, busLinks };
}

function push<K, V>(m: Map<K, V[]>, k: K, v: V): void {
  const list = m.get(k);
  if (list) list.push(v);
  else m.set(k, [v]);
}
