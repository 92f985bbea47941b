import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const S = KIND_SPECS.bus;

/** A bus drawn as a heavy bar across the equipment, the wire meeting it at the supply point. */
export function BusSymbol() {
  return (
    <>
      <line x1={S.wireX} y1={0} x2={S.wireX} y2={S.height} />
      <rect x={4} y={S.height / 2 - 3.5} width={S.width - 8} height={7} className="lw-sym-fill" />
    </>
  );
}

export const BusNode = memo(function BusNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'bus'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<BusSymbol />} variant="bus" />;
});
