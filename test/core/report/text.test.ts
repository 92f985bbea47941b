import { describe, expect, it } from 'vitest';
import { CAUTION } from '@linewright/core';
import { renderText } from '../../../core/src/report/text';
import { VERDICT_WORDS } from '../../../core/src/report/format';
import { cleanReport, fixtureReport } from './fixture';

const text = renderText(fixtureReport);
const lines = text.split('\n');

describe('renderText', () => {
  it('has a header, one table row per conductor, and rows that line up in fixed columns', () => {
    const head = lines.findIndex((l) => l.startsWith('Conductor  '));
    expect(head).toBeGreaterThan(0);
    const rows = lines.slice(head + 2, head + 2 + fixtureReport.conductors.length);
    expect(rows.map((r) => r.split(/\s+/)[0])).toEqual(fixtureReport.conductors.map((c) => c.id));
    const verdictCol = lines[head]!.indexOf('Verdict');
    for (const r of rows) expect(r.slice(verdictCol - 2, verdictCol)).toBe('  ');
  });

  it('shows size, length, ampacity, upstream device and the verdict with its section', () => {
    const c3 = lines.find((l) => l.startsWith('C3 '))!;
    for (const cell of ['Tap to LP-1, "north"', '3/0 AWG Cu', '20 ft', '200 A', 'Feeder 1 600 A', 'tap: 25 ft (240.21(B)(2))', '[2]']) expect(c3).toContain(cell);
    expect(lines.find((l) => l.startsWith('C1 '))).toContain('2×500 kcmil Cu');
    expect(lines.find((l) => l.startsWith('C6 '))).toMatch(/1 AWG Cu\s+\?\s+130 A/);
  });

  it('groups findings by severity in the order violation, needs AHJ review, warning, info, each with citation and fixes', () => {
    const at = (s: string) => text.indexOf(s);
    expect(at('violation (1)')).toBeGreaterThan(at('FINDINGS'));
    expect(at('needs AHJ review (1)')).toBeGreaterThan(at('violation (1)'));
    expect(at('warning (1)')).toBeGreaterThan(at('needs AHJ review (1)'));
    expect(at('info (1)')).toBeGreaterThan(at('warning (1)'));
    expect(text).toContain('[1] conductor C4 · NEC 2023 240.21(B)(2) · rule tap-25ft');
    expect(text).toContain('fix: add an OCPD of at most 85 A at the tap point');
  });

  it('lists the assumptions and ends with the caution', () => {
    expect(text).toContain('- Terminations are rated 75 °C');
    const tail = text.slice(text.lastIndexOf('CAUTION')).replace(/\s+/g, ' ').trim();
    expect(tail).toBe(`CAUTION ${CAUTION}`);
  });

  it('never uses "approved" as a verdict word', () => {
    for (const w of Object.values(VERDICT_WORDS)) expect(w).not.toMatch(/approv/i);
  });

  it('is plain by default; --color adds ANSI codes without moving a column', () => {
    expect(text).not.toContain('\x1b[');
    const coloured = renderText(fixtureReport, { color: true });
    expect(coloured).toContain('\x1b[31m');
    // eslint-disable-next-line no-control-regex
    expect(coloured.replace(/\x1b\[\d+m/g, '')).toBe(text);
  });

  it('says so when there is nothing to report', () => {
    const clean = renderText(cleanReport);
    expect(clean).toContain('FINDINGS\n  none');
    expect(renderText({ ...cleanReport, conductors: [] })).toContain('(the drawing has no conductors)');
  });
});

describe('renderText with hostile user text', () => {
  const hostile = {
    ...fixtureReport,
    projectName: 'Plant\x1b[2J',
    conductors: fixtureReport.conductors.map((c, i) =>
      i === 0 ? { ...c, label: 'ok\x1b[8m hidden\nC9  forged row' } : i === 1 ? { ...c, label: '🔌'.repeat(40) } : c,
    ),
  };
  const out = renderText(hostile);

  it('passes no control character but the line breaks it writes itself (ESC[8m would hide the verdict that follows)', () => {
    // eslint-disable-next-line no-control-regex -- the test looks for control characters
    expect(out).not.toMatch(/[\x00-\x09\x0b-\x1f\x7f-\x9f]/);
    expect(out).toContain('ok\\x1b[8m hidden\\nC9');
    expect(out).toContain('Plant\\x1b[2J');
    expect(out.split('\n').some((l) => l.startsWith('C9  forged'))).toBe(false);
  });

  it('clips a label of emoji without splitting a surrogate pair, and the row still lines up', () => {
    expect(out).not.toMatch(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/);
    const rows = out.split('\n');
    const head = rows.find((l) => l.startsWith('Conductor  '))!;
    const row = rows.find((l) => l.startsWith(`${hostile.conductors[1]!.id} `))!;
    const verdictAt = Array.from(head).length - Array.from(head.slice(head.indexOf('Verdict'))).length;
    expect(Array.from(row).slice(verdictAt - 2, verdictAt).join('')).toBe('  ');
  });
});
