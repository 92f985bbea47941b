import { memo } from 'react';
import type { Edge, EdgeProps } from '@xyflow/react';
import type { BusLinkEdgeData } from '../canvas/flowTypes';
import { pathOf, type Bar } from '../canvas/geometry';

export type { BusLinkEdgeData } from '../canvas/flowTypes';

/** The bus bar drawn on from its bus to the point above a piece it feeds, as heavy as the bar itself. */
export function BusBarStretch({ bar }: { bar: Bar }) {
  return <line x1={bar.x1} y1={bar.y} x2={bar.x2} y2={bar.y} className="lw-busbar" />;
}

/**
 * A bus link inside equipment (e.g. a main breaker to its panelboard bus): drawn as a double bar
 * with no length and no label, unlike a conductor; from a bus it drops straight from the bar.
 */
export const BusLinkEdge = memo(function BusLinkEdge(props: EdgeProps<Edge<BusLinkEdgeData, 'busLink'>>) {
  if (!props.data) return null;
  const { points, bar } = props.data.geometry;
  const path = pathOf(points);
  return (
    <g data-testid={`buslink-${props.data.busLinkId}`}>
      {bar && <BusBarStretch bar={bar} />}
      {props.selected && <path d={path} className="lw-edge-halo" />}
      <path d={path} className="lw-buslink-outer" />
      <path d={path} className="lw-buslink-inner" />
      <path d={path} className="react-flow__edge-interaction" fill="none" strokeOpacity={0} strokeWidth={14} />
    </g>
  );
});
