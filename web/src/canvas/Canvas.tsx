import { memo, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import {
  Background, BackgroundVariant, ConnectionLineType, Controls, MiniMap, Panel, ReactFlow, getNodesBounds, getViewportForBounds, useReactFlow, useStore, useStoreApi,
  type Connection, type EdgeChange, type IsValidConnection, type NodeChange, type ReactFlowInstance, type ReactFlowState,
} from '@xyflow/react';
import { StudyLayers } from '../studies/StudyLayers';
import type { EquipmentKind } from '@linewright/core';
import { EQUIPMENT_KINDS } from '@linewright/core';
import { addEquipment, connect, moveNodes } from '../editor/commands';
import { kindSpec } from '../editor/equipment';
import { connectionKindFor } from '../editor/placement';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { edgeTypes } from '../edges';
import { nodeTypes } from '../nodes';
import { KIND_DRAG_TYPE } from '../panels/Palette';
import { DrawingTools } from '../panels/Toolbar';
import { FlowDeriver, selectionAfter, type FlowEdge, type FlowNode } from './flowElements';
import { Overview } from './Overview';
import { OVERVIEW_ZOOM, OverviewLayouts, pickAt, selectionInBox, type OverviewHit } from './overview';
import { areaNear, elementsNear, viewArea, type Area } from './nearView';
import { EMPTY_SELECTION, LIST_OF, type Selection } from '../editor/store';
import { useReviewView } from '../review/reviewState';

/**
 * Below this zoom the small print would be under about 7 px on screen (12 px × 0.6): the drawing shows
 * names and verdict marks, grown to stay readable, and hides facts and conductor tags.
 */
const FAR_ZOOM = 0.6;
/** Growth of names and marks at a zoom: enough to keep them near 10 px on screen. */
const growAt = (zoom: number) => Math.max(1, 0.85 / zoom);
const isFar = (s: { transform: [number, number, number] }) => s.transform[2] < FAR_ZOOM;

/** Above this many elements only what is on screen is rendered. */
const CULL_FROM = 300;
const GRID = 20;
// Module constants: React Flow copies a prop into its store (and every subscriber re-reads) when its identity changes.
const SNAP_GRID: [number, number] = [GRID, GRID];
// Hidden elements (the overview below) still count for framing.
const FIT_VIEW_OPTIONS = { padding: 0.12, maxZoom: 1.2, includeHiddenNodes: true };
/**
 * From this many elements, a zoom below OVERVIEW_ZOOM, or a view holding more than MOUNT_AT_MOST pieces of
 * equipment, shows the drawing as one bitmap (canvas/Overview.tsx). Mounting a view of 770 pieces with their
 * wires (20 000 DOM elements) took over 2 s on the shared 2-core machine; 300 take a few hundred ms.
 */
const OVERVIEW_FROM = 2000;
const MOUNT_AT_MOST = 300;

/** True when the view holds more than `most` of the pieces (boxes at least partly inside it). */
function crowdedView(nodes: readonly FlowNode[], s: { transform: [number, number, number]; width: number; height: number }, most: number): boolean {
  const { x1, y1, x2, y2 } = viewArea(s.transform, s.width, s.height);
  let n = 0;
  for (const node of nodes) {
    const { x, y } = node.position;
    if (x <= x2 && y <= y2 && x + (node.width ?? 0) >= x1 && y + (node.height ?? 0) >= y1 && ++n > most) return true;
  }
  return false;
}
/** How near a click far out must come to an element to pick it, in screen pixels (the grown badges are about 9 px). */
const PICK_REACH_PX = 8;

/** The selection after a click far out picked `hit`: it alone, or, with Ctrl or Cmd held, it added to or taken from `cur`. */
function selectionAfterPick(cur: Selection, hit: OverviewHit, add: boolean): Selection {
  const key = LIST_OF[hit.kind];
  if (!add) return { nodes: [], conductors: [], busLinks: [], [key]: [hit.id] };
  const list = cur[key];
  return { ...cur, [key]: list.includes(hit.id) ? list.filter((id) => id !== hit.id) : [...list, hit.id] };
}

/**
 * The piece of equipment as React Flow holds it while the overview draws it: hidden (still framed by a
 * fit), one object per source object. The wires are not given to React Flow at all meanwhile: it keeps a
 * component and a store subscription for every edge it holds, hidden or not, and ran all of them on every
 * frame of a pan (10 000 conductors: 20 000 selectors a frame).
 */
const NO_EDGES: FlowEdge[] = [];
const hiddenCopies = new WeakMap<object, object>();
function hidden<T extends FlowNode>(e: T): T {
  let h = hiddenCopies.get(e) as T | undefined;
  if (!h) hiddenCopies.set(e, (h = { ...e, hidden: true }));
  return h;
}

/** The drawing. Memoized: it has no props, so an autosave notice re-rendering the app passes it by. */
export const Canvas = memo(function Canvas() {
  const ctx = useCommandContext();
  const { store } = ctx;
  const deriver = useMemo(() => new FlowDeriver(), []);
  const nodes = useEditorState((s) => deriver.nodes(s));
  const edges = useEditorState((s) => deriver.edges(s));
  const snap = useEditorState((s) => s.view.snapToGrid);
  const frameRequest = useEditorState((s) => s.view.frameRequest);
  const rf = useReactFlow<FlowNode, FlowEdge>();
  const wrapper = useRef<HTMLDivElement>(null);
  const far = useStore(isFar);
  // Set while a large drawing is framed whole: its elements wait hidden, so the frames between the old
  // view and the fitted one never mount thousands of elements only to drop them for the overview. A
  // large drawing the page starts with (restored after a reload) is framed the same way.
  const [fitting, setFitting] = useState(() => elementCount(store.getState().doc) >= OVERVIEW_FROM);
  const large = nodes.length + edges.length >= OVERVIEW_FROM;
  const farOrCrowded = useStore(
    useCallback((s: ReactFlowState) => large && (s.transform[2] < OVERVIEW_ZOOM || crowdedView(nodes, s, MOUNT_AT_MOST)), [large, nodes]),
  );
  const overview = large && (farOrCrowded || fitting);
  // Up close on a large drawing React Flow holds only what is near the view (canvas/nearView.ts).
  const heldArea = useRef<Area | null>(null);
  const area = useStore(
    useCallback(
      (s: ReactFlowState) => (large && !overview ? (heldArea.current = areaNear(viewArea(s.transform, s.width, s.height), heldArea.current)) : (heldArea.current = null)),
      [large, overview],
    ),
  );
  const near = useMemo(() => (area ? elementsNear(nodes, edges, area) : null), [nodes, edges, area]);
  const flowNodes = useMemo(() => (overview ? nodes.map(hidden) : (near?.nodes ?? nodes)), [nodes, overview, near]);
  const flowEdges = overview ? NO_EDGES : (near?.edges ?? edges);
  const flowStore = useStoreApi<FlowNode, FlowEdge>();
  // Far out the elements are hidden, so React Flow picks nothing: a click and a selection box pick from the overview's layout.
  const layouts = useMemo(() => new OverviewLayouts(), []);
  const layout = useMemo(() => (overview ? layouts.of(nodes, edges) : null), [overview, layouts, nodes, edges]);
  const onPaneClick = useCallback(
    (e: React.MouseEvent) => {
      if (!layout) return;
      const hit = pickAt(layout, rf.screenToFlowPosition({ x: e.clientX, y: e.clientY }), PICK_REACH_PX / rf.getZoom());
      const cur = store.getState().view.selection;
      const add = e.ctrlKey || e.metaKey;
      // React Flow clears the selection right after this handler returns: pick once it has. It holds no wires
      // far out, so a click on paper clears the selected conductors and bus links here.
      if (!hit) {
        if (!add) queueMicrotask(() => store.setSelection(EMPTY_SELECTION));
        return;
      }
      queueMicrotask(() => store.setSelection(selectionAfterPick(cur, hit, add)));
    },
    [layout, rf, store],
  );
  const selectionBox = useRef<{ x: number; y: number; width: number; height: number } | null>(null);
  useEffect(
    () =>
      flowStore.subscribe((s) => {
        if (s.userSelectionRect) selectionBox.current = s.userSelectionRect;
      }),
    [flowStore],
  );
  const onSelectionStart = useCallback(() => {
    selectionBox.current = null;
  }, []);
  const onSelectionEnd = useCallback(() => {
    const r = selectionBox.current;
    selectionBox.current = null;
    if (!layout || !r) return;
    const [tx, ty, zoom] = flowStore.getState().transform;
    store.setSelection(selectionInBox(layout, { x1: (r.x - tx) / zoom, y1: (r.y - ty) / zoom, x2: (r.x + r.width - tx) / zoom, y2: (r.y + r.height - ty) / zoom }));
  }, [layout, flowStore, store]);

  // The growth factor follows every zoom step as a CSS variable, without a React render.
  useEffect(() => {
    let last = 0;
    const apply = () => {
      const g = growAt(flowStore.getState().transform[2]);
      if (g !== last) wrapper.current?.style.setProperty('--grow', g.toFixed(3));
      last = g;
    };
    apply();
    return flowStore.subscribe(apply);
  }, [flowStore]);
  const readOnly = useReviewView((v) => v.on);

  // Give commands a way to read and move the view without knowing React Flow.
  useEffect(() => {
    ctx.canvas = {
      visibleCentre: () => {
        const r = wrapper.current?.getBoundingClientRect();
        if (!r) return { x: 0, y: 0 };
        return rf.screenToFlowPosition({ x: r.left + r.width / 2, y: r.top + r.height / 2 });
      },
      reveal: (b) => {
        // After the new element has rendered: pan by the least that brings the box inside the view.
        requestAnimationFrame(() => {
          const r = wrapper.current?.getBoundingClientRect();
          if (!r) return;
          const { x, y, zoom } = rf.getViewport();
          const pad = 40;
          const left = b.x * zoom + x;
          const top = b.y * zoom + y;
          const right = (b.x + b.w) * zoom + x;
          const bottom = (b.y + b.h) * zoom + y;
          let dx = 0;
          let dy = 0;
          if (right > r.width - pad) dx = r.width - pad - right;
          if (left + dx < pad) dx = pad - left;
          if (bottom > r.height - pad) dy = r.height - pad - bottom;
          if (top + dy < pad + 40) dy = pad + 40 - top;
          if (dx || dy) void rf.setViewport({ x: x + dx, y: y + dy, zoom }, { duration: 150 });
        });
      },
      fitAll: () => {
        if (elementCount(store.getState().doc) >= OVERVIEW_FROM) setFitting(true);
        // Wait a frame so React Flow holds the newly committed nodes.
        else requestAnimationFrame(() => void fitAll(rf));
      },
    };
    return () => {
      ctx.canvas = null;
    };
  }, [ctx, rf, store]);

  useEffect(() => {
    if (!fitting) return;
    // React Flow holds the hidden elements by now (its store updates in a child's effect, before this one).
    const id = requestAnimationFrame(() => void fitAll(rf).finally(() => setFitting(false)));
    // Whatever becomes of the fit, the elements do not stay hidden at a working zoom.
    const giveUp = setTimeout(() => setFitting(false), 2000);
    return () => {
      cancelAnimationFrame(id);
      clearTimeout(giveUp);
    };
  }, [fitting, rf]);

  // Framed from the drawing's own positions: up close on a large drawing React Flow may not hold the element.
  const latestNodes = useRef(nodes);
  latestNodes.current = nodes;
  useEffect(() => {
    if (!frameRequest) return;
    const ids = new Set(frameRequest.nodeIds);
    const boxes = latestNodes.current.filter((n) => ids.has(n.id));
    if (boxes.length === 0) return;
    const bounds = getNodesBounds(boxes);
    requestAnimationFrame(() => {
      const { width, height, minZoom } = flowStore.getState();
      void rf.setViewport(getViewportForBounds(bounds, width, height, minZoom, 1.1, 0.6), { duration: 250 });
    });
  }, [frameRequest, rf, flowStore]);

  // Escape during a drag puts the equipment back where it was (the drag was never committed).
  const dragCancelled = useRef(false);
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape' && store.getState().view.dragPositions) {
        dragCancelled.current = true;
        store.setView({ dragPositions: null });
      }
    };
    window.addEventListener('keydown', onKey, true);
    return () => window.removeEventListener('keydown', onKey, true);
  }, [store]);

  const onNodesChange = useCallback(
    (changes: NodeChange<FlowNode>[]) => {
      const sel: { id: string; selected: boolean }[] = [];
      let dragging: Map<string, { x: number; y: number }> | null = null;
      let finished: Map<string, { x: number; y: number }> | null = null;
      for (const c of changes) {
        if (c.type === 'select') sel.push({ id: c.id, selected: c.selected });
        else if (c.type === 'position' && c.position) {
          if (c.dragging) (dragging ??= new Map()).set(c.id, c.position);
          else (finished ??= new Map()).set(c.id, c.position);
        }
      }
      const s = store.getState();
      if (sel.length) store.setSelection(selectionAfter(s.view.selection, sel, []));
      if (dragCancelled.current) {
        if (finished) dragCancelled.current = false;
        return;
      }
      if (dragging) {
        // In flight: view state only. No history, no autosave, no analysis until release.
        const merged = new Map(s.view.dragPositions ?? []);
        for (const [id, p] of dragging) merged.set(id, p);
        store.setView({ dragPositions: merged });
      }
      if (finished) {
        const all = new Map(s.view.dragPositions ?? []);
        for (const [id, p] of finished) all.set(id, p);
        if (!moveNodesChanged(s.doc.nodes, all)) store.setView({ dragPositions: null });
        else moveNodes.run(ctx, all);
      }
    },
    [ctx, store],
  );

  const onEdgesChange = useCallback(
    (changes: EdgeChange<FlowEdge>[]) => {
      const sel = changes.flatMap((c) => (c.type === 'select' ? [{ id: c.id, selected: c.selected }] : []));
      if (sel.length) store.setSelection(selectionAfter(store.getState().view.selection, [], sel));
    },
    [store],
  );

  const onConnect = useCallback(
    (c: Connection) => {
      const doc = store.getState().doc;
      const to = doc.nodes.find((n) => n.id === c.target);
      if (to) connect.run(ctx, { from: c.source, to: c.target, as: connectionKindFor(doc, c.source, to.kind) });
    },
    [ctx, store],
  );

  const isValidConnection: IsValidConnection<FlowEdge> = useCallback((c) => c.source !== c.target, []);

  const onDragOver = useCallback((e: React.DragEvent) => {
    if (e.dataTransfer.types.includes(KIND_DRAG_TYPE)) {
      e.preventDefault();
      e.dataTransfer.dropEffect = 'copy';
    }
  }, []);

  const onDrop = useCallback(
    (e: React.DragEvent) => {
      const kind = e.dataTransfer.getData(KIND_DRAG_TYPE) as EquipmentKind;
      if (!EQUIPMENT_KINDS.includes(kind)) return;
      e.preventDefault();
      e.stopPropagation();
      const spec = kindSpec(kind);
      const p = rf.screenToFlowPosition({ x: e.clientX, y: e.clientY });
      addEquipment.run(ctx, { kind, position: { x: p.x - spec.wireX, y: p.y - spec.height / 2 } });
    },
    [ctx, rf],
  );

  const big = nodes.length + edges.length > CULL_FROM;
  return (
    <div className={far ? 'lw-canvas lw-far' : 'lw-canvas'} ref={wrapper} onDragOver={onDragOver} onDrop={onDrop} onMouseDown={keepTextSelection} data-testid="canvas">
      <ReactFlow<FlowNode, FlowEdge>
        nodes={flowNodes}
        edges={flowEdges}
        nodeTypes={nodeTypes}
        edgeTypes={edgeTypes}
        onNodesChange={onNodesChange}
        onEdgesChange={onEdgesChange}
        onConnect={onConnect}
        onPaneClick={onPaneClick}
        onSelectionStart={onSelectionStart}
        onSelectionEnd={onSelectionEnd}
        isValidConnection={isValidConnection}
        connectionLineType={ConnectionLineType.SmoothStep}
        snapToGrid={snap}
        snapGrid={SNAP_GRID}
        deleteKeyCode={null}
        multiSelectionKeyCode={['Control', 'Meta']}
        selectionKeyCode="Shift"
        onlyRenderVisibleElements={big}
        minZoom={0.03}
        maxZoom={3}
        fitView
        fitViewOptions={FIT_VIEW_OPTIONS}
        elevateEdgesOnSelect
        nodesDraggable={!readOnly}
        nodesConnectable={!readOnly}
      >
        <Background variant={BackgroundVariant.Dots} gap={GRID} size={1} color="#c9ccd1" />
        {layout && <Overview layout={layout} />}
        <Panel position="top-left" className="lw-drawing-tools-panel">
          <DrawingTools />
        </Panel>
        {nodes.length === 0 && (
          <Panel position="top-center" className="lw-empty-hint">
            Empty drawing. Click or drag equipment from the left onto the sheet, then drag from a bottom port (load side) to a top port (line side) to connect.
          </Panel>
        )}
        <StudyLayers />
        <Controls showInteractive={false} position="bottom-left" />
        {!big && nodes.length > 0 && <MiniMap pannable zoomable position="bottom-right" nodeStrokeWidth={2} ariaLabel="Overview of the drawing" style={{ width: 150, height: 100 }} />}
      </ReactFlow>
    </div>
  );
});

function elementCount(doc: { nodes: readonly unknown[]; conductors: readonly unknown[]; busLinks: readonly unknown[] }): number {
  return doc.nodes.length + doc.conductors.length + doc.busLinks.length;
}

/** Shift and drag draws a selection box: the browser must not also extend a text selection over the page. */
function keepTextSelection(e: React.MouseEvent): void {
  if (e.shiftKey) e.preventDefault();
}

/** Frames the whole drawing (an empty one at zoom 1). */
function fitAll(rf: ReactFlowInstance<FlowNode, FlowEdge>): Promise<unknown> {
  if (rf.getNodes().length === 0) return rf.setViewport({ x: 0, y: 0, zoom: 1 });
  return rf.fitView({ ...FIT_VIEW_OPTIONS, duration: 0 });
}

function moveNodesChanged(nodes: readonly { id: string; position?: { x: number; y: number } }[], moved: Map<string, { x: number; y: number }>): boolean {
  for (const n of nodes) {
    const p = moved.get(n.id);
    if (p && (n.position?.x !== p.x || n.position?.y !== p.y)) return true;
  }
  return false;
}
