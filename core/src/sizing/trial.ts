import { conductorAmpacity, type AmpacityInputs, type TerminationDefault } from '../analyze/ampacities';
import type { CodeEdition, Conductor, ConductorId } from '../model/schema';
import type { RunFacts } from '../rules/facts';
import { sizeIndexOf } from '../tables/sizes';
import { costPerFt, type CostedConfig } from './cost';

/** One configuration of a run's conductors: size, material and conductors in parallel per phase. */
export type SizingConfig = CostedConfig;

/** The ampacity figures the rules read, for a run built in a trial configuration. */
export interface TrialAmpacity {
  /** Lowest ampacity along the run, after correction, adjustment and 110.14(C). */
  ampacityA: number;
  /** Lowest Table 310.16 value at the termination's column × sets (what 125 % of the continuous load is compared with). */
  uncorrectedA: number;
  /** 240.4(D) limit, or null. */
  smallConductorMaxOcpdA: number | null;
}

/**
 * How a trial configuration is built along a run of several segments: 'upsize' (a fix) keeps a
 * segment already of the trial's material and sets and at least its size (a run may change
 * size at a splice); 'whole' (the sizing assistant) builds every segment alike.
 */
export type BuildMode = 'upsize' | 'whole';

/** The segment keeps its own conductors under the build mode. */
export function keepsSegment(c: Pick<Conductor, 'size' | 'material' | 'parallelSets'>, config: SizingConfig, mode: BuildMode): boolean {
  // A segment drawn without a size never keeps it: the configuration's size is what gets built.
  if (c.size === undefined || c.material !== config.material || c.parallelSets !== config.parallelSets) return false;
  return mode === 'upsize' ? sizeIndexOf(c.size) >= sizeIndexOf(config.size) : c.size === config.size;
}

/** The segments a configuration changes. */
export function changedSegments(members: readonly Conductor[], config: SizingConfig, mode: BuildMode): ConductorId[] {
  return members.filter((c) => !keepsSegment(c, config, mode)).map((c) => c.id);
}

/**
 * The run's ampacity in a trial configuration, by the analyzer's own ampacity function for
 * every segment (Table 310.16, correction, adjustment, 110.14(C), 310.10(G), 240.4(D));
 * null when a segment has no ampacity in it (e.g. parallel sets under 1/0 AWG).
 */
export function trialAmpacity(members: readonly Conductor[], config: SizingConfig, edition: CodeEdition, terminationDefault: TerminationDefault, mode: BuildMode = 'upsize'): TrialAmpacity | null {
  let ampacityA = Number.POSITIVE_INFINITY;
  let uncorrectedA = Number.POSITIVE_INFINITY;
  let small: number | null = null;
  for (const c of members) {
    const w = conductorAmpacity(keepsSegment(c, config, mode) ? c : rebuilt(c, config), edition, terminationDefault).working;
    if (w === null) return null;
    ampacityA = Math.min(ampacityA, w.ampacityA);
    uncorrectedA = Math.min(uncorrectedA, Math.round(w.terminalLimitA * w.parallelSets * 100) / 100);
    if (w.smallConductorMaxOcpdA !== null) small = small === null ? w.smallConductorMaxOcpdA : Math.min(small, w.smallConductorMaxOcpdA);
  }
  return { ampacityA, uncorrectedA, smallConductorMaxOcpdA: small };
}

/**
 * Segment `c` built in the configuration, as its ampacity reads it. One object rewritten for every
 * segment and configuration tried (the search tries thousands): conductorAmpacity keeps nothing of it.
 */
function rebuilt(c: AmpacityInputs, config: SizingConfig): AmpacityInputs {
  const b = withConfig(scratchSegment, config);
  b.insulation = c.insulation;
  b.ambientC = c.ambientC;
  b.terminalTempC = c.terminalTempC;
  b.currentCarrying = c.currentCarrying;
  return b;
}
const scratchSegment: { -readonly [K in keyof AmpacityInputs]: AmpacityInputs[K] } = { size: undefined, material: 'cu', insulation: 'THHN', parallelSets: 1, ambientC: 30, terminalTempC: undefined, currentCarrying: 3 };

/** `target` (a segment or a run's facts, rewritten in place) given the configuration's size, material and sets. */
function withConfig<T extends { size?: SizingConfig['size'] | null; material: SizingConfig['material']; parallelSets: number }>(target: T, config: SizingConfig): T {
  target.size = config.size;
  target.material = config.material;
  target.parallelSets = config.parallelSets;
  return target;
}

/**
 * The run's facts as the rules would see them in the trial configuration (supply, load and site
 * unchanged): a copy, or `into` (a copy made earlier for the same run) rewritten, so a search over
 * many configurations copies the facts once.
 */
export function trialFacts(facts: RunFacts, config: SizingConfig, at: TrialAmpacity, supplyOcpdA: number | null = facts.supplyOcpdA, into: RunFacts = { ...facts }): RunFacts {
  withConfig(into, config);
  into.ampacityA = at.ampacityA;
  into.ampacityUncorrectedA = at.uncorrectedA;
  into.smallConductorMaxOcpdA = at.smallConductorMaxOcpdA;
  into.supplyOcpdA = supplyOcpdA;
  return into;
}

/** Relative cost of the whole run after the change: each segment's length (1 ft when not given) × its cost per foot. */
export function runCost(members: readonly Conductor[], config: SizingConfig, mode: BuildMode): number {
  let sum = 0;
  for (const c of members) sum += (c.lengthFt ?? 1) * costPerFt(keepsSegment(c, config, mode) && c.size !== undefined ? { ...c, size: c.size } : config);
  return Math.round(sum * 10) / 10;
}
