import type { StudiesReport } from '../studies/types';
import type { CodeEdition, ConductorId, ConductorSize, EquipmentKind, Material, NodeId, BusLinkId } from '../model/schema';

/** Machine-readable verdict for one conductor. Exactly one per conductor. */
export const VERDICTS = [
  'protected',
  'protected-next-size',
  'motor-circuit',
  'hvac-circuit',
  'tap-10ft',
  'tap-25ft',
  'tap-transformer',
  'tap-high-bay',
  'tap-outside',
  'secondary-primary-protected',
  'secondary-10ft',
  'secondary-25ft',
  'secondary-outside',
  'service',
  'generator',
  'tap-from-tap',
  'unprotected',
  'incomplete',
] as const;
export type Verdict = (typeof VERDICTS)[number];

/** The words a reviewer reads for each verdict (text always accompanies any colour or shape). */
export const VERDICT_LABELS: Readonly<Record<Verdict, string>> = {
  protected: 'protected',
  'protected-next-size': 'protected (next size up)',
  'motor-circuit': 'motor circuit',
  'hvac-circuit': 'HVAC circuit',
  'tap-10ft': 'tap: 10 ft',
  'tap-25ft': 'tap: 25 ft',
  'tap-transformer': 'tap: transformer',
  'tap-high-bay': 'tap: high bay',
  'tap-outside': 'tap: outside',
  'secondary-primary-protected': 'secondary: primary-protected',
  'secondary-10ft': 'secondary: 10 ft',
  'secondary-25ft': 'secondary: 25 ft',
  'secondary-outside': 'secondary: outside',
  service: 'service',
  generator: 'generator',
  'tap-from-tap': 'tap from a tap',
  unprotected: 'unprotected',
  incomplete: 'incomplete (missing data)',
};

/** Verdicts that mean "no rule makes this conductor acceptable". */
export const FAILING_VERDICTS: ReadonlySet<Verdict> = new Set(['tap-from-tap', 'unprotected']);

export type ConductorRole =
  | 'service'
  | 'feeder'
  | 'branch'
  | 'transformer-primary'
  | 'transformer-secondary'
  | 'generator'
  | 'unknown';

export interface Citation {
  code: 'NEC';
  edition: CodeEdition;
  /** e.g. '240.21(B)(2)' */
  section: string;
}

export type ElementRef =
  | { kind: 'node'; id: NodeId }
  | { kind: 'conductor'; id: ConductorId }
  | { kind: 'busLink'; id: BusLinkId }
  | { kind: 'project' };

export type Severity = 'violation' | 'warning' | 'needs-ahj' | 'info';
export const SEVERITIES: readonly Severity[] = ['violation', 'warning', 'needs-ahj', 'info'];

export type ConditionStatus = 'pass' | 'fail' | 'unknown';

/** One condition of one rule, evaluated for one conductor. */
export interface ConditionResult {
  /** Key into the rule's messages. */
  id: string;
  status: ConditionStatus;
  /** Rendered from the rule's template and `data`. */
  text: string;
  data: Record<string, string | number>;
  /** Met only on a judgement the AHJ must accept, e.g. "other approved means". */
  needsAhj?: boolean;
}

/** One rule tried on one conductor: the working a reviewer reads. */
export interface RuleTrial {
  ruleId: string;
  title: string;
  cites: Citation;
  /** 'holds' when every condition passes, 'fails' when one fails, 'unknown' when data is missing. */
  outcome: 'holds' | 'fails' | 'unknown';
  conditions: ConditionResult[];
}

export type Fix =
  | { kind: 'resize'; conductorIds: ConductorId[]; size: ConductorSize; material: Material; parallelSets: number; forRule: string; label: string }
  | { kind: 'shorten'; conductorIds: ConductorId[]; maxLengthFt: number; forRule: string; label: string }
  | { kind: 'add-ocpd'; conductorId: ConductorId; ratingA: number; label: string }
  /** A main breaker in a panelboard: drawn between its incoming conductor or link and its bus (408.36). */
  | { kind: 'add-main'; busId: NodeId; ratingA: number; label: string }
  | { kind: 'set-field'; ref: ElementRef; field: string; value: string | number | boolean; label: string };

export interface Finding {
  /** Stable across runs: `${ruleId}:${subject}:${messageId}`. */
  id: string;
  ruleId: string;
  messageId: string;
  severity: Severity;
  cites: Citation | null;
  subject: ElementRef;
  related: ElementRef[];
  /** A sentence a reviewer can paste into a comment. */
  message: string;
  data: Record<string, string | number>;
  fixes: Fix[];
}

export type AmpacityStepId =
  | 'base'
  | 'ambient'
  | 'adjustment'
  | 'corrected'
  | 'terminal'
  | 'per-set'
  | 'parallel'
  | 'small-conductor';

export interface AmpacityStep {
  id: AmpacityStepId;
  /** Human text, e.g. 'Table 310.16, Cu, 90 °C column: 225 A'. */
  text: string;
  value: number;
  cites?: Citation;
}

/** Ampacity of a conductor run with every step kept (Article 310, 110.14(C), 240.4(D)). */
export interface AmpacityWorking {
  insulationTempC: 60 | 75 | 90;
  /** Table 310.16 value for one conductor in the insulation's column. */
  baseA: number;
  ambientFactor: number;
  /** Current-carrying conductors Table 310.15(C)(1) adjusted for (the circuit's 310.15(E) count, or the stated count where larger). */
  currentCarrying: number;
  adjustmentFactor: number;
  /** baseA × ambientFactor × adjustmentFactor, one conductor. */
  correctedA: number;
  /** Termination temperature rating used (110.14(C)): the conductor's own, or the project default. */
  terminalTempC: 60 | 75 | 90;
  /** Table 310.16 value in the termination's column, one conductor (110.14(C)). */
  terminalLimitA: number;
  /** min(correctedA, terminalLimitA). */
  perSetA: number;
  parallelSets: number;
  /** The conductor's ampacity: perSetA × parallelSets. */
  ampacityA: number;
  /** Which step set the final value. */
  governedBy: 'insulation-column' | 'correction-and-adjustment' | 'terminal-rating';
  /** 240.4(D) largest OCPD for a small conductor, or null when 240.4(D) does not apply. */
  smallConductorMaxOcpdA: number | null;
  steps: AmpacityStep[];
}

export interface DeviceRef {
  id: NodeId;
  kind: EquipmentKind;
  label: string;
  /** The rating that counts (240.6); null when the drawing does not give it. */
  ratingA: number | null;
}

export interface ConductorReport {
  id: ConductorId;
  label: string;
  from: NodeId;
  to: NodeId;
  verdict: Verdict;
  /** Rule id that decided the verdict (e.g. 'tap-25ft'), or null when none did. */
  rule: string | null;
  cites: Citation | null;
  role: ConductorRole;
  /** Short text: why this verdict, for tables and tooltips. */
  summary: string;
  /** Null when the drawing gives no size (the verdict is then incomplete). */
  size: ConductorSize | null;
  material: Material;
  parallelSets: number;
  lengthFt: number | null;
  ampacity: AmpacityWorking | null;
  /** The OCPD whose rating R the conductor is judged against (for secondaries: the primary device). */
  upstreamDevice: DeviceRef | null;
  /** What the upstream walk ended on. */
  supply: { kind: 'ocpd' | 'transformer' | 'generator' | 'utility' | 'none'; id: NodeId | null };
  /** Conductors joined at pass-through splices that are judged as one run, supply end first. */
  chain: ConductorId[];
  /** Tap length counted by the rule: chain length, plus secondary for a transformer tap. Null when not a tap. */
  tapLengthFt: number | null;
  load: { flowingA: number; calculatedA: number } | null;
  /** Every rule tried, in code order. */
  tried: RuleTrial[];
  fixes: Fix[];
  /** Ids of findings whose subject is this conductor. */
  findingIds: string[];
}

export interface AnalysisReport {
  format: 'linewright-analysis';
  version: 1;
  projectName: string;
  edition: CodeEdition;
  /** Assumptions the analysis made, stated on every report. */
  assumptions: string[];
  caution: string;
  conductors: ConductorReport[];
  findings: Finding[];
  /** Available fault current at every node and voltage drop on every conductor (core/src/studies). */
  studies?: StudiesReport;
  counts: {
    conductors: number;
    byVerdict: Record<Verdict, number>;
    bySeverity: Record<Severity, number>;
  };
}

/** The file could not be read as a project. Nothing was analyzed. */
export interface LoadError {
  /** JSON path into the file, e.g. 'conductors[3].lengthFt'; '' for the whole file. */
  path: string;
  message: string;
}
