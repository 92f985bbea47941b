import { CONDUCTOR_SIZES, type ConductorSize, type Material } from '../model/schema';

/**
 * Position of each size in CONDUCTOR_SIZES (18 AWG = 0 … 2000 kcmil = 29).
 * The tables in this folder are stored as arrays in this order, so a lookup is
 * one property read and one array index, with no string building.
 */
export const SIZE_INDEX: Readonly<Record<ConductorSize, number>> = Object.freeze(
  Object.fromEntries(CONDUCTOR_SIZES.map((s, i) => [s, i])) as Record<ConductorSize, number>,
);

// Hot paths read a Map: keys like '14' and '1/0' mix integer-like and named
// properties on a plain object, which makes keyed reads slower.
const SIZE_INDEX_MAP: ReadonlyMap<string, number> = new Map(CONDUCTOR_SIZES.map((s, i) => [s, i]));

/** Position of a size in CONDUCTOR_SIZES, or -1 for a value that is not a conductor size. */
export function sizeIndexOf(size: ConductorSize): number {
  return SIZE_INDEX_MAP.get(size) ?? -1;
}

/** Index of 14 AWG, the smallest size in Table 310.16. */
export const SIZE_INDEX_14 = CONDUCTOR_SIZES.indexOf('14');
/** Index of 1/0 AWG, the smallest size 310.10(G) lets run in parallel. */
export const SIZE_INDEX_1_0 = CONDUCTOR_SIZES.indexOf('1/0');
const SIZE_INDEX_250 = CONDUCTOR_SIZES.indexOf('250');

/** True for kcmil sizes (250 and larger); false for AWG sizes. */
export function isKcmilSize(size: ConductorSize): boolean {
  return sizeIndexOf(size) >= SIZE_INDEX_250;
}

const SIZE_LABELS: readonly string[] = CONDUCTOR_SIZES.map((s, i) => (i >= SIZE_INDEX_250 ? `${s} kcmil` : `${s} AWG`));

/** What a label says where the size is not given (the schema lets it be unknown, like a length). */
export const UNKNOWN_SIZE_LABEL = 'size unknown';

/** Trade label for a size: '12 AWG', '4/0 AWG', '500 kcmil'; 'size unknown' when none is given. */
export function sizeLabel(size: ConductorSize | null | undefined): string {
  if (size === null || size === undefined) return UNKNOWN_SIZE_LABEL;
  return SIZE_LABELS[sizeIndexOf(size)] ?? String(size);
}

/** Position of a material in MATERIALS (cu 0, al 1, cu-clad-al 2), or -1 for an unknown value. */
export function materialIndexOf(material: Material): number {
  return material === 'cu' ? 0 : material === 'al' ? 1 : material === 'cu-clad-al' ? 2 : -1;
}

const MATERIAL_LABELS: Readonly<Record<Material, string>> = { cu: 'Cu', al: 'Al', 'cu-clad-al': 'Cu-clad Al' };
const MATERIAL_NAMES: Readonly<Record<Material, string>> = { cu: 'copper', al: 'aluminum', 'cu-clad-al': 'copper-clad aluminum' };

/** Short material label for tables and step texts: 'Cu', 'Al', 'Cu-clad Al'. */
export function materialLabel(material: Material): string {
  return MATERIAL_LABELS[material];
}

/** Material in words for messages: 'copper', 'aluminum', 'copper-clad aluminum'. */
export function materialName(material: Material): string {
  return MATERIAL_NAMES[material];
}
