import type { EquipmentNode } from '@linewright/core';
import type { BusLinkGeometry, ConductorGeometry } from './geometry';

/** What an equipment node component receives; what the check says about it is read by id (canvas/looks.ts). */
export interface EquipmentNodeData extends Record<string, unknown> {
  node: EquipmentNode;
}

/** What a conductor edge component receives; its facts line and verdict are read by id (canvas/looks.ts). */
export interface ConductorEdgeData extends Record<string, unknown> {
  conductorId: string;
  /** Wire and label position, from canvas/geometry.ts. */
  geometry: ConductorGeometry;
}

export interface BusLinkEdgeData extends Record<string, unknown> {
  busLinkId: string;
  geometry: BusLinkGeometry;
}
