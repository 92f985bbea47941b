import type { TerminationDefault } from '../analyze/ampacities';
import type { RuleTrial } from '../analyze/types';
import type { CodeEdition, Conductor } from '../model/schema';
import { calculatedLoad } from '../rules/calculated-load';
import { runRule, type Rule } from '../rules/define';
import type { RunFacts } from '../rules/facts';
import { trialAmpacity, trialFacts, type BuildMode, type SizingConfig, type TrialAmpacity } from './trial';

/** A run under test: what the rules know of it and which rules could make it acceptable. */
export interface RunUnderTest {
  readonly facts: RunFacts;
  readonly members: readonly Conductor[];
  /** The rules that may make the run acceptable (the classifier's candidates); empty when no size decides it alone. */
  readonly rules: readonly Rule[];
  /** 210.19(A)(1), 215.2(A)(1), 230.42(A) apply (not a motor or HVAC branch circuit, sized by its own article). */
  readonly loadRule: boolean;
  readonly edition: CodeEdition;
  readonly terminationDefault: TerminationDefault;
  /** How a configuration is built along the run's segments. */
  readonly mode: BuildMode;
}

/** One configuration tried against the analyzer's rules over the run's trial facts. */
export interface Screen {
  readonly config: SizingConfig;
  /** Null when the analyzer gives the configuration no ampacity (e.g. parallel sets under 1/0 AWG). */
  readonly at: TrialAmpacity | null;
  /** The first rule (code order) that holds, or null. */
  readonly holds: Rule | null;
  /** Every rule tried, in code order. */
  readonly trials: readonly RuleTrial[];
  /** The calculated-load trial, when it applies. */
  readonly load: RuleTrial | null;
}

/**
 * Tries one configuration with the analyzer's own functions: its ampacity (computeAmpacity
 * through the analyzer's memo) and every candidate rule's check over the trial facts. No rule
 * is restated here.
 */
export function screenConfig(run: RunUnderTest, config: SizingConfig, supplyOcpdA: number | null = run.facts.supplyOcpdA): Screen {
  const at = trialAmpacity(run.members, config, run.edition, run.terminationDefault, run.mode);
  if (at === null) return { config, at, holds: null, trials: [], load: null };
  const facts = trialFacts(run.facts, config, at, supplyOcpdA);
  const trials: RuleTrial[] = [];
  let holds: Rule | null = null;
  for (const rule of run.rules) {
    const t = runRule(rule, facts);
    trials.push(t);
    if (holds === null && t.outcome === 'holds') holds = rule;
  }
  return { config, at, holds, trials, load: run.loadRule ? runRule(calculatedLoad, facts) : null };
}

/** The screen lets the configuration through to the full analysis: a rule holds (or none is to hold) and the load check does not fail. */
export function passesScreen(run: RunUnderTest, s: Screen): boolean {
  if (s.at === null) return false;
  if (run.rules.length > 0 && s.holds === null) return false;
  return s.load === null || s.load.outcome !== 'fails';
}
