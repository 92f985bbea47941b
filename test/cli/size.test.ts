import { describe, expect, it } from 'vitest';
import { CAUTION } from '@linewright/core';
import { parseArgs } from '../../core/src/cli/args';
import { cli } from '../helpers/cli';

/** `linewright size`, as a user runs it (child process); the contract is our own design. */
describe('parseArgs: size', () => {
  it('size FILE --conductor ID defaults to text', () => {
    expect(parseArgs(['size', 'a.json', '--conductor', 'F-1'])).toEqual({ command: 'size', file: 'a.json', conductor: 'F-1', format: 'text', edition: null });
    expect(parseArgs(['size', 'a.json', '--conductor=F-1', '--format', 'json', '--edition', '2020'])).toMatchObject({ format: 'json', edition: 2020 });
  });
  it.each([
    [['size', 'a.json'], 'size needs the conductor to size: --conductor ID'],
    [['size'], 'size needs a project file'],
    [['size', 'a.json', '--conductor', 'X', '--pdf', 'p.pdf'], 'option --pdf does not apply to size'],
    [['size', 'a.json', '--conductor', 'X', '--format', 'csv'], 'option --format of size must be text or json'],
    [['check', 'a.json', '--conductor', 'X'], 'option --conductor belongs to size'],
  ])('%j is refused naming the problem', (argv, message) => {
    const parsed = parseArgs(argv);
    expect(parsed.command).toBe('error');
    expect(parsed.command === 'error' && parsed.message).toContain(message);
  });
});

describe('linewright size', () => {
  it('sizes the cold-storage shop tap: 3/0 AWG Cu under 240.21(B)(2), 2/0 fails one third of 600 A; ends with the caution; exit 0', async () => {
    const r = await cli(['size', 'samples/cold-storage.json', '--conductor', 'TAP-6A']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('run TAP-6A → TAP-6B');
    expect(r.stdout).toMatch(/3\/0 AWG Cu · 200 A/);
    expect(r.stdout).toContain('one third of the 600 A feeder device');
    expect(r.stdout).toContain('Relative cost, not a price');
    expect(r.stdout.replace(/\s+/g, ' ').trim().endsWith(CAUTION)).toBe(true);
  }, 120_000);
  it('JSON carries the candidates, the cost basis and the caution', async () => {
    const r = await cli(['size', 'samples/cold-storage.json', '--conductor', 'B-LEV', '--format', 'json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout) as { format: string; caution: string; candidates: { config: { size: string }; reasons: string[] }[] };
    expect(j.format).toBe('linewright-sizing');
    expect(j.caution).toBe(CAUTION);
    expect(j.candidates.length).toBeGreaterThan(0);
    expect(j.candidates[0]!.reasons.length).toBeGreaterThan(0);
  }, 120_000);
  it('an unknown conductor id exits 2 naming the option and the id', async () => {
    const r = await cli(['size', 'samples/cold-storage.json', '--conductor', 'NOPE']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--conductor: there is no conductor "NOPE"');
  }, 120_000);
});
