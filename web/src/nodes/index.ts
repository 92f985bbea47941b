import type { EquipmentKind } from '@linewright/core';
import type { ComponentType } from 'react';
import type { Node, NodeProps } from '@xyflow/react';
import type { EquipmentNodeData } from './NodeFrame';
import { BreakerNode } from './BreakerNode';
import { BusNode } from './BusNode';
import { DisconnectNode } from './DisconnectNode';
import { FuseNode } from './FuseNode';
import { GeneratorNode } from './GeneratorNode';
import { LoadNode } from './LoadNode';
import { SpliceNode } from './SpliceNode';
import { TransformerNode } from './TransformerNode';
import { UtilityNode } from './UtilityNode';

// A module constant: React Flow warns (and remounts every node) when nodeTypes is rebuilt per render.
// `satisfies` makes a kind added to the core schema without a node here a compile error.
export const nodeTypes = {
  utility: UtilityNode,
  generator: GeneratorNode,
  bus: BusNode,
  breaker: BreakerNode,
  fuse: FuseNode,
  disconnect: DisconnectNode,
  splice: SpliceNode,
  transformer: TransformerNode,
  load: LoadNode,
} satisfies { [K in EquipmentKind]: ComponentType<NodeProps<Node<EquipmentNodeData, K>>> };

export { BreakerSymbol } from './BreakerNode';
export { BusSymbol } from './BusNode';
export { DisconnectSymbol } from './DisconnectNode';
export { FuseSymbol } from './FuseNode';
export { GeneratorSymbol } from './GeneratorNode';
export { LoadSymbol } from './LoadNode';
export { SpliceSymbol } from './SpliceNode';
export { TransformerSymbol } from './TransformerNode';
export { UtilitySymbol } from './UtilityNode';
