import type { CodeEdition, ConductorSize, Material } from '../model/schema';
import { conductorAreaCmil } from './conductorProperties';
import { smallestSizeWithAreaCmil } from './egc250_122';
import { sizeIndexOf } from './sizes';

/**
 * Minimum size of a supply-side bonding jumper (service equipment, the
 * secondary of a separately derived system, 250.30(A)(2)) by the size of the
 * largest ungrounded supply conductor in the raceway: NFPA 70-2023 / 2020
 * Table 250.102(C)(1), with 250.102(C)(1)'s rule above the table: over
 * 1100 kcmil copper or 1750 kcmil aluminum, an area of at least 12.5 % of the
 * ungrounded conductor's (never more than that conductor itself). Paralleled
 * in several raceways, each raceway's jumper is sized by the conductors in
 * that raceway (250.102(C)(2)). Aluminum and copper-clad aluminum share a
 * column; the jumper is taken of the supply conductors' material.
 *
 * Source: from memory, checked against public reproductions of the 2017–2023
 * editions (the rows match the first rows of Table 250.66, from which the
 * table was split). Independent checks (test/core/tables/bondingJumper250_102.test.ts):
 * both columns rise with the row; the last row's copper jumper (2/0, 133 100 cmil)
 * is within a few percent of 12.5 % of 1100 kcmil (137 500 cmil), so the 12.5 %
 * rule continues the table; every row's jumper is at least 12 % of the row's
 * largest conductor (Chapter 9 Table 8 areas).
 */
export const BONDING_JUMPER_SOURCE = 'NFPA 70-2023 / 2020 Table 250.102(C)(1) and 250.102(C)(1), from memory, checked against public reproductions';

export interface BondingJumperRow {
  /** Largest ungrounded copper conductor of the row. */
  maxCu: ConductorSize;
  /** Largest ungrounded aluminum or copper-clad aluminum conductor of the row. */
  maxAl: ConductorSize;
  /** Jumper, copper. */
  cu: ConductorSize;
  /** Jumper, aluminum or copper-clad aluminum. */
  al: ConductorSize;
}

export const TABLE_250_102_C1: readonly BondingJumperRow[] = Object.freeze([
  { maxCu: '2', maxAl: '1/0', cu: '8', al: '6' },
  { maxCu: '1/0', maxAl: '3/0', cu: '6', al: '4' },
  { maxCu: '3/0', maxAl: '250', cu: '4', al: '2' },
  { maxCu: '350', maxAl: '500', cu: '2', al: '1/0' },
  { maxCu: '600', maxAl: '900', cu: '1/0', al: '3/0' },
  // 1100 kcmil is not a Table 310.16 size: the row ends at 1000 kcmil among the sizes a drawing can hold.
  { maxCu: '1000', maxAl: '1750', cu: '2/0', al: '4/0' },
] satisfies BondingJumperRow[]);

/** Above these, 12.5 % of the area (250.102(C)(1)): 1100 kcmil Cu, 1750 kcmil Al, circular mils. */
export const TWELVE_AND_A_HALF_ABOVE_CMIL = { cu: 1_100_000, al: 1_750_000 } as const;

export interface BondingJumperSize {
  size: ConductorSize | null;
  /** 'table': read from Table 250.102(C)(1); 'percent': 12.5 % of the supply conductor's area. */
  basis: 'table' | 'percent';
  /** For 'percent': the area needed, cmil. */
  neededCmil: number | null;
}

/**
 * The supply-side bonding jumper for one raceway whose largest ungrounded
 * conductor is `phaseSize` of `material`. The edition argument is kept so a
 * future edition's change lands here; 2020 and 2023 agree.
 */
export function supplySideBondingJumper(phaseSize: ConductorSize, material: Material, edition: CodeEdition): BondingJumperSize {
  void edition;
  const cu = material === 'cu';
  const i = sizeIndexOf(phaseSize);
  const row = TABLE_250_102_C1.find((r) => i <= sizeIndexOf(cu ? r.maxCu : r.maxAl));
  if (row) return { size: cu ? row.cu : row.al, basis: 'table', neededCmil: null };
  const area = conductorAreaCmil(phaseSize);
  const neededCmil = 0.125 * area;
  const found = smallestSizeWithAreaCmil(neededCmil);
  // Never larger than the supply conductor itself.
  const size = found === null || sizeIndexOf(found) > i ? phaseSize : found;
  return { size, basis: 'percent', neededCmil };
}
