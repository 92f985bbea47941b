import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runRule, type Rule } from '../../../core/src/rules/define';
import type { RunFacts } from '../../../core/src/rules/facts';
import { ALL_RULES, STUDY_RULES } from '../../../core/src/rules/index';
import type { Case, RuleCases } from '../../../core/src/rules/testing';
import { baseAmpacityA } from '../../../core/src/tables/ampacity310_16';

/**
 * The rule modules' reference tables, run as one suite (the idea of ESLint's
 * checkRuleFiles): every registered rule has its code, a `<id>.cases.ts`
 * reference table and a `<id>.md` doc; every case gives the outcome it names;
 * no condition goes untested. The expected outcomes come from the code
 * sections each case cites, not from running the rules.
 */

const RULES_DIR = fileURLToPath(new URL('../../../core/src/rules/', import.meta.url));
const FILES = new Set(readdirSync(RULES_DIR));

const CASES = new Map<string, RuleCases>();
for (const rule of ALL_RULES) {
  if (!FILES.has(`${rule.id}.cases.ts`)) continue;
  const mod = (await import(`../../../core/src/rules/${rule.id}.cases.ts`)) as { cases?: RuleCases };
  if (mod.cases) CASES.set(rule.id, mod.cases);
}

/** A rule without a reference table gets none; the registry test and its own 'has cases' test then fail. */
function casesOf(rule: Rule): RuleCases {
  return CASES.get(rule.id) ?? { meets: [], fails: [] };
}

function allCases(c: RuleCases): Case[] {
  return [...c.meets, ...c.fails, ...(c.unknown ?? [])];
}

function idsWith(rule: Rule, facts: RunFacts, status: 'pass' | 'fail' | 'unknown'): string[] {
  return rule
    .check(facts)
    .filter((c) => c.status === status)
    .map((c) => c.id)
    .sort();
}

/** The run and, for a transformer tap, its secondary runs: every place a case states an ampacity. */
function runsOf(facts: RunFacts): RunFacts[] {
  return [facts, ...facts.secondaries.flatMap(runsOf)];
}

const sorted = (xs: readonly string[]): string[] => [...xs].sort();

describe('rule registry (core/src/rules/index.ts)', () => {
  it('ALL_RULES is sorted by id, one line each', () => {
    const ids = ALL_RULES.map((r) => r.id);
    expect(ids).toEqual([...ids].sort());
  });

  it('rule ids are unique', () => {
    const ids = ALL_RULES.map((r) => r.id);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('every rule has its code, a .cases.ts reference table and a .md doc', () => {
    const missing = ALL_RULES.flatMap((r) =>
      [`${r.id}.ts`, `${r.id}.cases.ts`, `${r.id}.md`].filter((f) => !FILES.has(f)),
    );
    expect(missing).toEqual([]);
  });

  it('every .cases.ts and .md in the folder belongs to a registered rule', () => {
    const ids = new Set([...ALL_RULES, ...STUDY_RULES].map((r) => r.id));
    const orphans = [...FILES].filter((f) => {
      const m = /^(.+?)(\.cases\.ts|\.md)$/.exec(f);
      return m !== null && !ids.has(m[1]!);
    });
    expect(orphans).toEqual([]);
  });
});

describe.each(ALL_RULES.map((rule) => [rule.id, rule] as const))('%s', (_id, rule) => {
  const cases = casesOf(rule);
  const messageIds = Object.keys(rule.messages);

  it('has at least one passing and one failing reference case', () => {
    expect(cases.meets.length).toBeGreaterThan(0);
    expect(cases.fails.length).toBeGreaterThan(0);
  });

  it('case names are unique', () => {
    const names = allCases(cases).map((c) => c.name);
    expect(names.filter((n, i) => names.indexOf(n) !== i)).toEqual([]);
  });

  it('every case names its source, and a cited edition is the edition of its facts', () => {
    for (const c of allCases(cases)) {
      expect(c.source, c.name).toMatch(/NFPA 70-20(20|23)|common practice|from memory/);
      const editions = [...c.source.matchAll(/NFPA 70-(\d{4})/g)].map((m) => Number(m[1]));
      if (editions.length > 0) expect(editions, c.name).toContain(c.facts.edition);
    }
  });

  it('ampacities in the facts are Table 310.16 values (× parallel sets) for the size named, unless the source cites a 310.15 correction or adjustment', () => {
    for (const c of allCases(cases)) {
      if (/310\.15/.test(c.source)) continue;
      for (const f of runsOf(c.facts)) {
        const size = f.size;
        if (f.ampacityA === null || size === null) continue;
        const columns = ([60, 75, 90] as const).map((t) => (baseAmpacityA(f.material, size, t) ?? Number.NaN) * f.parallelSets);
        expect(columns, `${c.name}: ${f.parallelSets} × ${f.size} ${f.material} = ${f.ampacityA} A`).toContain(f.ampacityA);
      }
    }
  });

  it('expected condition ids are message ids of the rule', () => {
    for (const c of allCases(cases)) for (const e of c.expect ?? []) expect(messageIds, c.name).toContain(e);
  });

  it.each(cases.meets.map((c) => [c.name, c] as const))('meets: %s', (_name, c) => {
    const trial = runRule(rule, c.facts);
    expect({ outcome: trial.outcome, failing: idsWith(rule, c.facts, 'fail'), unknown: idsWith(rule, c.facts, 'unknown') }).toEqual({
      outcome: 'holds',
      failing: [],
      unknown: [],
    });
    // Complete data renders every template: no '?' stands in for a missing value.
    for (const cond of trial.conditions) expect(cond.text, cond.id).not.toContain('?');
  });

  it.each(cases.fails.map((c) => [c.name, c] as const))('fails: %s', (_name, c) => {
    expect(c.expect?.length ?? 0, 'a failing case names the conditions that fail').toBeGreaterThan(0);
    expect({ outcome: runRule(rule, c.facts).outcome, failing: idsWith(rule, c.facts, 'fail') }).toEqual({
      outcome: 'fails',
      failing: sorted(c.expect ?? []),
    });
  });

  it.each((cases.unknown ?? []).map((c) => [c.name, c] as const))('unknown: %s', (_name, c) => {
    const got = { outcome: runRule(rule, c.facts).outcome, unknown: idsWith(rule, c.facts, 'unknown') };
    expect(c.expect ? got : got.outcome).toEqual(c.expect ? { outcome: 'unknown', unknown: sorted(c.expect) } : 'unknown');
  });

  it('a pass on "other approved means" of damage protection is marked as needing AHJ acceptance', () => {
    for (const c of cases.meets) {
      if (!runsOf(c.facts).some((f) => f.damageProtection === 'other-approved-means')) continue;
      const damage = rule.check(c.facts).find((k) => k.id === 'damage');
      if (damage) expect({ status: damage.status, needsAhj: damage.needsAhj }, c.name).toEqual({ status: 'pass', needsAhj: true });
    }
  });

  it('every message id is expected in a failing or unknown case, or passes in a meeting one (no untested message)', () => {
    const covered = new Set<string>();
    for (const c of [...cases.fails, ...(cases.unknown ?? [])]) for (const e of c.expect ?? []) covered.add(e);
    for (const c of cases.meets) for (const e of idsWith(rule, c.facts, 'pass')) covered.add(e);
    expect(messageIds.filter((m) => !covered.has(m))).toEqual([]);
  });

  it('every condition has a failing reference case and a passing one', () => {
    const failed = new Set(cases.fails.flatMap((c) => c.expect ?? []));
    const passed = new Set(cases.meets.flatMap((c) => idsWith(rule, c.facts, 'pass')));
    expect({ neverFails: messageIds.filter((m) => !failed.has(m)), neverPasses: messageIds.filter((m) => !passed.has(m)) }).toEqual({
      neverFails: [],
      neverPasses: [],
    });
  });

  it('the doc names the rule, its section and every condition', () => {
    const doc = readFileSync(join(RULES_DIR, `${rule.id}.md`), 'utf8');
    expect(doc.startsWith(`# ${rule.id}`)).toBe(true);
    expect(doc).toContain(rule.section);
    for (const m of messageIds) expect(doc, m).toContain(`\`${m}\``);
  });
});
