import { getSmoothStepPath, type EdgeProps } from '@xyflow/react';

/** The right-angled path React Flow draws between an edge's ports; returns [path, labelX, labelY]. */
export function stepPath(p: Pick<EdgeProps, 'sourceX' | 'sourceY' | 'sourcePosition' | 'targetX' | 'targetY' | 'targetPosition'>, borderRadius: number): [string, number, number] {
  const [path, lx, ly] = getSmoothStepPath({
    sourceX: p.sourceX,
    sourceY: p.sourceY,
    sourcePosition: p.sourcePosition,
    targetX: p.targetX,
    targetY: p.targetY,
    targetPosition: p.targetPosition,
    borderRadius,
  });
  return [path, lx, ly];
}
