import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { CAUTION, PROJECT_VERSION } from '@linewright/core';
import { fixtureInput } from '../core/report/fixture';
import { cli, ROOT, run } from '../helpers/cli';

/**
 * End to end: the CLI as a user runs it, in a child process, on temporary files. The exit codes
 * and messages are Linewright's own documented contract (linewright --help).
 */
const dir = mkdtempSync(join(tmpdir(), 'lw-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Most cases run the built command with node directly (one process instead of npx's three); the
// `npx tsx` and `npx linewright` forms a user types are each run once below.

function temp(name: string, content: string): string {
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
}

/** A small invented building, fully protected: 200 A breaker on 3/0 Cu (200 A at 75 °C, NFPA 70-2023 Table 310.16). */
const clean = {
  format: 'linewright-project',
  version: PROJECT_VERSION,
  project: { name: 'Quiet Row workshop' },
  nodes: [
    { id: 'U', kind: 'utility', voltsLL: 480, phases: 3 },
    { id: 'CB', kind: 'breaker', ratingA: 200 },
    { id: 'P', kind: 'bus', busType: 'panelboard', busRatingA: 225 },
    { id: 'L', kind: 'load', currentA: 120 },
  ],
  conductors: [
    { id: 'SVC', from: 'U', to: 'CB', size: '3/0', lengthFt: 20 },
    { id: 'F1', from: 'CB', to: 'P', size: '3/0', lengthFt: 60 },
    { id: 'F2', from: 'P', to: 'L', size: '3/0', lengthFt: 10 },
  ],
};
/** The same with a 600 A breaker on 3/0 Cu (200 A) for 60 ft: 600 A exceeds 200 A and no tap rule reaches 60 ft (240.4, 240.21(B)). */
const violating = structuredClone(clean);
violating.nodes[1] = { id: 'CB', kind: 'breaker', ratingA: 600 };

describe.concurrent('linewright CLI', { timeout: 60_000 }, () => {
  it('exits 0 on a clean project and prints the text report ending with the caution', async () => {
    const r = await cli(['check', temp('clean.json', JSON.stringify(clean))]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('Linewright check: Quiet Row workshop');
    expect(r.stdout.replace(/\s+/g, ' ').trim().endsWith(CAUTION)).toBe(true);
  });

  it('exits 1 when violations are found', async () => {
    const r = await cli(['check', temp('violating.json', JSON.stringify(violating))]);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/violations: [1-9]/);
  });

  it('exits 2 on a file that is not JSON, naming the problem without a stack trace', async () => {
    const r = await cli(['check', temp('broken.json', '{ "format": "linewright-project", ')]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/^\(file\): .*not valid JSON/m);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it('exits 2 on a schema-broken file, printing each error as "path: message"', async () => {
    const bad = structuredClone(clean) as { conductors: Record<string, unknown>[] };
    bad.conductors[1]!.size = '3/7';
    bad.conductors[2]!.lengthFt = -4;
    const r = await cli(['check', temp('schema.json', JSON.stringify(bad))]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^conductors\[1\]\.size: /m);
    expect(r.stderr).toMatch(/^conductors\[2\]\.lengthFt: /m);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it('exits 2 on a missing file', async () => {
    const r = await cli(['check', join(dir, 'nope.json')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('no such file');
  });

  it('exits 2 on a bad flag, naming it, with the usage', async () => {
    const r = await cli(['check', 'x.json', '--frobnicate']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('unknown option --frobnicate');
    expect(r.stderr).toContain('Usage: linewright check FILE');
  });

  it('runs as `npx tsx core/src/cli/main.ts` and as `npx linewright` (the built file `bin` names)', async () => {
    const viaTsx = await run('npx', ['tsx', 'core/src/cli/main.ts'], ['check', temp('t.json', JSON.stringify(violating))]);
    expect(viaTsx.code).toBe(1);
    const viaBin = await run('npx', ['linewright'], ['check', temp('b.json', JSON.stringify(clean))]);
    expect(viaBin.stderr).toBe('');
    expect(viaBin.code).toBe(0);
    expect((await run('npx', ['linewright'], ['--bogus'])).code).toBe(2);
  });

  it('--help and --version exit 0; the help ends with the caution', async () => {
    const help = await cli(['--help']);
    expect(help.code).toBe(0);
    expect(help.stdout.replace(/\s+/g, ' ').trim().endsWith(CAUTION)).toBe(true);
    expect((await cli(['--version'])).stdout).toMatch(/^Linewright \d+\.\d+\.\d+\n$/);
  });

  it('--format json|sarif|csv print machine output; the caution goes inside or to stderr', async () => {
    const file = temp('v.json', JSON.stringify(violating));
    const json = await cli(['check', file, '--format', 'json']);
    expect(json.code).toBe(1);
    expect(JSON.parse(json.stdout)).toMatchObject({ tool: 'Linewright', caution: CAUTION, edition: 2023, detail: 'summary' });
    // Compact by default: one line; the rules' full working only with --detail full.
    expect(json.stdout.trimEnd()).not.toContain('\n');
    expect(JSON.parse(json.stdout).conductors[0]).not.toHaveProperty('tried');
    const full = JSON.parse((await cli(['check', file, '--format', 'json', '--detail', 'full'])).stdout);
    expect(full.detail).toBe('full');
    expect(full.conductors[0].tried.length).toBeGreaterThan(0);
    const sarif = JSON.parse((await cli(['check', file, '--format=sarif'])).stdout);
    expect(sarif.version).toBe('2.1.0');
    expect(sarif.runs[0].results.some((r: { level: string }) => r.level === 'error')).toBe(true);
    // Outside the working directory the artifact is a file: URI; inside it, a relative reference.
    expect(sarif.runs[0].artifacts[0].location.uri).toMatch(/^file:\/\/\/.*v\.json$/);
    const inRepo = JSON.parse((await cli(['check', 'samples/demo-clinic.json', '--format', 'sarif'])).stdout);
    expect(inRepo.runs[0].artifacts[0].location.uri).toBe('samples/demo-clinic.json');
    const csv = await cli(['check', file, '--format', 'csv']);
    expect(csv.stdout.split('\r\n')[0]).toMatch(/^id,label,from,to,/);
    expect(csv.stderr).toContain(CAUTION);
  });

  it('a conductor without a size: exit 0 (no violation), that conductor incomplete and asking for its size in every format; the others as with the size', async () => {
    // Issue 6, item 13. F2 (3/0 Cu, 200 A ≥ 120 A load, NFPA 70-2023 Table 310.16) with its size left out.
    const unsized = structuredClone(clean) as { conductors: Record<string, unknown>[] };
    delete unsized.conductors[2]!.size;
    const file = temp('unsized.json', JSON.stringify(unsized));
    const base = JSON.parse((await cli(['check', temp('clean-again.json', JSON.stringify(clean)), '--format', 'json'])).stdout) as { conductors: { id: string; verdict: string }[] };
    const json = await cli(['check', file, '--format', 'json']);
    expect(json.code).toBe(0);
    const report = JSON.parse(json.stdout) as { conductors: { id: string; verdict: string; size: string | null; ampacityA: number | null; findingIds: string[] }[]; findings: { id: string; severity: string; message: string }[] };
    const f2 = report.conductors.find((c) => c.id === 'F2')!;
    expect(f2).toMatchObject({ verdict: 'incomplete', size: null, ampacityA: null });
    expect(report.findings.filter((f) => f2.findingIds.includes(f.id)).map((f) => f.message).join(' ')).toMatch(/needs the size.*field size/);
    expect(report.findings.filter((f) => f.severity === 'violation')).toEqual([]);
    for (const c of report.conductors) if (c.id !== 'F2') expect(c.verdict, c.id).toBe(base.conductors.find((b) => b.id === c.id)!.verdict);
    const text = await cli(['check', file]);
    expect(text.code).toBe(0);
    expect(text.stdout).toContain('size unknown');
    expect(text.stdout).not.toMatch(/NaN|undefined/);
    const sarif = JSON.parse((await cli(['check', file, '--format', 'sarif'])).stdout);
    expect(JSON.stringify(sarif.runs[0].results)).toContain('needs the size');
    const csv = await cli(['check', file, '--format', 'csv']);
    expect(csv.stdout.split('\r\n').find((l) => l.startsWith('F2,'))).toContain('size unknown');
    const sub = mkdtempSync(join(dir, 'unsized-'));
    const pdf = await cli(['check', file, '--pdf', join(sub, 'permit.pdf')]);
    expect(pdf.code).toBe(0);
    expect(readFileSync(join(sub, 'permit.pdf')).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('writes only what is asked: --out replaces stdout, --pdf adds a PDF', async () => {
    const sub = mkdtempSync(join(dir, 'out-'));
    const file = join(sub, 'c.json');
    writeFileSync(file, JSON.stringify(clean));
    expect((await cli(['check', file])).code).toBe(0);
    expect(readdirSync(sub)).toEqual(['c.json']);
    const r = await cli(['check', file, '--format', 'csv', '--out', join(sub, 'schedule.csv'), '--pdf', join(sub, 'permit.pdf')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toBe('');
    expect(readFileSync(join(sub, 'schedule.csv'), 'utf8')).toMatch(/^id,label/);
    expect(readFileSync(join(sub, 'permit.pdf')).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(readdirSync(sub).sort()).toEqual(['c.json', 'permit.pdf', 'schedule.csv']);
  });

  it('refuses to write a report or PDF over the project file (exit 2), leaving it intact', async () => {
    const file = temp('keep.json', JSON.stringify(clean));
    for (const flag of ['--pdf', '--out']) {
      const r = await cli(['check', file, flag, file]);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain('is the project file itself');
      expect(JSON.parse(readFileSync(file, 'utf8'))).toEqual(clean);
    }
  });

  it('--edition overrides the project edition', async () => {
    const r = await cli(['check', temp('e.json', JSON.stringify(clean)), '--format', 'json', '--edition', '2020']);
    expect(JSON.parse(r.stdout).edition).toBe(2020);
  });

  it('reads the project from stdin with "-"', async () => {
    const r = await cli(['check', '-', '--format', 'json'], JSON.stringify(fixtureInput));
    expect([0, 1]).toContain(r.code);
    expect(JSON.parse(r.stdout).projectName).toBe('Harbor Lane Test Shop');
  });
});

const SAMPLES = existsSync(join(ROOT, 'samples'))
  ? readdirSync(join(ROOT, 'samples')).filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json')
  : [];

describe.skipIf(SAMPLES.length === 0).concurrent('text report of each sample (one snapshot per sample)', { timeout: 60_000 }, () => {
  it.each(SAMPLES)('%s', async (sample) => {
    const r = await cli(['check', `samples/${sample}`]);
    expect([0, 1]).toContain(r.code);
    await expect(r.stdout).toMatchFileSnapshot(`__snapshots__/${sample.replace(/\.json$/, '')}.txt`);
  });
});
