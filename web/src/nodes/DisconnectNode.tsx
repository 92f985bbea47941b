import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const H = KIND_SPECS.disconnect.height;

/** IEEE Std 315 style disconnect symbol, drawn our own way. */
export function DisconnectSymbol() {
  return (
    <>
      <line x1={20} y1={0} x2={20} y2={H / 2 - 12} />
      <circle cx={20} cy={H / 2 - 12} r={2.5} className="lw-sym-fill" />
      <circle cx={20} cy={H / 2 + 12} r={2.5} className="lw-sym-fill" />
      <line x1={20} y1={H / 2 + 12} x2={8} y2={H / 2 - 10} />
      <line x1={20} y1={H / 2 + 12} x2={20} y2={H} />
    </>
  );
}

export const DisconnectNode = memo(function DisconnectNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'disconnect'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<DisconnectSymbol />} />;
});
