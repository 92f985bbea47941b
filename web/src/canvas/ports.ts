import type { EquipmentNode } from '@linewright/core';
import type { NodeHandle, Position } from '@xyflow/react';
import { kindSpec } from '../editor/equipment';

/** Side of a port (.lw-port in styles.css), border included. */
const PORT_PX = 14;
/** Where React Flow measures a port's corner from the wire and the box's top and bottom (the port is centred inside the node's 1 px frame). */
const PORT_LEFT = -6;
const PORT_TOP = -6;
const PORT_BOTTOM = -8;
const portsByKind = new Map<EquipmentNode['kind'], NodeHandle[]>();

/**
 * Where a kind's ports sit in its box (NodeFrame: on the wire, at the top and bottom edges), as React Flow
 * measures them (e2e/ports.spec.ts compares the two). Given up front, React Flow knows a node it has never drawn and renders
 * it only when it is in view: without them it mounts every unmeasured node, so the first zoom in past the
 * overview of 10 000 conductors mounted all 20 000 pieces to keep 800 (about 30 s).
 */
export function portsOf(kind: EquipmentNode['kind']): NodeHandle[] {
  let ports = portsByKind.get(kind);
  if (!ports) {
    const spec = kindSpec(kind);
    const x = spec.wireX + PORT_LEFT;
    ports = [];
    if (spec.ports.in) ports.push({ id: spec.ports.in, type: 'target', position: 'top' as Position, x, y: PORT_TOP, width: PORT_PX, height: PORT_PX });
    if (spec.ports.out) ports.push({ id: spec.ports.out, type: 'source', position: 'bottom' as Position, x, y: spec.height + PORT_BOTTOM, width: PORT_PX, height: PORT_PX });
    portsByKind.set(kind, ports);
  }
  return ports;
}
