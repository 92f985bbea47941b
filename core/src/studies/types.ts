import type { ConductorId, EquipmentKind, NodeId } from '../model/schema';

/** Available fault current at one node, as the report carries it. */
export interface NodeFault {
  nodeId: NodeId;
  kind: EquipmentKind;
  /** Symmetrical RMS kA (three-phase bolted; line to line on single-phase systems), motor contribution included; null when unknown. */
  kA: number | null;
  xOverR: number | null;
  /** Line-to-ground kA where the data allows, else null. */
  lineToGroundKA: number | null;
  /** Motor contribution included in kA. */
  motorKA: number;
  /** A missing impedance ahead was taken as zero: kA is "at most". */
  upperBound: boolean;
  voltsLL: number | null;
  /** Why kA is unknown. */
  unknownWhy?: string;
  /** The node supplying this one, for the working. */
  parentId: NodeId | null;
  /** R and X this node's element adds (source, transformer with the primary referred, or the conductor arriving), ohms at this node's voltage. */
  stepROhm: number;
  stepXOhm: number;
  /** R and X from the source to this node, ohms (one phase; the loop on single-phase circuits); null when unknown. */
  rOhm: number | null;
  xOhm: number | null;
}

/** Voltage drop of one conductor and the sums at its load end. */
export interface ConductorDrop {
  conductorId: ConductorId;
  currentA: number | null;
  powerFactor: number | null;
  /** This conductor's drop, % of its circuit voltage. */
  pct: number | null;
  /** Drop of its circuit up to its load end, %. */
  circuitPct: number | null;
  /** Drop from the source or transformer secondary to its load end, %. */
  totalPct: number | null;
}

/** 110.24(A): the available fault current to mark on service equipment, with the date of the calculation. */
export interface ServiceMarking {
  nodeId: NodeId;
  label: string;
  kA: number | null;
  upperBound: boolean;
  /** YYYY-MM-DD from the project settings; null until the user enters it. */
  date: string | null;
}

/** Short-circuit withstand of one tap or secondary run. */
export interface WithstandResult {
  conductorIds: ConductorId[];
  faultKA: number | null;
  clearingTimeS: number;
  clearingBasis: string;
  allowedS: number | null;
  withstands: boolean | null;
}

/** The short-circuit and voltage-drop studies, on every report. */
export interface StudiesReport {
  /** Method and defaults, stated once each. */
  notes: string[];
  faults: NodeFault[];
  voltageDrop: { circuitLimitPct: number; totalLimitPct: number; conductors: ConductorDrop[] };
  serviceMarkings: ServiceMarking[];
  withstand: WithstandResult[];
}
