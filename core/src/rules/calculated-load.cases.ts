import { runFacts, withoutSize, type RuleCases, type RunFactsOverrides } from './testing';

const S = 'NFPA 70-2023 215.2(A)(1)(a) and (b), 210.19(A)(1)(a) and (b), 230.42(A)';
const T = 'NFPA 70-2023 Table 310.16';
const D = 'NFPA 70-2023 Table 310.15(C)(1)';

/**
 * 3/0 Cu THHN in a raceway with six current-carrying conductors: 225 A (90 °C) × 0.80 = 180 A after
 * adjustment; 200 A in the 75 °C termination column before it.
 */
const derated = (o: RunFactsOverrides) => runFacts({ ampacityA: 180, ampacityUncorrectedA: 200, ...o });

export const cases: RuleCases = {
  meets: [
    {
      name: '150 A continuous on derated 3/0 Cu: 187.5 A ≤ 200 A before adjustment, and 150 A ≤ 180 A after (the two are never multiplied together)',
      facts: derated({ loadA: 150, calculatedLoadA: 187.5 }),
      source: `${S}; ${T}; ${D}`,
    },
    {
      name: 'at the limit: 160 A continuous on derated 3/0 Cu, 160 × 1.25 = 200 A = 200 A',
      facts: derated({ loadA: 160, calculatedLoadA: 200 }),
      source: `${S}; ${T}; ${D}`,
    },
    {
      name: '110 A continuous on 1/0 Cu at 75 °C (150 A): 137.5 A ≤ 150 A, 110 A ≤ 150 A',
      facts: runFacts({ size: '1/0', ampacityA: 150, loadA: 110, calculatedLoadA: 137.5 }),
      source: `${S}; ${T}`,
    },
  ],
  fails: [
    {
      name: 'across the limit: 161 A continuous on derated 3/0 Cu, 201.25 A > 200 A',
      facts: derated({ loadA: 161, calculatedLoadA: 201.25 }),
      expect: ['continuous'],
      source: `${S}; ${T}; ${D}`,
    },
    {
      name: '185 A noncontinuous on derated 3/0 Cu: within 200 A before adjustment, above 180 A after',
      facts: derated({ loadA: 185, calculatedLoadA: 185 }),
      expect: ['conditions'],
      source: `${S}; ${T}; ${D}`,
    },
    {
      name: '110 A continuous on 1 AWG Cu at 75 °C (130 A): 137.5 A > 130 A',
      facts: runFacts({ size: '1', ampacityA: 130, loadA: 110, calculatedLoadA: 137.5 }),
      expect: ['continuous'],
      source: `${S}; ${T}`,
    },
  ],
  unknown: [
    {
      name: 'load not known (no system voltage for a load given in amperes)',
      facts: runFacts({ loadA: null, calculatedLoadA: null }),
      expect: ['conditions', 'continuous'],
      source: S,
    },
  ],
};

// Issue 6, item 13: the first meeting case drawn without a size is unknown, never a failure.
cases.unknown = [...(cases.unknown ?? []), withoutSize(cases.meets[0]!, ['continuous', 'conditions'], S)];
