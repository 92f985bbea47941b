import { describe, expect, it } from 'vitest';
import { supplySideBondingJumper, TABLE_250_102_C1 } from '../../../core/src/tables/bondingJumper250_102';
import { conductorAreaCmil } from '../../../core/src/tables/conductorProperties';
import { sizeIndexOf } from '../../../core/src/tables/sizes';

// NFPA 70-2023 / 2020 Table 250.102(C)(1), from memory, checked against public reproductions.
describe('Table 250.102(C)(1): supply-side bonding jumper', () => {
  it.each([
    ['2', 'cu', '8'], ['1', 'cu', '6'], ['1/0', 'cu', '6'], ['2/0', 'cu', '4'], ['3/0', 'cu', '4'], ['4/0', 'cu', '2'], ['350', 'cu', '2'],
    ['400', 'cu', '1/0'], ['600', 'cu', '1/0'], ['700', 'cu', '2/0'], ['1000', 'cu', '2/0'],
    ['1/0', 'al', '6'], ['2/0', 'al', '4'], ['3/0', 'al', '4'], ['4/0', 'al', '2'], ['250', 'al', '2'], ['300', 'al', '1/0'], ['500', 'al', '1/0'],
    ['600', 'al', '3/0'], ['900', 'al', '3/0'], ['1000', 'al', '4/0'], ['1750', 'al', '4/0'],
  ] as const)('%s %s ungrounded → %s', (phase, material, jumper) => {
    expect(supplySideBondingJumper(phase, material, 2023)).toMatchObject({ size: jumper, basis: 'table' });
  });

  it('above 1100 kcmil Cu: 12.5 % of the area; 1250 kcmil → 156 250 cmil → 3/0 (167 800); 2000 kcmil → 250 000 cmil → 250 kcmil', () => {
    expect(supplySideBondingJumper('1250', 'cu', 2023)).toMatchObject({ size: '3/0', basis: 'percent', neededCmil: 156_250 });
    expect(supplySideBondingJumper('2000', 'cu', 2023)).toMatchObject({ size: '250', neededCmil: 250_000 });
  });

  it('above 1750 kcmil Al: 2000 kcmil Al → 12.5 % = 250 000 cmil → 250 kcmil Al; copper-clad aluminum reads the aluminum column', () => {
    expect(supplySideBondingJumper('2000', 'al', 2023)).toMatchObject({ size: '250', basis: 'percent' });
    expect(supplySideBondingJumper('500', 'cu-clad-al', 2023).size).toBe('1/0');
  });

  it('cross-check: both columns rise row by row, and every row\'s jumper is at least 12 % of the row\'s largest conductor (Chapter 9 Table 8 areas), so 12.5 % continues the table', () => {
    for (let k = 1; k < TABLE_250_102_C1.length; k++) {
      const a = TABLE_250_102_C1[k - 1]!;
      const b = TABLE_250_102_C1[k]!;
      expect(sizeIndexOf(b.cu)).toBeGreaterThan(sizeIndexOf(a.cu));
      expect(sizeIndexOf(b.al)).toBeGreaterThan(sizeIndexOf(a.al));
    }
    for (const r of TABLE_250_102_C1) {
      expect(conductorAreaCmil(r.cu) / conductorAreaCmil(r.maxCu)).toBeGreaterThanOrEqual(0.12);
      expect(conductorAreaCmil(r.al) / conductorAreaCmil(r.maxAl)).toBeGreaterThanOrEqual(0.12);
    }
    // The table's last copper row runs to 1100 kcmil: 2/0 = 133 100 cmil is 12.1 % of it, next to the 12.5 % rule above.
    expect(conductorAreaCmil('2/0') / 1_100_000).toBeCloseTo(0.121, 3);
  });
});
