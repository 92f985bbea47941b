import type { Conductor, CodeEdition } from '../model/schema';
import { CONDUCTOR_SIZES } from '../model/schema';
import { conductorName, outcomeOf, type Rule } from '../rules/define';
import { PROTECTION_RULES, RULES_BY_ID } from '../rules/index';
import { motorDeviceLimit } from '../rules/motor-device';
import type { RunFacts } from '../rules/facts';
import { configsByCost, MAX_PARALLEL_SETS } from '../sizing/configs';
import { costPerFt } from '../sizing/cost';
import type { RunUnderTest } from '../sizing/screen';
import { changedSegments, trialAmpacity, trialFacts, type SizingConfig } from '../sizing/trial';
import { sizeIndexOf, sizeLabel, materialLabel } from '../tables/sizes';
import { isStandardRating, largestStandardRatingAtMost, nextStandardRatingAbove } from '../tables/standardRatings';

const PROTECTION_IDS: ReadonlySet<string> = new Set(['protected', 'protected-next-size']);
import type { VerdictContext } from './context';
import { protectionTrial } from './trials';
import type { Fix, RuleTrial } from './types';


/** Shared empty list: most runs need no fix. Reports are read-only. */
const NO_FIXES: Fix[] = Object.freeze([]) as unknown as Fix[];

/** Stage: the fixes of every run that no rule makes acceptable, by run. */
export function runFixes(ctx: VerdictContext): Fix[][] {
  return ctx.verdicts.map((_, r) => fixesOfRun(ctx, r));
}

/** The fixes of run `r`. */
export function fixesOfRun(ctx: VerdictContext, r: number): Fix[] {
  const { runs, edition } = ctx;
  const v = ctx.verdicts[r]!;
  if (v.verdict !== 'unprotected' && v.verdict !== 'tap-from-tap') return NO_FIXES;
  return suggestFixes(v.facts, segmentsAsAdjusted(ctx, runs.members[r]!), v.verdict === 'tap-from-tap' ? [] : v.candidates, v.tried, edition);
}

/** Each segment at the count its ampacity was adjusted for (its circuit's 310.15(E) count), whatever size it is tried at. */
export function segmentsAsAdjusted(ctx: Pick<VerdictContext, 'graph' | 'circuits'>, conductorIndices: readonly number[]): Conductor[] {
  return conductorIndices.map((ci) => ({ ...ctx.graph.conductors[ci]!, currentCarrying: ctx.circuits[ci]!.currentCarrying.adjustmentCount }));
}

/**
 * The cheapest changes that make an unacceptable run acceptable: the smallest
 * conductor that qualifies under each rule (same material, insulation, sets
 * and conditions), the longest length a length rule allows the present size,
 * and an OCPD at the supply point sized to the run.
 */
export function suggestFixes(
  facts: RunFacts,
  members: readonly Conductor[],
  rules: readonly Rule[],
  trials: readonly RuleTrial[],
  edition: CodeEdition,
): Fix[] {
  if (facts.motor || facts.hvac) return ownArticleFixes(facts, members, edition);
  const fixes: Fix[] = [];
  const ids = facts.conductorIds;
  // A rule the run fails whatever its size (outdoors, length, what it ends in…) is not searched.
  const searched = rules.filter((rule) => mayHoldAtSomeSize(rule, trials));
  const run: RunUnderTest = { facts, members, rules: searched, loadRule: false, edition, terminationDefault: facts.site.terminationDefault, mode: 'upsize' };
  const resized = cheapestPerRule(run);
  const seen = new Set<string>();
  const byCost = [...resized.entries()].sort((a, b) => costPerFt(a[1]) - costPerFt(b[1]));
  for (const [ruleId, config] of byCost) {
    const key = `${config.size}/${config.parallelSets}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const rule = rules.find((r) => r.id === ruleId)!;
    fixes.push({
      kind: 'resize',
      conductorIds: changedSegments(members, config, 'upsize'),
      size: config.size,
      material: config.material,
      parallelSets: config.parallelSets,
      forRule: ruleId,
      label: `${resizeWords(facts, config)}: meets ${rule.section} (${rule.title.toLowerCase()}).`,
    });
  }
  const shorten: Fix[] = [];
  for (const t of trials) {
    const limit = RULES_BY_ID.get(t.ruleId)?.lengthLimit;
    // A transformer tap's limit counts the secondary as well; shortening one run is not a plain fix there.
    if (!limit || t.outcome !== 'fails' || t.ruleId === 'tap-transformer') continue;
    const failing = t.conditions.filter((c) => c.status !== 'pass');
    if (failing.length > 0 && failing.every((c) => c.id === limit.conditionId)) {
      shorten.push({
        kind: 'shorten',
        conductorIds: ids,
        maxLengthFt: limit.maxFt,
        forRule: t.ruleId,
        label: `Shorten the run to ${limit.maxFt} ft or less: then it meets ${t.cites.section} at its present size.`,
      });
    }
  }
  const protectionResizes = fixes.filter((f) => f.kind === 'resize' && PROTECTION_IDS.has(f.forRule));
  const tapResizes = fixes.filter((f) => !(f.kind === 'resize' && PROTECTION_IDS.has(f.forRule)));
  const addOcpd: Fix[] = [];
  const ocpd = largestProtectingRatingA(facts, edition);
  if (ocpd !== null && ids[0] !== undefined) {
    addOcpd.push({
      kind: 'add-ocpd',
      conductorId: ids[0],
      ratingA: ocpd,
      label: `Add ${articleFor(ocpd)} ${ocpd} A breaker at the supply end of ${ids[0]}: the run is then protected by it (${facts.ampacityA !== null && ocpd > facts.ampacityA ? '240.4(B), the next standard rating above its ampacity' : '240.4'}).`,
    });
  }
  // Cheapest first, as a designer weighs them: a size or two up under a tap rule, a shorter run,
  // a breaker at the tap, and last the (often much larger) size the device ahead would protect.
  // Only the longest length the present size allows: a shorter limit says nothing more.
  const longest = shorten.reduce<Fix[]>((best, f) => (f.kind === 'shorten' && (best.length === 0 || f.maxLengthFt > (best[0] as { maxLengthFt: number }).maxLengthFt) ? [f] : best), []);
  return [...tapResizes, ...longest, ...addOcpd, ...protectionResizes];
}

/** False when the run's own trial of `rule` does not pass a condition no size decides (Rule.sizeIndependent). */
function mayHoldAtSomeSize(rule: Rule, trials: readonly RuleTrial[]): boolean {
  const fixed = rule.sizeIndependent;
  if (!fixed) return true;
  const t = trials.find((x) => x.ruleId === rule.id);
  return !t || !t.conditions.some((c) => c.status !== 'pass' && fixed.includes(c.id));
}

/**
 * The cheapest configuration of the run's own material (by the sizing cost proxy) under which
 * each rule holds, among those that raise its ampacity: one conductor per phase or 2 to 8
 * sets in parallel from 1/0 AWG (310.10(G)). Where one very large conductor is the only
 * single-size answer, parallel sets of a moderate size usually cost less.
 */
function cheapestPerRule(run: RunUnderTest): Map<string, SizingConfig> {
  const { facts, rules } = run;
  const found = new Map<string, SizingConfig>();
  // One copy of the facts, rewritten for each configuration: the checks are pure and keep nothing of it.
  const trial: RunFacts = { ...facts };
  for (const config of configsByCost([facts.material], Math.max(MAX_PARALLEL_SETS, facts.parallelSets))) {
    if (found.size >= rules.length) break;
    const at = trialAmpacity(run.members, config, run.edition, run.terminationDefault, run.mode);
    if (at === null || (facts.ampacityA !== null && at.ampacityA <= facts.ampacityA)) continue;
    trialFacts(facts, config, at, facts.supplyOcpdA, trial);
    for (const rule of rules) {
      if (!found.has(rule.id) && outcomeOn(rule, trial) === 'holds') found.set(rule.id, config);
    }
    // Once the run is protected outright, nothing costlier says anything new.
    if (found.has('protected') || found.has('protected-next-size')) break;
  }
  return found;
}

/**
 * A rule's outcome on trial facts. 240.4 and 240.4(B) read a few numbers only and are looked up
 * among the shared protection trials (trials.ts): the search tries the same sizes for every run
 * on the same device, so after the first such run each is a look-up, not a check.
 */
function outcomeOn(rule: Rule, f: RunFacts): RuleTrial['outcome'] {
  return PROTECTION_RULES.includes(rule) ? protectionTrial(rule, f).outcome : outcomeOf(rule.check(f));
}

/** "Upsize to 400 kcmil Cu", or "Use 2 sets of 250 kcmil Cu in parallel (…)" when the number of sets changes. */
function resizeWords(facts: Pick<RunFacts, 'parallelSets'>, config: SizingConfig): string {
  const name = conductorName(config);
  if (config.parallelSets === facts.parallelSets) return `Upsize to ${name}`;
  if (config.parallelSets === 1) return `Use one ${name} per phase instead of ${facts.parallelSets} sets`;
  return `Use ${name} in parallel (310.10(G): equal sets, each in a raceway of its own)`;
}

/**
 * Fixes for a motor or HVAC branch circuit (240.4(G)), only those its own article allows:
 * the smallest conductor of at least 125 % of the full-load current (430.22) or the MCA
 * (440.35), and a device no larger than Table 430.52 or the nameplate MOP allows. Never a
 * breaker at the conductor's 240.4 ampacity, which need not start the motor.
 */
function ownArticleFixes(facts: RunFacts, members: readonly Conductor[], edition: CodeEdition): Fix[] {
  const fixes: Fix[] = [];
  const ids = facts.conductorIds;
  const motor = facts.motor;
  const minA = motor ? Math.round(motor.fullLoadA * 125) / 100 : facts.hvac!.mcaA;
  if (facts.ampacityA !== null && facts.ampacityA < minA) {
    for (let i = facts.size === null ? 0 : sizeIndexOf(facts.size) + 1; i < CONDUCTOR_SIZES.length; i++) {
      const size = CONDUCTOR_SIZES[i]!;
      const at = trialAmpacity(members, { size, material: facts.material, parallelSets: facts.parallelSets }, edition, facts.site.terminationDefault);
      if (at === null || at.ampacityA < minA) continue;
      const sets = facts.parallelSets > 1 ? `${facts.parallelSets} sets of ` : '';
      const why = motor ? `at least 125 % of the ${motor.fullLoadA} A full-load current, ${minA} A (430.22)` : `at least the nameplate MCA of ${minA} A (440.35)`;
      fixes.push({
        kind: 'resize',
        conductorIds: ids,
        size,
        material: facts.material,
        parallelSets: facts.parallelSets,
        forRule: motor ? 'motor-conductor' : 'hvac-circuit',
        label: `Upsize to ${sets}${sizeLabel(size)} ${materialLabel(facts.material)} (${at.ampacityA} A): ${why}.`,
      });
      break;
    }
  }
  const maxA = motor ? (motorDeviceLimit(facts)?.lowA ?? null) : largestStandardRatingAtMost(facts.hvac!.mopA, edition, facts.supplyOcpdKind ?? 'breaker');
  if (maxA !== null && facts.supplyOcpdA !== null && facts.supplyOcpdA > maxA && facts.supplyOcpdId !== null) {
    const kind = facts.supplyOcpdKind ?? 'breaker';
    fixes.push({
      kind: 'set-field',
      ref: { kind: 'node', id: facts.supplyOcpdId },
      field: 'ratingA',
      value: maxA,
      label: motor
        ? `Use ${articleFor(maxA)} ${maxA} A ${kind} ahead: the largest 430.52(C)(1) allows for a ${motor.fullLoadA} A full-load current (Exception No. 1: next standard rating). A larger device needs the starting facts of Exception No. 2.`
        : `Use ${articleFor(maxA)} ${maxA} A ${kind} ahead: the nameplate maximum (MOP) of ${facts.hvac!.mopA} A (440.22).`,
    });
  }
  return fixes;
}

/** The largest rating that protects a run of this ampacity under 240.4, including (B) and (D). */
export function largestProtectingRatingA(facts: Pick<RunFacts, 'ampacityA' | 'smallConductorMaxOcpdA' | 'multioutletCordAndPlug'>, edition: CodeEdition): number | null {
  const A = facts.ampacityA;
  if (A === null) return null;
  let best = largestStandardRatingAtMost(A, edition, 'breaker');
  if (!facts.multioutletCordAndPlug && !isStandardRating(A, edition, 'breaker')) {
    const up = nextStandardRatingAbove(A, edition, 'breaker');
    if (up !== null && up <= 800) best = up;
  }
  if (best !== null && facts.smallConductorMaxOcpdA !== null && best > facts.smallConductorMaxOcpdA) {
    best = largestStandardRatingAtMost(facts.smallConductorMaxOcpdA, edition, 'breaker');
  }
  return best;
}

/** 'an' before a rating read with a vowel sound (8, 11, 18, 80, 800…), else 'a'. */
function articleFor(n: number): 'a' | 'an' {
  const s = String(n);
  return s.startsWith('8') || s === '11' || s === '18' || /^1[18]\d{2}$/.test(s) ? 'an' : 'a';
}
