import { runFacts, terminationAt, type RuleCases, type RunFactsOverrides } from './testing';

const S = 'NFPA 70-2023 230.90(A)';
const B = 'NFPA 70-2023 240.4(B)';
const T = 'NFPA 70-2023 Table 310.16';

/** Service conductors from the utility (no OCPD ahead of them) into the service main breaker. */
const service = (o: RunFactsOverrides = {}) =>
  runFacts({ lengthFt: 60, supplyOcpdA: null, supplyOcpdId: null, supplyOcpdKind: null, ...o });
const main = (ratingA: number) => terminationAt('ocpd', { label: 'MAIN', ratingA });

export const cases: RuleCases = {
  meets: [
    {
      name: '3/0 Cu at 75 °C (200 A) into a 200 A main: 200 A ≤ 200 A',
      facts: service({ termination: main(200) }),
      source: `${S}; ${T}`,
    },
    {
      name: '500 kcmil Cu at 75 °C (380 A) into a 400 A main: 400 A is the next standard rating above 380 A',
      facts: service({ size: '500', ampacityA: 380, loadA: 320, calculatedLoadA: 320, termination: main(400) }),
      source: `${S}; ${B}; NFPA 70-2023 240.6(A); ${T}`,
    },
    {
      name: '2 × 500 kcmil Cu at 75 °C (2 × 380 = 760 A) into an 800 A main: next standard rating above 760 A, not over 800 A',
      facts: service({ size: '500', parallelSets: 2, ampacityA: 760, loadA: 640, calculatedLoadA: 640, termination: main(800) }),
      source: `${S}; ${B}; NFPA 70-2023 240.6(A); ${T}`,
    },
    {
      name: '3 × 400 kcmil Cu at 75 °C (3 × 335 = 1005 A) into a 1000 A main: 1000 A ≤ 1005 A',
      facts: service({ size: '400', parallelSets: 3, ampacityA: 1005, loadA: 850, calculatedLoadA: 850, termination: main(1000) }),
      source: `${S}; NFPA 70-2023 240.4(C); ${T}`,
    },
  ],
  fails: [
    {
      name: '3/0 Cu at 75 °C (200 A) into a 225 A main: 200 A is itself a standard rating, so no round-up',
      facts: service({ termination: main(225) }),
      expect: ['loadEnd'],
      source: `${S}; ${B}; ${T}`,
    },
    {
      name: '500 kcmil Cu at 75 °C (380 A) into a 450 A main: the next standard rating above 380 A is 400 A',
      facts: service({ size: '500', ampacityA: 380, loadA: 320, calculatedLoadA: 320, termination: main(450) }),
      expect: ['loadEnd'],
      source: `${S}; ${B}; ${T}`,
    },
    {
      name: '240.4(C): 2 × 750 kcmil Cu at 75 °C (2 × 475 = 950 A) into a 1000 A main: over 800 A there is no round-up',
      facts: service({ size: '750', parallelSets: 2, ampacityA: 950, loadA: 800, calculatedLoadA: 800, termination: main(1000) }),
      expect: ['loadEnd'],
      source: `${S}; NFPA 70-2023 240.4(C); ${T}`,
    },
  ],
  unknown: [
    {
      name: 'ampacity not known',
      facts: service({ ampacityA: null, termination: main(200) }),
      expect: ['loadEnd'],
      source: S,
    },
    {
      name: 'rating of the main breaker not given',
      facts: service({ termination: terminationAt('ocpd', { label: 'MAIN', ratingA: null }) }),
      expect: ['loadEnd'],
      source: S,
    },
  ],
};
