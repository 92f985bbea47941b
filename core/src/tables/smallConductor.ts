import { CODE_EDITIONS, CONDUCTOR_SIZES, MATERIALS, type CodeEdition, type ConductorSize, type Material } from '../model/schema';
import { materialIndexOf, sizeIndexOf } from './sizes';

/**
 * Small-conductor rule, NFPA 70 240.4(D): the largest overcurrent device for
 * 18–10 AWG conductors, whatever their ampacity (unless 240.4(E) or (G)
 * applies, which the caller decides).
 *
 * Source: NFPA 70-2023 and NFPA 70-2020 240.4(D)(1)–(7), from memory, checked
 * against public reproductions. 18 and 16 AWG copper carry extra conditions
 * (continuous load, listed cords or fixture wire) the caller must check.
 * 2023 adds 14 AWG copper-clad aluminum at 10 A; 2020 has no 14 AWG
 * aluminum or copper-clad aluminum entry.
 * Independent check: test/core/tables/smallConductor.test.ts (each entry, and
 * that every limit is at or below the 60 °C Table 310.16 ampacity, the
 * ordinary reason for the rule, common practice).
 */
export const SMALL_CONDUCTOR_SOURCE = 'NFPA 70-2023 / 2020 240.4(D), from memory, checked against public reproductions';

type Entry = Partial<Record<ConductorSize, number>>;

const COPPER: Entry = { '18': 7, '16': 10, '14': 15, '12': 20, '10': 30 };
const ALUMINUM: Entry = { '12': 15, '10': 25 };
const CU_CLAD_AL_2023: Entry = { '14': 10, '12': 15, '10': 25 };

const LIMITS: Readonly<Record<CodeEdition, Readonly<Record<Material, Entry>>>> = {
  2020: { cu: COPPER, al: ALUMINUM, 'cu-clad-al': ALUMINUM },
  2023: { cu: COPPER, al: ALUMINUM, 'cu-clad-al': CU_CLAD_AL_2023 },
};

/** Flat lookup by [edition 2020 = 0, 2023 = 1][material index][size index]; 0 = not covered. */
const FLAT: Uint8Array = (() => {
  const flat = new Uint8Array(2 * MATERIALS.length * CONDUCTOR_SIZES.length);
  CODE_EDITIONS.forEach((edition, e) =>
    MATERIALS.forEach((material, m) =>
      CONDUCTOR_SIZES.forEach((size, i) => {
        flat[(e * MATERIALS.length + m) * CONDUCTOR_SIZES.length + i] = LIMITS[edition][material][size] ?? 0;
      }),
    ),
  );
  return flat;
})();

/** 240.4(D) largest OCPD (A) for a small conductor, or null when 240.4(D) does not cover it. */
export function smallConductorMaxOcpdA(material: Material, size: ConductorSize, edition: CodeEdition): number | null {
  return smallConductorMaxOcpdAtIndex(edition, materialIndexOf(material), sizeIndexOf(size));
}

/** smallConductorMaxOcpdA by material and size index (see sizes.ts), for hot loops. */
export function smallConductorMaxOcpdAtIndex(edition: CodeEdition, materialIndex: number, sizeIndex: number): number | null {
  if (materialIndex < 0 || sizeIndex < 0) return null;
  const v = FLAT[((edition === 2020 ? 0 : 1) * MATERIALS.length + materialIndex) * CONDUCTOR_SIZES.length + sizeIndex];
  return v ? v : null;
}
