import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { CodeEdition } from '../../../core/src/model/schema';
import { runRule, type Rule } from '../../../core/src/rules/define';
import { STUDY_RULES } from '../../../core/src/rules/index';
import type { RuleCases } from '../../../core/src/rules/testing';

/**
 * The equipment and study rules' reference tables (their facts come from the
 * short-circuit and voltage-drop stages, not from a run): every case gives the
 * outcome it names, names its source, and every condition is tested both ways.
 */
const RULES_DIR = fileURLToPath(new URL('../../../core/src/rules/', import.meta.url));

type Facts = { edition: CodeEdition };
const entries = await Promise.all(
  STUDY_RULES.map(async (rule) => {
    const mod = (await import(`../../../core/src/rules/${rule.id}.cases.ts`)) as { cases: RuleCases<Facts> };
    return [rule.id, rule as unknown as Rule<string, Facts>, mod.cases] as const;
  }),
);

describe.each(entries)('%s', (_id, rule, cases) => {
  const all = [...cases.meets, ...cases.fails, ...(cases.unknown ?? [])];
  const ids = (f: Facts, status: string) => rule.check(f).filter((c) => c.status === status).map((c) => c.id).sort();

  it('cases name their source and are unique', () => {
    for (const c of all) expect(c.source, c.name).toMatch(/NFPA 70-20(20|23)|common practice|from memory/);
    expect(new Set(all.map((c) => c.name)).size).toBe(all.length);
  });

  it.each(cases.meets.map((c) => [c.name, c] as const))('meets: %s', (_n, c) => {
    const t = runRule(rule, c.facts);
    expect(t.outcome).toBe('holds');
    for (const cond of t.conditions) expect(cond.text).not.toContain('?');
  });

  it.each(cases.fails.map((c) => [c.name, c] as const))('fails: %s', (_n, c) => {
    expect({ outcome: runRule(rule, c.facts).outcome, failing: ids(c.facts, 'fail') }).toEqual({ outcome: 'fails', failing: [...(c.expect ?? [])].sort() });
  });

  it.each((cases.unknown ?? []).map((c) => [c.name, c] as const))('unknown: %s', (_n, c) => {
    expect({ outcome: runRule(rule, c.facts).outcome, unknown: ids(c.facts, 'unknown') }).toEqual({ outcome: 'unknown', unknown: [...(c.expect ?? [])].sort() });
  });

  it('every condition fails in a case and passes in another', () => {
    const messageIds = Object.keys(rule.messages);
    const failed = new Set(cases.fails.flatMap((c) => c.expect ?? []));
    const passed = new Set(cases.meets.flatMap((c) => ids(c.facts, 'pass')));
    expect(messageIds.filter((m) => !failed.has(m) || !passed.has(m))).toEqual([]);
  });

  it('the doc names the rule, its section and every condition', () => {
    const doc = readFileSync(`${RULES_DIR}${rule.id}.md`, 'utf8');
    expect(doc.startsWith(`# ${rule.id}`)).toBe(true);
    expect(doc).toContain(rule.section);
    for (const m of Object.keys(rule.messages)) expect(doc, m).toContain(`\`${m}\``);
  });
});
