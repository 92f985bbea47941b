import { memo } from 'react';
import { stepPath } from './stepPath';
import type { Edge, EdgeProps } from '@xyflow/react';
import type { BusLinkEdgeData } from '../canvas/flowTypes';

export type { BusLinkEdgeData } from '../canvas/flowTypes';

/**
 * A bus link inside equipment (e.g. a main breaker to its panelboard bus):
 * drawn as a double bar with no length and no label, unlike a conductor.
 */
export const BusLinkEdge = memo(function BusLinkEdge(props: EdgeProps<Edge<BusLinkEdgeData, 'busLink'>>) {
  const [path] = stepPath(props, 0);
  return (
    <g data-testid={`buslink-${props.data?.busLinkId ?? props.id}`}>
      {props.selected && <path d={path} className="lw-edge-halo" />}
      <path d={path} className="lw-buslink-outer" />
      <path d={path} className="lw-buslink-inner" />
      <path d={path} className="react-flow__edge-interaction" fill="none" strokeOpacity={0} strokeWidth={14} />
    </g>
  );
});
