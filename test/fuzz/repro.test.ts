import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../core/src/analyze/analyze';
import { loadProject } from '../../core/src/model/load';
import { toConductorScheduleCsv } from '../../core/src/report/csv';
import { FAR_POSITION, printPositions } from '../../core/src/report/pdf/positions';
import { looksLikeFormula } from '../../core/src/report/safeText';
import { renderText } from '../../core/src/report/text';
import { checkOne } from './checkOne';

/** Every repro of the fuzz and fault probe, kept as a file with its expected outcome (Linewright's own requirements). */
const dir = join(import.meta.dirname, '../fixtures/repro');
const expected = JSON.parse(readFileSync(join(dir, 'expected.json'), 'utf8')) as {
  files: Record<string, { outcome: 'accepted' | 'rejected'; pdf: boolean; why: string }>;
};

describe.each(Object.entries(expected.files))('%s', (file, entry) => {
  const text = readFileSync(join(dir, file), 'utf8');
  it(`is ${entry.outcome} with no internal error: ${entry.why}`, () => {
    const out = checkOne(text, { pdf: entry.pdf });
    expect(out.kind === 'internal' ? `${out.stage}: ${out.error}` : out.kind).toBe(entry.outcome);
  });
});

describe('what the repros must show', () => {
  const load = (file: string) => {
    const r = loadProject(readFileSync(join(dir, file), 'utf8'));
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    return { project: r.project, report: analyze(r.project) };
  };

  it('far positions: the drawing is laid out anew for print, with a note naming the piece', () => {
    const { project } = load('far-position.json');
    const { positions, note } = printPositions(project);
    expect(note).toContain('first: L');
    for (const p of positions.values()) expect(Math.abs(p.x) + Math.abs(p.y)).toBeLessThan(FAR_POSITION);
  });

  it('hostile text: no live formula in the CSV, no raw control character in the text report', () => {
    const { report } = load('hostile-text.json');
    const csv = toConductorScheduleCsv(report);
    for (const cell of csv.split(/,|\r\n/)) expect(looksLikeFormula(cell.replace(/^"/, ''))).toBe(false);
    // eslint-disable-next-line no-control-regex -- the test looks for control characters
    expect(renderText(report)).not.toMatch(/[\x00-\x09\x0b-\x1f\x7f-\x9f]/);
  });
});
