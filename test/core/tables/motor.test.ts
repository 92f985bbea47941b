import { describe, expect, it } from 'vitest';
import { motorColumnV, motorMaxDeviceA, motorTableFlcA } from '../../../core/src/tables/motor';

const HP_3 = [0.5, 0.75, 1, 1.5, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 40, 50, 60, 75, 100, 125, 150, 200];
const HP_1 = [1 / 6, 1 / 4, 1 / 3, 1 / 2, 3 / 4, 1, 1.5, 2, 3, 5, 7.5, 10];
const flc = (hp: number, v: number, ph: 1 | 3) => motorTableFlcA(hp, v, ph)!.flcA;

describe('Table 430.250, three-phase induction motors (NFPA 70-2023, from memory; checked by the ratios between columns)', () => {
  it.each(HP_3)('%s hp: the 460 V column is exactly half the 230 V column (same motor, twice the voltage)', (hp) => {
    expect(flc(hp, 480, 3) * 2).toBeCloseTo(flc(hp, 240, 3), 6);
  });
  it.each(HP_3)('%s hp: 208 V ≈ 1.10 × 230 V and 200 V ≈ 1.15 × 230 V, within 1.5 %', (hp) => {
    expect(Math.abs(flc(hp, 208, 3) / (1.1 * flc(hp, 240, 3)) - 1)).toBeLessThan(0.015);
    expect(Math.abs(flc(hp, 200, 3) / (1.15 * flc(hp, 240, 3)) - 1)).toBeLessThan(0.015);
  });
  it.each(HP_3.filter((hp) => hp >= 1))('%s hp at 460 V: efficiency × power factor from hp·746 / (√3·460·FLC) is 0.4–0.7 below 5 hp and 0.6–0.95 from 5 hp (handbook trend: small motors run at lower efficiency and power factor)', (hp) => {
    const etaPf = (hp * 746) / (Math.sqrt(3) * 460 * flc(hp, 480, 3));
    expect(etaPf).toBeGreaterThan(hp < 5 ? 0.4 : 0.6);
    expect(etaPf).toBeLessThan(hp < 5 ? 0.7 : 0.95);
  });
  it('worked values: 20 hp at 460 V is 27 A, 10 hp at 230 V is 28 A, 40 hp at 460 V is 52 A, 100 hp at 575 V is 99 A', () => {
    expect([flc(20, 480, 3), flc(10, 240, 3), flc(40, 480, 3), flc(100, 600, 3)]).toEqual([27, 28, 52, 99]);
  });
  it('a horsepower or voltage the table does not list gives no value (the nameplate is needed)', () => {
    expect(motorTableFlcA(8, 480, 3)).toBeNull();
    expect(motorTableFlcA(250, 208, 3)).toBeNull();
    expect(motorTableFlcA(5, 277, 1)).toBeNull();
  });
});

describe('Table 430.248, single-phase motors (NFPA 70-2023, from memory; checked by the ratios between columns)', () => {
  it.each(HP_1)('%s hp: the 115 V column is exactly twice the 230 V column', (hp) => {
    expect(flc(hp, 120, 1)).toBeCloseTo(2 * flc(hp, 240, 1), 6);
  });
  it.each(HP_1)('%s hp: 208 V ≈ 1.10 × 230 V within 1.5 %', (hp) => {
    expect(Math.abs(flc(hp, 208, 1) / (1.1 * flc(hp, 240, 1)) - 1)).toBeLessThan(0.015);
  });
  it('worked values: 1 hp at 115 V is 16 A, 5 hp at 230 V is 28 A', () => {
    expect([flc(1, 115, 1), flc(5, 230, 1)]).toEqual([16, 28]);
  });
});

describe('table columns by system voltage (Tables 430.248/430.250 headings)', () => {
  it('480 V uses 460 V, 240 V uses 230 V, 600 V uses 575 V, 208 V and 200 V their own, 120 V uses 115 V', () => {
    expect([motorColumnV(480, 3), motorColumnV(240, 3), motorColumnV(600, 3), motorColumnV(208, 3), motorColumnV(200, 1), motorColumnV(120, 1)]).toEqual([460, 230, 575, 208, 200, 115]);
  });
});

describe('Table 430.52 maximum device with Exception No. 1 (NFPA 70-2023 430.52(C)(1); 240.6(A))', () => {
  it('27 A on an inverse-time breaker: 250 % = 67.5 A → next standard rating 70 A', () => {
    expect(motorMaxDeviceA(27, 'induction', 'inverse-time-breaker', 2023)).toEqual({ pct: 250, rawA: 67.5, allowedA: 70 });
  });
  it('28 A on a dual-element fuse: 175 % = 49 A → 50 A; 40 A: 175 % = 70 A is standard and stays', () => {
    expect(motorMaxDeviceA(28, 'induction', 'dual-element-fuse', 2023).allowedA).toBe(50);
    expect(motorMaxDeviceA(40, 'induction', 'dual-element-fuse', 2023).allowedA).toBe(70);
  });
  it('27 A on a non-time-delay fuse: 300 % = 81 A → 90 A; wound-rotor on a breaker: 150 % = 40.5 A → 45 A', () => {
    expect(motorMaxDeviceA(27, 'induction', 'non-time-delay-fuse', 2023).allowedA).toBe(90);
    expect(motorMaxDeviceA(27, 'wound-rotor', 'inverse-time-breaker', 2023).allowedA).toBe(45);
  });
});
