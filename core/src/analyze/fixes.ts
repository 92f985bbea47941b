import type { Conductor, CodeEdition, ConductorSize } from '../model/schema';
import { CONDUCTOR_SIZES } from '../model/schema';
import { outcomeOf, type Rule } from '../rules/define';
import { RULES_BY_ID } from '../rules/index';

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
  const { graph, runs, edition } = ctx;
  return ctx.verdicts.map((v, r) => {
    if (v.verdict !== 'unprotected' && v.verdict !== 'tap-from-tap') return NO_FIXES;
    const members = runs.members[r]!.map((ci) => graph.conductors[ci]!);
    return suggestFixes(v.facts, members, v.verdict === 'tap-from-tap' ? [] : v.candidates, v.tried, edition);
  });
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
  const fixes: Fix[] = [];
  const ids = facts.conductorIds;
  const resized = new Map<string, ConductorSize>();
  const start = sizeIndexOf(facts.size) + 1;
  for (let i = start; i < CONDUCTOR_SIZES.length && resized.size < rules.length; i++) {
    const size = CONDUCTOR_SIZES[i]!;
    let ampacityA: number | null = Number.POSITIVE_INFINITY;
    let small: number | null = null;
    for (const c of members) {
      // A segment already larger than the trial size keeps its size (a run may change size at a splice).
      const w = conductorAmpacity(sizeIndexOf(c.size) >= i && c.material === facts.material ? c : { ...c, size }, edition).working;
      if (w === null) { ampacityA = null; break; }
      ampacityA = Math.min(ampacityA, w.ampacityA);
      if (w.smallConductorMaxOcpdA !== null) small = small === null ? w.smallConductorMaxOcpdA : Math.min(small, w.smallConductorMaxOcpdA);
    }
    if (ampacityA === null) continue;
    const trial: RunFacts = { ...facts, size, ampacityA, smallConductorMaxOcpdA: small };
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
