import { Handle, Position } from '@xyflow/react';
import type { EquipmentNodeData } from '../canvas/flowTypes';
import type { ReactNode } from 'react';
import { SEVERITY_LOOK, SEVERITY_TEXT } from '../analysis/verdicts';
import { kindSpec, nodeFacts, nodeTitle } from '../editor/equipment';
import { spokenNameId, useNodeLook } from '../canvas/looks';

export type { EquipmentNodeData } from '../canvas/flowTypes';

/**
 * Box shared by every equipment symbol: the wire runs vertically through the
 * symbol at `wireX`, the supply port at the top and the load port at the
 * bottom; name and key facts sit to the right as plain text.
 */
export function NodeFrame(props: { data: EquipmentNodeData; selected: boolean; symbol: ReactNode; variant?: 'bus' }) {
  const { node } = props.data;
  const look = useNodeLook(node.id);
  const worst = look?.worst ?? null;
  const findingCount = look?.findingCount ?? 0;
  const spec = kindSpec(node.kind);
  const bus = props.variant === 'bus';
  const sw = bus ? spec.width : 40;
  const symX = bus ? 0 : spec.wireX - sw / 2;
  const textLeft = bus ? spec.wireX + 12 : spec.wireX + sw / 2 + 6;
  return (
    <div
      className={`lw-node lw-node-${node.kind}${props.selected ? ' is-selected' : ''}`}
      style={{ width: spec.width, height: spec.height }}
      data-testid={`node-${node.id}`}
      data-kind={node.kind}
      title={`${spec.title}: ${nodeTitle(node)}`}
    >
      <span id={spokenNameId('node', node.id)} hidden>{look?.spoken}</span>
      {spec.ports.in && (
        <Handle type="target" id={spec.ports.in} position={Position.Top} style={{ left: spec.wireX }} className="lw-port lw-port-in" data-testid={`port-${node.id}-${spec.ports.in}`} title={`${spec.ports.in} side`} />
      )}
      <svg className="lw-symbol" width={sw} height={spec.height} viewBox={`0 0 ${sw} ${spec.height}`} style={{ left: symX }} aria-hidden="true">
        {props.symbol}
      </svg>
      <div className={bus ? 'lw-node-text lw-node-text-bus' : 'lw-node-text'} style={bus ? { left: textLeft, height: (spec.barY ?? spec.height) - 6 } : { left: textLeft }}>
        <div className="lw-node-name">{nodeTitle(node)}</div>
        <div className="lw-node-facts">{nodeFacts(node)}</div>
      </div>
      {worst && (
        <div className="lw-node-flag" style={{ color: SEVERITY_LOOK[worst].colour }} title={`${findingCount} ${findingCount === 1 ? 'finding' : 'findings'}, most serious: ${SEVERITY_TEXT[worst]}`} data-testid={`node-flag-${node.id}`}>
          <span aria-hidden="true">{SEVERITY_LOOK[worst].glyph}</span>
          <span className="lw-node-flag-n">{findingCount}</span>
        </div>
      )}
      {spec.ports.out && (
        <Handle type="source" id={spec.ports.out} position={Position.Bottom} style={{ left: spec.wireX }} className="lw-port lw-port-out" data-testid={`port-${node.id}-${spec.ports.out}`} title={`${spec.ports.out} side`} />
      )}
    </div>
  );
}
