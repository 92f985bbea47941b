/**
 * Every file in test/fixtures/malformed is broken in one way. loadProject must
 * refuse it with a list of errors, one of which names the offending field by
 * its JSON path (listed per fixture in expected.json), with a message a user
 * can act on and no stack trace. The corpus and the expected paths are ours:
 * "common practice" for a file loader, no outside source.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { loadProject } from '@linewright/core';

const dir = fileURLToPath(new URL('../fixtures/malformed/', import.meta.url));
const expected = JSON.parse(readFileSync(join(dir, 'expected.json'), 'utf8')) as {
  fixtures: Record<string, { paths: string[]; why: string; message?: string }>;
};
const files = readdirSync(dir).filter((f) => f !== 'expected.json' && f !== 'README.md').sort();

/** A stack frame such as "    at parse (file.ts:12:5)" or "at Object.<anonymous>". */
const STACK_FRAME = /\n\s*at\s|\bat\s+\S+\s+\(.*:\d+:\d+\)|\bat\s+\S+:\d+:\d+/;

describe('malformed corpus', () => {
  it('lists every fixture file in expected.json and nothing more', () => {
    expect(Object.keys(expected.fixtures).sort()).toEqual(files);
  });

  it('holds at least 40 broken inputs, some of them not JSON at all', () => {
    expect(files.length).toBeGreaterThanOrEqual(40);
    expect(files.filter((f) => f.endsWith('.txt')).length).toBeGreaterThanOrEqual(4);
  });
});

describe.each(files)('%s', (file) => {
  const entry = expected.fixtures[file]!;
  const text = readFileSync(join(dir, file), file.endsWith('.txt') ? 'latin1' : 'utf8');

  it(`is rejected: ${entry?.why}`, () => {
    let result: ReturnType<typeof loadProject>;
    expect(() => {
      result = loadProject(text);
    }, 'loadProject must return errors, never throw').not.toThrow();
    result = loadProject(text);
    expect(result.ok, 'a broken file must not load').toBe(false);
    if (result.ok) return;
    expect(result.errors.length).toBeGreaterThan(0);
    const paths = result.errors.map((e) => e.path);
    expect(
      paths.some((p) => entry.paths.includes(p)),
      `expected an error at ${entry.paths.map((p) => JSON.stringify(p)).join(' or ')}; got ${JSON.stringify(result.errors)}`,
    ).toBe(true);
    if (entry.message !== undefined) {
      const named = result.errors.find((e) => entry.paths.includes(e.path))!;
      expect(named.message, 'the message says what was expected and what was found').toContain(entry.message);
    }
    for (const e of result.errors) {
      expect(typeof e.message).toBe('string');
      expect(e.message.trim().length, `empty message at ${JSON.stringify(e.path)}`).toBeGreaterThan(0);
      expect(e.message, `stack trace in the message at ${JSON.stringify(e.path)}`).not.toMatch(STACK_FRAME);
      expect(e.message.length, 'a message is a sentence or two, not a dump').toBeLessThan(600);
    }
  });

  it('is also rejected when handed over already parsed (JSON files only)', () => {
    let parsed: unknown;
    try {
      parsed = JSON.parse(text);
    } catch {
      return; // not JSON: only the text path applies, checked above
    }
    const result = loadProject(parsed);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.map((e) => e.path).some((p) => entry.paths.includes(p)), JSON.stringify(result.errors)).toBe(true);
  });
});
