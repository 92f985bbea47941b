import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyze, loadProject, type NodeId, type Project } from '@linewright/core';
import { pdfSafe, renderPermitPdf, unprintableNote, unprintableTexts } from '../../../core/src/report/pdf';
import { CLI_ENTRY } from '../../../scripts/build-cli.mjs';

/**
 * Text the standard PDF fonts cannot print (WinAnsi only: ISO 32000-1 Annex D lists the encoding)
 * prints as "?" and the set says which texts, so nobody reads a "?" as what was typed. Linewright's
 * own requirement (issue 7); the note is read back with pdftotext (poppler-utils).
 */
const ROOT = resolve(import.meta.dirname, '../../..');
const HOSTILE = join(ROOT, 'test/fixtures/repro/hostile-text.json');
const dir = mkdtempSync(join(tmpdir(), 'lw-unprintable-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function load(text: string): Project {
  const r = loadProject(text);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return r.project;
}

/** Every text of page 1, in reading order, with runs of white space made one space. */
function page1(project: Project): string {
  const file = join(dir, `p${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, renderPermitPdf(project, analyze(project), { generatedAt: '2026-01-01T00:00:00Z' }));
  return execFileSync('pdftotext', ['-f', '1', '-l', '1', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
}

const NOTE = 'characters the PDF font cannot show; shown as ?; the JSON/CSV reports keep them';

describe('pdfSafe: one "?" per character a reader sees, accents composed', () => {
  it.each([
    ['日本', '??'],
    ['load 😀', 'load ?'],
    ['👨‍👩‍👧 family (one emoji of three joined)', '? family (one emoji of three joined)'],
    ['🇨🇦 flag (two regional indicators)', '? flag (two regional indicators)'],
    ['Cafe\u0301 (e and a combining acute)', 'Café (e and a combining acute)'],
    ['Щит', '???'],
    ['PANEL-1 480Y/277 V', 'PANEL-1 480Y/277 V'],
  ])('pdfSafe(%j) = %j', (input, expected) => {
    expect(pdfSafe(input)).toBe(expected);
  });
});

describe('the unprintable-text note', () => {
  it('names each text by element and field; an unprintable id by its place in the file', () => {
    const project = load(readFileSync(HOSTILE, 'utf8'));
    // L's label has CJK and emoji; C2's label a terminal escape, a newline and a right-to-left override.
    expect(unprintableTexts(project)).toEqual(['node L label', 'conductor C2 label']);
    project.nodes[0]!.id = '配電' as NodeId;
    project.project.name = 'Ωmega works';
    expect(unprintableTexts(project)).toEqual(['node #1 id', 'node L label', 'conductor C2 label']);
    expect(unprintableNote(project)).toBe(`3 labels contain ${NOTE}: node #1 id, node L label, conductor C2 label.`);
  });

  it('says nothing when every text prints as typed (accented Latin-1 and WinAnsi punctuation print)', () => {
    const project = load(readFileSync(HOSTILE, 'utf8'));
    project.nodes[2]!.label = 'Müller & Søn — “load” №'.replace('№', 'No.');
    project.conductors[1]!.label = 'feeder ≥ 100 A';
    expect(unprintableNote(project)).toBeNull();
  });

  it('counts past twelve names as "and n more"', () => {
    const project = load(readFileSync(HOSTILE, 'utf8'));
    for (let i = 0; i < 20; i++) project.nodes.push({ ...project.nodes[2]!, id: `L${i}` as NodeId });
    const note = unprintableNote(project)!;
    expect(note).toMatch(/^22 labels contain /);
    expect(note).toContain('node L10 label and 10 more.');
  });

  it('prints on the first sheet, read back with pdftotext', () => {
    const text = page1(load(readFileSync(HOSTILE, 'utf8')));
    expect(text).toContain(`2 labels contain ${NOTE}: node L label, conductor C2 label.`);
    // The label itself prints with one "?" per character it cannot show.
    expect(text).toContain('??? ?? load');
  });

  it('is absent from a sheet whose texts all print', () => {
    const text = page1(load(readFileSync(join(ROOT, 'samples/demo-clinic.json'), 'utf8')));
    expect(text).toContain('One-line diagram');
    expect(text).not.toContain(NOTE);
  });

  it('the CLI says it on stderr when it writes the PDF', () => {
    const out = join(dir, 'cli.pdf');
    const r = spawnSync(process.execPath, [CLI_ENTRY, 'check', HOSTILE, '--pdf', out], { cwd: ROOT, encoding: 'utf8' });
    expect(r.stderr).toContain(`linewright: permit-set PDF: 2 labels contain ${NOTE}: node L label, conductor C2 label.`);
    expect(readFileSync(out).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });
});
