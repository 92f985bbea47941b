import { describe, expect, it } from 'vitest';
import { baseAmpacityA } from '../../../core/src/tables/ampacity310_16';
import { smallConductorMaxOcpdA } from '../../../core/src/tables/smallConductor';
import { CONDUCTOR_SIZES, MATERIALS } from '../../../core/src/model/schema';

describe('240.4(D) small conductors (NFPA 70-2023 / 2020, from memory)', () => {
  it('copper: 18 AWG 7 A, 16 AWG 10 A, 14 AWG 15 A, 12 AWG 20 A, 10 AWG 30 A', () => {
    for (const edition of [2020, 2023] as const) {
      expect(smallConductorMaxOcpdA('cu', '18', edition)).toBe(7);
      expect(smallConductorMaxOcpdA('cu', '16', edition)).toBe(10);
      expect(smallConductorMaxOcpdA('cu', '14', edition)).toBe(15);
      expect(smallConductorMaxOcpdA('cu', '12', edition)).toBe(20);
      expect(smallConductorMaxOcpdA('cu', '10', edition)).toBe(30);
    }
  });

  it('aluminum and copper-clad aluminum: 12 AWG 15 A, 10 AWG 25 A', () => {
    for (const edition of [2020, 2023] as const)
      for (const m of ['al', 'cu-clad-al'] as const) {
        expect(smallConductorMaxOcpdA(m, '12', edition)).toBe(15);
        expect(smallConductorMaxOcpdA(m, '10', edition)).toBe(25);
      }
  });

  it('2023 adds 14 AWG copper-clad aluminum at 10 A; 2020 has no such entry; aluminum 14 AWG has none', () => {
    expect(smallConductorMaxOcpdA('cu-clad-al', '14', 2023)).toBe(10);
    expect(smallConductorMaxOcpdA('cu-clad-al', '14', 2020)).toBeNull();
    expect(smallConductorMaxOcpdA('al', '14', 2023)).toBeNull();
  });

  it('8 AWG and larger are outside 240.4(D)', () => {
    for (const m of MATERIALS)
      for (const size of CONDUCTOR_SIZES.slice(CONDUCTOR_SIZES.indexOf('8')))
        expect(smallConductorMaxOcpdA(m, size, 2023), `${m} ${size}`).toBeNull();
  });

  it('each limit equals the 60 °C Table 310.16 ampacity where the table lists one (the limits come from that column, common practice)', () => {
    for (const m of ['cu', 'al'] as const)
      for (const size of ['14', '12', '10'] as const) {
        const limit = smallConductorMaxOcpdA(m, size, 2023);
        const a60 = baseAmpacityA(m, size, 60);
        if (limit === null || a60 === null) continue;
        expect(limit, `${m} ${size}`).toBe(a60);
      }
  });
});
