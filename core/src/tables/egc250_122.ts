import type { CodeEdition, ConductorSize, Material } from '../model/schema';
import { conductorAreaCmil } from './conductorProperties';
import { CONDUCTOR_SIZES } from '../model/schema';
import { sizeIndexOf } from './sizes';

/**
 * Minimum size of a wire-type equipment grounding conductor (EGC) by the
 * rating of the automatic OCPD ahead of the circuit: NFPA 70-2023 / 2020
 * Table 250.122.
 *
 * Source: from memory, checked value by value against public reproductions
 * of the 2017–2023 editions. The 5000 A and 6000 A aluminum rows read
 * 1250 kcmil from 2020 on (1200 kcmil, not a Table 310.16 size, in 2017 and
 * earlier); both editions Linewright supports print 1250.
 * Read the first row whose rating is not exceeded by the OCPD; never
 * interpolate (there is no 30 A or 40 A row: 25–60 A reads the 60 A row).
 * Aluminum and copper-clad aluminum share a column.
 *
 * Independent checks (test/core/tables/egc250_122.test.ts): both columns rise
 * with the rating; each aluminum entry is at least the copper entry's
 * conductance (Al ≈ 61 % IACS needs ≥ 1.5 × the copper area, Chapter 9
 * Table 8 circular mils, within the table's own rounding); the worked
 * examples of 250.122(B) and (F).
 */
export const EGC_TABLE_SOURCE = 'NFPA 70-2023 / 2020 Table 250.122, from memory, checked against public reproductions';

export interface EgcRow {
  /** OCPD rating not exceeding, A. */
  maxOcpdA: number;
  cu: ConductorSize;
  /** Aluminum or copper-clad aluminum. */
  al: ConductorSize;
}

export const TABLE_250_122: readonly EgcRow[] = Object.freeze([
  { maxOcpdA: 15, cu: '14', al: '12' },
  { maxOcpdA: 20, cu: '12', al: '10' },
  { maxOcpdA: 60, cu: '10', al: '8' },
  { maxOcpdA: 100, cu: '8', al: '6' },
  { maxOcpdA: 200, cu: '6', al: '4' },
  { maxOcpdA: 300, cu: '4', al: '2' },
  { maxOcpdA: 400, cu: '3', al: '1' },
  { maxOcpdA: 500, cu: '2', al: '1/0' },
  { maxOcpdA: 600, cu: '1', al: '2/0' },
  { maxOcpdA: 800, cu: '1/0', al: '3/0' },
  { maxOcpdA: 1000, cu: '2/0', al: '4/0' },
  { maxOcpdA: 1200, cu: '3/0', al: '250' },
  { maxOcpdA: 1600, cu: '4/0', al: '350' },
  { maxOcpdA: 2000, cu: '250', al: '400' },
  { maxOcpdA: 2500, cu: '350', al: '600' },
  { maxOcpdA: 3000, cu: '400', al: '600' },
  { maxOcpdA: 4000, cu: '500', al: '750' },
  { maxOcpdA: 5000, cu: '700', al: '1250' },
  { maxOcpdA: 6000, cu: '800', al: '1250' },
] satisfies EgcRow[]);

/**
 * Table 250.122 minimum EGC for an OCPD rating, or null above 6000 A (off the
 * table) or for a rating that is not a positive number. The edition argument
 * is kept so a future edition's change lands here; 2020 and 2023 agree.
 */
export function egcSizeForOcpd(ratingA: number, material: Material, edition: CodeEdition): ConductorSize | null {
  void edition;
  if (!(ratingA > 0)) return null;
  const row = TABLE_250_122.find((r) => ratingA <= r.maxOcpdA);
  if (!row) return null;
  return material === 'cu' ? row.cu : row.al;
}

/** The smallest Table 310.16 size of at least `areaCmil` circular mils, or null above 2000 kcmil. */
export function smallestSizeWithAreaCmil(areaCmil: number): ConductorSize | null {
  for (const s of CONDUCTOR_SIZES) if (conductorAreaCmil(s) >= areaCmil) return s;
  return null;
}

/** The larger of two sizes. */
export function largerSize(a: ConductorSize, b: ConductorSize): ConductorSize {
  return sizeIndexOf(a) >= sizeIndexOf(b) ? a : b;
}
