import { runRule, type Rule } from '../rules/define';
import type { RunFacts } from '../rules/facts';
import { PROTECTION_RULES } from '../rules/index';
import { sizeIndexOf } from '../tables/sizes';
import type { RuleTrial, Verdict } from './types';

/**
 * Protection trials depend on four numbers only, and a riser repeats the same
 * few combinations thousands of times (20 A on 12 AWG…), so equal trials are
 * shared. Trials are read-only.
 */
const protectionTrials = new Map<number, Map<number, RuleTrial>>();
const MAX_SHARED_TRIALS = 4096;
let sharedTrials = 0;

export function protectionTrial(rule: Rule, f: RunFacts): RuleTrial {
  const R = f.supplyOcpdA;
  const A = f.ampacityA;
  // Two exact integers instead of a string: the facts the 240.4 rules read, packed.
  const r100 = R === null ? -1 : Math.round(R * 100);
  const a100 = A === null ? -1 : Math.round(A * 100);
  if (R === null || A === null || f.size === null || r100 !== R * 100 || a100 !== A * 100 || r100 >= 1e7 || a100 >= 1e7) return runRule(rule, f);
  const kind = f.supplyOcpdKind === 'fuse' ? 1 : f.supplyOcpdKind === 'breaker' ? 0 : 2;
  const outer =
    ((((rule === PROTECTION_RULES[0] ? 0 : 1) * 2 + (f.edition === 2020 ? 0 : 1)) * 3 + kind) * 2 + (f.multioutletCordAndPlug ? 1 : 0)) * 30 * 100 +
    sizeIndexOf(f.size) * 100 +
    (f.smallConductorMaxOcpdA ?? 0);
  const inner = r100 * 1e7 + a100;
  let byRA = protectionTrials.get(outer);
  if (!byRA) protectionTrials.set(outer, (byRA = new Map()));
  let t = byRA.get(inner);
  if (!t) {
    t = runRule(rule, f);
    if (++sharedTrials > MAX_SHARED_TRIALS) {
      protectionTrials.clear();
      sharedTrials = 0;
    }
    byRA.set(inner, t);
  }
  return t;
}

/** Try rules in code order; every rule is tried and kept, the first that holds names the verdict. */
export function firstHolding(rules: readonly Rule[], facts: RunFacts, tried: RuleTrial[]): { verdict: Verdict; rule: Rule | null } {
  let winner: Rule | null = null;
  let unknown = false;
  for (const rule of rules) {
    const t = runRule(rule, facts);
    tried.push(t);
    if (t.outcome === 'holds' && winner === null) winner = rule;
    if (t.outcome === 'unknown') unknown = true;
  }
  if (winner) return { verdict: winner.verdict!, rule: winner };
  return { verdict: unknown ? 'incomplete' : 'unprotected', rule: null };
}

