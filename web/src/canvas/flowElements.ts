import type { Edge, Node } from '@xyflow/react';
import type { AnalysisReport, BusLink, Conductor, EquipmentNode, Project } from '@linewright/core';
import { indexReport, type ReportIndex } from '../analysis/reportIndex';
import { FAMILY_LOOK, VERDICT_TEXT, conductorFamily, verdictFamily } from '../analysis/verdicts';
import { conductorLine, kindSpec, nodeFacts } from '../editor/equipment';
import type { EditorState, Selection } from '../editor/store';
import type { BusLinkEdgeData, ConductorEdgeData, EquipmentNodeData } from './flowTypes';
import { drawingGeometry, type Bar, type BusLinkGeometry, type ConductorGeometry, type Pt } from './geometry';

export type FlowNode = Node<EquipmentNodeData>;
export type FlowEdge = Edge<ConductorEdgeData> | Edge<BusLinkEdgeData>;

export const conductorEdgeId = (id: string) => `c:${id}`;
export const busLinkEdgeId = (id: string) => `b:${id}`;

interface NodeEntry {
  src: EquipmentNode;
  selected: boolean;
  x: number;
  y: number;
  worst: EquipmentNodeData['worst'];
  count: number;
  out: FlowNode;
}
interface EdgeEntry {
  src: Conductor | BusLink;
  selected: boolean;
  key: string;
  out: FlowEdge;
}

/**
 * Derives React Flow nodes and edges from the document, the selection, an
 * in-flight drag and the report, so they are never stored twice. Each element
 * keeps its previous object while nothing it shows changed: immer's structural
 * sharing makes that an identity check, and React Flow then re-renders only
 * the elements that did change (after an edit, usually one node and the few
 * conductors whose verdict moved).
 */
export class FlowDeriver {
  private nodeCache = new Map<string, NodeEntry>();
  private edgeCache = new Map<string, EdgeEntry>();
  private lastNodesKey: unknown[] = [];
  private lastNodes: FlowNode[] = [];
  private lastEdgesKey: unknown[] = [];
  private lastEdges: FlowEdge[] = [];
  private kindById = new Map<string, EquipmentNode['kind']>();
  private kindFor: Project['nodes'] | null = null;
  private posById = new Map<string, Pt>();

  nodes(s: EditorState): FlowNode[] {
    const key = [s.doc.nodes, s.view.selection, s.view.dragPositions, s.report];
    if (sameKey(key, this.lastNodesKey)) return this.lastNodes;
    const idx = indexReport(s.report);
    const sel = new Set(s.view.selection.nodes);
    const drag = s.view.dragPositions;
    const next = new Map<string, NodeEntry>();
    const out: FlowNode[] = new Array(s.doc.nodes.length);
    let i = 0;
    for (const n of s.doc.nodes) {
      const p = drag?.get(n.id) ?? n.position ?? { x: 0, y: 0 };
      const selected = sel.has(n.id);
      const worst = idx.worstByElement.get(n.id) ?? null;
      const count = idx.findingsByElement.get(n.id)?.length ?? 0;
      const prev = this.nodeCache.get(n.id);
      let e: NodeEntry;
      if (prev && prev.src === n && prev.selected === selected && prev.x === p.x && prev.y === p.y && prev.worst === worst && prev.count === count) e = prev;
      else {
        const spec = kindSpec(n.kind);
        const data: EquipmentNodeData =
          prev && prev.src === n && prev.worst === worst && prev.count === count ? prev.out.data : { node: n, worst, findingCount: count };
        e = {
          src: n, selected, x: p.x, y: p.y, worst, count,
          out: {
            id: n.id, type: n.kind, position: { x: p.x, y: p.y }, data, selected, width: spec.width, height: spec.height,
            ariaLabel: `${spec.title} ${n.label || n.id}, ${nodeFacts(n)}${count ? `, ${count} finding${count === 1 ? '' : 's'}` : ''}`,
          },
        };
      }
      next.set(n.id, e);
      out[i++] = e.out;
    }
    this.nodeCache = next;
    this.lastNodesKey = key;
    // Same elements in the same order: hand back the old array so React Flow skips its O(n) update.
    if (!sameKey(out, this.lastNodes)) this.lastNodes = out;
    return this.lastNodes;
  }

  edges(s: EditorState): FlowEdge[] {
    const key = [s.doc.conductors, s.doc.busLinks, s.doc.nodes, s.view.selection, s.view.dragPositions, s.report];
    if (sameKey(key, this.lastEdgesKey)) return this.lastEdges;
    const idx = indexReport(s.report);
    const kinds = this.kinds(s.doc.nodes);
    const drag = s.view.dragPositions;
    const pos = this.positions(s.doc.nodes);
    const geo = drawingGeometry(s.doc.nodes, s.doc.conductors, s.doc.busLinks, (id) => drag?.get(id) ?? pos.get(id), conductorLine);
    const selC = new Set(s.view.selection.conductors);
    const selB = new Set(s.view.selection.busLinks);
    const next = new Map<string, EdgeEntry>();
    const out: FlowEdge[] = [];
    for (const c of s.doc.conductors) {
      const g = geo.conductors.get(c.id);
      const e = g ? this.conductorEdge(c, g, selC.has(c.id), idx, kinds, s.report) : null;
      if (e) {
        next.set(e.out.id, e);
        out.push(e.out);
      }
    }
    for (const b of s.doc.busLinks) {
      const g = geo.busLinks.get(b.id);
      const e = g ? this.busLinkEdge(b, g, selB.has(b.id), kinds) : null;
      if (e) {
        next.set(e.out.id, e);
        out.push(e.out);
      }
    }
    this.edgeCache = next;
    this.lastEdgesKey = key;
    if (!sameKey(out, this.lastEdges)) this.lastEdges = out;
    return this.lastEdges;
  }

  private kinds(nodes: Project['nodes']): Map<string, EquipmentNode['kind']> {
    if (this.kindFor !== nodes) {
      this.kindById = new Map(nodes.map((n) => [n.id, n.kind]));
      this.posById = new Map(nodes.map((n) => [n.id, n.position ?? { x: 0, y: 0 }]));
      this.kindFor = nodes;
    }
    return this.kindById;
  }

  private positions(nodes: Project['nodes']): Map<string, Pt> {
    this.kinds(nodes);
    return this.posById;
  }

  private conductorEdge(c: Conductor, g: ConductorGeometry, selected: boolean, idx: ReportIndex, kinds: Map<string, EquipmentNode['kind']>, report: AnalysisReport | null): EdgeEntry | null {
    const checked = report !== null;
    const fk = kinds.get(c.from);
    const tk = kinds.get(c.to);
    if (!fk || !tk) return null;
    const id = conductorEdgeId(c.id);
    const r = idx.conductor.get(c.id);
    const verdict = r?.verdict ?? null;
    // One core answer for the alarm: a violation on the conductor shows whatever its verdict.
    const family = report && r ? conductorFamily(report, r) : checked ? verdictFamily(verdict) : 'pending';
    const verdictText = verdict ? VERDICT_TEXT[verdict] : checked ? 'not checked' : 'checking…';
    // The drawing shows the facts (sets × size, material, length); the conductor's own name is in the
    // details panel and the tooltip, so labels stay narrow enough to sit between columns of equipment.
    const line = conductorLine(c);
    const key = `${verdict}|${family}|${line}|${fk}|${tk}|${c.label ?? ''}|${geometryKey(g.points, g.bar)}|${g.label.x},${g.label.y}`;
    const prev = this.edgeCache.get(id);
    if (prev && prev.src === c && prev.selected === selected && prev.key === key) return prev;
    const data: ConductorEdgeData =
      prev && prev.key === key && prev.out.type === 'conductor'
        ? (prev.out.data as ConductorEdgeData)
        : { conductorId: c.id, name: c.label ?? null, line, verdict, verdictText, family, geometry: g };
    return {
      src: c, selected, key,
      out: {
        id, type: 'conductor', source: c.from, target: c.to,
        sourceHandle: kindSpec(fk).ports.out, targetHandle: kindSpec(tk).ports.in,
        selected, data: data.name === (c.label ?? null) ? data : { ...data, name: c.label ?? null }, ariaLabel: `Conductor ${c.label ? `${c.label}: ` : ''}${line}, ${verdictText}`,
        style: { color: FAMILY_LOOK[family].colour },
      },
    };
  }

  private busLinkEdge(b: BusLink, g: BusLinkGeometry, selected: boolean, kinds: Map<string, EquipmentNode['kind']>): EdgeEntry | null {
    const fk = kinds.get(b.from);
    const tk = kinds.get(b.to);
    if (!fk || !tk) return null;
    const id = busLinkEdgeId(b.id);
    const key = `${fk}|${tk}|${geometryKey(g.points, g.bar)}`;
    const prev = this.edgeCache.get(id);
    if (prev && prev.src === b && prev.selected === selected && prev.key === key) return prev;
    return {
      src: b, selected, key,
      out: {
        id, type: 'busLink', source: b.from, target: b.to,
        sourceHandle: kindSpec(fk).ports.out, targetHandle: kindSpec(tk).ports.in,
        selected, data: { busLinkId: b.id, geometry: g }, ariaLabel: `Bus link${b.label ? ` ${b.label}` : ''}`,
      },
    };
  }
}

function geometryKey(points: readonly Pt[], bar: Bar | null): string {
  let k = bar ? `${bar.x1},${bar.x2},${bar.y}:` : '';
  for (const p of points) k += `${p.x},${p.y};`;
  return k;
}

function sameKey(a: unknown[], b: unknown[]): boolean {
  return a.length === b.length && a.every((x, i) => x === b[i]);
}

/** Applies React Flow select changes to our selection (view state). */
export function selectionAfter(sel: Selection, nodeChanges: { id: string; selected: boolean }[], edgeChanges: { id: string; selected: boolean }[]): Selection {
  let nodes = sel.nodes;
  let conductors = sel.conductors;
  let busLinks = sel.busLinks;
  if (nodeChanges.length) {
    const s = new Set(nodes);
    for (const c of nodeChanges) {
      if (c.selected) s.add(c.id);
      else s.delete(c.id);
    }
    nodes = [...s];
  }
  if (edgeChanges.length) {
    const cs = new Set(conductors);
    const bs = new Set(busLinks);
    for (const c of edgeChanges) {
      const raw = c.id.slice(2);
      const set = c.id.startsWith('c:') ? cs : bs;
      if (c.selected) set.add(raw);
      else set.delete(raw);
    }
    conductors = [...cs];
    busLinks = [...bs];
  }
  return { nodes, conductors, busLinks };
}
