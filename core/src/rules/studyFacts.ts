import type { CodeEdition, ConductorId, ConductorSize, Material, NodeId } from '../model/schema';
import type { ThermalClass } from '../tables/insulation';

/**
 * Facts of the equipment and study rules (110.9, 110.10, conductor withstand,
 * voltage drop), filled in by the short-circuit and voltage-drop stages
 * (core/src/studies). Like RunFacts, rules read nothing else.
 */

/** A fault current at a point: kA, or null when unknown; `upperBound` when a missing impedance was taken as zero. */
export interface FaultAt {
  faultKA: number | null;
  upperBound: boolean;
}

/** 110.9: one breaker or fuse and the fault at its line terminals. */
export interface InterruptingFacts extends FaultAt {
  edition: CodeEdition;
  deviceId: NodeId;
  device: string;
  interruptingKA: number | null;
  /** 240.86: a series rating the user declared with this device on the load side. */
  series: { lineSideId: NodeId; lineSide: string; combinationKA: number; lineSideIsAhead: boolean } | null;
}

/** 110.10: equipment with a short-circuit current rating and the fault where it is installed. */
export interface EquipmentRatingFacts extends FaultAt {
  edition: CodeEdition;
  equipmentId: NodeId;
  equipment: string;
  sccrKA: number | null;
}

/** Short-circuit withstand of a tap or secondary run (ICEA P-32-382) against the device ahead of it. */
export interface WithstandFacts extends FaultAt {
  edition: CodeEdition;
  conductorIds: ConductorId[];
  material: Material;
  /** Null when the drawing gives no size: the withstand is then unknown. */
  size: ConductorSize | null;
  parallelSets: number;
  /** Area of one conductor, cmil (Chapter 9 Table 8); null when the size is unknown. */
  areaCmil: number | null;
  initialC: number;
  finalC: number;
  thermalClass: ThermalClass;
  device: string;
  clearingTimeS: number;
  /** 'entered' or the common-practice default's basis. */
  clearingBasis: string;
  /** Smallest size of the same material and sets that withstands, or null when none does. */
  smallestSize: ConductorSize | null;
}

/** Voltage drop of one circuit (at its end) or of the path to one load. */
export interface VoltageDropFacts {
  edition: CodeEdition;
  scope: 'circuit' | 'total';
  subject: string;
  pct: number | null;
  limitPct: number;
}
