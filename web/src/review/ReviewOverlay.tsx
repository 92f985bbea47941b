import { useStore, type ReactFlowState } from '@xyflow/react';
import { EMPTY_REVIEW, isOrphaned, pinnedElementId, type ReviewComment } from '@linewright/core';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { frameIds } from './CommentsPanel';
import { markedElements } from './RoundsPanel';
import { setReviewView, useReviewView } from './reviewState';

interface Box { x: number; y: number; w: number; h: number }

const transformOf = (s: ReactFlowState) => s.transform;
const lookupOf = (s: ReactFlowState) => s.nodeLookup;

/**
 * Comment pins and changed-element marks drawn over the canvas, in screen space from the flow
 * transform, so the canvas itself needs no change. Pins are numbered tags; a comment on a deleted
 * element has no place on the drawing and shows only in the list.
 */
export function ReviewOverlay() {
  const { store } = useCommandContext();
  const doc = useEditorState((s) => s.doc);
  const report = useEditorState((s) => s.report);
  const [tx, ty, zoom] = useStore(transformOf);
  const lookup = useStore(lookupOf);
  const active = useReviewView((v) => v.activeComment);
  const comparison = useReviewView((v) => v.comparison);
  const step = useReviewView((v) => v.step);
  const comments = (doc.review ?? EMPTY_REVIEW).comments;

  const nodeBox = (id: string): Box | null => {
    const n = lookup.get(id);
    if (!n) return null;
    const p = n.internals.positionAbsolute;
    return { x: p.x, y: p.y, w: n.measured.width ?? 0, h: n.measured.height ?? 0 };
  };
  const elementBox = (id: string): Box | null => {
    const e = doc.conductors.find((c) => c.id === id) ?? doc.busLinks.find((b) => b.id === id);
    if (!e) return nodeBox(id);
    const a = nodeBox(e.from);
    const b = nodeBox(e.to);
    if (!a || !b) return null;
    const x1 = a.x + a.w / 2;
    const y1 = a.y + a.h;
    const x2 = b.x + b.w / 2;
    const y2 = b.y;
    return { x: Math.min(x1, x2), y: Math.min(y1, y2), w: Math.abs(x2 - x1), h: Math.abs(y2 - y1) };
  };
  const screen = (x: number, y: number) => ({ left: x * zoom + tx, top: y * zoom + ty });

  const pinPlace = (c: ReviewComment): { left: number; top: number } | null => {
    if (c.pin.on === 'area') return screen(c.pin.x + c.pin.width / 2, c.pin.y + c.pin.height / 2);
    if (isOrphaned(c, doc)) return null;
    const id = pinnedElementId(c.pin, report);
    const b = id ? elementBox(id) : null;
    if (!b) return null;
    // A conductor's pin sits at the middle of its run; equipment's at its top-right corner.
    const isEdge = doc.conductors.some((x) => x.id === id) || doc.busLinks.some((x) => x.id === id);
    return isEdge ? screen(b.x + b.w / 2 + 12, b.y + b.h / 2) : screen(b.x + b.w, b.y);
  };

  const marks = markedElements(comparison);
  return (
    <div className="lw-rv-overlay" aria-hidden={false} data-testid="review-overlay">
      {marks.map((m, i) => {
        const b = elementBox(m.id);
        if (!b) return null;
        const pad = 10;
        const s = screen(b.x - pad, b.y - pad);
        return (
          <div
            key={`m${m.id}`}
            className={`lw-rv-mark is-${m.change}${i === step ? ' is-current' : ''}`}
            style={{ left: s.left, top: s.top, width: Math.max(24, (b.w + 2 * pad) * zoom), height: Math.max(24, (b.h + 2 * pad) * zoom) }}
            data-testid="change-mark"
            data-id={m.id}
          >
            <span className="lw-rv-mark-tag">{m.change === 'added' ? 'new' : 'changed'}</span>
          </div>
        );
      })}
      {comments.map((c) => {
        if (c.state === 'withdrawn') return null;
        const p = pinPlace(c);
        if (!p) return null;
        return (
          <button
            key={`c${c.number}`}
            type="button"
            className={`lw-rv-pin is-${c.state}${c.number === active ? ' is-active' : ''}`}
            style={{ left: p.left, top: p.top }}
            title={`Comment ${c.number} (${c.state}): ${c.text.slice(0, 120)}`}
            onClick={() => {
              setReviewView({ activeComment: c.number });
              const id = pinnedElementId(c.pin, report);
              if (id) store.requestFrame(frameIds(doc, id));
            }}
            data-testid="comment-pin"
            data-number={c.number}
          >
            {c.number}
          </button>
        );
      })}
    </div>
  );
}
