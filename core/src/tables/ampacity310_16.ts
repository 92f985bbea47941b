import { CONDUCTOR_SIZES, type ConductorSize, type Material } from '../model/schema';
import { sizeIndexOf } from './sizes';

/**
 * NFPA 70 Table 310.16: allowable ampacities (A) of insulated conductors rated
 * up to 2000 V, not more than three current-carrying conductors in a raceway,
 * cable or earth, 30 °C ambient. Same values in the 2014, 2017, 2020 and 2023
 * editions (older reproductions differ).
 *
 * Source: NFPA 70-2023 and NFPA 70-2020 Table 310.16, from memory, checked
 * value by value against public reproductions.
 * Independent check: test/core/tables/ampacity310_16.test.ts (monotonic growth
 * with size and with temperature column, copper above aluminum, the per-area
 * current density falling with size, and published worked values of the 75 °C
 * copper column).
 *
 * Copper-clad aluminum uses the aluminum columns (the table heads them
 * "aluminum or copper-clad aluminum"). Aluminum has no 14 AWG row; 18 and
 * 16 AWG are not in the table at all (they are fixture and control sizes).
 */

/** Temperature columns of Table 310.16. */
export type TempColumnC = 60 | 75 | 90;

/** One row: [60 °C, 75 °C, 90 °C] for copper and for aluminum / copper-clad aluminum (null when no row). */
export interface Table310_16Row {
  size: ConductorSize;
  cu: readonly [number, number, number];
  al: readonly [number, number, number] | null;
}

export const TABLE_310_16_ID = 'nec-310.16';
export const TABLE_310_16_SOURCE = 'NFPA 70-2023 / 2020 Table 310.16, from memory, checked against public reproductions';

export const TABLE_310_16: readonly Table310_16Row[] = [
  { size: '14', cu: [15, 20, 25], al: null },
  { size: '12', cu: [20, 25, 30], al: [15, 20, 25] },
  { size: '10', cu: [30, 35, 40], al: [25, 30, 35] },
  { size: '8', cu: [40, 50, 55], al: [35, 40, 45] },
  { size: '6', cu: [55, 65, 75], al: [40, 50, 55] },
  { size: '4', cu: [70, 85, 95], al: [55, 65, 75] },
  { size: '3', cu: [85, 100, 115], al: [65, 75, 85] },
  { size: '2', cu: [95, 115, 130], al: [75, 90, 100] },
  { size: '1', cu: [110, 130, 145], al: [85, 100, 115] },
  { size: '1/0', cu: [125, 150, 170], al: [100, 120, 135] },
  { size: '2/0', cu: [145, 175, 195], al: [115, 135, 150] },
  { size: '3/0', cu: [165, 200, 225], al: [130, 155, 175] },
  { size: '4/0', cu: [195, 230, 260], al: [150, 180, 205] },
  { size: '250', cu: [215, 255, 290], al: [170, 205, 230] },
  { size: '300', cu: [240, 285, 320], al: [195, 230, 260] },
  { size: '350', cu: [260, 310, 350], al: [210, 250, 280] },
  { size: '400', cu: [280, 335, 380], al: [225, 270, 305] },
  { size: '500', cu: [320, 380, 430], al: [260, 310, 350] },
  { size: '600', cu: [350, 420, 475], al: [285, 340, 385] },
  { size: '700', cu: [385, 460, 520], al: [315, 375, 425] },
  { size: '750', cu: [400, 475, 535], al: [320, 385, 435] },
  { size: '800', cu: [410, 490, 555], al: [330, 395, 445] },
  { size: '900', cu: [435, 520, 585], al: [355, 425, 480] },
  { size: '1000', cu: [455, 545, 615], al: [375, 445, 500] },
  { size: '1250', cu: [495, 590, 665], al: [405, 485, 545] },
  { size: '1500', cu: [525, 625, 705], al: [435, 520, 585] },
  { size: '1750', cu: [545, 650, 735], al: [455, 545, 615] },
  { size: '2000', cu: [555, 665, 750], al: [470, 560, 630] },
];

/**
 * Flat lookup: index = (material row 0 Cu / 1 Al) × 90 + column × 30 + size index;
 * NaN where the table has no value. Built once so computeAmpacity does no search.
 */
const FLAT: Float64Array = (() => {
  const flat = new Float64Array(2 * 3 * CONDUCTOR_SIZES.length).fill(Number.NaN);
  for (const row of TABLE_310_16) {
    const i = sizeIndexOf(row.size);
    for (let c = 0; c < 3; c++) {
      flat[c * CONDUCTOR_SIZES.length + i] = row.cu[c]!;
      if (row.al) flat[3 * CONDUCTOR_SIZES.length + c * CONDUCTOR_SIZES.length + i] = row.al[c]!;
    }
  }
  return flat;
})();

const N = CONDUCTOR_SIZES.length;

function columnIndex(tempC: TempColumnC): number {
  return tempC === 60 ? 0 : tempC === 75 ? 1 : 2;
}

/**
 * Table 310.16 ampacity (A) of one conductor, or null where the table has no
 * value (18/16 AWG, aluminum 14 AWG). Copper-clad aluminum reads the aluminum columns.
 */
export function baseAmpacityA(material: Material, size: ConductorSize, tempC: TempColumnC): number | null {
  const i = sizeIndexOf(size);
  return i < 0 ? null : baseAmpacityAtIndex(material === 'cu', tempC, i);
}

/** baseAmpacityA by size index (see sizes.ts), for hot loops that already hold the index. */
export function baseAmpacityAtIndex(copper: boolean, tempC: TempColumnC, sizeIndex: number): number | null {
  const v = FLAT[(copper ? 0 : 3 * N) + columnIndex(tempC) * N + sizeIndex];
  return v === undefined || Number.isNaN(v) ? null : v;
}
