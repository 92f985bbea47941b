import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyze, loadProject, type ProjectInput } from '@linewright/core';
import { toSarif } from '../../../core/src/report/sarif';
import { cli, ROOT } from '../../helpers/cli';
import { checkOne, fuzzBases } from '../../fuzz/checkOne';
import { HOSTILE_TEXT, inputAt } from '../../fuzz/mutate';
import { oddNetwork, treeNetwork } from '../../helpers/networks';
import { SARIF_2_1_0_SCHEMA as schema, sarifSchemaErrors as schemaErrors } from '../../helpers/sarifSchema';
import { cleanReport, fixtureReport } from './fixture';

/**
 * Every SARIF log we write, validated against the official SARIF 2.1.0 JSON schema (OASIS SARIF
 * 2.1.0; see test/helpers/sarifSchema.ts): the samples through the CLI as a user runs it, the
 * fixture reports, seeded random networks and fuzz mutations with hostile labels. The fuzz harness
 * (test/fuzz/checkOne.ts) validates the log of every accepted input the same way.
 */

function sarifOf(input: ProjectInput | string, uri: string): unknown {
  const text = typeof input === 'string' ? input : JSON.stringify(input, null, 2);
  const loaded = loadProject(text);
  if (!loaded.ok) throw new Error(loaded.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return toSarif(analyze(loaded.project), { artifactUri: uri, sourceText: text });
}

function cliSarif(file: string): ReturnType<typeof cli> {
  return cli(['check', file, '--format', 'sarif']);
}

const sampleFiles = [
  ...readdirSync(join(ROOT, 'samples')).filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json').map((f) => `samples/${f}`),
  ...readdirSync(join(ROOT, 'samples/review')).filter((f) => f.endsWith('.json')).map((f) => `samples/review/${f}`),
];

describe('SARIF against the official SARIF 2.1.0 JSON schema (OASIS; draft-04, ajv)', () => {
  it('the schema file is the 2.1.0 one and the validator rejects what the schema forbids', () => {
    expect(String(schema.title)).toContain('Version 2.1.0');
    expect(schemaErrors({ version: '2.1.0', runs: [] })).toBe('');
    const log = structuredClone(toSarif(fixtureReport, { artifactUri: 'a.json' })) as unknown as {
      runs: { tool: { driver: Record<string, unknown> }; results: Record<string, unknown>[] }[];
    };
    expect(schemaErrors(log)).toBe('');
    log.runs[0]!.tool.driver.informationUrl = 'x';
    log.runs[0]!.results[0]!.level = 'fatal';
    const errors = schemaErrors(log);
    expect(errors).toContain('must NOT have additional properties');
    expect(errors).toContain('must be equal to one of the allowed values');
    expect(schemaErrors({ version: '2.1.0', runs: [{ tool: { driver: { name: 'x', informationUri: 'not a uri' } } }] })).toContain('must match format "uri"');
  });

  it('the hand-built fixture reports (violations, needs-AHJ, warnings, info, a clean one)', () => {
    expect(schemaErrors(toSarif(fixtureReport, { artifactUri: 'samples/harbor lane.json' }))).toBe('');
    expect(schemaErrors(toSarif(cleanReport, { artifactUri: 'file:///tmp/a%20b.json' }))).toBe('');
  });

  it.each(sampleFiles)('linewright check %s --format sarif', { timeout: 60_000 }, async (file) => {
    const r = await cliSarif(file);
    expect(r.stderr).not.toMatch(/internal error/i);
    expect([0, 1]).toContain(r.code);
    const log = JSON.parse(r.stdout) as { runs: { results: unknown[] }[] };
    expect(log.runs[0]!.results.length).toBeGreaterThan(0);
    expect(schemaErrors(log)).toBe('');
  });

  it('40 seeded random networks (radial and odd: loops, double feeds, islands, several sources)', { timeout: 120_000 }, () => {
    const nets = [...fc.sample(treeNetwork(20), { seed: 7_001, numRuns: 20 }), ...fc.sample(oddNetwork(20), { seed: 7_002, numRuns: 20 })];
    const bad = nets.map((n, i) => [i, schemaErrors(sarifOf(n, `random/net ${i}.json`))] as const).filter(([, e]) => e !== '');
    expect(bad).toEqual([]);
  });

  it('seeded fuzz mutations of the samples that load, hostile labels included', { timeout: 120_000 }, () => {
    const bases = fuzzBases(ROOT);
    let accepted = 0;
    const bad: string[] = [];
    for (let i = 0; i < 60; i++) {
      const { text } = inputAt(bases, 4_242, i, 0.1);
      if (checkOne(text, { pdf: false }).kind !== 'accepted') continue;
      accepted++;
      const e = schemaErrors(sarifOf(text, 'fuzz/input.json'));
      if (e) bad.push(`#${i}: ${e}`);
    }
    expect(accepted).toBeGreaterThan(10);
    expect(bad).toEqual([]);
    // Every hostile label at once, as node and conductor labels of one drawing.
    const hostile = JSON.parse(readFileSync(join(ROOT, 'samples/demo-clinic.json'), 'utf8')) as ProjectInput;
    hostile.nodes.forEach((n, k) => (n.label = HOSTILE_TEXT[k % HOSTILE_TEXT.length]));
    hostile.conductors.forEach((c, k) => (c.label = HOSTILE_TEXT[(k + 3) % HOSTILE_TEXT.length]));
    expect(schemaErrors(sarifOf(hostile, 'hostile labels/a#b?.json'))).toBe('');
  });
});
