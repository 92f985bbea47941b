import type { ConductorRole, Verdict } from '../analyze/types';
import type { ConductorId, ConductorSize, Insulation, Material, NodeId, RacewayKind } from '../model/schema';
import type { TradeSize } from '../tables/chapter9Table4';

export type { CircuitMakeup, CurrentCarryingCount, SystemAt } from '../analyze/circuits';
import type { CircuitMakeup, CurrentCarryingCount, SystemAt } from '../analyze/circuits';

export interface EgcSizing {
  /** Size of one EGC; null when the takeoff cannot size it (see `reason`). */
  size: ConductorSize | null;
  material: Material;
  /** One per raceway or cable (250.122(F)): the number of parallel sets. 0 when not sized. */
  count: number;
  /** Table 250.122 size from the OCPD ahead, before any increase; for a supply-side bonding jumper its Table 250.102(C)(1) (or 12.5 %) size. */
  tableSize: ConductorSize | null;
  /** Smallest phase size the OCPD and load allow, against which 250.122(B) measures an increase. */
  minimumPhaseSize: ConductorSize | null;
  /** Circular-mil ratio of the actual to the minimum phase conductors (1 when not increased). */
  increaseRatio: number;
  ocpdA: number | null;
  /** Sections that sized it: 'Table 250.122', '250.122(B)', '250.122(F)', '250.122(G)', '250.122(A)'; a supply-side bonding jumper 'Table 250.102(C)(1)', '250.102(C)(1)' (12.5 %), '250.102(C)(2)'. */
  cites: string[];
  reason: string;
  /** What an estimator must resolve (missing OCPD, stated size below the minimum), or null. */
  problem: string | null;
}

export interface RacewayFill {
  kind: RacewayKind | null;
  tradeSize: TradeSize | null;
  /** Raceways: one per parallel set. */
  count: number;
  /** Conductors in one raceway (phases, neutral, EGC). */
  conductorsPerRaceway: number;
  /** Sum of the Table 5 areas in one raceway, in². */
  conductorAreaIn2: number | null;
  /** Table 1 fraction for that number of conductors. */
  maxFillFraction: number | null;
  /** Allowed area of the chosen trade size, in². */
  allowedAreaIn2: number | null;
  /** Fill of the chosen trade size, % of its whole internal area. */
  fillPct: number | null;
  /** Why there is no trade size, or null. */
  problem: string | null;
}

/** One drawn conductor run, as an estimator counts it. */
export interface TakeoffRun {
  conductorId: ConductorId;
  label: string;
  from: NodeId;
  to: NodeId;
  role: ConductorRole;
  verdict: Verdict;
  system: SystemAt;
  circuit: CircuitMakeup;
  currentCarrying: CurrentCarryingCount;
  lengthFt: number | null;
  material: Material;
  insulation: Insulation;
  /** Null when the drawing gives no size: the run's feet are totalled under "size unknown", never under a size. */
  size: ConductorSize | null;
  parallelSets: number;
  /** sets × ungrounded per set. */
  phaseConductors: number;
  neutralConductors: number;
  /** Null when the run has no neutral, or when it has one (neutralConductors > 0) of unknown size. */
  neutralSize: ConductorSize | null;
  egc: EgcSizing;
  /** The EGC is bare (Table 8 area in the fill; 'bare' in the wire totals). */
  egcBare: boolean;
  raceway: RacewayFill;
  /** Conductor feet with the makeup allowance; null when the length is missing. */
  phaseFt: number | null;
  neutralFt: number | null;
  egcFt: number | null;
  /** Raceway feet: length × raceways; null without a length or a raceway. */
  racewayFt: number | null;
  /** Things an estimator must look at before pricing this run. */
  flags: string[];
}

export interface DeviceItem {
  id: NodeId;
  kind: 'breaker' | 'fuse';
  label: string;
  ratingA: number | null;
  poles: number | null;
  interruptingKA: number | null;
}

export interface Takeoff {
  projectName: string;
  edition: 2020 | 2023;
  makeupFtPerTermination: number;
  runs: TakeoffRun[];
  devices: DeviceItem[];
  /** Node ids of buses, transformers and disconnects, for the equipment totals. */
  equipment: EquipmentItem[];
  assumptions: string[];
  caution: string;
}

export type EquipmentItem =
  | { kind: 'bus'; id: NodeId; label: string; busType: string; ratingA: number | null; system: string }
  | { kind: 'transformer'; id: NodeId; label: string; kva: number; primaryVoltsLL: number; secondaryVoltsLL: number; phases: 1 | 3; connection: string }
  | { kind: 'disconnect'; id: NodeId; label: string; ratingA: number | null; poles: number | null; fused: boolean };

