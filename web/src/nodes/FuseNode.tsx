import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const H = KIND_SPECS.fuse.height;

/** IEEE Std 315 style fuse symbol, drawn our own way. */
export function FuseSymbol() {
  return (
    <>
      <line x1={20} y1={0} x2={20} y2={H} />
      <rect x={13} y={H / 2 - 14} width={14} height={28} rx={1.5} className="lw-sym-bg" />
    </>
  );
}

export const FuseNode = memo(function FuseNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'fuse'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<FuseSymbol />} />;
});
