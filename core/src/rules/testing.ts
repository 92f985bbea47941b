import type { ConductorId, NodeId } from '../model/schema';
import { smallConductorMaxOcpdA } from '../tables/smallConductor';
import { transformerFullLoadA } from '../tables/transformer';
import type { GeneratorFacts, MotorRunFacts, RunFacts, Termination, TransformerFacts } from './facts';

/**
 * Fixture builders for the rules' reference tables (`<id>.cases.ts`) and the
 * one test that runs them (test/core/rules/rules.test.ts). Pure data, no I/O.
 */

/** One reference case: facts in, the expected result, and where that expectation comes from. */
export type Case<F = RunFacts> = {
  /** Carries the arithmetic: 'one third of 600 A is 200 A, so 3/0 Cu at 75 °C (200 A) meets a 25 ft tap'. */
  name: string;
  facts: F;
  /** In `fails`: exactly the ids of the failing conditions. In `unknown`: exactly the ids of the unknown ones. */
  expect?: string[];
  /** Where the expected outcome comes from: 'NFPA 70-2023 240.21(B)(2)', 'common practice', 'from memory'. */
  source: string;
};

/** A rule's reference table, ESLint RuleTester style. */
export type RuleCases<F = RunFacts> = { meets: Case<F>[]; fails: Case<F>[]; unknown?: Case<F>[] };

const id = <T extends string>(s: string): T => s as T;

/** Overrides for `runFacts`; `site` is merged field by field onto the defaults. */
export type RunFactsOverrides = Omit<Partial<RunFacts>, 'site'> & { site?: Partial<RunFacts['site']> };

/**
 * Where a run ends. Defaults per kind: an OCPD is a single 200 A breaker, a bus
 * a 225 A panelboard; other kinds carry no rating.
 */
export function terminationAt(kind: Termination['kind'] = 'ocpd', overrides: Partial<Termination> = {}): Termination {
  const none: Termination = {
    kind,
    nodeId: null,
    label: '',
    single: false,
    ratingA: null,
    atDisconnectingMeans: false,
    disconnectLocation: null,
    busType: null,
    groupedOcpdSumA: null,
    groupedOcpdCount: 0,
    onlyOcpdsBelow: false,
  };
  const byKind: Partial<Termination> =
    kind === 'ocpd'
      ? { nodeId: id<NodeId>('CB-END'), label: 'CB-END', single: true, ratingA: 200 }
      : kind === 'bus'
        ? { nodeId: id<NodeId>('PNL-A'), label: 'PNL-A', ratingA: 225, busType: 'panelboard' }
        : kind === 'none'
          ? {}
          : { nodeId: id<NodeId>(`${kind.toUpperCase()}-1`), label: `${kind.toUpperCase()}-1` };
  return { ...none, ...byKind, ...overrides };
}

/**
 * A transformer as the rules see it. Defaults: 150 kVA, 480 V to 208 V,
 * three-phase delta-wye, primary protected by a 200 A breaker. Full-load
 * currents come from the kVA and voltages unless given.
 */
export function transformerFacts(overrides: Partial<TransformerFacts> = {}): TransformerFacts {
  const kva = overrides.kva ?? 150;
  const primaryVoltsLL = overrides.primaryVoltsLL ?? 480;
  const secondaryVoltsLL = overrides.secondaryVoltsLL ?? 208;
  const phases = overrides.phases ?? 3;
  return {
    id: id<NodeId>('T-1'),
    label: 'T-1',
    connection: 'delta-wye',
    primaryOcpdA: 200,
    primaryOcpdId: id<NodeId>('CB-T1'),
    secondaryEnds: [],
    ...overrides,
    kva,
    primaryVoltsLL,
    secondaryVoltsLL,
    phases,
    primaryFlaA: overrides.primaryFlaA ?? transformerFullLoadA(kva, primaryVoltsLL, phases),
    secondaryFlaA: overrides.secondaryFlaA ?? transformerFullLoadA(kva, secondaryVoltsLL, phases),
  };
}

/**
 * A generator. Nameplate current from kVA and voltage unless given: the same
 * kVA-to-amperes relation as a transformer winding (three-phase kVA·1000 / (√3·V)).
 */
export function generatorFacts(
  overrides: Partial<GeneratorFacts> & { voltsLL?: number; phases?: 1 | 3 } = {},
): GeneratorFacts {
  const { voltsLL = 480, phases = 3, ...rest } = overrides;
  const kva = rest.kva ?? 150;
  return {
    id: id<NodeId>('GEN-1'),
    overloadPreventedByDesign: false,
    ...rest,
    kva,
    nameplateA: rest.nameplateA ?? transformerFullLoadA(kva, voltsLL, phases),
  };
}

/**
 * Facts of a typical feeder tap: NFPA 70-2023, one 20 ft run of 3/0 Cu
 * (200 A, Table 310.16 at 75 °C) in a raceway, tapped from a feeder protected
 * by a 600 A breaker, ending in a single 200 A breaker, serving 150 A.
 * `smallConductorMaxOcpdA` follows 240.4(D) for the size, material and edition
 * unless given.
 */
export function runFacts(overrides: RunFactsOverrides = {}): RunFacts {
  const { site, ...rest } = overrides;
  const base: RunFacts = {
    edition: 2023,
    conductorIds: [id<ConductorId>('C-1')],
    material: 'cu',
    size: '3/0',
    parallelSets: 1,
    lengthFt: 20,
    ampacityA: 200,
    ampacityUncorrectedA: 200,
    smallConductorMaxOcpdA: null,
    supplyOcpdA: 600,
    supplyOcpdId: id<NodeId>('CB-FEEDER'),
    supplyOcpdKind: 'breaker',
    supplyDeviceType: 'inverse-time',
    termination: terminationAt('ocpd'),
    loadA: 150,
    calculatedLoadA: 150,
    inRaceway: true,
    damageProtection: 'raceway',
    outdoors: false,
    leavesEnclosure: false,
    extendsBeyondEquipment: false,
    multioutletCordAndPlug: false,
    hasSplices: false,
    highBay: null,
    site: { qualifiedMaintenance: false, industrialInstallation: false, manufacturingWallHeightFt: null, terminationDefault: 'listed-75' },
    transformer: null,
    secondaries: [],
    generator: null,
    motor: null,
    hvac: null,
    suppliedFrom: null,
  };
  const facts: RunFacts = { ...base, ...rest, site: { ...base.site, ...site } };
  if (!('ampacityUncorrectedA' in rest)) facts.ampacityUncorrectedA = facts.ampacityA;
  if (!('smallConductorMaxOcpdA' in rest)) facts.smallConductorMaxOcpdA = facts.size === null ? null : smallConductorMaxOcpdA(facts.material, facts.size, facts.edition);
  return facts;
}

/**
 * Facts of a transformer secondary run: supplied by the transformer (no OCPD
 * ahead of it on the secondary side), the transformer from `transformerFacts`.
 */
/**
 * The same run drawn without a size (issue 6, item 13): no size, so no ampacity (before or after
 * correction) and no 240.4(D) limit. Every condition that needs one is unknown, never failed.
 */
export function unsized(facts: RunFacts): RunFacts {
  return { ...facts, size: null, ampacityA: null, ampacityUncorrectedA: null, smallConductorMaxOcpdA: null };
}

/** A case drawn without a size: `base` (a meeting case) unsized, expected unknown on exactly `unknownIds`. */
export function withoutSize(base: Case, unknownIds: string[], source: string): Case {
  return {
    name: `drawn without a size (needs the size): ${base.name}; no ampacity, so unknown, never failed`,
    facts: unsized(base.facts),
    expect: unknownIds,
    source: `${source}; common practice (an unknown fact is asked for, not judged)`,
  };
}

export function secondaryRunFacts(overrides: RunFactsOverrides = {}): RunFacts {
  return runFacts({
    conductorIds: [id<ConductorId>('C-SEC-1')],
    supplyOcpdA: null,
    supplyOcpdId: null,
    supplyOcpdKind: null,
    transformer: transformerFacts(),
    ...overrides,
  });
}

/**
 * Facts of a motor branch circuit: one 20 hp, 460 V three-phase induction motor
 * (27 A, NFPA 70-2023 Table 430.250), 10 AWG Cu at 75 °C (35 A), 40 ft, behind a
 * 70 A inverse-time breaker. Override `motor` fields through `motor`.
 */
export function motorRunFacts(overrides: RunFactsOverrides & { motorFacts?: Partial<MotorRunFacts> } = {}): RunFacts {
  const { motorFacts, ...rest } = overrides;
  return runFacts({
    size: '10',
    ampacityA: 35,
    lengthFt: 40,
    supplyOcpdA: 70,
    supplyOcpdId: id<NodeId>('CB-M1'),
    termination: terminationAt('load'),
    loadA: 27,
    calculatedLoadA: 33.75,
    motor: { fullLoadA: 27, source: 'Table 430.250, 20 hp, 460 V column', motorType: 'induction', ...motorFacts },
    ...rest,
  });
}

/** Facts of a rooftop unit's circuit: MCA 18 A, MOP 25 A, 14 AWG Cu at 75 °C (20 A) behind a 25 A breaker. */
export function hvacRunFacts(overrides: RunFactsOverrides = {}): RunFacts {
  return runFacts({
    size: '14',
    ampacityA: 20,
    lengthFt: 60,
    supplyOcpdA: 25,
    supplyOcpdId: id<NodeId>('CB-RTU'),
    termination: terminationAt('load'),
    loadA: 18,
    calculatedLoadA: 18,
    hvac: { mcaA: 18, mopA: 25 },
    ...overrides,
  });
}
