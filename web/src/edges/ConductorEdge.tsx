import { memo } from 'react';
import { BaseEdge, type Edge, type EdgeProps } from '@xyflow/react';
import { FAMILY_LOOK } from '../analysis/verdicts';
import type { ConductorEdgeData } from '../canvas/flowTypes';
import { spokenNameId, useConductorLook } from '../canvas/looks';
import { LINE_H, pathOf } from '../canvas/geometry';
import { BusBarStretch } from './BusLinkEdge';
import { VerdictBadge } from './VerdictBadge';

export type { ConductorEdgeData } from '../canvas/flowTypes';

/**
 * A conductor: its wire and a label above the piece it feeds, both placed by canvas/geometry.ts.
 * At low zoom the text hides and the verdict badge grows (see styles.css, `.lw-far`).
 */
export const ConductorEdge = memo(function ConductorEdge(props: EdgeProps<Edge<ConductorEdgeData, 'conductor'>>) {
  const { data: edge, selected } = props;
  const data = useConductorLook(edge?.conductorId ?? '');
  if (!edge || !data) return null;
  const { points, bar, label } = edge.geometry;
  const path = pathOf(points);
  const look = FAMILY_LOOK[data.family];
  const badgeX = label.x + label.w - 9;
  const badgeY = label.y + label.h / 2;
  return (
    <>
      {bar && <BusBarStretch bar={bar} />}
      {selected && <path d={path} className="lw-edge-halo" />}
      <BaseEdge path={path} interactionWidth={14} style={{ stroke: look.colour, strokeWidth: look.strokeWidth, strokeDasharray: look.dash || undefined }} />
      <g className={`lw-edge-label${selected ? ' is-selected' : ''}`} transform={`translate(${label.x} ${label.y})`} data-testid={`conductor-label-${edge.conductorId}`} data-verdict={data.verdict ?? 'pending'}>
        <title>{`${data.name ? `${data.name}\n` : ''}${data.line}\n${data.verdictText}`}</title>
        <text id={spokenNameId('conductor', edge.conductorId)} display="none">{data.spoken}</text>
        <rect x={0} y={0} width={label.w} height={label.h} rx={3} className="lw-edge-label-bg" style={{ stroke: look.colour }} />
        <text x={5} y={LINE_H - 1} className="lw-edge-label-text">{data.line}</text>
        <g className="lw-edge-badge-near">
          <VerdictBadge family={data.family} x={11} y={LINE_H * 1.5 + 3} size={11} />
        </g>
        <text x={21} y={LINE_H * 2 + 1} className="lw-edge-label-verdict">{data.verdictText}</text>
      </g>
      <g className="lw-edge-badge-far" transform={`translate(${badgeX} ${badgeY})`} aria-hidden="true">
        <g className="lw-lod-grow">
          <VerdictBadge family={data.family} x={0} y={0} size={11} />
        </g>
      </g>
    </>
  );
});
