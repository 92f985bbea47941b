import type { EquipmentNode, Severity, Verdict } from '@linewright/core';
import type { VerdictFamily } from '../analysis/verdicts';
import type { BusLinkGeometry, ConductorGeometry } from './geometry';

/** What an equipment node component receives. */
export interface EquipmentNodeData extends Record<string, unknown> {
  node: EquipmentNode;
  /** Most serious finding about this equipment, or null. */
  worst: Severity | null;
  findingCount: number;
}

/** What a conductor edge component receives. */
export interface ConductorEdgeData extends Record<string, unknown> {
  conductorId: string;
  /** The user's name for the conductor, shown as a tooltip. */
  name: string | null;
  /** First label line: sets × size, material, length. */
  line: string;
  verdict: Verdict | null;
  verdictText: string;
  family: VerdictFamily;
  /** Wire and label position, from canvas/geometry.ts. */
  geometry: ConductorGeometry;
}

export interface BusLinkEdgeData extends Record<string, unknown> {
  busLinkId: string;
  geometry: BusLinkGeometry;
}
