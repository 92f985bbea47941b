import type { CodeEdition, MOTOR_TYPES } from '../model/schema';
import { isStandardRating, nextStandardRatingAbove } from './standardRatings';

/**
 * Motor full-load currents and the maximum branch-circuit short-circuit and
 * ground-fault device, NFPA 70 Article 430.
 *
 * Sources: Table 430.248 (single-phase AC motors) and Table 430.250
 * (three-phase AC induction motors, squirrel-cage and wound-rotor), unchanged
 * between the 2020 and 2023 editions; transcribed from memory and checked
 * value by value against public reproductions of older editions whose values
 * did not change. Table 430.52 (2023: Table 430.52(C)(1)) percentages, from
 * the 2020 text; 2023 adds "premium efficiency" to the Design B
 * energy-efficient row.
 * Independent checks (test/core/tables/motor.test.ts): the ratios between
 * columns (115 V = 2 × 230 V single-phase; 460 V = 230 V / 2 three-phase to
 * 200 hp; 208 V ≈ 1.10 × 230 V), and the trend FLC ≈ hp·746 / (√3·V·η·pf)
 * with η·pf between 0.6 and 0.9 for three-phase motors of 1 hp and more.
 */
export const MOTOR_TABLES_SOURCE = 'NFPA 70-2023 / 2020 Tables 430.248 and 430.250, from memory, checked against public reproductions';

/** Horsepower ratings of Table 430.248, smallest first. */
const HP_1PH = [1 / 6, 1 / 4, 1 / 3, 1 / 2, 3 / 4, 1, 1.5, 2, 3, 5, 7.5, 10] as const;
/** Table 430.248 columns: 115, 200, 208, 230 V. */
const FLC_1PH: Readonly<Record<115 | 200 | 208 | 230, readonly number[]>> = {
  115: [4.4, 5.8, 7.2, 9.8, 13.8, 16, 20, 24, 34, 56, 80, 100],
  200: [2.5, 3.3, 4.1, 5.6, 7.9, 9.2, 11.5, 13.8, 19.6, 32.2, 46.0, 57.5],
  208: [2.4, 3.2, 4.0, 5.4, 7.6, 8.8, 11.0, 13.2, 18.7, 30.8, 44.0, 55.0],
  230: [2.2, 2.9, 3.6, 4.9, 6.9, 8.0, 10, 12, 17, 28, 40, 50],
};

/** Horsepower ratings of Table 430.250 (induction motors), smallest first. */
const HP_3PH = [0.5, 0.75, 1, 1.5, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 40, 50, 60, 75, 100, 125, 150, 200, 250, 300, 350, 400, 450, 500] as const;
const N = null;
/** Table 430.250 induction-motor columns: 115, 200, 208, 230, 460, 575 V (null: no entry). */
const FLC_3PH: Readonly<Record<115 | 200 | 208 | 230 | 460 | 575, readonly (number | null)[]>> = {
  115: [4.4, 6.4, 8.4, 12.0, 13.6, N, N, N, N, N, N, N, N, N, N, N, N, N, N, N, N, N, N, N, N, N, N],
  200: [2.5, 3.7, 4.8, 6.9, 7.8, 11.0, 17.5, 25.3, 32.2, 48.3, 62.1, 78.2, 92, 120, 150, 177, 221, 285, 359, 414, 552, N, N, N, N, N, N],
  208: [2.4, 3.5, 4.6, 6.6, 7.5, 10.6, 16.7, 24.2, 30.8, 46.2, 59.4, 74.8, 88, 114, 143, 169, 211, 273, 343, 396, 528, N, N, N, N, N, N],
  230: [2.2, 3.2, 4.2, 6.0, 6.8, 9.6, 15.2, 22, 28, 42, 54, 68, 80, 104, 130, 154, 192, 248, 312, 360, 480, N, N, N, N, N, N],
  460: [1.1, 1.6, 2.1, 3.0, 3.4, 4.8, 7.6, 11, 14, 21, 27, 34, 40, 52, 65, 77, 96, 124, 156, 180, 240, 302, 361, 414, 477, 515, 590],
  575: [0.9, 1.3, 1.7, 2.4, 2.7, 3.9, 6.1, 9, 11, 17, 22, 27, 32, 41, 52, 62, 77, 99, 125, 144, 192, 242, 289, 336, 382, 412, 472],
};

/**
 * The table column a system voltage uses: the columns are rated motor
 * voltages, and a column serves systems of 110–120, 220–240, 440–480 and
 * 550–600 V (table heading); 200 V and 208 V have columns of their own.
 */
export function motorColumnV(systemV: number, phases: 1 | 3): number | null {
  const v = Math.round(systemV);
  if (v >= 110 && v <= 120) return 115;
  if (v === 200) return 200;
  if (v === 208) return 208;
  if (v >= 220 && v <= 240) return 230;
  if (phases === 3 && v >= 440 && v <= 480) return 460;
  if (phases === 3 && v >= 550 && v <= 600) return 575;
  return null;
}

/** The horsepower's index in a table, or -1 when the table lists no such rating. */
function hpIndex(list: readonly number[], hp: number): number {
  return list.findIndex((x) => Math.abs(x - hp) < 1e-6);
}

/**
 * Full-load current (A) of Table 430.248 or 430.250 for a motor of `hp` on a
 * system of `systemV` volts; null when the tables list no such horsepower or
 * voltage (then the nameplate current must be given).
 */
export function motorTableFlcA(hp: number, systemV: number, phases: 1 | 3): { flcA: number; columnV: number; table: string } | null {
  const col = motorColumnV(systemV, phases);
  if (col === null) return null;
  if (phases === 1) {
    const i = hpIndex(HP_1PH, hp);
    const row = FLC_1PH[col as 115 | 200 | 208 | 230];
    if (i < 0 || row === undefined) return null;
    return { flcA: row[i]!, columnV: col, table: 'Table 430.248' };
  }
  const i = hpIndex(HP_3PH, hp);
  const v = i < 0 ? null : FLC_3PH[col as 115 | 200 | 208 | 230 | 460 | 575][i];
  return v === null || v === undefined ? null : { flcA: v, columnV: col, table: 'Table 430.250' };
}

/** Table 430.52 rows (motor types) as the schema names them. */
export type MotorType = (typeof MOTOR_TYPES)[number];

/** Table 430.52 columns: the kind of branch-circuit short-circuit and ground-fault device. */
export type MotorDeviceKind = 'non-time-delay-fuse' | 'dual-element-fuse' | 'instantaneous-trip-breaker' | 'inverse-time-breaker';

/** Maximum rating or setting, per cent of the table FLC (Table 430.52; 2023 Table 430.52(C)(1)). */
const PCT: Readonly<Record<MotorType, Readonly<Record<MotorDeviceKind, number>>>> = {
  induction: { 'non-time-delay-fuse': 300, 'dual-element-fuse': 175, 'instantaneous-trip-breaker': 800, 'inverse-time-breaker': 250 },
  'design-b-energy-efficient': { 'non-time-delay-fuse': 300, 'dual-element-fuse': 175, 'instantaneous-trip-breaker': 1100, 'inverse-time-breaker': 250 },
  synchronous: { 'non-time-delay-fuse': 300, 'dual-element-fuse': 175, 'instantaneous-trip-breaker': 800, 'inverse-time-breaker': 250 },
  'wound-rotor': { 'non-time-delay-fuse': 150, 'dual-element-fuse': 150, 'instantaneous-trip-breaker': 800, 'inverse-time-breaker': 150 },
  dc: { 'non-time-delay-fuse': 150, 'dual-element-fuse': 150, 'instantaneous-trip-breaker': 250, 'inverse-time-breaker': 150 },
};

export function motorDevicePct(type: MotorType, device: MotorDeviceKind): number {
  return PCT[type][device];
}

/**
 * The largest device 430.52(C)(1) allows: FLC × the table percentage, and
 * where that is not a standard rating (240.6(A)) the next standard rating
 * above it (Exception No. 1). Exception No. 2 (a larger device where this
 * one will not start the motor) needs the starting facts and is not applied.
 */
export function motorMaxDeviceA(flcA: number, type: MotorType, device: MotorDeviceKind, edition: CodeEdition): { pct: number; rawA: number; allowedA: number } {
  const pct = motorDevicePct(type, device);
  const rawA = Math.round(flcA * pct) / 100;
  const kind = device.endsWith('fuse') ? 'fuse' : 'breaker';
  const allowedA = isStandardRating(rawA, edition, kind) ? rawA : (nextStandardRatingAbove(rawA, edition, kind) ?? rawA);
  return { pct, rawA, allowedA };
}
