import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatPath, loadProject } from '@linewright/core';
import { MAX_DEPTH } from '../../../core/src/model/load';
import { diagram } from '../../helpers/builder';

describe('loadProject and fields it does not know', () => {
  it('sets an unknown field aside with a notice naming it and where, and still loads the drawing', () => {
    const input = diagram().utility(480).breaker(200).conductor({ id: 'C1', size: '3/0', lengthFt: 20 }).breaker(200).build() as Record<string, unknown>;
    input.$schema = './linewright-project.schema.json';
    (input.conductors as Record<string, unknown>[])[0]!.lenghtFt = 20;
    const r = loadProject(input);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.notices).toContainEqual(expect.stringContaining('"$schema"'));
    expect(r.notices).toContainEqual(expect.stringMatching(/"lenghtFt" at conductors\[0\]; check the spelling/));
    expect(r.project.conductors[0]).not.toHaveProperty('lenghtFt');
  });

  it('an unknown field beside a real error is reported with it, and nothing loads', () => {
    const input = diagram().utility(480).breaker(200).conductor({ id: 'C1', size: '3/0', lengthFt: 20 }).breaker(200).build() as Record<string, unknown>;
    const c = (input.conductors as Record<string, unknown>[])[0]!;
    c.lenghtFt = 20;
    c.lengthFt = -1;
    const r = loadProject(input);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.map((e) => e.path)).toEqual(expect.arrayContaining(['conductors[0].lengthFt', 'conductors[0]']));
  });
});

describe('loadProject names the real problem (common practice for a file loader)', () => {
  const root = join(import.meta.dirname, '../../..');
  const samples = readdirSync(join(root, 'samples'))
    .filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json')
    .map((f) => JSON.parse(readFileSync(join(root, 'samples', f), 'utf8')) as Record<string, unknown>);

  /** Every numeric leaf of a sample with its path (keys and indexes) from the root. */
  function numericLeaves(v: unknown, path: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] {
    if (typeof v === 'number' && path[0] !== 'version') out.push(path);
    else if (Array.isArray(v)) v.forEach((x, i) => numericLeaves(x, [...path, i], out));
    else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) numericLeaves(x, [...path, k], out);
    return out;
  }

  it('a number written as a string, anywhere in any sample, says "expected number, found string" at that path, never "required"', () => {
    let tried = 0;
    const seen = new Set<string>();
    for (const sample of samples) {
      for (const path of numericLeaves(sample)) {
        // One trial per field of each equipment kind is enough: the same field of the same kind fails the same way.
        const item = path.length > 2 ? (sample[path[0]!] as Record<string, unknown>[])[path[1] as number] : undefined;
        const shape = `${String(item?.kind ?? '')}:${formatPath(path.slice(2).length ? [path[0]!, ...path.slice(2)] : path)}`;
        if (seen.has(shape)) continue;
        seen.add(shape);
        const copy = structuredClone(sample);
        const owner = path.slice(0, -1).reduce<Record<string | number, unknown>>((o, k) => o[k] as Record<string | number, unknown>, copy);
        const key = path[path.length - 1]!;
        owner[key] = String(owner[key]);
        const r = loadProject(copy);
        expect(r.ok).toBe(false);
        if (r.ok) continue;
        const at = r.errors.find((e) => e.path === formatPath(path));
        expect(at, `no error at ${formatPath(path)}: ${JSON.stringify(r.errors)}`).toBeDefined();
        // A plain number says "expected number"; a field with a short list of values (2020 or 2023) lists them.
        expect(at!.message).toMatch(/: expected number, found string "|must be .*; found string "/);
        expect(at!.message).not.toMatch(/required/);
        tried++;
      }
    }
    expect(tried).toBeGreaterThan(30);
  });

  it('a missing version or field says "missing", never "found undefined"', () => {
    const input = diagram().utility(480).breaker(200).conductor({ id: 'C1', size: '3/0', lengthFt: 20 }).breaker(200).build() as Record<string, unknown>;
    const noVersion = { ...input };
    delete noVersion.version;
    const r1 = loadProject(noVersion);
    expect(r1.ok ? '' : r1.errors[0]!.message).toMatch(/"version" is missing/);
    const noEnd = structuredClone(input);
    delete (noEnd.conductors as Record<string, unknown>[])[0]!.from;
    // The size may be missing (unknown, like a length): only the missing end is an error.
    delete (noEnd.conductors as Record<string, unknown>[])[0]!.size;
    const r2 = loadProject(noEnd);
    const at = (path: string) => (r2.ok ? '' : r2.errors.find((e) => e.path === path)?.message);
    expect(at('conductors[0].from')).toMatch(/"from" is missing; expected a string/);
    expect(at('conductors[0].size')).toBeUndefined();
    for (const r of [r1, r2]) expect(JSON.stringify(r)).not.toContain('undefined');
  });

  it('refuses nesting deeper than the limit with the path, without recursing (5 000 and 200 000 levels)', () => {
    for (const depth of [5_000, 200_000]) {
      const text = `{"notes":${'['.repeat(depth)}${']'.repeat(depth)},"format":"linewright-project","version":1}`;
      const r = loadProject(text);
      expect(r.ok).toBe(false);
      if (r.ok) continue;
      expect(r.errors[0]!.path.startsWith('notes[0][0]')).toBe(true);
      expect(r.errors[0]!.message).toContain(`Nested more than ${MAX_DEPTH} levels deep`);
    }
  });
});
