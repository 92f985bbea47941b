import { cite } from '../tables/citations';
import { materialLabel, sizeLabel } from '../tables/sizes';
import type { Citation, ConditionResult, ConditionStatus, RuleTrial, Verdict } from '../analyze/types';
import type { CodeEdition } from '../model/schema';
import type { RunFacts } from './facts';

export type RuleFamily = 'protection' | 'equipment' | 'study' | 'feeder-tap' | 'transformer-secondary' | 'transformer-protection' | 'service' | 'generator' | 'tap-from-tap' | 'motor' | 'hvac' | 'load';

/**
 * One condition of one rule, as the rule's check returns it and as the
 * report keeps it. Its text is rendered from the rule's template when first
 * read: most conductors are never displayed one by one, and rendering every
 * template of a large riser up front costs more than the classification.
 * `toJSON` keeps the text in serialized reports.
 */
export class Check<K extends string = string> implements ConditionResult {
  readonly id: K;
  readonly status: ConditionStatus;
  readonly data: Record<string, string | number>;
  /** The condition passed only on a judgement the AHJ must accept (e.g. "other approved means"). */
  readonly needsAhj?: boolean;
  /** Set by runRule from the rule's messages. */
  template = '';
  #text: string | undefined;
  constructor(id: K, status: ConditionStatus, data: Record<string, string | number>, needsAhj = false) {
    this.id = id;
    this.status = status;
    this.data = data;
    if (needsAhj) this.needsAhj = true;
  }
  get text(): string {
    return (this.#text ??= renderTemplate(this.template || this.id, this.data));
  }
  /** The same condition under another rule's message (a shared condition, see shareConditionsOf). */
  withTemplate(template: string): Check<K> {
    const c = new Check(this.id, this.status, this.data, this.needsAhj);
    c.template = template;
    return c;
  }
  toJSON(): ConditionResult {
    return { id: this.id, status: this.status, text: this.text, data: this.data, ...(this.needsAhj ? { needsAhj: true } : {}) };
  }
}

/** A rule over facts `F`: a run's facts for the conductor rules, a study's facts for the equipment and study rules. */
export interface Rule<K extends string = string, F = RunFacts> {
  id: string;
  /** The verdict a conductor gets when this rule holds; null for a check that only adds findings. */
  verdict: Verdict | null;
  family: RuleFamily;
  section: string;
  title: string;
  /** For a rule with a length limit: the limit and the condition that checks it. */
  lengthLimit?: { maxFt: number; conditionId: NoInfer<K> };
  /**
   * Conditions that no size, material, number of sets or ampacity of the run itself decides (the
   * site, the installation, its length, what it ends in): a run that does not pass one of them
   * cannot meet the rule at any size, so the search for a larger size passes the rule by
   * (analyze/fixes.ts). test/core/rules/sizeIndependent.test.ts holds each list to that.
   */
  sizeIndependent?: readonly NoInfer<K>[];
  /** Condition templates, phrased as the requirement with the values filled in. */
  messages: Readonly<Record<K, string>>;
  /** Pure: facts in, every condition out. No lookups beyond `facts`, no I/O, no clock. */
  check(facts: F): Check<NoInfer<K>>[];
}

export function defineRule<K extends string, F = RunFacts>(rule: Rule<K, F>): Rule<K, F> {
  return rule;
}

/** A condition that is met when `ok` is true, failed when false, unknown when null. */
export function when<K extends string>(id: K, ok: boolean | null, data: Record<string, string | number> = NO_DATA): Check<K> {
  return new Check(id, ok === null ? 'unknown' : ok ? 'pass' : 'fail', data);
}

const NO_DATA: Record<string, string | number> = Object.freeze({}) as Record<string, string | number>;

const TEMPLATE = /\{\{(\w+)\}\}/g;

export function renderTemplate(template: string, data: Record<string, string | number>): string {
  return template.replace(TEMPLATE, (_, key: string) => {
    const v = data[key];
    return v === undefined ? '?' : typeof v === 'number' ? formatNumber(v) : v;
  });
}

/** Amperes and feet as a reviewer writes them: no float noise, at most two decimals. */
export function formatNumber(n: number): string {
  return Number.isInteger(n) ? String(n) : String(Math.round(n * 100) / 100);
}

export function outcomeOf(checks: readonly Check[]): RuleTrial['outcome'] {
  let unknown = false;
  for (const c of checks) {
    if (c.status === 'fail') return 'fails';
    if (c.status === 'unknown') unknown = true;
  }
  return unknown ? 'unknown' : 'holds';
}

const citations = new WeakMap<object, Partial<Record<CodeEdition, Citation>>>();

/** The rule's citation in an edition, one frozen object per rule and edition. */
export function ruleCitation(rule: Pick<Rule, 'section'>, edition: CodeEdition): Citation {
  let byEdition = citations.get(rule);
  if (!byEdition) citations.set(rule, (byEdition = {}));
  return (byEdition[edition] ??= Object.freeze(cite(rule.section, edition)));
}

export function runRule<F extends { edition: CodeEdition }>(rule: Rule<string, F>, facts: F): RuleTrial {
  const conditions = rule.check(facts);
  for (let i = 0; i < conditions.length; i++) {
    const c = conditions[i]!;
    const template = rule.messages[c.id] ?? c.id;
    // A condition already kept by another rule's trial (a shared one) is kept as it is when its message reads the same.
    if (c.template === '') c.template = template;
    else if (c.template !== template) conditions[i] = c.withTemplate(template);
  }
  return { ruleId: rule.id, title: rule.title, cites: ruleCitation(rule, facts.edition), outcome: outcomeOf(conditions), conditions };
}

/**
 * The conditions below are shared by several rules of a family. While one run's facts are tried
 * under the whole family (analyze/trials.ts `firstHolding`), each is made once for the run and kept
 * by every trial that states it (conditions are read-only, and a rule whose message differs gets its
 * own copy in runRule): a feeder tap tried under five rules makes its load condition once, not four times.
 */
interface SharedConditions {
  damage?: Check<'damage'>;
  single?: Check<'single'>;
  device?: Check<'device'>;
  load?: Check<'load'>;
  third?: Check<'third'>;
}
let sharingFor: object | null = null;
let shared: SharedConditions = {};

/** Runs `tryAll` with the shared conditions of `facts` made once (the facts must not change meanwhile). */
export function shareConditionsOf<T>(facts: object, tryAll: () => T): T {
  sharingFor = facts;
  shared = {};
  try {
    return tryAll();
  } finally {
    sharingFor = null;
    shared = {};
  }
}

function sharedCondition<K extends keyof SharedConditions, F extends object>(f: F, key: K, make: (f: F) => NonNullable<SharedConditions[K]>): NonNullable<SharedConditions[K]> {
  if (f !== sharingFor) return make(f);
  return (shared[key] ??= make(f)) as NonNullable<SharedConditions[K]>;
}

/** Shared condition: protection from physical damage (240.21(B)(2)–(5), (C)(3)–(6)). */
export function damageCheck(f: Pick<RunFacts, 'damageProtection'>): Check<'damage'> {
  return sharedCondition(f, 'damage', damageCondition);
}
function damageCondition(f: Pick<RunFacts, 'damageProtection'>): Check<'damage'> {
  const p = f.damageProtection;
  const protection = p === 'raceway' ? 'a raceway' : p === 'other-approved-means' ? 'other approved means' : 'nothing';
  return new Check('damage', p === 'none' ? 'fail' : 'pass', { protection }, p === 'other-approved-means');
}

/** Shared condition: ends in a single breaker or set of fuses. */
export function singleDeviceCheck(f: RunFacts): Check<'single'> {
  return sharedCondition(f, 'single', singleDeviceCondition);
}
function singleDeviceCondition(f: RunFacts): Check<'single'> {
  const t = f.termination;
  return when('single', t.kind === 'ocpd' && t.single, { termination: t.label || t.kind });
}

/** Shared condition: the device at the end limits the load to the run's ampacity. */
export function deviceLimitCheck(f: RunFacts): Check<'device'> {
  return sharedCondition(f, 'device', deviceLimitCondition);
}
function deviceLimitCondition(f: RunFacts): Check<'device'> {
  const t = f.termination;
  if (t.kind !== 'ocpd') return when('device', false, { deviceA: '—', ampacityA: f.ampacityA ?? '?' });
  return when('device', t.ratingA === null || f.ampacityA === null ? null : t.ratingA <= f.ampacityA, {
    deviceA: t.ratingA ?? '?',
    ampacityA: f.ampacityA ?? '?',
  });
}

export function atMost(value: number | null, limit: number): boolean | null {
  return value === null ? null : value <= limit;
}

/** a ≥ b, or null when either is unknown. Float noise below 1 mA is ignored. */
export function atLeast(a: number | null, b: number | null): boolean | null {
  return a === null || b === null ? null : a + 1e-6 >= b;
}

/** Shared condition: the run carries the load it serves (unfactored sum, DOMAIN.md §7). */
export function loadCheck(f: RunFacts): Check<'load'> {
  return sharedCondition(f, 'load', loadCondition);
}
function loadCondition(f: RunFacts): Check<'load'> {
  return when('load', atLeast(f.ampacityA, f.loadA), { ampacityA: f.ampacityA ?? '?', loadA: f.loadA ?? '?' });
}
export const LOAD_MESSAGE = 'Ampacity ({{ampacityA}} A) must be at least the load it serves ({{loadA}} A).';

/** Shared condition: at least one third of the feeder device ahead (240.21(B)(2)–(4)); no round-up. */
export function oneThirdCheck(f: RunFacts): Check<'third'> {
  return sharedCondition(f, 'third', oneThirdCondition);
}
function oneThirdCondition(f: RunFacts): Check<'third'> {
  const minA = f.supplyOcpdA === null ? null : f.supplyOcpdA / 3;
  return when('third', atLeast(f.ampacityA, minA), { ampacityA: f.ampacityA ?? '?', feederA: f.supplyOcpdA ?? '?', minA: minA ?? '?' });
}
export const ONE_THIRD_MESSAGE = 'Ampacity ({{ampacityA}} A) must be at least one third of the {{feederA}} A feeder device ({{minA}} A).';

/** A primary-side current seen from the secondary: amperes × Vp / Vs; null when either is unknown. */
export function toSecondaryA(primaryA: number | null, t: { primaryVoltsLL: number; secondaryVoltsLL: number } | null): number | null {
  return primaryA === null || t === null ? null : (primaryA * t.primaryVoltsLL) / t.secondaryVoltsLL;
}

/** '10 AWG Al', '2 sets of 500 kcmil Cu', 'Cu, size unknown': how a message names the run's conductors. */
export function conductorName(f: Pick<RunFacts, 'size' | 'material' | 'parallelSets'>): string {
  const sets = f.parallelSets > 1 ? `${f.parallelSets} sets of ` : '';
  if (f.size === null) return `${sets}${materialLabel(f.material)}, ${sizeLabel(null)}`;
  return `${sets}${sizeLabel(f.size)} ${materialLabel(f.material)}`;
}
