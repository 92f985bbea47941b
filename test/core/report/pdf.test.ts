import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { CAUTION } from '@linewright/core';
import { pdfSafe, renderPermitPdf } from '../../../core/src/report/pdf';
import { fixtureProject, fixtureReport, syntheticRiser } from './fixture';

function has(tool: string): boolean {
  try {
    execFileSync('sh', ['-c', `command -v ${tool}`], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

const HAS_PDFTOPPM = has('pdftoppm');
const HAS_PDFTOTEXT = has('pdftotext');
if (!HAS_PDFTOPPM) console.warn('pdf.test: pdftoppm not found (apt-get install poppler-utils); the page-1 render check is skipped');
if (!HAS_PDFTOTEXT) console.warn('pdf.test: pdftotext not found (apt-get install poppler-utils); the text checks are skipped');

const dir = mkdtempSync(join(tmpdir(), 'lw-pdf-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const GENERATED = '2026-12-01T22:00:00Z';
const bytes = renderPermitPdf(fixtureProject, fixtureReport, { generatedAt: GENERATED });
const file = join(dir, 'fixture.pdf');
writeFileSync(file, bytes);
const latin1 = Buffer.from(bytes).toString('latin1');

/** Page objects: `/Type /Page` not followed by `s` (ISO 32000-1 §7.7.3.3, page objects). */
function pageCount(pdf: string): number {
  return (pdf.match(/\/Type\s*\/Page(?![a-z])/g) ?? []).length;
}

function pageText(path: string, page: number): string {
  return execFileSync('pdftotext', ['-layout', '-f', String(page), '-l', String(page), path, '-'], { encoding: 'utf8' });
}

describe('renderPermitPdf', () => {
  it('is a PDF file: header %PDF- and trailer %%EOF (ISO 32000-1 §7.5.2, §7.5.5)', () => {
    expect(latin1.startsWith('%PDF-')).toBe(true);
    expect(latin1.trimEnd().endsWith('%%EOF')).toBe(true);
  });

  it('has the drawing, findings, schedule, conductor-and-raceway schedule and working + assumptions pages: 5 for the fixture', () => {
    expect(pageCount(latin1)).toBe(5);
  });

  it('uses an ANSI B landscape sheet, 17 × 11 in = 1224 × 792 pt (ASME Y14.1 sheet B)', () => {
    expect(latin1).toMatch(/\/MediaBox \[0 0 1224\.?0* 792\.?0*\]/);
  });

  it.skipIf(!HAS_PDFTOTEXT)('page 1 carries the title block, the verdict words, the callout numbers and the caution (needs pdftotext)', () => {
    const t = pageText(file, 1).replace(/\s+/g, ' ');
    for (const s of ['One-line diagram: Harbor Lane Test Shop', 'FOR REVIEW — NOT A VERDICT OF ACCEPTANCE', 'NFPA 70 (NEC) 2023', '2026-12-01 22:00:00Z', 'tap: 25 ft (240.21(B)(2))', 'unprotected', 'C4: 4 AWG Cu, 30 ft', 'Legend', 'R. Example, PE']) {
      expect(t).toContain(s);
    }
    expect(t).toContain(CAUTION);
    expect(t).not.toMatch(/approved/i);
  });

  it.skipIf(!HAS_PDFTOTEXT)('every page has the caution and "Page n of N" in its footer (needs pdftotext)', () => {
    for (let p = 1; p <= 5; p++) {
      const t = pageText(file, p).replace(/\s+/g, ' ');
      expect(t).toContain(`Page ${p} of 5`);
      expect(t).toContain(CAUTION);
    }
  });

  it.skipIf(!HAS_PDFTOTEXT)('lists findings with citations and fixes, then the schedule and the assumptions (needs pdftotext)', () => {
    const findings = pageText(file, 2).replace(/\s+/g, ' ');
    expect(findings).toContain('NEC 2023 240.21(B)(2)');
    expect(findings).toContain('Fix: add an OCPD of at most 85 A at the tap point');
    const schedule = pageText(file, 3).replace(/\s+/g, ' ');
    expect(schedule).toContain('Conductor schedule');
    for (const c of fixtureReport.conductors) expect(schedule).toContain(c.id);
    expect(pageText(file, 5)).toContain('Terminations are rated 75 °C');
  });

  it.skipIf(!HAS_PDFTOTEXT)('the conductor and raceway schedule gives each run its EGC (Table 250.122) and raceway trade size (Chapter 9) (needs pdftotext)', () => {
    const t = pageText(file, 4).replace(/\s+/g, ' ');
    expect(t).toContain('Conductor and raceway schedule');
    for (const c of fixtureReport.conductors) expect(t).toContain(c.id);
    expect(t).toContain('Table 250.122');
    expect(t).toMatch(/\d × [\d/-]+" EMT/);
  });

  it.skipIf(!HAS_PDFTOPPM)('page 1 renders with pdftoppm and has ink in the drawing area (skipped when poppler-utils is missing)', () => {
    execFileSync('pdftoppm', ['-gray', '-r', '30', '-f', '1', '-l', '1', '-singlefile', file, join(dir, 'p1')]);
    const pgm = readFileSync(join(dir, 'p1.pgm'));
    // Binary PGM (netpbm): "P5\n<w> <h>\n<max>\n" then one byte per pixel.
    const header = pgm.subarray(0, 40).toString('latin1').match(/^P5\s+(\d+)\s+(\d+)\s+(\d+)\s/)!;
    const [w, h] = [Number(header[1]), Number(header[2])];
    expect([w, h]).toEqual([510, 330]); // 17 × 11 in at 30 dpi
    const pixels = pgm.subarray(header[0].length);
    let dark = 0;
    // Left two thirds of the sheet, below the title: the drawing.
    for (let y = 40; y < h - 40; y++) for (let x = 20; x < (w * 2) / 3; x++) if (pixels[y * w + x]! < 128) dark++;
    expect(dark).toBeGreaterThan(500);
  });

  it('draws a 500-element riser without positions and paginates its schedule', () => {
    const { project, report } = syntheticRiser(10, 24); // 3 + 10 × (2 + 48) = 503 nodes, 251 conductors
    expect(project.nodes.length + project.conductors.length).toBeGreaterThan(500);
    const big = renderPermitPdf(project, report, { generatedAt: GENERATED });
    const text = Buffer.from(big).toString('latin1');
    expect(text.startsWith('%PDF-')).toBe(true);
    // 1 overview, detail sheets, findings, at least 4 schedule pages of 251 rows, working pages.
    expect(pageCount(text)).toBeGreaterThanOrEqual(8);
    if (HAS_PDFTOTEXT) {
      const path = join(dir, 'big.pdf');
      writeFileSync(path, big);
      // 240 branch circuits side by side do not fit one sheet legibly: detail sheets follow the overview.
      expect(pageText(path, 1)).toContain('detail sheets D1-');
      expect(pageText(path, 2).replace(/\s+/g, ' ')).toContain('detail sheet D1');
      expect(pageText(path, 2)).toMatch(/CB0\.0: 12 AWG Cu, 40 ft/);
    }
  });

  it('works with no positions, no conductors and no findings', () => {
    const { project, report } = syntheticRiser(0, 0);
    expect(pageCount(Buffer.from(renderPermitPdf(project, { ...report, findings: [] })).toString('latin1'))).toBeGreaterThanOrEqual(3);
  });

  it.each([
    ['I ≥ R/3, R ≤ 800 A', 'I at least R/3, R at most 800 A'],
    ['√3 × V', 'sqrt 3 × V'],
    ['5 Ω', '5 ohm'],
    ['a — b – c “q” …', 'a — b – c “q” …'],
    ['75 °C, 10 µs', '75 °C, 10 µs'],
    ['日本', '??'],
  ])('pdfSafe(%j) keeps WinAnsi text printable', (input, expected) => {
    expect(pdfSafe(input)).toBe(expected);
  });
});
