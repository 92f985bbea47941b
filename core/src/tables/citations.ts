import type { Citation } from '../analyze/types';
import type { CodeEdition } from '../model/schema';

/**
 * Building citations and the section numbers that differ between the
 * editions Linewright supports (NFPA 70-2020 and NFPA 70-2023).
 *
 * Source: NFPA 70-2020 and NFPA 70-2023 section numbering, from memory,
 * checked against public reproductions.
 * Independent check: test/core/tables/citations.test.ts (each edition's number).
 */

/** A citation of an NEC section in the given edition. */
export function cite(section: string, edition: CodeEdition): Citation {
  return { code: 'NEC', edition, section };
}

/** Things whose section or table number depends on the edition. */
export type EditionDependentRef = 'ambient-correction-table' | 'tap-conductor-definition';

const SECTIONS: Readonly<Record<EditionDependentRef, Readonly<Record<CodeEdition, string>>>> = {
  // 2023 split the ambient table in two ((1): 30 °C basis, (2): 40 °C basis).
  'ambient-correction-table': { 2020: 'Table 310.15(B)(1)', 2023: 'Table 310.15(B)(1)(1)' },
  // 2023 moved the definitions of Article 240 into Article 100.
  'tap-conductor-definition': { 2020: '240.2', 2023: 'Article 100' },
};

/** Section or table number of an edition-dependent reference. */
export function sectionFor(ref: EditionDependentRef, edition: CodeEdition): string {
  return SECTIONS[ref][edition];
}

/** Citation of an edition-dependent reference. */
export function citeRef(ref: EditionDependentRef, edition: CodeEdition): Citation {
  return cite(SECTIONS[ref][edition], edition);
}
