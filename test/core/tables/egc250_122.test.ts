import { describe, expect, it } from 'vitest';
import { CONDUCTOR_SIZES } from '../../../core/src/model/schema';
import { conductorAreaCmil } from '../../../core/src/tables/conductorProperties';
import { egcSizeForOcpd, smallestSizeWithAreaCmil, TABLE_250_122 } from '../../../core/src/tables/egc250_122';
import { sizeIndexOf } from '../../../core/src/tables/sizes';

describe('Table 250.122 (NFPA 70-2023 / 2020, from memory, checked against public reproductions)', () => {
  it('reads the published rows: copper and aluminum by OCPD rating not exceeded', () => {
    // NFPA 70-2023 Table 250.122, every row.
    const published: [number, string, string][] = [
      [15, '14', '12'], [20, '12', '10'], [60, '10', '8'], [100, '8', '6'], [200, '6', '4'], [300, '4', '2'],
      [400, '3', '1'], [500, '2', '1/0'], [600, '1', '2/0'], [800, '1/0', '3/0'], [1000, '2/0', '4/0'],
      [1200, '3/0', '250'], [1600, '4/0', '350'], [2000, '250', '400'], [2500, '350', '600'], [3000, '400', '600'],
      [4000, '500', '750'], [5000, '700', '1250'], [6000, '800', '1250'],
    ];
    for (const [a, cu, al] of published) {
      expect(egcSizeForOcpd(a, 'cu', 2023), `${a} A Cu`).toBe(cu);
      expect(egcSizeForOcpd(a, 'al', 2023), `${a} A Al`).toBe(al);
      expect(egcSizeForOcpd(a, 'cu-clad-al', 2020), `${a} A Cu-clad Al`).toBe(al);
    }
  });

  it('takes the first row not exceeded, never interpolating: 25–60 A read the 60 A row, 61 A the 100 A row', () => {
    expect(egcSizeForOcpd(25, 'cu', 2023)).toBe('10');
    expect(egcSizeForOcpd(40, 'cu', 2023)).toBe('10');
    expect(egcSizeForOcpd(61, 'cu', 2023)).toBe('8');
    // DOMAIN worked example E3: a 90 A motor breaker falls in the 100 A row → 8 AWG Cu.
    expect(egcSizeForOcpd(90, 'cu', 2023)).toBe('8');
    expect(egcSizeForOcpd(6001, 'cu', 2023)).toBeNull();
  });

  it('both columns rise with the rating', () => {
    for (let i = 1; i < TABLE_250_122.length; i++) {
      const a = TABLE_250_122[i - 1]!;
      const b = TABLE_250_122[i]!;
      expect(b.maxOcpdA).toBeGreaterThan(a.maxOcpdA);
      expect(sizeIndexOf(b.cu)).toBeGreaterThan(sizeIndexOf(a.cu));
      expect(sizeIndexOf(b.al)).toBeGreaterThanOrEqual(sizeIndexOf(a.al));
    }
  });

  it('each aluminum entry has about the conductance of the copper one: 1.45–1.8 × its area (Al 61 % IACS → 1.64; Chapter 9 Table 8 cmil)', () => {
    for (const row of TABLE_250_122) {
      const ratio = conductorAreaCmil(row.al) / conductorAreaCmil(row.cu);
      expect(ratio, `${row.maxOcpdA} A`).toBeGreaterThanOrEqual(1.45);
      expect(ratio, `${row.maxOcpdA} A`).toBeLessThanOrEqual(1.8);
    }
  });

  it('smallest size with an area: 33 133 cmil → 4 AWG (41 740), 6 AWG (26 240) is too small', () => {
    expect(smallestSizeWithAreaCmil(33_133)).toBe('4');
    expect(smallestSizeWithAreaCmil(26_240)).toBe('6');
    expect(smallestSizeWithAreaCmil(conductorAreaCmil(CONDUCTOR_SIZES[CONDUCTOR_SIZES.length - 1]!) + 1)).toBeNull();
  });
});
