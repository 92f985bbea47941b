import type { Edge, Node } from '@xyflow/react';
import type { BusLink, Conductor, EquipmentNode, Project } from '@linewright/core';
import { conductorLine, kindSpec } from '../editor/equipment';
import type { EditorState, Selection } from '../editor/store';
import type { BusLinkEdgeData, ConductorEdgeData, EquipmentNodeData } from './flowTypes';
import { drawingGeometry, labelWidth, type Bar, type BusLinkGeometry, type ConductorGeometry, type Pt } from './geometry';
import { spokenNameId } from './looks';
import { portsOf } from './ports';

export type FlowNode = Node<EquipmentNodeData>;
export type FlowEdge = Edge<ConductorEdgeData> | Edge<BusLinkEdgeData>;

export const conductorEdgeId = (id: string) => `c:${id}`;
export const busLinkEdgeId = (id: string) => `b:${id}`;

interface NodeEntry {
  src: EquipmentNode;
  selected: boolean;
  x: number;
  y: number;
  out: FlowNode;
}
interface EdgeEntry {
  src: Conductor | BusLink;
  selected: boolean;
  key: string;
  out: FlowEdge;
}

/**
 * Derives React Flow nodes and edges from the document, the selection and an
 * in-flight drag, so they are never stored twice. The report is not an input:
 * verdicts, colours and finding flags are read by id inside the components
 * (canvas/looks.ts), so a check never changes a node or edge object. Each
 * element keeps its previous object while its ends, place, geometry and
 * selection stay: after a length edit every object is kept and React Flow
 * neither rebuilds its lookups nor re-renders a wrapper; only the edited
 * conductor's own component, subscribed to its look, draws again.
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
    const key = [s.doc.nodes, s.view.selection, s.view.dragPositions];
    if (sameKey(key, this.lastNodesKey)) return this.lastNodes;
    const sel = new Set(s.view.selection.nodes);
    const drag = s.view.dragPositions;
    const next = new Map<string, NodeEntry>();
    const out: FlowNode[] = new Array(s.doc.nodes.length);
    let i = 0;
    for (const n of s.doc.nodes) {
      const p = drag?.get(n.id) ?? n.position ?? { x: 0, y: 0 };
      const selected = sel.has(n.id);
      const prev = this.nodeCache.get(n.id);
      let e: NodeEntry;
      if (prev && prev.src === n && prev.selected === selected && prev.x === p.x && prev.y === p.y) e = prev;
      else {
        const spec = kindSpec(n.kind);
        const data: EquipmentNodeData = prev && prev.src === n ? prev.out.data : { node: n };
        e = {
          src: n, selected, x: p.x, y: p.y,
          out: {
            id: n.id, type: n.kind, position: { x: p.x, y: p.y }, data, selected, width: spec.width, height: spec.height, handles: portsOf(n.kind),
            domAttributes: { 'aria-labelledby': spokenNameId('node', n.id) },
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
    const key = [s.doc.conductors, s.doc.busLinks, s.doc.nodes, s.view.selection, s.view.dragPositions];
    if (sameKey(key, this.lastEdgesKey)) return this.lastEdges;
    if (this.onlyFactsChanged(key)) {
      this.lastEdgesKey = key;
      return this.lastEdges;
    }
    if (this.onlySelectionChanged(key)) return this.reselectEdges(s.view.selection, key);
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
      const e = g ? this.conductorEdge(c, g, selC.has(c.id), kinds) : null;
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

  /**
   * True when only conductors changed since the last derivation, in place, each keeping its ends and
   * the width of its label (the geometry's only input from a conductor): the usual edit of a length,
   * size or material, answered in one pass of identity checks instead of the whole geometry.
   */
  private onlyFactsChanged(key: unknown[]): boolean {
    const last = this.lastEdgesKey;
    if (last.length === 0 || key[0] === last[0] || !key.slice(1).every((x, i) => x === last[i + 1])) return false;
    const now = key[0] as Project['conductors'];
    const before = last[0] as Project['conductors'];
    if (now.length !== before.length) return false;
    for (let i = 0; i < now.length; i++) {
      const a = before[i]!;
      const b = now[i]!;
      if (a === b) continue;
      if (a.id !== b.id || a.from !== b.from || a.to !== b.to || labelWidth(conductorLine(a)) !== labelWidth(conductorLine(b))) return false;
    }
    return true;
  }

  /** True when only the selection changed since the last derivation: no wire moves, so none is routed again. */
  private onlySelectionChanged(key: unknown[]): boolean {
    const last = this.lastEdgesKey;
    return last.length === key.length && key[3] !== last[3] && key.every((x, i) => i === 3 || x === last[i]);
  }

  /**
   * The edges of the last derivation with a new selection: each edge whose selected flag flipped is a
   * copy with the new flag, every other keeps its object. Selecting a conductor of 10 000 no longer routes
   * every wire again (drawingGeometry and a geometry key per edge: 67 ms in the page).
   */
  private reselectEdges(sel: Selection, key: unknown[]): FlowEdge[] {
    const selC = new Set(sel.conductors);
    const selB = new Set(sel.busLinks);
    let out: FlowEdge[] | null = null;
    this.lastEdges.forEach((edge, i) => {
      const selected = edge.type === 'busLink' ? selB.has((edge.data as BusLinkEdgeData).busLinkId) : selC.has((edge.data as ConductorEdgeData).conductorId);
      if (selected === !!edge.selected) return;
      const prev = this.edgeCache.get(edge.id)!;
      const e: EdgeEntry = { ...prev, selected, out: { ...prev.out, selected } };
      this.edgeCache.set(edge.id, e);
      (out ??= this.lastEdges.slice())[i] = e.out;
    });
    this.lastEdgesKey = key;
    if (out) this.lastEdges = out;
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

  private conductorEdge(c: Conductor, g: ConductorGeometry, selected: boolean, kinds: Map<string, EquipmentNode['kind']>): EdgeEntry | null {
    const fk = kinds.get(c.from);
    const tk = kinds.get(c.to);
    if (!fk || !tk) return null;
    const id = conductorEdgeId(c.id);
    const key = `${c.from}|${c.to}|${fk}|${tk}|${geometryKey(g.points, g.bar)}|${g.label.x},${g.label.y},${g.label.w}`;
    const prev = this.edgeCache.get(id);
    if (prev && prev.selected === selected && prev.key === key) return prev.src === c ? prev : { ...prev, src: c };
    const data: ConductorEdgeData = prev && prev.key === key && prev.out.type === 'conductor' ? (prev.out.data as ConductorEdgeData) : { conductorId: c.id, geometry: g };
    return {
      src: c, selected, key,
      out: {
        id, type: 'conductor', source: c.from, target: c.to,
        sourceHandle: kindSpec(fk).ports.out, targetHandle: kindSpec(tk).ports.in,
        selected, data, domAttributes: { 'aria-labelledby': spokenNameId('conductor', c.id) },
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
