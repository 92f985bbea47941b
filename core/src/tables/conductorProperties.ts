import type { ConductorSize, Material } from '../model/schema';
import { sizeIndexOf } from './sizes';

/**
 * Conductor properties, NFPA 70 Chapter 9 Table 8 (same values in the 2020 and
 * 2023 editions): area in circular mils and DC resistance at 75 °C of
 * stranded conductors, Ω per 1000 ft.
 *
 * Source: from memory, checked against public reproductions (areas and the
 * uncoated copper column). The aluminum column is also from memory and has
 * not been checked value by value; it agrees with the copper column × 1.64
 * to within 2 %, the ratio of the conductivities (61 % IACS aluminum), which
 * the tests hold it to. Some reproductions print 3.18 / 2.00 / 1.26 for
 * 12 / 10 / 8 AWG aluminum; we keep the values that fit the ratio.
 * Copper-clad aluminum (10 % copper by volume) is about 62 % IACS: we use the
 * aluminum column for it, an approximation stated here and in the report.
 *
 * Overall diameters of bare stranded conductors: from memory; the table's
 * in² column is π/4 × d² of them, and each is about 1.14–1.15 × the solid
 * diameter of its area (concentric class B stranding, common practice), which
 * the tests hold them to.
 *
 * Independent checks (test/core/tables/conductorProperties.test.ts): AWG areas
 * against the AWG diameter law of ASTM B258, d = 0.005 in × 92^((36 − n)/39),
 * within 1 %; kcmil sizes are the size × 1000; copper resistance against
 * ρ(20 °C) = 10.37 Ω·cmil/ft, α = 0.00393/°C, 75 °C, ~2 % stranding, within 3 %.
 */
export const CONDUCTOR_PROPERTIES_SOURCE =
  'NFPA 70-2023 / 2020 Chapter 9 Table 8, from memory, checked against public reproductions (aluminum column from memory only)';

export interface Table8Row {
  size: ConductorSize;
  areaCmil: number;
  /** Uncoated stranded copper, 75 °C, Ω/1000 ft. */
  cuOhmPerKft: number;
  /** Stranded aluminum, 75 °C, Ω/1000 ft. */
  alOhmPerKft: number;
  /** Overall diameter of the bare stranded conductor, in (its area counts in raceway fill, Chapter 9 Note 8). */
  strandedDiameterIn: number;
}

export const CHAPTER9_TABLE8: readonly Table8Row[] = [
  { size: '18', areaCmil: 1620, cuOhmPerKft: 7.95, alOhmPerKft: 13.1, strandedDiameterIn: 0.046 },
  { size: '16', areaCmil: 2580, cuOhmPerKft: 4.99, alOhmPerKft: 8.21, strandedDiameterIn: 0.058 },
  { size: '14', areaCmil: 4110, cuOhmPerKft: 3.14, alOhmPerKft: 5.17, strandedDiameterIn: 0.073 },
  { size: '12', areaCmil: 6530, cuOhmPerKft: 1.98, alOhmPerKft: 3.25, strandedDiameterIn: 0.092 },
  { size: '10', areaCmil: 10380, cuOhmPerKft: 1.24, alOhmPerKft: 2.04, strandedDiameterIn: 0.116 },
  { size: '8', areaCmil: 16510, cuOhmPerKft: 0.778, alOhmPerKft: 1.28, strandedDiameterIn: 0.146 },
  { size: '6', areaCmil: 26240, cuOhmPerKft: 0.491, alOhmPerKft: 0.808, strandedDiameterIn: 0.184 },
  { size: '4', areaCmil: 41740, cuOhmPerKft: 0.308, alOhmPerKft: 0.508, strandedDiameterIn: 0.232 },
  { size: '3', areaCmil: 52620, cuOhmPerKft: 0.245, alOhmPerKft: 0.403, strandedDiameterIn: 0.26 },
  { size: '2', areaCmil: 66360, cuOhmPerKft: 0.194, alOhmPerKft: 0.319, strandedDiameterIn: 0.292 },
  { size: '1', areaCmil: 83690, cuOhmPerKft: 0.154, alOhmPerKft: 0.253, strandedDiameterIn: 0.332 },
  { size: '1/0', areaCmil: 105600, cuOhmPerKft: 0.122, alOhmPerKft: 0.201, strandedDiameterIn: 0.372 },
  { size: '2/0', areaCmil: 133100, cuOhmPerKft: 0.0967, alOhmPerKft: 0.159, strandedDiameterIn: 0.418 },
  { size: '3/0', areaCmil: 167800, cuOhmPerKft: 0.0766, alOhmPerKft: 0.126, strandedDiameterIn: 0.47 },
  { size: '4/0', areaCmil: 211600, cuOhmPerKft: 0.0608, alOhmPerKft: 0.1, strandedDiameterIn: 0.528 },
  { size: '250', areaCmil: 250000, cuOhmPerKft: 0.0515, alOhmPerKft: 0.0847, strandedDiameterIn: 0.575 },
  { size: '300', areaCmil: 300000, cuOhmPerKft: 0.0429, alOhmPerKft: 0.0707, strandedDiameterIn: 0.63 },
  { size: '350', areaCmil: 350000, cuOhmPerKft: 0.0367, alOhmPerKft: 0.0605, strandedDiameterIn: 0.681 },
  { size: '400', areaCmil: 400000, cuOhmPerKft: 0.0321, alOhmPerKft: 0.0529, strandedDiameterIn: 0.728 },
  { size: '500', areaCmil: 500000, cuOhmPerKft: 0.0258, alOhmPerKft: 0.0424, strandedDiameterIn: 0.813 },
  { size: '600', areaCmil: 600000, cuOhmPerKft: 0.0214, alOhmPerKft: 0.0353, strandedDiameterIn: 0.893 },
  { size: '700', areaCmil: 700000, cuOhmPerKft: 0.0184, alOhmPerKft: 0.0303, strandedDiameterIn: 0.964 },
  { size: '750', areaCmil: 750000, cuOhmPerKft: 0.0171, alOhmPerKft: 0.0282, strandedDiameterIn: 0.998 },
  { size: '800', areaCmil: 800000, cuOhmPerKft: 0.0161, alOhmPerKft: 0.0265, strandedDiameterIn: 1.03 },
  { size: '900', areaCmil: 900000, cuOhmPerKft: 0.0143, alOhmPerKft: 0.0235, strandedDiameterIn: 1.094 },
  { size: '1000', areaCmil: 1000000, cuOhmPerKft: 0.0129, alOhmPerKft: 0.0212, strandedDiameterIn: 1.152 },
  { size: '1250', areaCmil: 1250000, cuOhmPerKft: 0.0103, alOhmPerKft: 0.0169, strandedDiameterIn: 1.289 },
  { size: '1500', areaCmil: 1500000, cuOhmPerKft: 0.00858, alOhmPerKft: 0.0141, strandedDiameterIn: 1.412 },
  { size: '1750', areaCmil: 1750000, cuOhmPerKft: 0.00735, alOhmPerKft: 0.0121, strandedDiameterIn: 1.526 },
  { size: '2000', areaCmil: 2000000, cuOhmPerKft: 0.00643, alOhmPerKft: 0.0106, strandedDiameterIn: 1.632 },
];

const BY_INDEX: readonly Table8Row[] = (() => {
  const rows: Table8Row[] = [];
  for (const row of CHAPTER9_TABLE8) rows[sizeIndexOf(row.size)] = row;
  return rows;
})();

/** Chapter 9 Table 8 area of a conductor size, circular mils. */
export function conductorAreaCmil(size: ConductorSize): number {
  return BY_INDEX[sizeIndexOf(size)]!.areaCmil;
}

/**
 * Chapter 9 Table 8 DC resistance at 75 °C, stranded, Ω/1000 ft, one conductor.
 * Copper-clad aluminum reads the aluminum column (approximation, see header).
 */
export function dcResistanceOhmPerKft(material: Material, size: ConductorSize): number {
  const row = BY_INDEX[sizeIndexOf(size)]!;
  return material === 'cu' ? row.cuOhmPerKft : row.alOhmPerKft;
}

/** Chapter 9 Table 8 area of a bare stranded conductor, in² (π/4 × its overall diameter²): a bare EGC's area in the fill (Note 8). */
export function bareAreaIn2(size: ConductorSize): number {
  const d = BY_INDEX[sizeIndexOf(size)]!.strandedDiameterIn;
  return Math.round((Math.PI / 4) * d * d * 10_000) / 10_000;
}
