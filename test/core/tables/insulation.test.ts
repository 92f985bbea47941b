import { describe, expect, it } from 'vitest';
import { INSULATIONS } from '../../../core/src/model/schema';
import { INSULATION_RATINGS, insulationRating } from '../../../core/src/tables/insulation';

describe('Table 310.4(1) insulation ratings (NFPA 70-2023 / 2020, common types, from memory)', () => {
  it('every schema insulation type has a rating', () => {
    expect(Object.keys(INSULATION_RATINGS).sort()).toEqual([...INSULATIONS].sort());
  });

  it('90 °C (dry rating): THHN, THWN-2, XHHW-2, RHH, RHW-2, USE-2, THHW', () => {
    for (const t of ['THHN', 'THWN-2', 'XHHW-2', 'RHH', 'RHW-2', 'USE-2', 'THHW'] as const) expect(insulationRating(t).tempC, t).toBe(90);
  });

  it('75 °C: THW, THWN, XHHW (wet rating), RHW, USE; 60 °C: TW, UF', () => {
    for (const t of ['THW', 'THWN', 'XHHW', 'RHW', 'USE'] as const) expect(insulationRating(t).tempC, t).toBe(75);
    for (const t of ['TW', 'UF'] as const) expect(insulationRating(t).tempC, t).toBe(60);
  });

  it('thermoplastic (T…): TW, UF, THW, THWN, THHN, THWN-2, THHW; thermoset (X…, R…, USE): XHHW, XHHW-2, RHH, RHW, RHW-2, USE, USE-2', () => {
    for (const t of ['TW', 'UF', 'THW', 'THWN', 'THHN', 'THWN-2', 'THHW'] as const) expect(insulationRating(t).thermalClass, t).toBe('thermoplastic');
    for (const t of ['XHHW', 'XHHW-2', 'RHH', 'RHW', 'RHW-2', 'USE', 'USE-2'] as const) expect(insulationRating(t).thermalClass, t).toBe('thermoset');
  });

  it('type letters: "-2" and "HH" mean 90 °C (manufacturers’ marking convention, common practice)', () => {
    for (const t of INSULATIONS) if (t.endsWith('-2') || t === 'THHN' || t === 'RHH') expect(insulationRating(t).tempC, t).toBe(90);
  });
});
