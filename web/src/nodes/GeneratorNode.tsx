import { memo } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import { KIND_SPECS } from '../editor/equipment';
import { NodeFrame, type EquipmentNodeData } from './NodeFrame';

const H = KIND_SPECS.generator.height;

/** IEEE Std 315 style generator symbol, drawn our own way. */
export function GeneratorSymbol() {
  return (
    <>
      <circle cx={20} cy={H / 2} r={15} />
      <text x={20} y={H / 2 + 5} textAnchor="middle" className="lw-sym-text">G</text>
      <line x1={20} y1={H / 2 + 15} x2={20} y2={H} />
    </>
  );
}

export const GeneratorNode = memo(function GeneratorNode({ data, selected }: NodeProps<Node<EquipmentNodeData, 'generator'>>) {
  return <NodeFrame data={data} selected={selected} symbol={<GeneratorSymbol />} />;
});
