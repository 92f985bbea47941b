import type {
  CodeEdition,
  ConductorId,
  ConductorSize,
  Material,
  NodeId,
  ProjectSettings,
} from '../model/schema';
import type { Verdict } from '../analyze/types';

/** Where a run ends, as the tap rules see it. */
export interface Termination {
  kind: 'ocpd' | 'bus' | 'transformer' | 'load' | 'splice' | 'disconnect' | 'none';
  nodeId: NodeId | null;
  label: string;
  /** A single circuit breaker or a single set of fuses (240.21(B)(2)). */
  single: boolean;
  /** Rating of the OCPD at the termination, or of the equipment containing it (a bus rating). */
  ratingA: number | null;
  atDisconnectingMeans: boolean;
  disconnectLocation: 'outside' | 'inside-nearest-entrance' | 'elsewhere' | null;
  busType: 'switchgear' | 'switchboard' | 'panelboard' | 'tap-box' | 'busway' | null;
  /** For a bus: the sum of the ratings of the OCPDs it feeds directly (240.21(C)(3)); null when one lacks a rating. */
  groupedOcpdSumA: number | null;
  /** For a bus: how many OCPDs it feeds directly through bus links. */
  groupedOcpdCount: number;
  /** For a bus: everything it feeds goes through one of those OCPDs (no conductor or other equipment straight off the bus). */
  onlyOcpdsBelow: boolean;
}

export interface TransformerFacts {
  id: NodeId;
  label: string;
  kva: number;
  primaryVoltsLL: number;
  secondaryVoltsLL: number;
  phases: 1 | 3;
  connection: string;
  primaryFlaA: number;
  secondaryFlaA: number;
  /** Rating of the OCPD protecting the primary; null when unknown or absent. */
  primaryOcpdA: number | null;
  primaryOcpdId: NodeId | null;
  /** Where each secondary run of the transformer ends (450.3(B) Note 2 counts the devices there). */
  secondaryEnds: Termination[];
}

export interface MotorRunFacts {
  /** Full-load current, A: Table 430.248/430.250 by horsepower and voltage, or the nameplate (430.6(A)). */
  fullLoadA: number;
  /** Where the full-load current came from, in words. */
  source: string;
  motorType: 'induction' | 'design-b-energy-efficient' | 'synchronous' | 'wound-rotor' | 'dc';
}

export interface GeneratorFacts {
  id: NodeId;
  kva: number;
  nameplateA: number;
  overloadPreventedByDesign: boolean;
}

/**
 * Everything a rule may read about one run (one conductor, or several joined
 * at pass-through splices). Rules are pure functions of this object.
 */
export interface RunFacts {
  edition: CodeEdition;
  conductorIds: ConductorId[];
  material: Material;
  /** Size of the weakest segment; null when any segment of the run has no size (then the ampacity is unknown too). */
  size: ConductorSize | null;
  parallelSets: number;
  /** Sum of the run's conductor lengths; null when any is missing. */
  lengthFt: number | null;
  /** Lowest ampacity along the run; null when a segment's ampacity cannot be found. */
  ampacityA: number | null;
  /**
   * Lowest ampacity along the run before correction and adjustment: Table 310.16 in the
   * termination's column (110.14(C)), times the parallel sets; what 125 % of the continuous
   * load is compared with (210.19(A)(1)(a), 215.2(A)(1)(a), 230.42(A)(1)). Null when unknown.
   */
  ampacityUncorrectedA: number | null;
  smallConductorMaxOcpdA: number | null;
  /** R: rating of the OCPD ahead of the run's supply point; null when unknown. */
  supplyOcpdA: number | null;
  supplyOcpdId: NodeId | null;
  supplyOcpdKind: 'breaker' | 'fuse' | null;
  /** Table 430.52 column of the device ahead: a breaker's trip (inverse-time when not stated), a fuse's delay (null when not stated). */
  supplyDeviceType: 'inverse-time' | 'instantaneous' | 'time-delay' | 'non-time-delay' | null;
  termination: Termination;
  /** Sum of the loads served, not factored (A). */
  loadA: number | null;
  /** Continuous × 1.25 + noncontinuous (A), 215.2(A)(1). */
  calculatedLoadA: number | null;
  /** Every segment is enclosed in a raceway (conduit). */
  inRaceway: boolean;
  /** Weakest protection from physical damage along the run. */
  damageProtection: 'raceway' | 'other-approved-means' | 'none';
  outdoors: boolean;
  /** A field installation leaving the enclosure where tapped; null when no segment says (the rules then take it as leaving). */
  leavesEnclosure: boolean | null;
  extendsBeyondEquipment: boolean;
  multioutletCordAndPlug: boolean;
  /** The run passes through splices. */
  hasSplices: boolean;
  highBay: { horizontalFt: number; tapHeightAboveFloorFt: number; penetratesWallFloorCeiling: boolean } | null;
  site: Pick<ProjectSettings, 'qualifiedMaintenance' | 'industrialInstallation' | 'terminationDefault'> & { manufacturingWallHeightFt: number | null };
  /** For a secondary: the transformer supplying it. For a primary run ending at a transformer: that transformer. */
  transformer: TransformerFacts | null;
  /** For a primary run ending at a transformer: the transformer's secondary runs. */
  secondaries: RunFacts[];
  generator: GeneratorFacts | null;
  /** The one load the run serves, when it is a motor (Article 430); null otherwise. */
  motor: MotorRunFacts | null;
  /** The one load the run serves, when it is HVAC equipment with a nameplate MCA and MOP (Article 440); null otherwise. */
  hvac: { mcaA: number; mopA: number } | null;
  /** When the supply point lies on another run: that run's ids and verdict. */
  suppliedFrom: { conductorIds: ConductorId[]; verdict: Verdict } | null;
}
