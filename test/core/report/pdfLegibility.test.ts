import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyze, loadProject, renderPermitPdf, SHEET_SIZE_IDS, SHEET_SIZES } from '@linewright/core';

/**
 * The permit PDF read back the way a reader gets it: words and their boxes extracted by poppler's
 * `pdftotext -bbox` (installed with the test tools, README). Helvetica's box is 0.926 of its size
 * (ascent 718 + descent 207 per 1000 units, the font's AFM), so a 6 pt word is 5.56 pt tall.
 */
// Every sample, and a project under review (comment pins on the drawing, a revision block in the title column).
const SAMPLES = ['demo-clinic', 'mixed-use', 'bottling-hall', 'cold-storage', 'motor-shop', 'service-yard', 'review/round-2'];
const dir = mkdtempSync(join(tmpdir(), 'lw-pdf-'));
const BOX_PER_PT = 0.926;

interface Word { page: number; x: number; y: number; w: number; h: number; text: string }

function words(pdf: Uint8Array, name: string): Word[] {
  const file = join(dir, `${name.replace(/\//g, '-')}.pdf`);
  writeFileSync(file, pdf);
  const html = execFileSync('pdftotext', ['-bbox', file, '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
  const out: Word[] = [];
  let page = 0;
  for (const line of html.split('\n')) {
    if (line.includes('<page ')) page++;
    const m = /<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/.exec(line);
    if (m) out.push({ page, x: +m[1]!, y: +m[2]!, w: +m[3]! - +m[1]!, h: +m[4]! - +m[2]!, text: m[5]! });
  }
  return out;
}

/**
 * Text size of a word in pt. A word set vertically (a match line) is much taller than wide and has its
 * size across its box's width; a word of one or two characters may be either way, so the larger side counts.
 */
function sizeOf(w: Word): number {
  const across = w.text.length <= 2 ? Math.max(w.h, w.w) : w.h > 1.8 * w.w ? w.w : w.h;
  return across / BOX_PER_PT;
}

function pdfOf(sample: string, sheet: (typeof SHEET_SIZE_IDS)[number]): Uint8Array {
  const r = loadProject(readFileSync(new URL(`../../../samples/${sample}.json`, import.meta.url), 'utf8'));
  if (!r.ok) throw new Error(`${sample} does not load`);
  return renderPermitPdf(r.project, analyze(r.project), { generatedAt: '2026-01-05T10:00:00Z', sheet });
}

describe('permit PDF: text never under 6 pt (legible on an ANSI B print, common practice)', () => {
  for (const sheet of SHEET_SIZE_IDS) {
    it.each(SAMPLES)(`%s on ${SHEET_SIZES[sheet].name}`, (sample) => {
      const ws = words(pdfOf(sample, sheet), `${sample}-${sheet}`);
      expect(ws.length).toBeGreaterThan(200);
      const small = ws.filter((w) => sizeOf(w) < 6 - 0.05).map((w) => `p${w.page} "${w.text}" ${sizeOf(w).toFixed(2)} pt`);
      expect(small).toEqual([]);
    });
  }
});

describe('permit PDF drawing sheets: no word printed over another', () => {
  it.each(SAMPLES)('%s (ANSI B)', (sample) => {
    const pdf = pdfOf(sample, 'ansi-b');
    const ws = words(pdf, `${sample}-overlap`);
    const drawingPages = new Set(ws.filter((w) => w.text === 'One-line').map((w) => w.page));
    expect(drawingPages.size).toBeGreaterThan(0);
    const clashes: string[] = [];
    for (const p of drawingPages) {
      const on = ws.filter((w) => w.page === p);
      for (let i = 0; i < on.length; i++)
        for (let j = i + 1; j < on.length; j++) {
          const a = on[i]!;
          const b = on[j]!;
          const ox = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x);
          const oy = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y);
          if (ox > 0.5 && oy > 0.5) clashes.push(`p${p} "${a.text}" / "${b.text}"`);
        }
    }
    expect(clashes).toEqual([]);
  });
});
