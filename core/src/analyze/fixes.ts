import type { Conductor, CodeEdition, ConductorSize } from '../model/schema';
import { CONDUCTOR_SIZES } from '../model/schema';
import { outcomeOf, type Rule } from '../rules/define';
import { RULES_BY_ID } from '../rules/index';
import { motorDeviceLimit } from '../rules/motor-device';

const PROTECTION_IDS: ReadonlySet<string> = new Set(['protected', 'protected-next-size']);
import type { RunFacts } from '../rules/facts';
import { sizeIndexOf, sizeLabel, materialLabel } from '../tables/sizes';
import { isStandardRating, largestStandardRatingAtMost, nextStandardRatingAbove } from '../tables/standardRatings';
import { conductorAmpacity } from './ampacities';
import type { VerdictContext } from './context';
import type { Fix, RuleTrial } from './types';


/** Shared empty list: most runs need no fix. Reports are read-only. */
const NO_FIXES: Fix[] = Object.freeze([]) as unknown as Fix[];

/** Stage: the fixes of every run that no rule makes acceptable, by run. */
export function runFixes(ctx: VerdictContext): Fix[][] {
  return ctx.verdicts.map((_, r) => fixesOfRun(ctx, r));
}

/** The fixes of run `r`. */
export function fixesOfRun(ctx: VerdictContext, r: number): Fix[] {
  const { graph, runs, edition } = ctx;
  const v = ctx.verdicts[r]!;
  if (v.verdict !== 'unprotected' && v.verdict !== 'tap-from-tap') return NO_FIXES;
  // Each segment at the count its ampacity was adjusted for (its circuit's 310.15(E) count), whatever size it is tried at.
  const members = runs.members[r]!.map((ci) => ({ ...graph.conductors[ci]!, currentCarrying: ctx.circuits[ci]!.currentCarrying.adjustmentCount }));
  return suggestFixes(v.facts, members, v.verdict === 'tap-from-tap' ? [] : v.candidates, v.tried, edition);
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
  const resized = new Map<string, ConductorSize>();
  const start = sizeIndexOf(facts.size) + 1;
  for (let i = start; i < CONDUCTOR_SIZES.length && resized.size < rules.length; i++) {
    const size = CONDUCTOR_SIZES[i]!;
    const at = runAmpacityAt(members, size, edition, facts);
    if (at === null) continue;
    const trial: RunFacts = { ...facts, size, ampacityA: at.ampacityA, smallConductorMaxOcpdA: at.small };
    for (const rule of rules) {
      if (resized.has(rule.id)) continue;
      if (outcomeOf(rule.check(trial)) === 'holds') resized.set(rule.id, size);
    }
    // Once the run is protected outright, no larger size says anything new.
    if (resized.has('protected') || resized.has('protected-next-size')) break;
  }
  const seen = new Set<ConductorSize>();
  const bySize = [...resized.entries()].sort((a, b) => sizeIndexOf(a[1]) - sizeIndexOf(b[1]));
  for (const [ruleId, size] of bySize) {
    if (seen.has(size)) continue;
    seen.add(size);
    const rule = rules.find((r) => r.id === ruleId)!;
    const sets = facts.parallelSets > 1 ? `${facts.parallelSets} sets of ` : '';
    fixes.push({
      kind: 'resize',
      conductorIds: smallerThan(members, size, facts),
      size,
      material: facts.material,
      parallelSets: facts.parallelSets,
      forRule: ruleId,
      label: `Upsize to ${sets}${sizeLabel(size)} ${materialLabel(facts.material)}: meets ${rule.section} (${rule.title.toLowerCase()}).`,
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

/** The run's ampacity (lowest segment) and 240.4(D) limit were every segment of `size`; null when a segment has none. */
function runAmpacityAt(members: readonly Conductor[], size: ConductorSize, edition: CodeEdition, facts: RunFacts): { ampacityA: number; small: number | null } | null {
  let ampacityA = Number.POSITIVE_INFINITY;
  let small: number | null = null;
  for (const c of members) {
    // A segment already larger than the trial size keeps its size (a run may change size at a splice).
    const keep = sizeIndexOf(c.size) >= sizeIndexOf(size) && c.material === facts.material;
    const w = conductorAmpacity(keep ? c : { ...c, size }, edition, facts.site.terminationDefault).working;
    if (w === null) return null;
    ampacityA = Math.min(ampacityA, w.ampacityA);
    if (w.smallConductorMaxOcpdA !== null) small = small === null ? w.smallConductorMaxOcpdA : Math.min(small, w.smallConductorMaxOcpdA);
  }
  return { ampacityA, small };
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
    for (let i = sizeIndexOf(facts.size) + 1; i < CONDUCTOR_SIZES.length; i++) {
      const size = CONDUCTOR_SIZES[i]!;
      const at = runAmpacityAt(members, size, edition, facts);
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

/** The segments a resize changes: those smaller than the new size, or of another material or number of sets. */
function smallerThan(members: readonly Conductor[], size: ConductorSize, f: Pick<RunFacts, 'material' | 'parallelSets'>): Conductor['id'][] {
  return members.filter((c) => sizeIndexOf(c.size) < sizeIndexOf(size) || c.material !== f.material || c.parallelSets !== f.parallelSets).map((c) => c.id);
}
