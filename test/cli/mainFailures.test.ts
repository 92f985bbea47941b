import { mkdtempSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { diagram } from '../helpers/builder';

/**
 * The exit-code contract of `linewright --help` (0 clean, 1 violations, 2 bad input or arguments,
 * 3 internal failure), run in-process so a renderer can be made to fail. Linewright's own contract.
 */
vi.mock('../../core/src/report/pdf', () => ({
  renderPermitPdf: () => {
    throw new Error('renderer exploded');
  },
}));

const { main, EXIT_BAD_INPUT, EXIT_INTERNAL } = await import('../../core/src/cli/main');

const dir = mkdtempSync(join(tmpdir(), 'lw-main-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function capture() {
  let stderr = '';
  let stdout = '';
  vi.spyOn(process.stderr, 'write').mockImplementation((s) => ((stderr += String(s)), true));
  vi.spyOn(process.stdout, 'write').mockImplementation((s) => ((stdout += String(s)), true));
  return { err: () => stderr, out: () => stdout };
}
afterEach(() => vi.restoreAllMocks());

const project = diagram().utility(480).breaker(200).conductor({ id: 'C1', size: '3/0', lengthFt: 20 }).breaker(200).build();

describe('linewright check: exit codes of failures', () => {
  it('a PDF renderer that throws is an internal error (exit 3), not "cannot write FILE" (exit 2), and writes no PDF', async () => {
    const file = join(dir, 'p.json');
    writeFileSync(file, JSON.stringify(project));
    const pdf = join(dir, 'out.pdf');
    const io = capture();
    const code = await main(['check', file, '--pdf', pdf]);
    expect(code).toBe(EXIT_INTERNAL);
    expect(io.err()).toContain('internal error: renderer exploded');
    expect(io.err()).not.toContain('cannot write');
    expect(existsSync(pdf)).toBe(false);
  });

  it('5 000 nested arrays under an unknown field are bad input (exit 2) naming the path, not a stack overflow (exit 3)', async () => {
    const file = join(dir, 'deep.json');
    writeFileSync(file, JSON.stringify(project).replace(/^\{/, `{"notes":${'['.repeat(5000)}${']'.repeat(5000)},`));
    const io = capture();
    const code = await main(['check', file]);
    expect(code).toBe(EXIT_BAD_INPUT);
    expect(io.err()).toMatch(/^notes\[0\]\[0\].*: Nested more than \d+ levels deep/m);
  });

  it('an id holding an ESC sequence reaches stderr made inert', async () => {
    const bad = structuredClone(project) as { conductors: { from: string }[] };
    bad.conductors[0]!.from = 'X\x1b[8m';
    const file = join(dir, 'esc.json');
    writeFileSync(file, JSON.stringify(bad));
    const io = capture();
    expect(await main(['check', file])).toBe(EXIT_BAD_INPUT);
    expect(io.err()).toContain('X\\x1b[8m');
    expect(io.err()).not.toContain('\x1b');
  });
});
