import { describe, expect, it } from 'vitest';
import { ICEA_CONSTANTS, withstandAreaCmil, withstandConstant, withstandCurrentA, withstandTimeS } from '../../../core/src/tables/conductorWithstand';

/**
 * ICEA P-32-382 constants against the adiabatic heating derivation:
 * ρ(T)·J²·dt = c_v·dT with ρ(T) = ρ20·(T + T0)/(20 + T0) gives
 * J²·t = c_v·(20 + T0)/ρ20 · ln((T2 + T0)/(T1 + T0)). Material data (from
 * memory): copper ρ20 = 1.7241e-8 Ω·m (IEC 60028, 100 % IACS), T0 = 234.5 °C,
 * c_v = 3.45e6 J/(m³·K); aluminum ρ20 = 2.8264e-8 Ω·m (61 % IACS), T0 = 228 °C,
 * c_v = 2.5e6 J/(m³·K) (IEC 60949 Table 1). 1 cmil = 5.0671e-10 m².
 */
const CMIL_M2 = 5.0671e-10;
function derivedK(cv: number, rho20: number, t0: number): number {
  return ((cv * (20 + t0)) / rho20) * CMIL_M2 * CMIL_M2 * Math.LN10;
}

describe('ICEA P-32-382 conductor withstand', () => {
  it('published constants: copper 0.0297 with T + 234, aluminum 0.0125 with T + 228', () => {
    expect(ICEA_CONSTANTS).toEqual({ cu: { k: 0.0297, t0C: 234 }, al: { k: 0.0125, t0C: 228 } });
  });

  it('copper 0.0297 agrees with the adiabatic derivation within 2 %', () => {
    expect(Math.abs(derivedK(3.45e6, 1.7241e-8, 234.5) / 0.0297 - 1)).toBeLessThan(0.02);
  });

  it('aluminum 0.0125 agrees with the adiabatic derivation within 5 %', () => {
    expect(Math.abs(derivedK(2.5e6, 2.8264e-8, 228) / 0.0125 - 1)).toBeLessThan(0.05);
  });

  it('T0 terms are the inferred zero-resistance temperatures: 1/α20 − 20 = 234.5 °C (Cu, α20 = 0.00393) and 228 °C (Al, α20 = 0.00403)', () => {
    expect(1 / 0.00393 - 20).toBeCloseTo(234.5, 0);
    expect(1 / 0.00403 - 20).toBeCloseTo(228.1, 0);
  });

  it('worked value: 1/0 Cu (105 600 cmil), 75 → 150 °C, 20 kA: K = 0.0297·log10(384/309) = 0.0028029, t = 0.0781 s', () => {
    const k = withstandConstant('cu', 75, 150);
    expect(k).toBeCloseTo(0.0028029, 6);
    expect(withstandTimeS(20_000, 105_600, k)).toBeCloseTo(0.0781, 4);
  });

  it('worked value: the same conductor from 90 °C gives 0.0611 s; XHHW-2 90 → 250 °C gives 0.1443 s', () => {
    expect(withstandTimeS(20_000, 105_600, withstandConstant('cu', 90, 150))).toBeCloseTo(0.0611, 4);
    expect(withstandTimeS(20_000, 105_600, withstandConstant('cu', 90, 250))).toBeCloseTo(0.1443, 4);
  });

  it('largest current for one cycle: 1/0 Cu THHN 105 600·√(0.0028029·60) = 43 300 A; aluminum 1/0 28 300 A', () => {
    expect(withstandCurrentA(105_600, 1 / 60, withstandConstant('cu', 75, 150))).toBeCloseTo(43_300, -2);
    expect(withstandCurrentA(105_600, 1 / 60, withstandConstant('al', 75, 150))).toBeCloseTo(28_300, -2);
  });

  it('smallest area for 20 kA and 0.35 s: 20 000·√(0.35/0.0028029) = 223 500 cmil (so 250 kcmil; 4/0 = 211 600 is short)', () => {
    expect(withstandAreaCmil(20_000, 0.35, withstandConstant('cu', 75, 150))).toBeCloseTo(223_500, -2);
  });
});
