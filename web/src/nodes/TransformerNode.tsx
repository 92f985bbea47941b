import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const H = KIND_SPECS.transformer.height;

/** IEEE Std 315 style transformer symbol, drawn our own way. */
export function TransformerSymbol() {
  return (
    <>
      <line x1={20} y1={0} x2={20} y2={H / 2 - 25} />
      <circle cx={20} cy={H / 2 - 10} r={15} />
      <circle cx={20} cy={H / 2 + 10} r={15} />
      <line x1={20} y1={H / 2 + 25} x2={20} y2={H} />
    </>
  );
}

export const TransformerNode = memo(function TransformerNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'transformer'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<TransformerSymbol />} />;
});
