/**
 * Every sample project is analyzed and each conductor's verdict compared with
 * samples/<name>.expected.json. The expected verdicts were worked out by hand
 * from NFPA 70 (Table 310.16, 240.4, 240.6(A), 240.21(B)/(C), 450.3(B),
 * 110.14(C)), with the arithmetic in each entry's `why`; they are not output
 * of the analyzer. When the two disagree, the message shows both and the
 * working, so the person reading can check the arithmetic and the code.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { VERDICTS, analyze, loadProject, type Verdict } from '@linewright/core';

interface Expectation {
  verdict: Verdict;
  /** Compared when present (null included); absent means "not compared". */
  rule?: string | null;
  /** Length the tap or secondary rule counts, in ft; compared when present. */
  tapLengthFt?: number;
  why: string;
}
interface ExpectedFile {
  conductors: Record<string, Expectation>;
}

const samplesDir = fileURLToPath(new URL('../../samples/', import.meta.url));
const sampleNames = readdirSync(samplesDir)
  .filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json')
  .map((f) => f.replace(/\.json$/, ''))
  .sort();

const readJson = (file: string): unknown => JSON.parse(readFileSync(samplesDir + file, 'utf8'));
const expectedFor = (name: string) => readJson(`${name}.expected.json`) as ExpectedFile;

describe('sample set', () => {
  it('has the demo and at least four projects, each with an expected-verdicts file', () => {
    expect(sampleNames).toContain('demo-clinic');
    expect(sampleNames.length).toBeGreaterThanOrEqual(4);
    for (const name of sampleNames) expect(() => expectedFor(name), `${name}.expected.json`).not.toThrow();
  });

  it('exercises every verdict code between them', () => {
    const seen = new Set<string>();
    for (const name of sampleNames) for (const e of Object.values(expectedFor(name).conductors)) seen.add(e.verdict);
    expect(VERDICTS.filter((v) => !seen.has(v)), 'verdicts no sample expects').toEqual([]);
    expect([...seen].filter((v) => !(VERDICTS as readonly string[]).includes(v)), 'unknown verdicts in expected files').toEqual([]);
  });
});

describe.each(sampleNames)('samples/%s.json', (name) => {
  const text = readFileSync(`${samplesDir}${name}.json`, 'utf8');
  const expected = expectedFor(name);

  it('loads without errors', () => {
    const loaded = loadProject(text);
    expect(loaded.ok ? [] : loaded.errors).toEqual([]);
  });

  it('lays out every node with a position, top to bottom from the sources', () => {
    const raw = JSON.parse(text) as { nodes: { id: string; kind: string; position?: { x: number; y: number } }[] };
    expect(raw.nodes.filter((n) => !n.position).map((n) => n.id)).toEqual([]);
    const conductors = (JSON.parse(text) as { conductors: { id: string; from: string; to: string }[] }).conductors;
    const y = new Map(raw.nodes.map((n) => [n.id, n.position!.y]));
    const upward = conductors.filter((c) => y.get(c.to)! <= y.get(c.from)!).map((c) => c.id);
    expect(upward, 'conductors drawn with the load end above the supply end').toEqual([]);
  });

  it('expects a verdict for exactly the conductors in the file', () => {
    const ids = (JSON.parse(text) as { conductors: { id: string }[] }).conductors.map((c) => c.id).sort();
    expect(Object.keys(expected.conductors).sort()).toEqual(ids);
  });

  it('gives every conductor the hand-derived verdict', () => {
    const loaded = loadProject(text);
    if (!loaded.ok) throw new Error(`does not load: ${JSON.stringify(loaded.errors)}`);
    const report = analyze(loaded.project);
    const byId = new Map(report.conductors.map((c) => [c.id as string, c]));
    const diffs: string[] = [];
    for (const [id, want] of Object.entries(expected.conductors)) {
      const got = byId.get(id);
      if (!got) {
        diffs.push(`- ${id}: expected ${want.verdict}, conductor missing from the report`);
        continue;
      }
      const verdictOk = got.verdict === want.verdict;
      const ruleOk = want.rule === undefined || got.rule === want.rule;
      const lengthOk = want.tapLengthFt === undefined || (got.tapLengthFt !== null && Math.abs(got.tapLengthFt - want.tapLengthFt) < 1e-9);
      if (!verdictOk || !ruleOk || !lengthOk) {
        const wantLength = want.tapLengthFt !== undefined ? `, tap length ${want.tapLengthFt} ft` : '';
        const gotLength = want.tapLengthFt !== undefined ? `, tap length ${got.tapLengthFt} ft` : '';
        diffs.push(
          `- ${id}: expected ${want.verdict}${want.rule !== undefined ? ` (rule ${want.rule})` : ''}${wantLength}, ` +
            `got ${got.verdict} (rule ${got.rule})${gotLength}\n    hand working: ${want.why}\n    analyzer says: ${got.summary}`,
        );
      }
    }
    expect(diffs.join('\n'), `${diffs.length} conductor(s) differ from the hand-derived verdicts`).toBe('');
  });
});
