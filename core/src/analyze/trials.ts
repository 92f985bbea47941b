import { ruleCitation, runRule, shareConditionsOf, type Rule } from '../rules/define';
import type { RunFacts } from '../rules/facts';
import { calculatedLoad, PROTECTION_RULES } from '../rules/index';
import { carriesLoad, coversCalculatedLoad } from '../rules/calculated-load';
import { sizeIndexOf } from '../tables/sizes';
import type { Citation, RuleTrial, Verdict } from './types';

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

/**
 * The trials a run protected under 240.4 was judged by: [240.4] or [240.4, 240.4(B)]. Runs judged
 * by the same shared trials share one list (read-only, like the trials), so most runs of a riser
 * keep no list of their own.
 */
const lists = new WeakMap<RuleTrial, RuleTrial[]>();
const pairs = new WeakMap<RuleTrial, WeakMap<RuleTrial, RuleTrial[]>>();

export function triedList(first: RuleTrial, second?: RuleTrial): RuleTrial[] {
  if (!second) {
    let list = lists.get(first);
    if (!list) lists.set(first, (list = [first]));
    return list;
  }
  let after = pairs.get(first);
  if (!after) pairs.set(first, (after = new WeakMap()));
  let list = after.get(second);
  if (!list) after.set(second, (list = [first, second]));
  return list;
}

/**
 * Try rules in code order; every rule is kept in the working, the first that holds names the verdict.
 * The rules after it are kept as trials made when first read (see LaterTrial): the verdict does not
 * depend on them, and most runs' working is never read beyond the rule that holds.
 */
export function firstHolding(rules: readonly Rule[], facts: RunFacts, tried: RuleTrial[]): { verdict: Verdict; rule: Rule | null } {
  // The conditions several rules of the family share (load, damage, the device at the end…) are made once for the run.
  return shareConditionsOf(facts, () => {
    let unknown = false;
    for (let i = 0; i < rules.length; i++) {
      const rule = rules[i]!;
      const t = runRule(rule, facts);
      tried.push(t);
      if (t.outcome === 'holds') {
        for (let k = i + 1; k < rules.length; k++) tried.push(new LaterTrial(rules[k]!, facts));
        return { verdict: rule.verdict!, rule };
      }
      if (t.outcome === 'unknown') unknown = true;
    }
    return { verdict: unknown ? 'incomplete' : 'unprotected', rule: null };
  });
}

/**
 * The trial of a rule tried after the one that names a run's verdict, made when its outcome or
 * conditions are first read. The rules are pure and the classifier has finished writing the run's
 * facts before any rule is tried, so the trial reads what it would have read then. `facts` is kept
 * in the open so that comparing two trials compares what they are made of.
 */
class LaterTrial implements RuleTrial {
  readonly ruleId: string;
  readonly title: string;
  readonly cites: Citation;
  readonly facts: RunFacts;
  readonly #rule: Rule;
  #made: RuleTrial | undefined;
  constructor(rule: Rule, facts: RunFacts) {
    this.ruleId = rule.id;
    this.title = rule.title;
    this.cites = ruleCitation(rule, facts.edition);
    this.facts = facts;
    this.#rule = rule;
  }
  #trial(): RuleTrial {
    return (this.#made ??= runRule(this.#rule, this.facts));
  }
  get outcome(): RuleTrial['outcome'] {
    return this.#trial().outcome;
  }
  get conditions(): RuleTrial['conditions'] {
    return this.#trial().conditions;
  }
  toJSON(): RuleTrial {
    const { outcome, conditions } = this.#trial();
    return { ruleId: this.ruleId, title: this.title, cites: this.cites, outcome, conditions };
  }
}

/** The calculated-load trial of the run has a failed condition: what its findings need to know first (most runs pass). */
export function calculatedLoadFails(f: RunFacts): boolean {
  return coversCalculatedLoad(f) === false || carriesLoad(f) === false;
}

/**
 * The 210.19(A)(1) / 215.2(A)(1) / 230.42(A) trial of a run (rules/calculated-load.ts), which reads the
 * edition and four numbers only: equal trials are shared, as the protection trials are (a riser repeats
 * the same loads on the same sizes). Trials are read-only.
 */
type TrialTree = Map<number, TrialTree | RuleTrial>;
const loadTrials: TrialTree = new Map();
let sharedLoadTrials = 0;

export function calculatedLoadTrial(f: RunFacts): RuleTrial {
  const keys = [f.edition, f.ampacityUncorrectedA, f.calculatedLoadA, f.ampacityA, f.loadA];
  // A null fact is keyed as NaN; a NaN fact (never expected) would share that key but not the text, so it is not shared.
  for (const k of keys) if (k !== null && Number.isNaN(k)) return runRule(calculatedLoad, f);
  if (sharedLoadTrials >= MAX_SHARED_TRIALS) {
    loadTrials.clear();
    sharedLoadTrials = 0;
  }
  let node = loadTrials;
  for (let i = 0; i < keys.length - 1; i++) {
    const k = keys[i] ?? Number.NaN;
    let next = node.get(k) as TrialTree | undefined;
    if (!next) node.set(k, (next = new Map()));
    node = next;
  }
  const last = keys[keys.length - 1] ?? Number.NaN;
  let t = node.get(last) as RuleTrial | undefined;
  if (!t) {
    t = runRule(calculatedLoad, f);
    sharedLoadTrials++;
    node.set(last, t);
  }
  return t;
}
