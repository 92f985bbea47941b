import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const H = KIND_SPECS.utility.height;

/** IEEE Std 315 style utility symbol, drawn our own way. */
export function UtilitySymbol() {
  return (
    <>
      <circle cx={20} cy={H / 2} r={15} />
      <path d={`M 9 ${H / 2} q 5.5 -9 11 0 t 11 0`} />
      <line x1={20} y1={H / 2 + 15} x2={20} y2={H} />
    </>
  );
}

export const UtilityNode = memo(function UtilityNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'utility'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<UtilitySymbol />} />;
});
