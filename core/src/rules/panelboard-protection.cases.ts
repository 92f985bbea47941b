import type { NodeId } from '../model/schema';
import type { PanelboardFacts } from './panelboard-protection';
import { transformerFacts, type RuleCases } from './testing';

const S = 'NFPA 70-2023 408.36';
const B = 'NFPA 70-2023 408.36(B)';

const panel = (o: Partial<PanelboardFacts> = {}): PanelboardFacts => ({
  edition: 2023,
  id: 'PNL-A' as NodeId,
  label: 'PNL-A',
  ratingA: 225,
  device: { id: 'FDR' as NodeId, label: 'FDR', ratingA: 225, where: 'supply-side' },
  ...o,
  transformer: o.transformer ?? null,
});
const device = (ratingA: number | null, where: 'main' | 'supply-side' = 'supply-side') => ({ id: 'CB' as NodeId, label: 'CB', ratingA, where });

export const cases: RuleCases<PanelboardFacts> = {
  meets: [
    { name: 'main-lug 225 A panelboard on a 225 A feeder breaker: the supply-side device is not above the rating', facts: panel(), source: S },
    { name: '225 A panelboard with a 200 A main breaker in it', facts: panel({ device: device(200, 'main') }), source: S },
    { name: 'at the limit: a 225 A main in a 225 A panelboard', facts: panel({ device: device(225, 'main') }), source: S },
    {
      name: '408.36(B) exception: 10 kVA single-phase 2-wire 480 V to 240 V, 20 A primary breaker, 20 × 480 / 240 = 40 A ≤ a 60 A main-lug panelboard',
      facts: panel({ ratingA: 60, device: device(20), transformer: transformerFacts({ kva: 10, phases: 1, secondaryVoltsLL: 240, connection: 'single-phase-2w' }) }),
      source: `${B}; NFPA 70-2023 240.21(C)(1)`,
    },
  ],
  fails: [
    {
      name: 'a 10 ft tap into a 225 A main-lug panelboard off a 600 A feeder: the first device upstream is 600 A > 225 A',
      facts: panel({ device: device(600) }),
      expect: ['rating'],
      source: S,
    },
    {
      name: 'across the limit: a 250 A feeder breaker ahead of a 225 A main-lug panelboard',
      facts: panel({ device: device(250) }),
      expect: ['rating'],
      source: S,
    },
    {
      name: 'a transformer secondary into a main-lug panelboard: 45 kVA 480 V to 208Y/120 V (4-wire) with a 70 A primary breaker; the primary device does not count',
      facts: panel({ ratingA: 150, device: device(70), transformer: transformerFacts({ kva: 45, connection: 'delta-wye' }) }),
      expect: ['device'],
      source: `${B}; NFPA 70-2023 240.21(C)(1) (a 4-wire wye secondary never qualifies)`,
    },
    {
      name: '408.36(B) exception across the limit: a 40 A primary breaker × 480 / 240 = 80 A > a 60 A panelboard on a single-phase 2-wire secondary',
      facts: panel({ ratingA: 60, device: device(40), transformer: transformerFacts({ kva: 10, phases: 1, secondaryVoltsLL: 240, connection: 'single-phase-2w' }) }),
      expect: ['rating'],
      source: B,
    },
    {
      name: 'a main-lug panelboard used as service equipment: no OCPD anywhere on its supply side (2020 and later have no exception for several service disconnects in one panelboard)',
      facts: panel({ device: null }),
      expect: ['device'],
      source: `${S}; NFPA 70-2020 408.36 (old Exception No. 1 removed)`,
    },
  ],
  unknown: [
    { name: 'panelboard rating not given', facts: panel({ ratingA: null }), expect: ['rating'], source: S },
    { name: 'rating of the feeder breaker ahead not given', facts: panel({ device: device(null) }), expect: ['rating'], source: S },
  ],
};
