import { describe, expect, it } from 'vitest';
import { cite, citeRef, sectionFor } from '../../../core/src/tables/citations';

describe('citations and edition numbering (NFPA 70-2020 vs 2023, from memory)', () => {
  it('cite builds an NEC citation for the edition', () => {
    expect(cite('240.21(B)(2)', 2020)).toEqual({ code: 'NEC', edition: 2020, section: '240.21(B)(2)' });
  });

  it('ambient correction table: Table 310.15(B)(1) in 2020, Table 310.15(B)(1)(1) in 2023', () => {
    expect(sectionFor('ambient-correction-table', 2020)).toBe('Table 310.15(B)(1)');
    expect(sectionFor('ambient-correction-table', 2023)).toBe('Table 310.15(B)(1)(1)');
  });

  it('tap conductor definition: 240.2 in 2020, Article 100 in 2023', () => {
    expect(citeRef('tap-conductor-definition', 2020)).toEqual({ code: 'NEC', edition: 2020, section: '240.2' });
    expect(citeRef('tap-conductor-definition', 2023)).toEqual({ code: 'NEC', edition: 2023, section: 'Article 100' });
  });
});
