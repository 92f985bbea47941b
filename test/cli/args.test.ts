import { describe, expect, it } from 'vitest';
import { CAUTION } from '@linewright/core';
import { USAGE, parseArgs } from '../../core/src/cli/args';

// The command line is our own design (no outside source): these cases pin its documented behaviour.
describe('parseArgs', () => {
  it('check FILE defaults to the text format and writes nothing else', () => {
    expect(parseArgs(['check', 'samples/a.json'])).toEqual({ command: 'check', file: 'samples/a.json', format: 'text', pdf: null, sheet: 'ansi-b', out: null, edition: null, color: false, detail: 'summary', failOnAhj: false });
  });

  it.each([
    [['check', 'a.json', '--format', 'json'], { format: 'json' }],
    [['check', '--format=sarif', 'a.json'], { format: 'sarif' }],
    [['check', 'a.json', '--format', 'csv', '--out', 'r.csv'], { format: 'csv', out: 'r.csv' }],
    [['check', 'a.json', '--pdf', 'out.pdf'], { pdf: 'out.pdf' }],
    [['check', 'a.json', '--pdf', 'out.pdf', '--sheet', 'arch-d'], { pdf: 'out.pdf', sheet: 'arch-d' }],
    [['check', 'a.json', '--edition', '2020'], { edition: 2020 }],
    [['check', 'a.json', '--edition=2023'], { edition: 2023 }],
    [['check', 'a.json', '--color'], { color: true }],
    [['check', 'a.json', '--format', 'json', '--detail', 'full'], { format: 'json', detail: 'full' }],
    [['check', 'a.json', '--detail=summary'], { detail: 'summary' }],
    [['check', '-'], { file: '-' }],
    [['check', '--', '--odd-name.json'], { file: '--odd-name.json' }],
  ])('%j', (argv, expected) => {
    expect(parseArgs(argv)).toMatchObject({ command: 'check', ...expected });
  });

  it.each([
    [['--help'], 'help'],
    [['-h'], 'help'],
    [['check', 'a.json', '--help'], 'help'],
    [['--version'], 'version'],
    [['-V'], 'version'],
  ])('%j is %s', (argv, command) => {
    expect(parseArgs(argv)).toEqual({ command });
  });

  it.each([
    [[], 'no command'],
    [['lint', 'a.json'], 'unknown command "lint"'],
    [['check'], 'needs a project file'],
    [['check', 'a.json', 'b.json'], 'unexpected argument "b.json"'],
    [['check', 'a.json', '--bogus'], 'unknown option --bogus'],
    [['check', 'a.json', '--sheet', 'a4'], 'option --sheet must be one of ansi-b, ansi-d, arch-d (got "a4")'],
    [['check', 'a.json', '--bogus=1'], 'unknown option --bogus'],
    [['check', 'a.json', '-x'], 'unknown option -x'],
    [['check', 'a.json', '--format'], 'option --format needs a value'],
    [['check', 'a.json', '--format', '--pdf'], 'option --format needs a value'],
    [['check', 'a.json', '--format='], 'option --format needs a value'],
    [['check', 'a.json', '--format', 'xml'], 'option --format must be one of text, json, sarif, csv (got "xml")'],
    [['check', 'a.json', '--edition', '2017'], 'option --edition must be 2020 or 2023 (got "2017")'],
    [['check', 'a.json', '--out', 'a', '--out', 'b'], 'option --out given twice'],
    [['check', 'a.json', '--detail', 'all'], 'option --detail must be summary or full (got "all")'],
  ])('%j is refused naming the problem', (argv, message) => {
    const parsed = parseArgs(argv);
    expect(parsed.command).toBe('error');
    expect(parsed.command === 'error' && parsed.message).toContain(message);
  });

  it('the help names every option and exit code and ends with the caution', () => {
    for (const flag of ['--format', '--out', '--pdf', '--edition', '--detail', '--color', '--help', '--version']) expect(USAGE).toContain(flag);
    for (const code of ['0  ', '1  ', '2  ', '3  ']) expect(USAGE).toContain(`  ${code}`);
    expect(USAGE.replace(/\s+/g, ' ').trim().endsWith(CAUTION)).toBe(true);
  });
});
