import { describe, expect, it } from 'vitest';
import { clipText, inertText, looksLikeFormula, spreadsheetCell, textLength } from '../../../core/src/report/safeText';

describe('spreadsheetCell (OWASP "CSV Injection" guidance, common practice)', () => {
  it.each(['=1+1', '+1', '-1', '@A1', '\tx', '\rx', '\nx', ' =1'])('%j could start a formula and gets an apostrophe', (s) => {
    expect(looksLikeFormula(s)).toBe(true);
    expect(spreadsheetCell(s)).toBe(`'${s}`);
  });
  it.each(['LP-1', 'Main 600 A', '', "'quoted", '1=1'])('%j is plain text and stays as it is', (s) => {
    expect(spreadsheetCell(s)).toBe(s);
  });
  it('numbers and null pass through unchanged', () => {
    expect(spreadsheetCell(-3)).toBe(-3);
    expect(spreadsheetCell(null)).toBeNull();
  });
});

describe('inertText', () => {
  it('shows ESC, newlines, CR, tab, DEL and C1 controls as visible escapes', () => {
    expect(inertText('a\x1b[8mb')).toBe('a\\x1b[8mb');
    expect(inertText('one\ntwo\r\tthree')).toBe('one\\ntwo\\r\\tthree');
    expect(inertText('\x7f\x9b\u2028')).toBe('\\x7f\\x9b\\u2028');
  });
  it('leaves ordinary text, accents, CJK and emoji alone', () => {
    const s = 'Feeder Ä 配電盤 ⚡ 🔌';
    expect(inertText(s)).toBe(s);
  });
});

describe('clipText', () => {
  it('never splits a surrogate pair', () => {
    const s = 'ab🔌🔌🔌';
    expect(clipText(s, 4)).toBe('ab🔌…');
    for (let max = 1; max < 8; max++) {
      const out = clipText('🔌'.repeat(10), max);
      expect(out).not.toMatch(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/);
      expect(textLength(out)).toBeLessThanOrEqual(max);
    }
  });
  it('leaves text that fits untouched and counts code points', () => {
    expect(clipText('🔌🔌', 2)).toBe('🔌🔌');
    expect(textLength('a🔌b')).toBe(3);
  });
});
