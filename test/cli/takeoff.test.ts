import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { CAUTION } from '@linewright/core';
import { parseArgs } from '../../core/src/cli/args';
import { cli } from '../helpers/cli';

/** `linewright takeoff`, as a user runs it (child process, temporary files); the contract is our own design. */
const dir = mkdtempSync(join(tmpdir(), 'lw-takeoff-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('parseArgs: takeoff', () => {
  it('takeoff FILE defaults to text on stdout', () => {
    expect(parseArgs(['takeoff', 'a.json'])).toEqual({ command: 'takeoff', file: 'a.json', format: 'text', out: null, edition: null });
  });
  it.each([
    [['takeoff', 'a.json', '--format', 'xlsx', '--out', 't.xlsx'], { format: 'xlsx', out: 't.xlsx' }],
    [['takeoff', 'a.json', '--format=csv'], { format: 'csv' }],
    [['takeoff', 'a.json', '--format', 'json', '--edition', '2020'], { format: 'json', edition: 2020 }],
  ])('%j', (argv, expected) => {
    expect(parseArgs(argv)).toMatchObject({ command: 'takeoff', ...expected });
  });
  it.each([
    [['takeoff'], 'takeoff needs a project file'],
    [['takeoff', 'a.json', '--format', 'sarif'], 'option --format for takeoff must be one of text, csv, xlsx, json (got "sarif")'],
    [['takeoff', 'a.json', '--pdf', 'x.pdf'], 'option --pdf belongs to check'],
    [['takeoff', 'a.json', 'b.json'], 'unexpected argument "b.json"'],
  ])('%j is refused naming the problem', (argv, message) => {
    const parsed = parseArgs(argv);
    expect(parsed.command).toBe('error');
    expect(parsed.command === 'error' && parsed.message).toContain(message);
  });
});

describe('linewright takeoff', () => {
  it('prints the demo takeoff as text ending with the caution, exit 0', async () => {
    const r = await cli(['takeoff', 'samples/demo-clinic.json']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('WIRE BY SIZE, MATERIAL AND INSULATION (FT)');
    expect(r.stdout).toContain('CONDUCTOR AND RACEWAY SCHEDULE');
    expect(r.stdout.replace(/\s+/g, ' ').trim().endsWith(CAUTION)).toBe(true);
  }, 120_000);

  it('writes JSON with totals; CSV and XLSX to files; the caution goes to stderr', async () => {
    const json = await cli(['takeoff', 'samples/demo-clinic.json', '--format', 'json']);
    expect(json.code).toBe(0);
    const parsed = JSON.parse(json.stdout) as { format: string; runs: unknown[]; totals: { wire: unknown[] }; caution: string };
    expect(parsed.format).toBe('linewright-takeoff');
    expect(parsed.runs.length).toBeGreaterThan(0);
    expect(parsed.totals.wire.length).toBeGreaterThan(0);
    expect(parsed.caution).toBe(CAUTION);
    expect(json.stderr).toContain('Caution:');
    const xlsx = join(dir, 'demo.xlsx');
    const w = await cli(['takeoff', 'samples/demo-clinic.json', '--format', 'xlsx', '--out', xlsx]);
    expect(w.code).toBe(0);
    // An XLSX file is a zip archive: it starts with the local file header 'PK\x03\x04' (ECMA-376 Part 2, OPC).
    expect(readFileSync(xlsx).subarray(0, 4)).toEqual(Buffer.from([0x50, 0x4b, 0x03, 0x04]));
  }, 120_000);

  it('refuses to write over the project file, exit 2', async () => {
    const r = await cli(['takeoff', 'samples/demo-clinic.json', '--out', 'samples/demo-clinic.json']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('is the project file itself');
  }, 120_000);
});
