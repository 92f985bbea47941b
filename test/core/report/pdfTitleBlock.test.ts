import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyze, loadProject, SHEET_SIZE_IDS, SHEET_SIZES, type ProjectInput } from '@linewright/core';
import { renderPermitPdf } from '../../../core/src/report/pdf';
import { FOOTER_H, M, SIDE_W } from '../../../core/src/report/pdf/sheet';
import { syntheticRiser } from './fixture';

/**
 * The title block read back from the PDF with poppler's `pdftotext -bbox`: every word of it lies inside
 * the block's box (the right-hand column, SIDE_W wide, ending M from the sheet's right edge and at the
 * top of the footer), however long the project name or the preparer. A 200-character name wraps and is
 * cut with an ellipsis, never runs off the block or the sheet (Linewright's own requirement, issue 7;
 * a title block keeps its entries inside its frame: common drafting practice).
 */
const ROOT = resolve(import.meta.dirname, '../../..');
const dir = mkdtempSync(join(tmpdir(), 'lw-title-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Word { page: number; x0: number; y0: number; x1: number; y1: number; text: string }

function words(pdf: Uint8Array): { words: Word[]; pages: { w: number; h: number }[] } {
  const file = join(dir, `${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, pdf);
  const html = execFileSync('pdftotext', ['-bbox', file, '-'], { encoding: 'utf8', maxBuffer: 64 << 20 });
  const out: Word[] = [];
  const pages: { w: number; h: number }[] = [];
  for (const line of html.split('\n')) {
    const p = /<page width="([\d.]+)" height="([\d.]+)">/.exec(line);
    if (p) pages.push({ w: +p[1]!, h: +p[2]! });
    const m = /<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/.exec(line);
    if (m) out.push({ page: pages.length, x0: +m[1]!, y0: +m[2]!, x1: +m[3]!, y1: +m[4]!, text: m[5]! });
  }
  return { words: out, pages };
}

/**
 * The words of each drawing sheet's title block (from its "PROJECT" heading down to the footer, in
 * the right-hand column or reaching into it), with the box they must keep inside.
 */
function titleBlocks(pdf: Uint8Array): { page: number; box: { x0: number; x1: number; y1: number }; words: Word[] }[] {
  const { words: all, pages } = words(pdf);
  const out: { page: number; box: { x0: number; x1: number; y1: number }; words: Word[] }[] = [];
  pages.forEach((size, i) => {
    const page = i + 1;
    const on = all.filter((w) => w.page === page);
    if (!on.some((w) => w.text === 'PROFESSIONAL')) return;
    const box = { x0: size.w - M - SIDE_W, x1: size.w - M, y1: size.h - M - FOOTER_H };
    const heading = on.find((w) => w.text === 'PROJECT' && Math.abs(w.x0 - (box.x0 + 8)) < 1);
    if (!heading) throw new Error(`page ${page}: no PROJECT heading at the title block's left edge`);
    // Anything from the heading down to the footer's first line (which starts about 11 pt below the
    // block) that reaches past the gap beside the drawing frame.
    const footerTop = Math.min(...on.filter((w) => w.y0 > box.y1).map((w) => w.y0));
    if (!(footerTop > box.y1 + 8)) throw new Error(`page ${page}: text runs below the title block into the footer band (${footerTop})`);
    const inBlock = on.filter((w) => w.y1 > heading.y0 - 0.5 && w.y0 < footerTop - 0.5 && w.x1 > box.x0 - 14);
    out.push({ page, box, words: inBlock });
  });
  return out;
}

function outside(blocks: ReturnType<typeof titleBlocks>): string[] {
  const bad: string[] = [];
  for (const b of blocks)
    for (const w of b.words)
      if (w.x0 < b.box.x0 || w.x1 > b.box.x1 || w.y1 > b.box.y1) bad.push(`p${b.page} "${w.text}" x ${w.x0.toFixed(1)}-${w.x1.toFixed(1)} (box ${b.box.x0}-${b.box.x1}), bottom ${w.y1.toFixed(1)} (box ${b.box.y1})`);
  return bad;
}

const LONG_WORDS = 'Riverside outpatient clinic and administration building, phase two expansion with central plant, parking structure, loading dock and rooftop mechanical yard, '.repeat(2).slice(0, 200);
const ONE_TOKEN = `Name${'x'.repeat(196)}`;
const PREPARED = `Prepared by ${'Ä'.repeat(40)} on behalf of the design-build team of record for the owner, reviewed by the electrical engineer of record and the commissioning agent ${'x'.repeat(20)}`.slice(0, 200);

function sample(name: string, preparedBy: string): Uint8Array {
  const input = JSON.parse(readFileSync(join(ROOT, 'samples/demo-clinic.json'), 'utf8')) as ProjectInput;
  input.project = { ...input.project, name, preparedBy };
  const r = loadProject(input);
  if (!r.ok) throw new Error(r.errors[0]!.message);
  return renderPermitPdf(r.project, analyze(r.project), { generatedAt: '2026-01-01T00:00:00Z' });
}

describe('title block: its text stays inside its box (pdftotext -bbox)', () => {
  it.each([
    ['a 200-character name of words', LONG_WORDS],
    ['a 200-character name with no space to break at', ONE_TOKEN],
  ])('%s and a 200-character prepared-by, ANSI B', (_, name) => {
    // The clinic's riser takes a key plan and detail sheets, each with its title block.
    const blocks = titleBlocks(sample(name, PREPARED));
    expect(blocks.length).toBeGreaterThanOrEqual(1);
    for (const b of blocks) expect(b.words.length).toBeGreaterThan(30);
    expect(outside(blocks)).toEqual([]);
    const text = blocks[0]!.words.map((w) => w.text).join(' ');
    // The name is cut, with an ellipsis saying so, and the preparer's row too.
    expect(text).toContain('…');
    expect(text).toContain(name.slice(0, 4));
    expect(text).toContain('PREPARED BY');
    expect(text).toContain('FOR REVIEW');
  });

  it.each(SHEET_SIZE_IDS.map((id) => [SHEET_SIZES[id].name, id] as const))('on every drawing sheet of a riser that needs detail sheets, %s', (_, sheet) => {
    const { project, report } = syntheticRiser(10, 24);
    project.project.name = LONG_WORDS;
    project.project.preparedBy = PREPARED;
    const blocks = titleBlocks(renderPermitPdf(project, { ...report, projectName: LONG_WORDS }, { generatedAt: '2026-01-01T00:00:00Z', sheet }));
    expect(blocks.length).toBeGreaterThanOrEqual(1);
    expect(outside(blocks)).toEqual([]);
  });

  it('the check itself catches a word outside the box', () => {
    const blocks = titleBlocks(sample('Short name', 'A. Preparer'));
    expect(outside(blocks)).toEqual([]);
    const moved = blocks.map((b) => ({ ...b, box: { ...b.box, x1: b.box.x1 - 150 } }));
    expect(outside(moved).length).toBeGreaterThan(0);
  });
});
