import type { ConductorSize, Material, WiringMethod } from '../model/schema';
import { sizeIndexOf } from './sizes';

/**
 * AC resistance and reactance of 600 V cables, three single conductors in one
 * conduit, three-phase, 60 Hz, conductors at 75 °C: ohms to neutral per
 * 1000 ft. NFPA 70-2023 Chapter 9 Table 9 (same values in 2020).
 *
 * Source: from memory, checked value by value against two independent public
 * reproductions of the code table. One public copy prints 1/0 Cu in aluminum
 * conduit as 0.12; both reproductions of the code table give 0.13, kept here.
 *
 * Independent checks (test/core/tables/chapter9Table9.test.ts):
 * - Reactance against the geometry law X = 2πf·(μ0/2π)·ln(GMD/GMR): the centre
 *   spacing each value implies lies between touching conductors and five
 *   diameters, and steel conduit reads 1.2–1.3 × the nonmagnetic column.
 * - Resistance (PVC column) against Chapter 9 Table 8 DC resistance corrected
 *   for AC by the skin and proximity factors of IEC 60287-1-1 (2.1.2–2.1.4),
 *   using the spacing the reactance implies, within 4 % (the table prints two
 *   figures, so rounding alone reaches 3.2 % at 10 AWG).
 *
 * Which column: steel conduit reads the steel columns, aluminum conduit the
 * aluminum ones; PVC conduit, cable, cable tray and open wiring read the PVC
 * (nonmagnetic) columns, common practice for conductors without a magnetic
 * enclosure around the three phases. Copper-clad aluminum reads the aluminum
 * columns (the same approximation as Table 8). Sizes the table does not list
 * (18, 16, 700, 800, 900 and 1250 kcmil and larger) have no value here.
 */
export const TABLE9_SOURCE =
  'NFPA 70-2023 / 2020 Chapter 9 Table 9, from memory, checked against two public reproductions';

export type RacewayColumn = 'pvc' | 'aluminum' | 'steel';

export interface Table9Row {
  size: ConductorSize;
  /** Reactance, PVC or aluminum conduit, Ω/1000 ft. */
  xPvcAl: number;
  /** Reactance, steel conduit, Ω/1000 ft. */
  xSteel: number;
  /** Copper AC resistance by conduit: PVC, aluminum, steel. */
  rCu: readonly [number, number, number];
  /** Aluminum AC resistance by conduit: PVC, aluminum, steel; null where the table has none (14 AWG). */
  rAl: readonly [number, number, number] | null;
}

export const CHAPTER9_TABLE9: readonly Table9Row[] = [
  { size: '14', xPvcAl: 0.058, xSteel: 0.073, rCu: [3.1, 3.1, 3.1], rAl: null },
  { size: '12', xPvcAl: 0.054, xSteel: 0.068, rCu: [2.0, 2.0, 2.0], rAl: [3.2, 3.2, 3.2] },
  { size: '10', xPvcAl: 0.05, xSteel: 0.063, rCu: [1.2, 1.2, 1.2], rAl: [2.0, 2.0, 2.0] },
  { size: '8', xPvcAl: 0.052, xSteel: 0.065, rCu: [0.78, 0.78, 0.78], rAl: [1.3, 1.3, 1.3] },
  { size: '6', xPvcAl: 0.051, xSteel: 0.064, rCu: [0.49, 0.49, 0.49], rAl: [0.81, 0.81, 0.81] },
  { size: '4', xPvcAl: 0.048, xSteel: 0.06, rCu: [0.31, 0.31, 0.31], rAl: [0.51, 0.51, 0.51] },
  { size: '3', xPvcAl: 0.047, xSteel: 0.059, rCu: [0.25, 0.25, 0.25], rAl: [0.4, 0.41, 0.4] },
  { size: '2', xPvcAl: 0.045, xSteel: 0.057, rCu: [0.19, 0.2, 0.2], rAl: [0.32, 0.32, 0.32] },
  { size: '1', xPvcAl: 0.046, xSteel: 0.057, rCu: [0.15, 0.16, 0.16], rAl: [0.25, 0.26, 0.25] },
  { size: '1/0', xPvcAl: 0.044, xSteel: 0.055, rCu: [0.12, 0.13, 0.12], rAl: [0.2, 0.21, 0.2] },
  { size: '2/0', xPvcAl: 0.043, xSteel: 0.054, rCu: [0.1, 0.1, 0.1], rAl: [0.16, 0.16, 0.16] },
  { size: '3/0', xPvcAl: 0.042, xSteel: 0.052, rCu: [0.077, 0.082, 0.079], rAl: [0.13, 0.13, 0.13] },
  { size: '4/0', xPvcAl: 0.041, xSteel: 0.051, rCu: [0.062, 0.067, 0.063], rAl: [0.1, 0.11, 0.1] },
  { size: '250', xPvcAl: 0.041, xSteel: 0.052, rCu: [0.052, 0.057, 0.054], rAl: [0.085, 0.09, 0.086] },
  { size: '300', xPvcAl: 0.041, xSteel: 0.051, rCu: [0.044, 0.049, 0.045], rAl: [0.071, 0.076, 0.072] },
  { size: '350', xPvcAl: 0.04, xSteel: 0.05, rCu: [0.038, 0.043, 0.039], rAl: [0.061, 0.066, 0.063] },
  { size: '400', xPvcAl: 0.04, xSteel: 0.049, rCu: [0.033, 0.038, 0.035], rAl: [0.054, 0.059, 0.055] },
  { size: '500', xPvcAl: 0.039, xSteel: 0.048, rCu: [0.027, 0.032, 0.029], rAl: [0.043, 0.048, 0.045] },
  { size: '600', xPvcAl: 0.039, xSteel: 0.048, rCu: [0.023, 0.028, 0.025], rAl: [0.036, 0.041, 0.038] },
  { size: '750', xPvcAl: 0.038, xSteel: 0.048, rCu: [0.019, 0.024, 0.021], rAl: [0.029, 0.034, 0.031] },
  { size: '1000', xPvcAl: 0.037, xSteel: 0.046, rCu: [0.015, 0.019, 0.018], rAl: [0.023, 0.027, 0.025] },
];

const BY_INDEX: readonly (Table9Row | undefined)[] = (() => {
  const rows: (Table9Row | undefined)[] = [];
  for (const row of CHAPTER9_TABLE9) rows[sizeIndexOf(row.size)] = row;
  return rows;
})();

/** The Table 9 column a wiring method reads (see the header). */
export function racewayColumn(wiring: WiringMethod): RacewayColumn {
  return wiring === 'steel-conduit' ? 'steel' : wiring === 'aluminum-conduit' ? 'aluminum' : 'pvc';
}

const COLUMN_INDEX: Readonly<Record<RacewayColumn, 0 | 1 | 2>> = { pvc: 0, aluminum: 1, steel: 2 };

/** R and X of one conductor, Ω/1000 ft, or null when Table 9 has no value for it. */
export function table9Impedance(material: Material, size: ConductorSize, column: RacewayColumn): { rOhmPerKft: number; xOhmPerKft: number } | null {
  const r = table9ROhmPerKft(material, size, column);
  return Number.isNaN(r) ? null : { rOhmPerKft: r, xOhmPerKft: table9XOhmPerKft(size, column) };
}

/** R of one conductor, Ω/1000 ft, NaN when Table 9 has no value (no object: the studies read it per conductor). */
export function table9ROhmPerKft(material: Material, size: ConductorSize, column: RacewayColumn): number {
  const row = BY_INDEX[sizeIndexOf(size)];
  const rs = row ? (material === 'cu' ? row.rCu : row.rAl) : null;
  return rs ? rs[COLUMN_INDEX[column]] : Number.NaN;
}

/** X of one conductor, Ω/1000 ft, NaN when Table 9 has no row for the size. */
export function table9XOhmPerKft(size: ConductorSize, column: RacewayColumn): number {
  const row = BY_INDEX[sizeIndexOf(size)];
  return row ? (column === 'steel' ? row.xSteel : row.xPvcAl) : Number.NaN;
}
