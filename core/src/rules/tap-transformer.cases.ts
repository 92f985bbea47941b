import { runFacts, terminationAt, transformerFacts, withoutSize, type RuleCases, type RunFactsOverrides } from './testing';
import type { ConductorId } from '../model/schema';

const S = 'NFPA 70-2023 240.21(B)(3)';
const T = 'NFPA 70-2023 Table 310.16';

/**
 * A 300 kVA 480 V to 208 V transformer tapped from a 600 A feeder. Primary:
 * 10 ft of 3/0 Cu (200 A) ending at the transformer. Secondary: 15 ft of
 * 750 kcmil Cu (475 A) into a single 450 A breaker.
 * Minimums: one third of 600 A = 200 A; 600 × 480 / 208 / 3 = 461.54 A.
 * (Table 450.3(B) with secondary protection allows 250 % of the 360.84 A
 * primary current, 902 A, so the 600 A feeder device also protects the transformer.)
 */
const secondary = (o: RunFactsOverrides = {}) =>
  runFacts({
    conductorIds: ['C-SEC-1' as ConductorId],
    size: '750',
    ampacityA: 475,
    lengthFt: 15,
    supplyOcpdA: null,
    supplyOcpdId: null,
    supplyOcpdKind: null,
    loadA: 400,
    calculatedLoadA: 400,
    termination: terminationAt('ocpd', { ratingA: 450 }),
    ...o,
  });

const primary = (o: RunFactsOverrides = {}, s: RunFactsOverrides = {}) =>
  runFacts({
    lengthFt: 10,
    termination: terminationAt('transformer'),
    // 400 A on the secondary is 400 × 208 / 480 = 173.33 A on the primary.
    loadA: 173.33,
    calculatedLoadA: 173.33,
    transformer: transformerFacts({ kva: 300, primaryOcpdA: 600, primaryOcpdId: null }),
    secondaries: [secondary(s)],
    ...o,
  });

export const cases: RuleCases = {
  meets: [
    {
      name: 'one third of 600 A is 200 A for the 3/0 Cu primary (200 A); 600 A × 480 V / 208 V / 3 = 461.54 A, so a 750 kcmil Cu secondary (475 A) qualifies; 10 ft + 15 ft = 25 ft',
      facts: primary(),
      source: `${S}; ${T}`,
    },
    {
      name: '112.5 kVA 480 V to 240 V from a 300 A feeder, all at the limits: 3 AWG Cu primary (100 A) = 300 / 3; 3/0 Cu secondary (200 A) = 300 × 2 / 3; 5 ft + 20 ft = 25 ft; 200 A breaker',
      facts: primary(
        {
          size: '3',
          ampacityA: 100,
          lengthFt: 5,
          supplyOcpdA: 300,
          loadA: 80,
          calculatedLoadA: 80,
          transformer: transformerFacts({ kva: 112.5, secondaryVoltsLL: 240, connection: 'delta-delta-3w', primaryOcpdA: 300 }),
        },
        { size: '3/0', ampacityA: 200, lengthFt: 20, loadA: 160, calculatedLoadA: 160, termination: terminationAt('ocpd', { ratingA: 200 }) },
      ),
      source: `${S}; ${T}`,
    },
    {
      name: 'secondary protected from damage by other approved means: met, subject to the AHJ accepting the means',
      facts: primary({}, { damageProtection: 'other-approved-means', inRaceway: false }),
      source: S,
    },
  ],
  fails: [
    {
      name: '600 A × 480 V / 208 V / 3 = 461.54 A, so a 700 kcmil Cu secondary at 75 °C (460 A) falls just short',
      facts: primary({}, { size: '700', ampacityA: 460 }),
      expect: ['secondaryThird'],
      source: `${S}; ${T}`,
    },
    {
      name: 'one third of 600 A is 200 A, so a 2/0 Cu primary at 75 °C (175 A) is too small',
      facts: primary({ size: '2/0', ampacityA: 175 }),
      expect: ['primaryThird'],
      source: `${S}; ${T}`,
    },
    {
      name: 'a 750 kcmil Cu secondary at 75 °C (475 A) meets one third of 600 A × 480/208 (461.54 A) but does not carry a 480 A load',
      facts: primary({}, { size: '750', ampacityA: 475, loadA: 480, calculatedLoadA: 480, termination: terminationAt('ocpd', { ratingA: 450 }) }),
      expect: ['load'],
      source: `${S}; ${T}; DOMAIN.md §5 (every tap carries its load)`,
    },
    {
      name: 'primary 10 ft + secondary 15.1 ft = 25.1 ft: over 25 ft',
      facts: primary({}, { lengthFt: 15.1 }),
      expect: ['length'],
      source: S,
    },
    {
      name: 'the tap ends in a breaker, not a transformer: there is no secondary to judge',
      facts: runFacts(),
      expect: ['transformer', 'oneSecondary', 'secondaryThird', 'load', 'length', 'single', 'device'],
      source: S,
    },
    {
      name: 'two secondary sets, each judged: the second (C-SEC-2) is 20 ft, so primary plus that set is over 25 ft while the first set holds',
      facts: primary({ secondaries: [secondary(), secondary({ conductorIds: ['C-SEC-2' as ConductorId], lengthFt: 20 })] }),
      expect: ['length'],
      source: `${S} (each secondary set: primary plus secondary not over 25 ft)`,
    },
    {
      name: 'primary exposed to physical damage',
      facts: primary({ damageProtection: 'none', inRaceway: false }),
      expect: ['damage'],
      source: S,
    },
    {
      name: 'secondary exposed to physical damage',
      facts: primary({}, { damageProtection: 'none', inRaceway: false }),
      expect: ['damage'],
      source: S,
    },
    {
      name: 'secondary ends in a panelboard with no main breaker: nothing limits the load to 475 A',
      facts: primary({}, { termination: terminationAt('bus', { ratingA: 600 }) }),
      expect: ['single', 'device'],
      source: S,
    },
    {
      name: 'secondary ends in a 500 A breaker: 500 A > 475 A',
      facts: primary({}, { termination: terminationAt('ocpd', { ratingA: 500 }) }),
      expect: ['device'],
      source: `${S}; ${T}`,
    },
  ],
  unknown: [
    {
      name: 'secondary length not given: primary plus secondary cannot be added up',
      facts: primary({}, { lengthFt: null }),
      expect: ['length'],
      source: S,
    },
    {
      name: 'rating of the feeder device not given: neither third can be computed',
      facts: primary({ supplyOcpdA: null, transformer: transformerFacts({ kva: 300, primaryOcpdA: null, primaryOcpdId: null }) }),
      expect: ['primaryThird', 'secondaryThird'],
      source: S,
    },
    {
      name: 'rating of the breaker at the end of the secondary not given',
      facts: primary({}, { termination: terminationAt('ocpd', { ratingA: null }) }),
      expect: ['device'],
      source: S,
    },
  ],
};

// Issue 6, item 13: the first meeting case drawn without a size is unknown, never a failure.
cases.unknown = [...(cases.unknown ?? []), withoutSize(cases.meets[0]!, ['primaryThird'], S)];
