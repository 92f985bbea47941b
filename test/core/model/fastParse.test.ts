import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { isDeepStrictEqual } from 'node:util';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { project } from '../../../core/src/model/schema';
import { compileSchema, FAIL } from '../../../core/src/model/fastParse';

/**
 * The compiled validator must agree with zod exactly: same verdict on every
 * input, and the same parsed value (defaults filled, absent optionals absent).
 */
const root = join(import.meta.dirname, '../../..');

/** Node runs the object checks written out as code; a page whose policy forbids eval (the editor) runs the closures. */
const validators = [
  ['written out as code (Node)', compileSchema(project, { generate: true })],
  ['closures (the editor)', compileSchema(project, { generate: false })],
] as const;

function agree(fast: (typeof validators)[number][1], input: unknown): void {
  const z = project.safeParse(input);
  const f = fast(input);
  expect(f === FAIL, `zod ${z.success ? 'accepts' : 'rejects'} but the fast path ${f === FAIL ? 'rejects' : 'accepts'}`).toBe(!z.success);
  if (z.success) expect(isDeepStrictEqual(f, z.data)).toBe(true);
}

const samples = readdirSync(join(root, 'samples'))
  .filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json')
  .map((f) => [f, JSON.parse(readFileSync(join(root, 'samples', f), 'utf8'))] as const);

describe.each(validators)('compiled project validator, %s, agrees with the zod schema', (_kind, fast) => {
  it.each(samples)('sample %s', (_, json) => agree(fast, json));

  const malformed = readdirSync(join(root, 'test/fixtures/malformed')).filter((f) => f.endsWith('.json') && f !== 'expected.json');
  it.each(malformed)('malformed fixture %s', (f) => {
    let json: unknown;
    try {
      json = JSON.parse(readFileSync(join(root, 'test/fixtures/malformed', f), 'utf8'));
    } catch {
      return; // not JSON at all: never reaches either validator
    }
    agree(fast, json);
  });

  it('random single edits of the samples (delete a key, or set it to another value)', () => {
    const values = fc.oneof(fc.constant(undefined), fc.constant(null), fc.integer({ min: -5, max: 30_000 }), fc.double(), fc.boolean(), fc.string({ maxLength: 4 }), fc.constantFrom('cu', 'al', '3/0', 'breaker', 'bus', 60, 75, 90, 1, 3), fc.constant([]), fc.constant({}));
    fc.assert(
      fc.property(fc.nat(samples.length - 1), fc.nat(), fc.nat(), fc.string({ maxLength: 3 }), values, (s, pick, keyPick, extraKey, value) => {
        const doc = structuredClone(samples[s]![1]) as Record<string, unknown>;
        const containers: Record<string, unknown>[] = [doc];
        const walk = (v: unknown) => {
          if (v && typeof v === 'object') {
            if (!Array.isArray(v)) containers.push(v as Record<string, unknown>);
            for (const x of Object.values(v)) walk(x);
          }
        };
        walk(doc.project);
        walk(doc.nodes);
        walk(doc.conductors);
        walk(doc.busLinks);
        const target = containers[pick % containers.length]!;
        const keys = Object.keys(target);
        const key = keyPick % 5 === 0 || keys.length === 0 ? extraKey : keys[keyPick % keys.length]!;
        if (value === undefined) delete target[key];
        else target[key] = value;
        agree(fast, doc);
      }),
      { numRuns: 300, seed: 20261201 },
    );
  });
});
