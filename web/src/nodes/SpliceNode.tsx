import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const H = KIND_SPECS.splice.height;

/** IEEE Std 315 style splice symbol, drawn our own way. */
export function SpliceSymbol() {
  return (
    <>
      <line x1={20} y1={0} x2={20} y2={H} />
      <circle cx={20} cy={H / 2} r={5.5} className="lw-sym-fill" />
    </>
  );
}

export const SpliceNode = memo(function SpliceNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'splice'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<SpliceSymbol />} />;
});
