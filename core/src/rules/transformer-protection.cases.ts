import type { ConductorId } from '../model/schema';
import { runFacts, terminationAt, transformerFacts, type RuleCases, type RunFactsOverrides } from './testing';
import type { Termination, TransformerFacts } from './facts';

const S = 'NFPA 70-2023 Table 450.3(B)';

/**
 * 75 kVA, 480 V to 208 V, three-phase. Rated currents: 75 000 / (√3 × 480) =
 * 90.21 A primary, 75 000 / (√3 × 208) = 208.18 A secondary.
 * Primary only: 125 % = 112.76 A, next standard size 125 A.
 * Primary and secondary: primary 250 % = 225.53 A, so 225 A (no round-up);
 * secondary 125 % = 260.22 A, next standard size 300 A.
 */
const secondaryRun = (end: Termination, n = 1) =>
  runFacts({
    conductorIds: [`C-SEC-${n}` as ConductorId],
    size: '350',
    ampacityA: 310,
    lengthFt: 8,
    supplyOcpdA: null,
    supplyOcpdId: null,
    supplyOcpdKind: null,
    loadA: 180,
    calculatedLoadA: 180,
    termination: end,
  });
const breaker = (ratingA: number | null) => terminationAt('ocpd', { ratingA });
/** A board without a main whose every output is one of `count` breakers of `eachA` (450.3(B) Note 2). */
const mainLugBoard = (count: number, eachA: number, onlyOcpdsBelow = true) =>
  terminationAt('bus', { busType: 'panelboard', ratingA: 400, groupedOcpdCount: count, groupedOcpdSumA: count * eachA, onlyOcpdsBelow });
const N2 = `${S} Note 2 (up to six breakers grouped in one location count as the secondary device, ratings added)`;
/** The primary run, judged by this rule: ends at the transformer, fed by a breaker of `primaryA`. */
const primary = (primaryA: number | null, ends: Termination[], o: RunFactsOverrides = {}, t: Partial<TransformerFacts> = {}) =>
  runFacts({
    size: '3/0',
    ampacityA: 200,
    supplyOcpdA: primaryA,
    termination: terminationAt('transformer'),
    loadA: 78,
    calculatedLoadA: 78,
    transformer: transformerFacts({ kva: 75, primaryOcpdA: primaryA, ...t }),
    secondaries: ends.map((e, i) => secondaryRun(e, i + 1)),
    ...o,
  });

/** 3 kVA single-phase 480 V to 120 V: 3000 / 480 = 6.25 A primary, so 167 % = 10.44 A, no round-up. */
const SMALL: Partial<TransformerFacts> = { kva: 3, phases: 1, secondaryVoltsLL: 120, connection: 'single-phase-2w' };
const smallPrimary = (fuseA: number) =>
  primary(fuseA, [terminationAt('load')], { size: '14', ampacityA: 20, loadA: 5, calculatedLoadA: 5, supplyOcpdKind: 'fuse' }, { ...SMALL, primaryOcpdA: fuseA });

export const cases: RuleCases = {
  meets: [
    {
      name: 'primary protection only (secondary ends on a panelboard bus): 125 % of 90.21 A = 112.76 A, next standard size 125 A, and the primary breaker is 125 A',
      facts: primary(125, [terminationAt('bus', { ratingA: 225 })]),
      source: `${S}; NFPA 70-2023 240.6(A)`,
    },
    {
      name: 'primary and secondary: primary 225 A ≤ 250 % of 90.21 A = 225.53 A; secondary 250 A ≤ 125 % of 208.18 A = 260.22 A, next standard 300 A',
      facts: primary(225, [breaker(250)]),
      source: `${S}; NFPA 70-2023 240.6(A)`,
    },
    {
      name: 'primary and secondary at the limit: secondary breaker 300 A, the next standard size above 260.22 A',
      facts: primary(225, [breaker(300)]),
      source: `${S}; NFPA 70-2023 240.6(A)`,
    },
    {
      name: 'two secondary runs counted together: 150 A + 150 A = 300 A ≤ 300 A',
      facts: primary(225, [breaker(150), breaker(150)]),
      source: `${S} (Note 2, devices counted together)`,
    },
    {
      name: 'small transformer: 3 kVA single-phase at 480 V, 6.25 A × 1.67 = 10.44 A, so a 10 A primary fuse complies',
      facts: smallPrimary(10),
      source: `${S}; NFPA 70-2023 240.6(A)`,
    },
    {
      name: 'Note 2: the secondary lands on a main-lug board with six 50 A breakers, 300 A in all ≤ 300 A (125 % of 208.18 A = 260.22 A, next standard 300 A), so the 225 A primary (≤ 250 % of 90.21 A = 225.53 A) complies',
      facts: primary(225, [mainLugBoard(6, 50)]),
      source: `${N2}; NFPA 70-2023 240.6(A)`,
    },
  ],
  fails: [
    {
      name: 'Note 2 allows at most six: a main-lug board with seven 40 A breakers is no secondary device, so the 225 A primary exceeds the 125 A of primary-only protection',
      facts: primary(225, [mainLugBoard(7, 40)]),
      expect: ['primary'],
      source: N2,
    },
    {
      name: 'Note 2: six 60 A breakers on the main-lug board add up to 360 A > 300 A',
      facts: primary(225, [mainLugBoard(6, 60)]),
      expect: ['secondary'],
      source: N2,
    },
    {
      name: 'Note 2 needs every output through the grouped devices: a board with a conductor straight off its bus is no secondary device, so 225 A > 125 A primary-only',
      facts: primary(225, [mainLugBoard(3, 50, false)]),
      expect: ['primary'],
      source: N2,
    },
    {
      name: 'small transformer, primary only: 2.4 kVA single-phase 480 V is 5 A; 167 % is 8.35 A and a 15 A breaker exceeds it (no round-up under 9 A)',
      facts: primary(15, [terminationAt('bus')], {}, { kva: 2.4, phases: 1, secondaryVoltsLL: 240 }),
      expect: ['primary'],
      source: 'NFPA 70-2023 Table 450.3(B)',
    },
    {
      name: 'primary protection only: a 150 A primary breaker exceeds the 125 A that 125 % of 90.21 A (112.76 A) rounds up to',
      facts: primary(150, [terminationAt('bus', { ratingA: 225 })]),
      expect: ['primary'],
      source: `${S}; NFPA 70-2023 240.6(A)`,
    },
    {
      name: 'primary and secondary: a 250 A primary breaker exceeds 250 % of 90.21 A = 225.53 A (no round-up)',
      facts: primary(250, [breaker(250)]),
      expect: ['primary'],
      source: S,
    },
    {
      name: 'primary and secondary: a 350 A secondary breaker exceeds 300 A, the next standard size above 260.22 A',
      facts: primary(225, [breaker(350)]),
      expect: ['secondary'],
      source: `${S}; NFPA 70-2023 240.6(A)`,
    },
    {
      name: 'two secondary runs counted together: 200 A + 200 A = 400 A > 300 A',
      facts: primary(225, [breaker(200), breaker(200)]),
      expect: ['secondary'],
      source: `${S} (Note 2, devices counted together)`,
    },
    {
      name: 'small transformer: a 15 A primary fuse exceeds 167 % of 6.25 A = 10.44 A, and under 9 A there is no round-up',
      facts: smallPrimary(15),
      expect: ['primary'],
      source: S,
    },
  ],
  unknown: [
    {
      name: 'rating of the primary device not given',
      facts: primary(null, [breaker(250)]),
      expect: ['primary'],
      source: S,
    },
  ],
};
