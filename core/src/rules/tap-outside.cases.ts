import { runFacts, terminationAt, withoutSize, type RuleCases, type RunFactsOverrides } from './testing';

const S = 'NFPA 70-2023 240.21(B)(5)';
const T = 'NFPA 70-2023 Table 310.16';

const MAIN = { ratingA: 200, atDisconnectingMeans: true, disconnectLocation: 'outside' } as const;

/** 180 ft of 3/0 Cu (200 A) outdoors from a 600 A feeder to a 200 A breaker that is part of a disconnect outside the building. */
const tap = (o: RunFactsOverrides = {}) =>
  runFacts({ lengthFt: 180, outdoors: true, termination: terminationAt('ocpd', MAIN), ...o });

export const cases: RuleCases = {
  meets: [
    {
      name: '180 ft of 3/0 Cu (200 A) outdoors from a 600 A feeder into a 200 A breaker at a disconnect outside: no length limit and no one-third rule',
      facts: tap(),
      source: `${S}; ${T}`,
    },
    {
      name: 'the disconnecting means may be inside, nearest the point of entrance',
      facts: tap({ termination: terminationAt('ocpd', { ...MAIN, disconnectLocation: 'inside-nearest-entrance' }) }),
      source: S,
    },
    {
      name: '1/0 Cu at 75 °C (150 A), 400 ft outdoors from an 800 A feeder into a 150 A breaker at the disconnect: 150 A ≤ 150 A, however small against 800 A',
      facts: tap({ lengthFt: 400, size: '1/0', ampacityA: 150, supplyOcpdA: 800, loadA: 120, termination: terminationAt('ocpd', { ...MAIN, ratingA: 150 }) }),
      source: `${S}; ${T}`,
    },
    {
      name: 'protected from damage by other approved means instead of a raceway: met, subject to the AHJ accepting the means',
      facts: tap({ damageProtection: 'other-approved-means', inRaceway: false }),
      source: S,
    },
  ],
  fails: [
    {
      name: '3/0 Cu at 75 °C (200 A) serving a 210 A load does not carry it',
      facts: tap({ loadA: 210, calculatedLoadA: 210 }),
      expect: ['load'],
      source: `${S}; ${T}; DOMAIN.md §5 (every tap carries its load)`,
    },
    {
      name: 'runs inside the building before it reaches its termination',
      facts: tap({ outdoors: false }),
      expect: ['outdoors'],
      source: S,
    },
    {
      name: 'exposed to physical damage',
      facts: tap({ damageProtection: 'none', inRaceway: false }),
      expect: ['damage'],
      source: S,
    },
    {
      name: 'ends in a group of breakers, not a single breaker or set of fuses',
      facts: tap({ termination: terminationAt('ocpd', { ...MAIN, single: false }) }),
      expect: ['single'],
      source: S,
    },
    {
      name: '3/0 Cu at 75 °C (200 A) into a 225 A breaker: 225 A > 200 A',
      facts: tap({ termination: terminationAt('ocpd', { ...MAIN, ratingA: 225 }) }),
      expect: ['device'],
      source: `${S}; ${T}`,
    },
    {
      name: 'the breaker is neither part of nor next to the disconnecting means',
      facts: tap({ termination: terminationAt('ocpd', { ...MAIN, atDisconnectingMeans: false }) }),
      expect: ['atDisconnect'],
      source: S,
    },
    {
      name: 'the disconnecting means is deep inside the building, not nearest the point of entrance',
      facts: tap({ termination: terminationAt('ocpd', { ...MAIN, disconnectLocation: 'elsewhere' }) }),
      expect: ['accessible'],
      source: S,
    },
    {
      name: 'ends on a panelboard bus: no single device, none at a disconnect',
      facts: tap({ termination: terminationAt('bus', { ratingA: 200 }) }),
      expect: ['single', 'device', 'atDisconnect', 'accessible'],
      source: S,
    },
  ],
  unknown: [
    {
      name: 'where the disconnecting means is was not given',
      facts: tap({ termination: terminationAt('ocpd', { ...MAIN, disconnectLocation: null }) }),
      expect: ['accessible'],
      source: S,
    },
    {
      name: 'rating of the breaker at the end not given',
      facts: tap({ termination: terminationAt('ocpd', { ...MAIN, ratingA: null }) }),
      expect: ['device'],
      source: S,
    },
    {
      name: 'ampacity not known',
      facts: tap({ ampacityA: null }),
      expect: ['load', 'device'],
      source: S,
    },
  ],
};

// Issue 6, item 13: the first meeting case drawn without a size is unknown, never a failure.
cases.unknown = [...(cases.unknown ?? []), withoutSize(cases.meets[0]!, ['load', 'device'], S)];
