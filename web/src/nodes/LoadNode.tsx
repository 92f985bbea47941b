import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const H = KIND_SPECS.load.height;

/** IEEE Std 315 style load symbol, drawn our own way. */
export function LoadSymbol() {
  return (
    <>
      <line x1={20} y1={0} x2={20} y2={H / 2 - 6} />
      <path d={`M 11 ${H / 2 - 6} L 29 ${H / 2 - 6} L 20 ${H / 2 + 12} Z`} className="lw-sym-fill" />
    </>
  );
}

export const LoadNode = memo(function LoadNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'load'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<LoadSymbol />} />;
});
