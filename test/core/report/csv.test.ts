import { describe, expect, it } from 'vitest';
import { SCHEDULE_COLUMNS, csvField, toConductorScheduleCsv } from '../../../core/src/report/csv';
import { fixtureReport } from './fixture';

/** A small RFC 4180 reader written from the grammar in RFC 4180 §2 (file, record, field, escaped, non-escaped). */
function parseRfc4180(text: string): string[][] {
  const records: string[][] = [];
  let i = 0;
  while (i < text.length) {
    const record: string[] = [];
    for (;;) {
      let field = '';
      if (text[i] === '"') {
        i++;
        for (;;) {
          if (text[i] === '"' && text[i + 1] === '"') {
            field += '"';
            i += 2;
          } else if (text[i] === '"') {
            i++;
            break;
          } else if (i >= text.length) throw new Error('unterminated quoted field');
          else field += text[i++];
        }
      } else while (i < text.length && text[i] !== ',' && text[i] !== '\r' && text[i] !== '"') field += text[i++];
      record.push(field);
      if (text[i] === ',') i++;
      else break;
    }
    if (text.slice(i, i + 2) !== '\r\n') throw new Error(`record not ended by CRLF at ${i}`);
    i += 2;
    records.push(record);
  }
  return records;
}

describe('toConductorScheduleCsv (RFC 4180)', () => {
  const csv = toConductorScheduleCsv(fixtureReport);
  const records = parseRfc4180(csv);

  it('is a header plus one CRLF-terminated record per conductor, all with the same field count (RFC 4180 §2.1, §2.3, §2.4)', () => {
    expect(records).toHaveLength(fixtureReport.conductors.length + 1);
    expect(records[0]).toEqual([...SCHEDULE_COLUMNS]);
    for (const r of records) expect(r).toHaveLength(SCHEDULE_COLUMNS.length);
  });

  it('quotes fields holding commas and quotes, doubling the quotes (RFC 4180 §2.6, §2.7)', () => {
    expect(csv).toContain('"Tap to LP-1, ""north"""');
    const c3 = records.find((r) => r[0] === 'C3')!;
    expect(c3[SCHEDULE_COLUMNS.indexOf('label')]).toBe('Tap to LP-1, "north"');
    expect(c3[SCHEDULE_COLUMNS.indexOf('verdict')]).toBe('tap-25ft');
    expect(c3[SCHEDULE_COLUMNS.indexOf('verdict_text')]).toBe('tap: 25 ft');
    expect(c3[SCHEDULE_COLUMNS.indexOf('citation')]).toBe('NEC 2023 240.21(B)(2)');
    expect(c3[SCHEDULE_COLUMNS.indexOf('ampacity_a')]).toBe('200');
    expect(c3[SCHEDULE_COLUMNS.indexOf('upstream_rating_a')]).toBe('600');
  });

  it('leaves unknown values empty', () => {
    const c6 = records.find((r) => r[0] === 'C6')!;
    expect(c6[SCHEDULE_COLUMNS.indexOf('length_ft')]).toBe('');
  });

  it.each([
    ['plain', 'plain'],
    ['a,b', '"a,b"'],
    ['say "hi"', '"say ""hi"""'],
    ['two\nlines', '"two\nlines"'],
    ['cr\r', '"cr\r"'],
  ])('csvField(%j) = %j (RFC 4180 §2.6–2.7)', (input, expected) => {
    expect(csvField(input)).toBe(expected);
    expect(parseRfc4180(`${expected}\r\n`)).toEqual([[input]]);
  });
});

describe('CSV formula injection (OWASP "CSV Injection" guidance, common practice)', () => {
  it.each([
    ['=HYPERLINK("http://example.invalid","x")', `"'=HYPERLINK(""http://example.invalid"",""x"")"`],
    ['+cmd|\' /C calc\'!A0', `'+cmd|' /C calc'!A0`],
    ['-2+3', `'-2+3`],
    ['@SUM(A1:A9)', `'@SUM(A1:A9)`],
    ['\t=1+1', `'\t=1+1`],
    ['\r=1+1', `"'\r=1+1"`],
    ['  =1+1', `'  =1+1`],
    ['\uFF1D1+1', `'\uFF1D1+1`],
  ])('a label %j is written as inert text %j', (input, expected) => {
    expect(csvField(input)).toBe(expected);
    expect(parseRfc4180(`${expected}\r\n`)[0]![0]!.startsWith("'")).toBe(true);
  });

  it('numbers stay numbers, negative ones included, and text that merely contains = is left alone', () => {
    expect(csvField(-12.5)).toBe('-12.5');
    expect(csvField(0)).toBe('0');
    expect(csvField('LP-1 = lighting')).toBe('LP-1 = lighting');
    expect(csvField(null)).toBe('');
  });

  it('a hostile conductor label reaches the schedule neutralised', () => {
    const hostile = { ...fixtureReport, conductors: fixtureReport.conductors.map((c, i) => (i === 0 ? { ...c, label: '=HYPERLINK("x")' } : c)) };
    const rows = parseRfc4180(toConductorScheduleCsv(hostile));
    expect(rows[1]![SCHEDULE_COLUMNS.indexOf('label')]).toBe(`'=HYPERLINK("x")`);
  });
});
