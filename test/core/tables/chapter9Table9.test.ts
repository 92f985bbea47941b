import { describe, expect, it } from 'vitest';
import { CHAPTER9_TABLE9, racewayColumn, table9Impedance } from '../../../core/src/tables/chapter9Table9';
import { conductorAreaCmil, dcResistanceOhmPerKft } from '../../../core/src/tables/conductorProperties';

/**
 * Chapter 9 Table 9 against sources independent of it.
 *
 * Reactance, the geometry law: X = 2πf·(μ0/2π)·ln(GMD/GMR) per unit length;
 * at 60 Hz and per 1000 ft that is 0.022982·ln(GMD/GMR) Ω. GMR of a round
 * conductor is 0.7788·r (e^(-1/4), the internal flux term), r from the Table 8
 * area as a solid equivalent. The spacing each tabulated X implies must be
 * physical: at least the stranded diameter (conductors touching) and not more
 * than five diameters (three conductors in one conduit).
 *
 * Resistance, method: Table 8 DC resistance at 75 °C corrected for AC by the
 * skin effect and proximity effect factors of IEC 60287-1-1 (2.1.2 and 2.1.4,
 * ks = kp = 1), with the spacing the reactance implies; tolerance 4 %, since
 * the table prints two figures (3.1 for 3.14 Ω at 14 AWG, 1.2 for 1.24 Ω at
 * 10 AWG is 3.2 % off by rounding alone).
 */
const K_PER_NEPER = 2 * Math.PI * 60 * 2e-7 * 304.8;
const STRANDED_OVER_SOLID = 1.08; // concentric stranding, common practice (about 1.08–1.16 × the solid diameter)

function geometry(size: (typeof CHAPTER9_TABLE9)[number]['size'], xOhmPerKft: number) {
  const dIn = Math.sqrt(conductorAreaCmil(size)) / 1000;
  const gmr = (0.7788 * dIn) / 2;
  const gmd = gmr * Math.exp(xOhmPerKft / K_PER_NEPER);
  return { dIn, strandedIn: dIn * STRANDED_OVER_SOLID, gmd };
}

/** IEC 60287-1-1 2.1: R_ac = R_dc (1 + ys + yp), three single-core cables in trefoil. */
function acOverDc(rdcOhmPerKft: number, dIn: number, spacingIn: number): number {
  const rPerM = rdcOhmPerKft / 304.8;
  const xs4 = ((8 * Math.PI * 60) / rPerM * 1e-7) ** 2;
  const f = xs4 / (192 + 0.8 * xs4);
  const ratio = dIn / spacingIn;
  const yp = f * ratio * ratio * (0.312 * ratio * ratio + 1.18 / (f + 0.27));
  return 1 + f + yp;
}

describe('NFPA 70-2023 Chapter 9 Table 9 (transcribed)', () => {
  it('lists 14 AWG to 1000 kcmil, 21 sizes', () => {
    expect(CHAPTER9_TABLE9.map((r) => r.size)).toEqual(['14', '12', '10', '8', '6', '4', '3', '2', '1', '1/0', '2/0', '3/0', '4/0', '250', '300', '350', '400', '500', '600', '750', '1000']);
  });

  it.each(CHAPTER9_TABLE9.map((r) => [r.size, r] as const))('%s: reactance implies a physical spacing by the geometry law (between touching and five diameters)', (_s, row) => {
    const { strandedIn, gmd } = geometry(row.size, row.xPvcAl);
    expect(gmd / strandedIn).toBeGreaterThanOrEqual(1);
    expect(gmd / strandedIn).toBeLessThanOrEqual(5);
  });

  it.each(CHAPTER9_TABLE9.map((r) => [r.size, r] as const))('%s: steel conduit reads 1.2–1.3 × the nonmagnetic reactance (common practice: magnetic conduit adds about 25 %)', (_s, row) => {
    expect(row.xSteel / row.xPvcAl).toBeGreaterThanOrEqual(1.2);
    expect(row.xSteel / row.xPvcAl).toBeLessThanOrEqual(1.3);
  });

  it.each(CHAPTER9_TABLE9.map((r) => [r.size, r] as const))('%s: Cu in PVC = Table 8 DC resistance × (1 + ys + yp) of IEC 60287-1-1, within 4 %', (_s, row) => {
    const { dIn, strandedIn, gmd } = geometry(row.size, row.xPvcAl);
    const predicted = dcResistanceOhmPerKft('cu', row.size) * acOverDc(dcResistanceOhmPerKft('cu', row.size), strandedIn, gmd);
    expect(dIn).toBeGreaterThan(0);
    expect(Math.abs(row.rCu[0] / predicted - 1)).toBeLessThanOrEqual(0.04);
  });

  it.each(CHAPTER9_TABLE9.filter((r) => r.rAl).map((r) => [r.size, r] as const))('%s: Al in PVC = Table 8 aluminum DC resistance × (1 + ys + yp), within 4 %', (_s, row) => {
    const { strandedIn, gmd } = geometry(row.size, row.xPvcAl);
    const rdc = dcResistanceOhmPerKft('al', row.size);
    expect(Math.abs(row.rAl![0] / (rdc * acOverDc(rdc, strandedIn, gmd)) - 1)).toBeLessThanOrEqual(0.04);
  });

  it.each(CHAPTER9_TABLE9.map((r) => [r.size, r] as const))('%s: metal conduit never lowers the resistance (eddy and hysteresis losses only add)', (_s, row) => {
    expect(row.rCu[1]).toBeGreaterThanOrEqual(row.rCu[0]);
    expect(row.rCu[2]).toBeGreaterThanOrEqual(row.rCu[0]);
  });

  // Printed effective Z at 0.85 PF (sin θ = 0.5268), copper, Ω/1000 ft, NFPA 70 Chapter 9 Table 9.
  it.each([
    ['4/0', 'pvc-conduit', 0.074],
    ['4/0', 'steel-conduit', 0.08],
    ['250', 'pvc-conduit', 0.066],
    ['250', 'steel-conduit', 0.073],
    ['500', 'pvc-conduit', 0.043],
    ['500', 'steel-conduit', 0.05],
    ['1000', 'pvc-conduit', 0.032],
    ['1000', 'steel-conduit', 0.04],
  ] as const)('%s Cu in %s: R·0.85 + X·0.5268 = the printed %f Ω/1000 ft within 0.001 (Chapter 9 Table 9, 0.85 PF column)', (size, wiring, printed) => {
    const z = table9Impedance('cu', size, racewayColumn(wiring))!;
    expect(Math.abs(z.rOhmPerKft * 0.85 + z.xOhmPerKft * 0.5268 - printed)).toBeLessThanOrEqual(0.001 + 1e-9);
  });

  it('wiring methods without a magnetic raceway read the PVC column; copper-clad aluminum reads aluminum; sizes outside the table have no value', () => {
    expect(racewayColumn('cable')).toBe('pvc');
    expect(racewayColumn('aluminum-conduit')).toBe('aluminum');
    expect(table9Impedance('cu-clad-al', '4/0', 'pvc')).toEqual(table9Impedance('al', '4/0', 'pvc'));
    expect(table9Impedance('cu', '700', 'pvc')).toBeNull();
    expect(table9Impedance('al', '14', 'pvc')).toBeNull();
  });
});
