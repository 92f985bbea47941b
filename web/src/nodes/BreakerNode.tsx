import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const H = KIND_SPECS.breaker.height;

/** IEEE Std 315 style breaker symbol, drawn our own way. */
export function BreakerSymbol() {
  return (
    <>
      <line x1={20} y1={0} x2={20} y2={H / 2 - 12} />
      <circle cx={20} cy={H / 2 - 10} r={2.5} className="lw-sym-fill" />
      <circle cx={20} cy={H / 2 + 10} r={2.5} className="lw-sym-fill" />
      <path d={`M 20 ${H / 2 - 13} A 13 13 0 0 1 20 ${H / 2 + 13}`} />
      <line x1={20} y1={H / 2 + 12} x2={20} y2={H} />
    </>
  );
}

export const BreakerNode = memo(function BreakerNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'breaker'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<BreakerSymbol />} />;
});
