import { describe, expect, it } from 'vitest';
import { RACEWAY_KINDS } from '../../../core/src/model/schema';
import { maxFillFraction, sameSizeCount } from '../../../core/src/tables/chapter9Table1';
import { CHAPTER9_TABLE4, TRADE_SIZES } from '../../../core/src/tables/chapter9Table4';
import { CHAPTER9_TABLE5, insulatedAreaIn2, table5Family } from '../../../core/src/tables/chapter9Table5';

const circleArea = (d: number) => (Math.PI / 4) * d * d;

describe('Chapter 9 Table 1 (NFPA 70-2023 / 2020, from memory, checked against public reproductions)', () => {
  it('1 conductor 53 %, 2 conductors 31 %, more than 2 40 %', () => {
    expect(maxFillFraction(1)).toBe(0.53);
    expect(maxFillFraction(2)).toBe(0.31);
    expect(maxFillFraction(3)).toBe(0.4);
    expect(maxFillFraction(40)).toBe(0.4);
  });

  it('Note 7: a quotient with a decimal part of 0.8 or more rounds up, else down', () => {
    expect(sameSizeCount(0.8, 1)).toBe(1);
    expect(sameSizeCount(1.79, 1)).toBe(1);
    expect(sameSizeCount(2.8, 1)).toBe(3);
    expect(sameSizeCount(2.0, 1)).toBe(2);
  });
});

describe('Chapter 9 Table 4 (NFPA 70-2023 / 2020, 1/2–4 from memory and checked against a public transcription; RMC and PVC 5 and 6 from memory)', () => {
  it('EMT and IMC have trade sizes 1/2–4, the largest 358.20(B) and 342.20(B) permit; RMC and PVC go on to 6', () => {
    for (const kind of ['EMT', 'IMC'] as const) expect(CHAPTER9_TABLE4[kind].map((r) => r.tradeSize), kind).toEqual(TRADE_SIZES.slice(0, 10));
    for (const kind of ['RMC', 'PVC-40', 'PVC-80'] as const) expect(CHAPTER9_TABLE4[kind].map((r) => r.tradeSize), kind).toEqual([...TRADE_SIZES]);
  });

  // The published IDs are themselves rounded to 0.001 in, so half a unit of the area's last place plus a hair (IMC 2: 0.000503).
  it('each 100 % area is π/4 × ID² within 0.0006 in² (geometry)', () => {
    for (const kind of RACEWAY_KINDS) {
      for (const r of CHAPTER9_TABLE4[kind]) expect(Math.abs(circleArea(r.idIn) - r.areaIn2), `${kind} ${r.tradeSize}`).toBeLessThan(0.0006);
    }
  });

  // Both columns are rounded to 0.001 in² from the unrounded area: 0.4 × 0.0005 + 0.0005 = 0.0007 at most.
  it('each 40 % column entry is 0.40 × its 100 % area within the two roundings (0.0007 in²)', () => {
    for (const kind of RACEWAY_KINDS) {
      for (const r of CHAPTER9_TABLE4[kind]) expect(Math.abs(0.4 * r.areaIn2 - r.area40In2), `${kind} ${r.tradeSize}`).toBeLessThanOrEqual(0.0007);
    }
  });

  it('each 40 % column entry is 0.40 × π/4 × ID² rounded to 0.001 in² (geometry)', () => {
    for (const kind of RACEWAY_KINDS) {
      for (const r of CHAPTER9_TABLE4[kind]) expect(Math.abs(0.4 * circleArea(r.idIn) - r.area40In2), `${kind} ${r.tradeSize}`).toBeLessThanOrEqual(0.0006);
    }
  });

  it('areas rise with trade size; PVC Schedule 80, the thickest wall, has the smallest area of every trade size', () => {
    for (const kind of RACEWAY_KINDS) {
      const rows = CHAPTER9_TABLE4[kind];
      for (let i = 1; i < rows.length; i++) expect(rows[i]!.areaIn2).toBeGreaterThan(rows[i - 1]!.areaIn2);
    }
    for (let i = 0; i < TRADE_SIZES.length; i++) {
      const pvc80 = CHAPTER9_TABLE4['PVC-80'][i]!.areaIn2;
      for (const kind of RACEWAY_KINDS) {
        const row = CHAPTER9_TABLE4[kind][i];
        if (kind !== 'PVC-80' && row) expect(row.areaIn2).toBeGreaterThan(pvc80);
      }
    }
  });
});

describe('Chapter 9 Table 5 (NFPA 70-2023 / 2020, THHN, XHHW and TW/THW rows, from memory, checked against a public reproduction)', () => {
  it('each area is π/4 × d² of its diameter within 0.0001 in² (geometry)', () => {
    for (const [family, rows] of Object.entries(CHAPTER9_TABLE5)) {
      for (const r of rows) expect(Math.abs(circleArea(r.diameterIn) - r.areaIn2), `${family} ${r.size}`).toBeLessThan(0.0001);
    }
  });

  it('THHN, THWN and THWN-2 share a row; XHHW and XHHW-2 share one; TW, THW and THHW one; RHH, RHW, USE and UF are not transcribed', () => {
    expect(insulatedAreaIn2('THWN-2', '500')).toBe(0.7073);
    expect(insulatedAreaIn2('THHN', '12')).toBe(0.0133);
    expect(insulatedAreaIn2('XHHW-2', '4/0')).toBe(0.3197);
    expect(insulatedAreaIn2('XHHW', '2000')).toBe(2.6073);
    expect(insulatedAreaIn2('THW', '4/0')).toBe(0.3718);
    expect(insulatedAreaIn2('THHW', '500')).toBe(0.7901);
    expect(insulatedAreaIn2('TW', '14')).toBe(0.0139);
    for (const ins of ['RHH', 'RHW', 'RHW-2', 'USE', 'USE-2', 'UF'] as const) expect(table5Family(ins), ins).toBeNull();
    expect(insulatedAreaIn2('THHN', '1250')).toBeNull();
  });

  it('every row rises with size, and from 6 AWG up the TW/THW wall is thicker than THHN (larger area for every size both list)', () => {
    for (const rows of Object.values(CHAPTER9_TABLE5)) for (let i = 1; i < rows.length; i++) expect(rows[i]!.areaIn2).toBeGreaterThan(rows[i - 1]!.areaIn2);
    for (const r of CHAPTER9_TABLE5['THHN/THWN/THWN-2']) expect(insulatedAreaIn2('THW', r.size)!, r.size).toBeGreaterThan(r.areaIn2);
  });
});

describe('Annex C Table C.1 (EMT, THHN) counts reproduced from Tables 1, 4 and 5 with Note 7 (Annex C values from memory)', () => {
  const emt = (trade: string) => CHAPTER9_TABLE4.EMT.find((r) => r.tradeSize === trade)!.area40In2;
  const cases: [string, string, number][] = [
    ['14', '1/2', 12], ['14', '3/4', 22], ['14', '1', 35],
    ['12', '1/2', 9], ['12', '3/4', 16], ['12', '1', 26],
    ['10', '1/2', 5], ['10', '3/4', 10], ['10', '1', 16],
  ];
  for (const [size, trade, annexC] of cases) {
    it(`${size} AWG THHN in ${trade} EMT: ${annexC}`, () => {
      expect(sameSizeCount(emt(trade), insulatedAreaIn2('THHN', size as '14')!)).toBe(annexC);
    });
  }
  // TW/THW rows of Table C.1: 0.122 / 0.0139 = 8.78 → 8 (0.78 < 0.8, Note 7); 0.213 / 0.0181 = 11.77 → 11; 0.346 / 0.0243 = 14.24 → 14.
  const tw: [string, string, number][] = [['14', '1/2', 8], ['12', '3/4', 11], ['10', '1', 14]];
  for (const [size, trade, annexC] of tw) {
    it(`${size} AWG TW in ${trade} EMT: ${annexC}`, () => {
      expect(sameSizeCount(emt(trade), insulatedAreaIn2('TW', size as '14')!)).toBe(annexC);
    });
  }
});

describe('trade sizes 5 and 6 (from memory; π/4 × ID² checked above) size a large feeder', () => {
  it('4 × 750 kcmil THW + 2/0 THW EGC = 4 × 1.1652 + 0.2624 = 4.9232 in²: 4 in PVC Schedule 40 holds 5.022 at 40 %; 4 × 1000 kcmil THW + 2/0 = 6.1760 in² needs 5 in (7.904)', () => {
    const pvc = CHAPTER9_TABLE4['PVC-40'];
    const a = 4 * insulatedAreaIn2('THW', '750')! + insulatedAreaIn2('THW', '2/0')!;
    expect(a).toBeCloseTo(4.9232, 4);
    expect(pvc.find((r) => r.area40In2 >= a)!.tradeSize).toBe('4');
    const b = 4 * insulatedAreaIn2('THW', '1000')! + insulatedAreaIn2('THW', '2/0')!;
    expect(b).toBeCloseTo(6.176, 4);
    expect(pvc.find((r) => r.area40In2 >= b)!.tradeSize).toBe('5');
  });
});
