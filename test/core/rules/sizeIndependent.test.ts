import { describe, expect, it } from 'vitest';
import type { Rule } from '../../../core/src/rules/define';
import type { RunFacts } from '../../../core/src/rules/facts';
import { ALL_RULES } from '../../../core/src/rules/index';
import type { RuleCases } from '../../../core/src/rules/testing';
import type { ConductorSize, Material } from '../../../core/src/model/schema';

/**
 * Rule.sizeIndependent names the conditions no size, material, number of sets or ampacity of the
 * run decides (240.21(B) and (C): the length limits, the site, the installation and what the run
 * ends in are stated apart from the conductor). The fixes search skips a rule the run fails on one
 * of them (analyze/fixes.ts), so each list is held here to what it claims: over every reference
 * case of the rule (<id>.cases.ts, each with its code source), the run built at other sizes,
 * materials, sets and ampacities leaves the status of every listed condition as it was.
 */

const SIZES: readonly (ConductorSize | null)[] = [null, '14', '12', '8', '6', '4', '1/0', '4/0', '500', '2000'];
const MATERIALS: readonly Material[] = ['cu', 'al'];
const SETS = [1, 2, 4];
/** Ampacities below, around and far above the ratings the cases use; null when unknown. */
const AMPACITIES: readonly (number | null)[] = [null, 1, 15, 20, 30, 65, 150, 199.5, 200, 400, 1000, 5000];
const SMALL_LIMITS: readonly (number | null)[] = [null, 15, 20, 30];

/** The run as the fixes search would try it: the trial's fields changed, everything else kept (sizing/trial.ts trialFacts). */
function* resized(f: RunFacts): Generator<RunFacts> {
  let k = 0;
  for (const size of SIZES) {
    for (const material of MATERIALS) {
      for (const parallelSets of SETS) {
        for (const ampacityA of AMPACITIES) {
          k++;
          const uncorrected = AMPACITIES[(k * 7) % AMPACITIES.length]!;
          yield { ...f, size, material, parallelSets, ampacityA, ampacityUncorrectedA: uncorrected, smallConductorMaxOcpdA: SMALL_LIMITS[k % SMALL_LIMITS.length]! };
        }
      }
    }
  }
}

/** The statuses of the listed conditions, in the order the rule gives them (an id may repeat, one per secondary set). */
function statuses(rule: Rule, facts: RunFacts, ids: readonly string[]): string[] {
  return rule
    .check(facts)
    .filter((c) => ids.includes(c.id))
    .map((c) => `${c.id}:${c.status}`);
}

const CASES = new Map<string, RuleCases>();
for (const rule of ALL_RULES) {
  if (!rule.sizeIndependent) continue;
  const mod = (await import(`../../../core/src/rules/${rule.id}.cases.ts`)) as { cases: RuleCases };
  CASES.set(rule.id, mod.cases);
}

describe('Rule.sizeIndependent', () => {
  it('the feeder-tap and secondary rules (240.21(B), (C)) each list theirs', () => {
    expect([...CASES.keys()].sort()).toEqual([
      'secondary-10ft',
      'secondary-25ft',
      'secondary-industrial-25ft',
      'secondary-outside',
      'secondary-primary-protected',
      'tap-10ft',
      'tap-25ft',
      'tap-high-bay',
      'tap-outside',
      'tap-transformer',
    ]);
  });

  for (const rule of ALL_RULES.filter((r) => r.sizeIndependent)) {
    const ids = rule.sizeIndependent!;
    it(`${rule.id}: every listed condition is one of its own`, () => {
      expect(ids.filter((id) => !(id in rule.messages))).toEqual([]);
    });

    it(`${rule.id}: no size, material, sets or ampacity changes ${ids.join(', ')}`, () => {
      const cases = CASES.get(rule.id)!;
      const all = [...cases.meets, ...cases.fails, ...(cases.unknown ?? [])];
      expect(all.length).toBeGreaterThan(0);
      let seen = 0;
      for (const c of all) {
        const before = statuses(rule, c.facts, ids);
        expect(before.length, c.name).toBeGreaterThan(0);
        for (const trial of resized(c.facts)) {
          const after = statuses(rule, trial, ids);
          if (after.join() !== before.join()) expect({ case: c.name, size: trial.size, material: trial.material, sets: trial.parallelSets, ampacityA: trial.ampacityA, after }).toEqual({ before });
          seen++;
        }
      }
      expect(seen).toBe(all.length * SIZES.length * MATERIALS.length * SETS.length * AMPACITIES.length);
    });
  }
});
