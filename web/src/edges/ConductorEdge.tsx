import { memo } from 'react';
import { stepPath } from './stepPath';
import { BaseEdge, type Edge, type EdgeProps } from '@xyflow/react';
import { FAMILY_LOOK } from '../analysis/verdicts';
import type { ConductorEdgeData } from '../canvas/flowTypes';
import { VerdictBadge } from './VerdictBadge';

export type { ConductorEdgeData } from '../canvas/flowTypes';

/** Label text is monospace, so its width is known without measuring (0.6 em per character). */
const CHAR_W = 6.6;
const LINE_H = 14;

export const ConductorEdge = memo(function ConductorEdge(props: EdgeProps<Edge<ConductorEdgeData, 'conductor'>>) {
  const { data, selected } = props;
  const [path, lx, ly] = stepPath(props, 6);
  if (!data) return null;
  const look = FAMILY_LOOK[data.family];
  const w = Math.max(data.line.length, data.verdictText.length + 3) * CHAR_W + 10;
  // Conductor data sits left of the wire; equipment names sit right of their symbols, so the two rarely meet.
  const x = lx - 8 - w;
  const y = ly - LINE_H;
  return (
    <>
      {selected && <path d={path} className="lw-edge-halo" />}
      <BaseEdge path={path} interactionWidth={14} style={{ stroke: look.colour, strokeWidth: look.strokeWidth, strokeDasharray: look.dash || undefined }} />
      <g className={`lw-edge-label${selected ? ' is-selected' : ''}`} transform={`translate(${x} ${y})`} data-testid={`conductor-label-${data.conductorId}`} data-verdict={data.verdict ?? 'pending'}>
        <title>{`${data.name ? `${data.name}\n` : ''}${data.line}\n${data.verdictText}`}</title>
        <rect x={0} y={0} width={w} height={LINE_H * 2 + 6} rx={3} className="lw-edge-label-bg" style={{ stroke: look.colour }} />
        <text x={5} y={LINE_H - 1} className="lw-edge-label-text">{data.line}</text>
        <VerdictBadge family={data.family} x={11} y={LINE_H * 1.5 + 3} size={11} />
        <text x={21} y={LINE_H * 2 + 1} className="lw-edge-label-verdict">{data.verdictText}</text>
      </g>
    </>
  );
});
