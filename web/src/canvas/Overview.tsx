import { useEffect, useRef } from 'react';
import { useStoreApi } from '@xyflow/react';
import { useCommandContext } from '../editor/useEditor';
import type { FlowEdge, FlowNode } from './flowElements';
import { overviewScene, sceneChanges, type Box, type OverviewLayout, type OverviewScene } from './overview';
import { drawOverview, overviewPad, type View } from './overviewDraw';

/** Room drawn beyond each side of the view, as a share of its size: a pan shows it before the next redraw. */
const MARGIN = 0.25;
/** A zoom, or a pan past the margin drawn, redraws once it has rested this long; until then the bitmap is moved and scaled. */
const REST_MS = 90;
/** Most boxes of changed looks drawn one by one after a check; more redraw the whole view. */
const MAX_BOXES = 8;

/**
 * The drawing far out as one canvas over the flow (canvas/overview.ts): React Flow holds the elements
 * hidden meanwhile, so the canvas (Canvas.tsx) picks a click and a selection box from the same layout. A pan
 * or a zoom moves and scales the bitmap drawn last (a compositor transform, no redraw); it is drawn again when
 * the gesture rests, after a zoom or a pan past the margin drawn around the view (a whole redraw of 10 000
 * conductors took tens of milliseconds a wheel step). An edit or a new report redraws only the boxes whose
 * look changed; a selection or a resize redraws on the next frame.
 */
export function Overview({ layout }: { layout: OverviewLayout }) {
  const ref = useRef<HTMLCanvasElement>(null);
  const { store } = useCommandContext();
  const flow = useStoreApi<FlowNode, FlowEdge>();
  // The last scene outlives a new layout: one that differs only in its selection keeps the scene's families.
  const lastScene = useRef<OverviewScene | null>(null);

  useEffect(() => {
    const canvas = ref.current;
    const g = canvas?.getContext('2d');
    if (!canvas || !g) return;
    let scene: OverviewScene | null = null;
    let drawn: View | null = null;
    let frame = 0;
    let rest: ReturnType<typeof setTimeout> | null = null;

    // The layout follows the elements (this effect's inputs); the scene follows the report alone.
    const sceneNow = (): OverviewScene => {
      const s = store.getState();
      if (!scene || scene.report !== s.report) scene = lastScene.current = overviewScene(layout, s, scene ?? lastScene.current);
      return scene;
    };
    const viewNow = (): View => {
      const { transform, width, height } = flow.getState();
      const mx = Math.round(width * MARGIN);
      const my = Math.round(height * MARGIN);
      return { x: transform[0] + mx, y: transform[1] + my, zoom: transform[2], width: width + 2 * mx, height: height + 2 * my, dpr: window.devicePixelRatio || 1 };
    };
    const draw = () => {
      frame = 0;
      const v = viewNow();
      const w = Math.round(v.width * v.dpr);
      const h = Math.round(v.height * v.dpr);
      if (canvas.width !== w || canvas.height !== h) {
        canvas.width = w;
        canvas.height = h;
      }
      const mx = (v.width - flow.getState().width) / 2;
      const my = (v.height - flow.getState().height) / 2;
      Object.assign(canvas.style, { left: `${-mx}px`, top: `${-my}px`, width: `${v.width}px`, height: `${v.height}px`, transform: '', transformOrigin: '0 0' });
      drawOverview(g, sceneNow(), v);
      drawn = v;
    };
    const redrawSoon = () => {
      dirty = null;
      if (frame === 0) frame = requestAnimationFrame(draw);
    };
    // After a check: only the boxes where the scene changed are drawn again (none when no verdict moved).
    let dirty: Box[] | null = null;
    const drawChanges = () => {
      frame = 0;
      const boxes = dirty;
      dirty = null;
      if (!boxes || !drawn || !scene) return draw();
      for (const b of boxes) drawOverview(g, scene, drawn, b);
    };
    const changesSoon = (boxes: Box[]) => {
      if (boxes.length === 0) return;
      if (frame !== 0 && dirty === null) return; // a whole redraw is already due
      dirty = [...(dirty ?? []), ...boxes];
      // Each box is a pass over the whole scene: past a few, one whole redraw is cheaper (the first verdicts
      // of a drawing just opened change every conductor: box by box that was 10 000 passes).
      if (dirty.length > MAX_BOXES) return redrawSoon();
      if (frame === 0) frame = requestAnimationFrame(drawChanges);
    };

    const onFlow = () => {
      const v = viewNow();
      if (!drawn || v.width !== drawn.width || v.height !== drawn.height) return redrawSoon();
      // A flow point drawn at drawn.x + p·drawn.zoom belongs at v.x + p·v.zoom: scale by k about the bitmap's corner, then move.
      const k = v.zoom / drawn.zoom;
      const dx = v.x - drawn.x * k;
      const dy = v.y - drawn.y * k;
      if (rest !== null) clearTimeout(rest);
      rest = null;
      if (k === 1) {
        // Whole pixels, so a bitmap that is not drawn again stays sharp.
        canvas.style.transform = dx === 0 && dy === 0 ? '' : `translate(${Math.round(dx)}px, ${Math.round(dy)}px)`;
        // The margin drawn around the view still covers it: nothing to draw.
        if (Math.abs(dx) <= (v.width - flow.getState().width) / 2 && Math.abs(dy) <= (v.height - flow.getState().height) / 2) return;
      } else canvas.style.transform = `translate(${dx}px, ${dy}px) scale(${k})`;
      rest = setTimeout(() => {
        rest = null;
        redrawSoon();
      }, REST_MS);
    };
    const onStore = () => {
      if (scene && scene.report === store.getState().report) return;
      const before = scene;
      const after = sceneNow();
      if (!before || !drawn) return redrawSoon();
      changesSoon(sceneChanges(before, after, overviewPad(drawn.zoom)));
    };
    draw();
    const offFlow = flow.subscribe(onFlow);
    const offStore = store.subscribe(onStore);
    return () => {
      offFlow();
      offStore();
      if (frame) cancelAnimationFrame(frame);
      if (rest !== null) clearTimeout(rest);
    };
  }, [store, flow, layout]);

  return <canvas ref={ref} className="lw-overview" data-testid="overview" role="img" aria-label="The whole drawing far out: wiring, bus bars and verdict badges. Zoom in, or pick a row of a schedule or a finding, to reach each element." />;
}
