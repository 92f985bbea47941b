import { secondaryRunFacts, terminationAt, withoutSize, type RuleCases, type RunFactsOverrides } from './testing';

const S = 'NFPA 70-2023 240.21(C)(4)';
const T = 'NFPA 70-2023 Table 310.16';

const MAIN = { ratingA: 400, atDisconnectingMeans: true, disconnectLocation: 'outside' } as const;

/**
 * A 150 kVA pad-mounted transformer outdoors (480 V to 208 V, 200 A primary
 * breaker): 120 ft of 600 kcmil Cu (420 A) outdoors to a 400 A main breaker
 * at the building's disconnecting means, outside.
 */
const secondary = (o: RunFactsOverrides = {}) =>
  secondaryRunFacts({
    size: '600',
    ampacityA: 420,
    lengthFt: 120,
    outdoors: true,
    loadA: 350,
    calculatedLoadA: 350,
    termination: terminationAt('ocpd', MAIN),
    ...o,
  });

export const cases: RuleCases = {
  meets: [
    {
      name: '120 ft of 600 kcmil Cu at 75 °C (420 A) outdoors into a 400 A breaker at a disconnect outside: no length limit, 400 A ≤ 420 A',
      facts: secondary(),
      source: `${S}; ${T}`,
    },
    {
      name: 'the disconnecting means may be inside, nearest the point of entrance',
      facts: secondary({ termination: terminationAt('ocpd', { ...MAIN, disconnectLocation: 'inside-nearest-entrance' }) }),
      source: S,
    },
    {
      name: '500 ft of 2 × 250 kcmil Cu at 75 °C (2 × 255 = 510 A) into a 500 A breaker: any length, 500 A ≤ 510 A',
      facts: secondary({ lengthFt: 500, size: '250', parallelSets: 2, ampacityA: 510, termination: terminationAt('ocpd', { ...MAIN, ratingA: 500 }) }),
      source: `${S}; ${T}`,
    },
    {
      name: 'at the limit: 600 kcmil Cu at 75 °C (420 A) into an adjustable-trip breaker whose long-time setting, behind restricted access, is 420 A: 420 A ≤ 420 A',
      facts: secondary({ termination: terminationAt('ocpd', { ...MAIN, ratingA: 420 }) }),
      source: `${S}; NFPA 70-2023 240.6(C); ${T}`,
    },
  ],
  fails: [
    {
      name: '600 kcmil Cu at 75 °C (420 A) serving a 430 A load does not carry it',
      facts: secondary({ loadA: 430, calculatedLoadA: 430 }),
      expect: ['load'],
      source: 'NFPA 70-2023 240.21(C)(4); NFPA 70-2023 Table 310.16; DOMAIN.md §5 (the conductor carries its load)',
    },
    {
      name: 'runs inside the building before it reaches its termination',
      facts: secondary({ outdoors: false }),
      expect: ['outdoors'],
      source: S,
    },
    {
      name: 'exposed to physical damage',
      facts: secondary({ damageProtection: 'none', inRaceway: false }),
      expect: ['damage'],
      source: S,
    },
    {
      name: 'ends in a group of breakers, not a single breaker or set of fuses',
      facts: secondary({ termination: terminationAt('ocpd', { ...MAIN, single: false }) }),
      expect: ['single'],
      source: S,
    },
    {
      name: '600 kcmil Cu at 75 °C (420 A) into a 450 A breaker: 450 A > 420 A',
      facts: secondary({ termination: terminationAt('ocpd', { ...MAIN, ratingA: 450 }) }),
      expect: ['device'],
      source: `${S}; ${T}`,
    },
    {
      name: 'the breaker is neither part of nor next to the disconnecting means',
      facts: secondary({ termination: terminationAt('ocpd', { ...MAIN, atDisconnectingMeans: false }) }),
      expect: ['atDisconnect'],
      source: S,
    },
    {
      name: 'the disconnecting means is deep inside the building, not nearest the point of entrance',
      facts: secondary({ termination: terminationAt('ocpd', { ...MAIN, disconnectLocation: 'elsewhere' }) }),
      expect: ['accessible'],
      source: S,
    },
    {
      name: 'ends on a switchboard bus: no single device, none at a disconnect',
      facts: secondary({ termination: terminationAt('bus', { busType: 'switchboard', ratingA: 400 }) }),
      expect: ['single', 'device', 'atDisconnect', 'accessible'],
      source: S,
    },
  ],
  unknown: [
    {
      name: 'where the disconnecting means is was not given',
      facts: secondary({ termination: terminationAt('ocpd', { ...MAIN, disconnectLocation: null }) }),
      expect: ['accessible'],
      source: S,
    },
    {
      name: 'rating of the breaker at the end not given',
      facts: secondary({ termination: terminationAt('ocpd', { ...MAIN, ratingA: null }) }),
      expect: ['device'],
      source: S,
    },
  ],
};

// Issue 6, item 13: the first meeting case drawn without a size is unknown, never a failure.
cases.unknown = [...(cases.unknown ?? []), withoutSize(cases.meets[0]!, ['load', 'device'], S)];
