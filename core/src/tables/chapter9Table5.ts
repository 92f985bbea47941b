import type { ConductorSize, Insulation } from '../model/schema';

/**
 * Approximate overall diameter and area of insulated conductors: NFPA 70-2023
 * / 2020 Chapter 9 Table 5, the THHN/THWN/THWN-2 rows (14 AWG to 1000 kcmil,
 * the table's last), the XHH/XHHW/XHHW-2 rows and the TW/THW/THHW/THW-2 rows
 * (14 AWG to 2000 kcmil).
 *
 * Source: from memory, checked value by value against a public reproduction
 * (these rows are unchanged since the 1999 edition). RHH, RHW, RHW-2, USE,
 * USE-2 and UF are not transcribed: the takeoff says so and does not size a
 * raceway for them rather than guess. Compact conductors (Table 5A) are not
 * covered.
 * Independent check (test/core/tables/chapter9.test.ts): π/4 × d² gives every
 * area within 0.0001 in².
 */
export const CHAPTER9_TABLE5_SOURCE =
  'NFPA 70-2023 / 2020 Chapter 9 Table 5, THHN/THWN/THWN-2, XHH/XHHW/XHHW-2 and TW/THW/THHW/THW-2 rows, from memory, checked against a public reproduction';

export type Table5Family = 'THHN/THWN/THWN-2' | 'XHH/XHHW/XHHW-2' | 'TW/THW/THHW/THW-2';

export interface Table5Row {
  size: ConductorSize;
  /** Approximate overall diameter, in. */
  diameterIn: number;
  /** Approximate area, in². */
  areaIn2: number;
}

type Pair = readonly [size: ConductorSize, diameterIn: number, areaIn2: number];

function rows(values: readonly Pair[]): readonly Table5Row[] {
  return Object.freeze(values.map(([size, diameterIn, areaIn2]) => Object.freeze({ size, diameterIn, areaIn2 })));
}

export const CHAPTER9_TABLE5: Readonly<Record<Table5Family, readonly Table5Row[]>> = Object.freeze({
  'THHN/THWN/THWN-2': rows([
    ['14', 0.111, 0.0097], ['12', 0.13, 0.0133], ['10', 0.164, 0.0211], ['8', 0.216, 0.0366], ['6', 0.254, 0.0507],
    ['4', 0.324, 0.0824], ['3', 0.352, 0.0973], ['2', 0.384, 0.1158], ['1', 0.446, 0.1562], ['1/0', 0.486, 0.1855],
    ['2/0', 0.532, 0.2223], ['3/0', 0.584, 0.2679], ['4/0', 0.642, 0.3237], ['250', 0.711, 0.397], ['300', 0.766, 0.4608],
    ['350', 0.817, 0.5242], ['400', 0.864, 0.5863], ['500', 0.949, 0.7073], ['600', 1.051, 0.8676], ['700', 1.122, 0.9887],
    ['750', 1.156, 1.0496], ['800', 1.188, 1.1085], ['900', 1.252, 1.2311], ['1000', 1.31, 1.3478],
  ]),
  'XHH/XHHW/XHHW-2': rows([
    ['14', 0.133, 0.0139], ['12', 0.152, 0.0181], ['10', 0.176, 0.0243], ['8', 0.236, 0.0437], ['6', 0.274, 0.059],
    ['4', 0.322, 0.0814], ['3', 0.35, 0.0962], ['2', 0.382, 0.1146], ['1', 0.442, 0.1534], ['1/0', 0.482, 0.1825],
    ['2/0', 0.528, 0.219], ['3/0', 0.58, 0.2642], ['4/0', 0.638, 0.3197], ['250', 0.705, 0.3904], ['300', 0.76, 0.4536],
    ['350', 0.811, 0.5166], ['400', 0.858, 0.5782], ['500', 0.943, 0.6984], ['600', 1.053, 0.8709], ['700', 1.124, 0.9923],
    ['750', 1.158, 1.0532], ['800', 1.19, 1.1122], ['900', 1.254, 1.2351], ['1000', 1.312, 1.3519],
    ['1250', 1.479, 1.718], ['1500', 1.602, 2.0157], ['1750', 1.716, 2.3127], ['2000', 1.822, 2.6073],
  ]),
  // 14–8 AWG share the XHHW diameters; from 6 AWG the thicker wall (the RHH/RHW rows without outer covering read the same).
  'TW/THW/THHW/THW-2': rows([
    ['14', 0.133, 0.0139], ['12', 0.152, 0.0181], ['10', 0.176, 0.0243], ['8', 0.236, 0.0437], ['6', 0.304, 0.0726],
    ['4', 0.352, 0.0973], ['3', 0.38, 0.1134], ['2', 0.412, 0.1333], ['1', 0.492, 0.1901], ['1/0', 0.532, 0.2223],
    ['2/0', 0.578, 0.2624], ['3/0', 0.63, 0.3117], ['4/0', 0.688, 0.3718], ['250', 0.765, 0.4596], ['300', 0.82, 0.5281],
    ['350', 0.871, 0.5958], ['400', 0.918, 0.6619], ['500', 1.003, 0.7901], ['600', 1.113, 0.9729], ['700', 1.184, 1.101],
    ['750', 1.218, 1.1652], ['800', 1.25, 1.2272], ['900', 1.314, 1.3561], ['1000', 1.372, 1.4784],
    ['1250', 1.539, 1.8602], ['1500', 1.662, 2.1695], ['1750', 1.776, 2.4773], ['2000', 1.882, 2.7818],
  ]),
});

/** The Table 5 family an insulation type is listed under, or null when its rows are not transcribed. */
export function table5Family(insulation: Insulation): Table5Family | null {
  switch (insulation) {
    case 'THHN':
    case 'THWN':
    case 'THWN-2':
      return 'THHN/THWN/THWN-2';
    case 'XHHW':
    case 'XHHW-2':
      return 'XHH/XHHW/XHHW-2';
    case 'TW':
    case 'THW':
    case 'THHW':
      return 'TW/THW/THHW/THW-2';
    default:
      return null;
  }
}

/** Table 5 area of one insulated conductor, in², or null when the insulation or size is not transcribed. */
export function insulatedAreaIn2(insulation: Insulation, size: ConductorSize): number | null {
  const family = table5Family(insulation);
  if (family === null) return null;
  return CHAPTER9_TABLE5[family].find((r) => r.size === size)?.areaIn2 ?? null;
}
