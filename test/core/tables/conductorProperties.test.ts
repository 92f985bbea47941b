import { describe, expect, it } from 'vitest';
import { CONDUCTOR_SIZES, type ConductorSize } from '../../../core/src/model/schema';
import { bareAreaIn2, CHAPTER9_TABLE8, conductorAreaCmil, dcResistanceOhmPerKft } from '../../../core/src/tables/conductorProperties';
import { isKcmilSize } from '../../../core/src/tables/sizes';

/** AWG gauge number: 1/0 → 0, 2/0 → −1, 3/0 → −2, 4/0 → −3. */
function gaugeNumber(size: ConductorSize): number {
  return size.endsWith('/0') ? 1 - Number(size[0]) : Number(size);
}

/** ASTM B258 AWG diameter law: d = 0.005 in × 92^((36 − n)/39); area in cmil = (d in mils)². */
function awgAreaCmil(n: number): number {
  const dMils = 5 * 92 ** ((36 - n) / 39);
  return dMils * dMils;
}

/** Resistance per 1000 ft at 75 °C from resistivity (Ω·cmil/ft at 20 °C), α, and a stranding allowance. */
function resistanceFromPhysics(rho20: number, alpha: number, areaCmil: number): number {
  const stranding = 1.02;
  return ((rho20 * (1 + alpha * (75 - 20)) * stranding) / areaCmil) * 1000;
}

describe('Chapter 9 Table 8 (NFPA 70-2023 / 2020, from memory), conductor properties', () => {
  it('lists every schema size once, smallest first', () => {
    expect(CHAPTER9_TABLE8.map((r) => r.size)).toEqual([...CONDUCTOR_SIZES]);
  });

  it('AWG areas agree with the ASTM B258 diameter law within 1 %', () => {
    for (const size of CONDUCTOR_SIZES.filter((s) => !isKcmilSize(s))) {
      const expected = awgAreaCmil(gaugeNumber(size));
      expect(Math.abs(conductorAreaCmil(size) / expected - 1), size).toBeLessThan(0.01);
    }
  });

  it('4/0 AWG is exactly 0.460 in across: 460² = 211 600 cmil (ASTM B258 anchor)', () => {
    expect(conductorAreaCmil('4/0')).toBe(211_600);
  });

  it('bare stranded overall diameters (from memory) are 1.13–1.16 × the solid diameter of the same area, √cmil / 1000 in (concentric class B stranding, common practice); 1000 kcmil: 1.152 in, π/4 × 1.152² = 1.042 in²', () => {
    for (const r of CHAPTER9_TABLE8) {
      const ratio = r.strandedDiameterIn / (Math.sqrt(r.areaCmil) / 1000);
      expect(ratio, r.size).toBeGreaterThanOrEqual(1.13);
      expect(ratio, r.size).toBeLessThanOrEqual(1.16);
    }
    expect(bareAreaIn2('1000')).toBeCloseTo(1.0423, 4);
    expect(bareAreaIn2('4')).toBeCloseTo(0.0423, 4);
  });

  it('kcmil sizes are the size × 1000 cmil', () => {
    for (const size of CONDUCTOR_SIZES.filter(isKcmilSize)) expect(conductorAreaCmil(size), size).toBe(Number(size) * 1000);
  });

  it('copper resistance agrees with ρ(20 °C) = 10.37 Ω·cmil/ft, α = 0.00393/°C, 75 °C, ~2 % stranding, within 3 % (handbook values)', () => {
    for (const size of CONDUCTOR_SIZES) {
      const expected = resistanceFromPhysics(10.37, 0.00393, conductorAreaCmil(size));
      expect(Math.abs(dcResistanceOhmPerKft('cu', size) / expected - 1), size).toBeLessThan(0.03);
    }
  });

  it('aluminum resistance agrees with 61 % IACS (ρ(20 °C) = 17.0 Ω·cmil/ft, α = 0.00403/°C, handbook values, from memory) within 3 %', () => {
    for (const size of CONDUCTOR_SIZES) {
      const expected = resistanceFromPhysics(10.37 / 0.61, 0.00403, conductorAreaCmil(size));
      expect(Math.abs(dcResistanceOhmPerKft('al', size) / expected - 1), size).toBeLessThan(0.03);
    }
  });

  it('aluminum is about 1.64 × copper for every size (within 2 %)', () => {
    for (const size of CONDUCTOR_SIZES) {
      const ratio = dcResistanceOhmPerKft('al', size) / dcResistanceOhmPerKft('cu', size);
      expect(Math.abs(ratio / 1.64 - 1), size).toBeLessThan(0.02);
    }
  });

  it('copper-clad aluminum uses the aluminum column (approximation stated in the table header)', () => {
    expect(dcResistanceOhmPerKft('cu-clad-al', '2')).toBe(dcResistanceOhmPerKft('al', '2'));
  });

  it('spot values (field notes, from memory): 12 AWG Cu 1.98, 1/0 Cu 0.122, 500 kcmil Cu 0.0258 Ω/1000 ft', () => {
    expect(dcResistanceOhmPerKft('cu', '12')).toBe(1.98);
    expect(dcResistanceOhmPerKft('cu', '1/0')).toBe(0.122);
    expect(dcResistanceOhmPerKft('cu', '500')).toBe(0.0258);
  });
});
