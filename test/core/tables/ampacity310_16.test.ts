import { describe, expect, it } from 'vitest';
import { CONDUCTOR_SIZES, type ConductorSize } from '../../../core/src/model/schema';
import { baseAmpacityA, TABLE_310_16, type TempColumnC } from '../../../core/src/tables/ampacity310_16';
import { conductorAreaCmil } from '../../../core/src/tables/conductorProperties';

const COLUMNS: readonly TempColumnC[] = [60, 75, 90];

/*
 * Second representation of NFPA 70-2023 / 2020 Table 310.16, kept apart from
 * the code's constant: the field notes' transcription (from memory, all 168
 * values checked against public reproductions of the 2014–2023 editions),
 * written as text columns: size | Cu 60 | Cu 75 | Cu 90 | Al 60 | Al 75 | Al 90.
 */
const TABLE_TEXT = `
14   15  20  25  -   -   -
12   20  25  30  15  20  25
10   30  35  40  25  30  35
8    40  50  55  35  40  45
6    55  65  75  40  50  55
4    70  85  95  55  65  75
3    85 100 115  65  75  85
2    95 115 130  75  90 100
1   110 130 145  85 100 115
1/0 125 150 170 100 120 135
2/0 145 175 195 115 135 150
3/0 165 200 225 130 155 175
4/0 195 230 260 150 180 205
250 215 255 290 170 205 230
300 240 285 320 195 230 260
350 260 310 350 210 250 280
400 280 335 380 225 270 305
500 320 380 430 260 310 350
600 350 420 475 285 340 385
700 385 460 520 315 375 425
750 400 475 535 320 385 435
800 410 490 555 330 395 445
900 435 520 585 355 425 480
1000 455 545 615 375 445 500
1250 495 590 665 405 485 545
1500 525 625 705 435 520 585
1750 545 650 735 455 545 615
2000 555 665 750 470 560 630
`;

const TEXT_ROWS = TABLE_TEXT.trim()
  .split('\n')
  .map((line) => line.trim().split(/\s+/))
  .map(([size, ...v]) => ({ size: size as ConductorSize, values: v.map((x) => (x === '-' ? null : Number(x))) }));

const TABLE_SIZES = CONDUCTOR_SIZES.filter((s) => s !== '18' && s !== '16');

describe('Table 310.16 (NFPA 70-2023 / 2020), transcription checks', () => {
  it('covers 14 AWG to 2000 kcmil, in CONDUCTOR_SIZES order', () => {
    expect(TABLE_310_16.map((r) => r.size)).toEqual(TABLE_SIZES);
    expect(TEXT_ROWS.map((r) => r.size)).toEqual(TABLE_SIZES);
  });

  it('all 168 values match the second transcription (field notes, from memory, checked against public reproductions)', () => {
    let compared = 0;
    for (const { size, values } of TEXT_ROWS) {
      for (let c = 0; c < 3; c++) {
        expect(baseAmpacityA('cu', size, COLUMNS[c]!), `Cu ${size} ${COLUMNS[c]} °C`).toBe(values[c]);
        expect(baseAmpacityA('al', size, COLUMNS[c]!), `Al ${size} ${COLUMNS[c]} °C`).toBe(values[c + 3]);
        compared += 2;
      }
    }
    expect(compared).toBe(168);
  });

  it('copper-clad aluminum reads the aluminum columns (Table 310.16 heading)', () => {
    for (const size of TABLE_SIZES)
      for (const t of COLUMNS) expect(baseAmpacityA('cu-clad-al', size, t)).toBe(baseAmpacityA('al', size, t));
  });

  it('18 and 16 AWG are not in the table; aluminum has no 14 AWG row', () => {
    for (const t of COLUMNS) {
      expect(baseAmpacityA('cu', '18', t)).toBeNull();
      expect(baseAmpacityA('cu', '16', t)).toBeNull();
      expect(baseAmpacityA('al', '14', t)).toBeNull();
      expect(baseAmpacityA('cu-clad-al', '14', t)).toBeNull();
    }
  });

  it('75 °C copper column: worked values used throughout the trade (common practice, from memory)', () => {
    const known: Array<[ConductorSize, number]> = [
      ['12', 25], ['10', 35], ['8', 50], ['6', 65], ['4', 85], ['3', 100], ['2', 115], ['1', 130],
      ['1/0', 150], ['2/0', 175], ['3/0', 200], ['4/0', 230], ['250', 255], ['350', 310], ['500', 380], ['600', 420],
    ];
    for (const [size, a] of known) expect(baseAmpacityA('cu', size, 75), size).toBe(a);
  });

  it('grows strictly with size in every column (heat balance: a larger conductor carries more)', () => {
    for (const m of ['cu', 'al'] as const)
      for (const t of COLUMNS) {
        const col = TABLE_SIZES.map((s) => baseAmpacityA(m, s, t)).filter((v): v is number => v !== null);
        for (let i = 1; i < col.length; i++) expect(col[i]!, `${m} ${t} °C row ${i}`).toBeGreaterThan(col[i - 1]!);
      }
  });

  it('grows strictly with the temperature column in every row', () => {
    for (const m of ['cu', 'al'] as const)
      for (const s of TABLE_SIZES) {
        const [a60, a75, a90] = COLUMNS.map((t) => baseAmpacityA(m, s, t));
        if (a60 === null || a60 === undefined) continue;
        expect(a75!, `${m} ${s}`).toBeGreaterThan(a60);
        expect(a90!, `${m} ${s}`).toBeGreaterThan(a75!);
      }
  });

  it('copper above aluminum, aluminum 72–88 % of copper (conductivity 61 % IACS, common practice)', () => {
    for (const s of TABLE_SIZES)
      for (const t of COLUMNS) {
        const cu = baseAmpacityA('cu', s, t)!;
        const al = baseAmpacityA('al', s, t);
        if (al === null) continue;
        expect(al, `${s} ${t} °C`).toBeLessThan(cu);
        expect(al / cu, `${s} ${t} °C`).toBeGreaterThanOrEqual(0.72);
        expect(al / cu, `${s} ${t} °C`).toBeLessThanOrEqual(0.88);
      }
  });

  it('columns agree with I ∝ sqrt(Tc − 30 °C) within 10 % (I²R heating balances heat loss ∝ temperature rise; Neher–McGrath form)', () => {
    for (const m of ['cu', 'al'] as const)
      for (const s of TABLE_SIZES) {
        const a75 = baseAmpacityA(m, s, 75);
        if (a75 === null) continue;
        const expect60 = a75 * Math.sqrt(30 / 45);
        const expect90 = a75 * Math.sqrt(60 / 45);
        expect(Math.abs(baseAmpacityA(m, s, 60)! / expect60 - 1), `${m} ${s} 60 °C`).toBeLessThan(0.1);
        expect(Math.abs(baseAmpacityA(m, s, 90)! / expect90 - 1), `${m} ${s} 90 °C`).toBeLessThan(0.1);
      }
  });

  it('current per kcmil falls as size grows (larger conductors shed less heat per unit area, common practice)', () => {
    // The one exception is real: aluminum 12 AWG at 60 °C (15 A) is rated low, so
    // 10 AWG (25 A) carries 4.8 % more per kcmil. Anything else rising is a typo.
    const rises: string[] = [];
    for (const m of ['cu', 'al'] as const)
      for (const t of COLUMNS) {
        let last = Number.POSITIVE_INFINITY;
        for (const s of TABLE_SIZES) {
          const a = baseAmpacityA(m, s, t);
          if (a === null) continue;
          const density = a / conductorAreaCmil(s);
          if (density >= last) rises.push(`${m} ${s} ${t}`);
          last = density;
        }
      }
    expect(rises).toEqual(['al 10 60']);
  });
});
