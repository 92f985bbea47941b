import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyze, loadProject, type ProjectInput } from '@linewright/core';
import { renderPermitPdf } from '../../../core/src/report/pdf';
import { BODY_BOTTOM, M, Sheet } from '../../../core/src/report/pdf/sheet';

/**
 * Large sets stay bounded in work without losing content (Linewright's own requirement, issue 7): the
 * working of conductors that read the same word for word prints once under all their ids, and text
 * flowed across pages loses no line. Times are printed by `npm run bench:pdf`, never asserted here.
 */
const ROOT = resolve(import.meta.dirname, '../../..');
const dir = mkdtempSync(join(tmpdir(), 'lw-pdf-large-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** 600 A breaker feeding a 100 A load over `copies` + 1 identical 350 kcmil conductors, 50 ft each. */
function parallelCopies(copies: number): ProjectInput {
  const base = JSON.parse(readFileSync(join(ROOT, 'test/fixtures/repro/parallel-4000.json'), 'utf8')) as ProjectInput;
  const [c1, c2] = base.conductors;
  return { ...base, conductors: [c1!, c2!, ...Array.from({ length: copies }, (_, i) => ({ ...c2!, id: `PC${i}` }))] };
}

function pdfText(input: ProjectInput): string {
  const r = loadProject(input);
  if (!r.ok) throw new Error(r.errors[0]!.message);
  const file = join(dir, `${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, renderPermitPdf(r.project, analyze(r.project), { generatedAt: '2026-01-01T00:00:00Z' }));
  return execFileSync('pdftotext', [file, '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
}

describe('working pages of many identical conductors', () => {
  it('print the working once, under every id, when conductors read the same word for word', () => {
    const text = pdfText(parallelCopies(40));
    const working = text.slice(text.indexOf('Working for taps, secondaries and flagged conductors'));
    // C2 and its 40 copies: 350 kcmil Cu on a 600 A breaker (NFPA 70-2023 Table 310.16: 310 A at 75 °C).
    expect(working).toMatch(/41 conductors with the same working: /);
    const ids = working.replace(/\s+/g, ' ');
    expect(ids).toContain(['C2', ...Array.from({ length: 40 }, (_, i) => `PC${i}`)].join(', '));
    expect(ids).not.toContain('C2 (C2)');
    // The ampacity working appears once for the group, not 41 times.
    expect(working.match(/Ampacity: /g)?.length).toBeLessThanOrEqual(2);
  });

  it('Sheet.flow: 300 lines run onto the following pages, in order, none lost, none into the footer', () => {
    const sh = new Sheet();
    sh.y = BODY_BOTTOM - 100;
    sh.font(7.5, 'normal');
    const lines = Array.from({ length: 300 }, (_, i) => `flowed line ${i}`);
    sh.flow(lines, M, { lineH: 9.5, need: 10, ascent: 7.5 });
    // 10 lines fit above the footer on page 1; 72 a page after that (M to BODY_BOTTOM at 9.5 pt).
    const perPage = Math.floor((BODY_BOTTOM - M - 10) / 9.5) + 1;
    expect(sh.doc.getNumberOfPages()).toBe(1 + Math.ceil((300 - 10) / perPage));
    expect(sh.y).toBeLessThanOrEqual(BODY_BOTTOM);
    const file = join(dir, 'flow.pdf');
    writeFileSync(file, new Uint8Array(sh.doc.output('arraybuffer')));
    const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
    const got = text.split('\n').map((l) => l.trim()).filter((l) => l.startsWith('flowed line'));
    expect(got).toEqual(lines);
    // pdftotext -bbox: every line's baseline lies above the footer.
    const bbox = execFileSync('pdftotext', ['-bbox', file, '-'], { encoding: 'utf8' });
    const yMax = [...bbox.matchAll(/yMax="([\d.]+)">flowed/g)].map((m) => Number(m[1]));
    expect(yMax.length).toBe(300);
    expect(Math.max(...yMax)).toBeLessThanOrEqual(BODY_BOTTOM);
  });
});
