import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const S = KIND_SPECS.bus;

/** A bus drawn as a heavy bar low in its box, the wire meeting it at the supply point; name and rating sit above the bar. */
export function BusSymbol() {
  return (
    <>
      <line x1={S.wireX} y1={0} x2={S.wireX} y2={S.barY} />
      <rect x={4} y={S.barY - 3.5} width={S.width - 8} height={7} className="lw-sym-fill" />
    </>
  );
}

export const BusNode = memo(function BusNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'bus'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<BusSymbol />} variant="bus" />;
});
