import { Panel, ViewportPortal, useNodes } from '@xyflow/react';
import { useMemo, useState } from 'react';
import { faultText, pctText } from '@linewright/core';
import type { FlowNode } from '../canvas/flowElements';
import { useEditorState } from '../editor/useEditor';

/** Most labels a layer draws; a larger drawing shows the figures in the details panel and the reports. */
const MAX_LABELS = 3000;

/**
 * Two layers over the drawing that the user switches on: available fault
 * current at each node and voltage drop on each conductor. Labels are plain
 * text in the drawing's coordinates; a device whose interrupting rating is
 * below the fault is flagged by its finding like any violation.
 */
export function StudyLayers() {
  const [showFault, setShowFault] = useState(false);
  const [showDrop, setShowDrop] = useState(false);
  const report = useEditorState((s) => s.report);
  const nodes = useNodes<FlowNode>();
  const labels = useMemo(() => {
    const s = report?.studies;
    if (!s || (!showFault && !showDrop) || nodes.length > MAX_LABELS) return [];
    const at = new Map(nodes.map((n) => [n.id, n]));
    const out: { key: string; x: number; y: number; text: string; kind: 'fault' | 'drop'; over: boolean }[] = [];
    if (showFault) {
      for (const f of s.faults) {
        const n = at.get(f.nodeId);
        if (!n || f.kA === null) continue;
        out.push({ key: `f:${f.nodeId}`, x: n.position.x + (n.width ?? 0) + 4, y: n.position.y - 14, text: faultText(f.kA, f.upperBound), kind: 'fault', over: false });
      }
    }
    if (showDrop && report) {
      report.conductors.forEach((c, i) => {
        const d = s.voltageDrop.conductors[i];
        const a = at.get(c.from);
        const b = at.get(c.to);
        if (!d || !a || !b || d.pct === null) return;
        const over = (d.circuitPct ?? 0) > s.voltageDrop.circuitLimitPct || (d.totalPct ?? 0) > s.voltageDrop.totalLimitPct;
        out.push({
          key: `d:${c.id}`,
          x: (a.position.x + b.position.x) / 2 + (a.width ?? 0) / 2 + 8,
          y: (a.position.y + (a.height ?? 0) + b.position.y) / 2,
          text: `VD ${pctText(d.pct)} (total ${pctText(d.totalPct)})${over ? ' over the limit' : ''}`,
          kind: 'drop',
          over,
        });
      });
    }
    return out;
  }, [report, nodes, showFault, showDrop]);

  return (
    <>
      <Panel position="top-right" className="lw-study-layers" data-testid="study-layers">
        <label>
          <input type="checkbox" checked={showFault} onChange={(e) => setShowFault(e.target.checked)} data-testid="layer-fault" /> Fault kA
        </label>
        <label>
          <input type="checkbox" checked={showDrop} onChange={(e) => setShowDrop(e.target.checked)} data-testid="layer-drop" /> Voltage drop %
        </label>
        {(showFault || showDrop) && nodes.length > MAX_LABELS && <span className="lw-muted"> too many to label; see the details panel</span>}
      </Panel>
      {/* Only with labels to show: the portal looks itself up in the DOM on every pan and zoom step. */}
      {labels.length > 0 && (
        <ViewportPortal>
          {labels.map((l) => (
            <div
              key={l.key}
              className={`lw-study-label lw-study-${l.kind}${l.over ? ' is-over' : ''}`}
              data-testid={`layer-label-${l.key}`}
              style={{ position: 'absolute', transform: `translate(${l.x}px, ${l.y}px)`, pointerEvents: 'none', fontSize: 11, whiteSpace: 'nowrap', background: 'rgba(255,255,255,0.85)', padding: '0 3px', borderRadius: 3, fontWeight: l.over ? 700 : 400, color: l.kind === 'fault' ? '#5b2a86' : l.over ? '#a1260d' : '#1d5e3a', border: l.over ? '1px dashed #a1260d' : undefined }}
            >
              {l.kind === 'fault' ? '⚡ ' : l.over ? '▲ ' : ''}
              {l.text}
            </div>
          ))}
        </ViewportPortal>
      )}
    </>
  );
}
