/**
 * fast-check arbitraries for random, schema-valid one-line networks, built
 * with the fixture builder. `treeNetwork` draws radial systems (every node fed
 * from one place, as real distribution is); `oddNetwork` adds extra joins on
 * top, so loops, double feeds, islands and several sources turn up too.
 * Facts are drawn from the whole schema: every material, size, insulation,
 * terminal rating, wiring method, ambient and bundling, missing lengths and
 * ratings, high-bay facts, project settings of both editions.
 */
import fc from 'fast-check';
import {
  BUS_TYPES, CONDUCTOR_SIZES, DAMAGE_PROTECTION, INSULATIONS, MATERIALS, TRANSFORMER_CONNECTIONS, WIRING_METHODS,
  type ProjectInput,
} from '@linewright/core';
import { diagram, type ConductorSpec, type NodeInput } from './builder';

/** NFPA 70-2023 240.6(A) standard ratings up to 1200 A, plus a few non-standard values. */
const RATINGS = [15, 20, 25, 30, 40, 50, 60, 70, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 400, 600, 800, 1000, 1200, 37, 333];
const PARALLEL_OK = CONDUCTOR_SIZES.indexOf('1/0');
const MAIN_RATINGS = [1200, 400, 800];
/** True about once in `n` draws. */
const rarely = (n: number) => fc.integer({ min: 0, max: n - 1 }).map((k) => k === 0);
/** The value about one time in `n`, else undefined (so the schema default applies). */
const sometimes = <T>(arb: fc.Arbitrary<T>, n = 3) =>
  fc.oneof({ weight: n - 1, arbitrary: fc.constant(undefined) }, { weight: 1, arbitrary: arb });

export const conductorSpecArb: fc.Arbitrary<ConductorSpec> = fc
  .record(
    {
      material: sometimes(fc.constantFrom(...MATERIALS)),
      sizeIndex: fc.nat({ max: CONDUCTOR_SIZES.length - 1 }),
      sets: fc.integer({ min: 1, max: 4 }),
      insulation: sometimes(fc.constantFrom(...INSULATIONS)),
      lengthFt: fc.option(fc.oneof(fc.constantFrom(5, 10, 10.1, 24.9, 25, 25.1, 60, 100), fc.double({ min: 0.5, max: 800, noNaN: true })), { freq: 12 }),
      wiring: sometimes(fc.constantFrom(...WIRING_METHODS)),
      ambientC: sometimes(fc.integer({ min: 0, max: 70 }), 4),
      currentCarrying: sometimes(fc.integer({ min: 1, max: 45 }), 4),
      terminalTempC: sometimes(fc.constantFrom(60 as const, 75 as const, 90 as const)),
      leavesEnclosure: fc.boolean(),
      extendsBeyondEquipment: rarely(8),
      outdoors: rarely(4),
      damageProtection: sometimes(fc.constantFrom(...DAMAGE_PROTECTION)),
      multioutletCordAndPlug: rarely(5),
      // Now and then a conductor drawn without a size: its verdict is incomplete, never an exception.
      unsized: rarely(12),
      highBay: fc.option(
        fc.record({
          horizontalFt: fc.integer({ min: 0, max: 40 }),
          tapHeightAboveFloorFt: fc.integer({ min: 10, max: 50 }),
          penetratesWallFloorCeiling: fc.boolean(),
        }),
        { freq: 3 },
      ),
    },
    { requiredKeys: [] },
  )
  .map((r) => {
    const size = CONDUCTOR_SIZES[r.sizeIndex ?? 10]!;
    // 310.10(G): parallel sets only for 1/0 and larger.
    const parallelSets = (r.sizeIndex ?? 0) >= PARALLEL_OK ? (r.sets ?? 1) : 1;
    const spec: ConductorSpec = r.unsized ? { parallelSets } : { size, parallelSets };
    for (const key of ['material', 'insulation', 'wiring', 'ambientC', 'currentCarrying', 'terminalTempC', 'leavesEnclosure',
      'extendsBeyondEquipment', 'outdoors', 'damageProtection', 'multioutletCordAndPlug'] as const) {
      if (r[key] !== undefined) (spec as Record<string, unknown>)[key] = r[key];
    }
    if (r.lengthFt !== undefined && r.lengthFt !== null) spec.lengthFt = Math.round(r.lengthFt * 10) / 10;
    if (r.highBay) spec.highBay = r.highBay;
    return spec;
  });

/** A node without its id, kept as a union by kind (a plain Omit would merge the kinds). */
type NodeBody = NodeInput extends infer N ? (N extends unknown ? Omit<N, 'id'> : never) : never;

const ocpdExtras = {
  arrangement: fc.constantFrom('single' as const, 'group' as const),
  atDisconnectingMeans: fc.boolean(),
  disconnectLocation: fc.constantFrom('outside' as const, 'inside-nearest-entrance' as const, 'elsewhere' as const),
};

/** Equipment that can sit below another node. */
export const downstreamNodeArb: fc.Arbitrary<NodeBody> = fc.oneof(
  { weight: 5, arbitrary: fc.record({ kind: fc.constant('breaker' as const), ratingA: fc.option(fc.constantFrom(...RATINGS), { freq: 15, nil: undefined }), ...ocpdExtras }, { requiredKeys: ['kind'] }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('fuse' as const), ratingA: fc.option(fc.constantFrom(...RATINGS), { freq: 15, nil: undefined }), currentLimiting: fc.boolean(), ...ocpdExtras }, { requiredKeys: ['kind'] }) },
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('splice' as const) }) },
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('bus' as const), busType: fc.constantFrom(...BUS_TYPES), busRatingA: fc.option(fc.constantFrom(...RATINGS), { freq: 6, nil: undefined }) }, { requiredKeys: ['kind', 'busType'] }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('disconnect' as const), ratingA: fc.option(fc.constantFrom(100, 200, 400), { nil: undefined }) }, { requiredKeys: ['kind'] }) },
  {
    weight: 2,
    arbitrary: fc
      .record({
        kva: fc.constantFrom(10, 15, 45, 75, 112.5, 150, 500),
        volts: fc.constantFrom([480, 208], [480, 240], [208, 480], [480, 480], [600, 208]),
        connection: fc.constantFrom(...TRANSFORMER_CONNECTIONS),
      })
      .map(({ kva, volts, connection }) => ({
        kind: 'transformer' as const, kva, primaryVoltsLL: volts[0]!, secondaryVoltsLL: volts[1]!, connection,
        phases: connection.startsWith('single') ? (1 as const) : (3 as const),
      })),
  },
  {
    weight: 3,
    arbitrary: fc
      .record({ amps: fc.oneof(fc.record({ currentA: fc.double({ min: 0.5, max: 900, noNaN: true }) }), fc.record({ kva: fc.double({ min: 0.5, max: 400, noNaN: true }) })), continuous: fc.boolean(), powerFactor: fc.double({ min: 0.5, max: 1, noNaN: true }), phases: fc.constantFrom(1 as const, 3 as const) })
      .map(({ amps, ...rest }) => {
        const rounded = Object.fromEntries(Object.entries(amps).map(([k, v]) => [k, Math.round(v * 10) / 10])) as { currentA: number } | { kva: number };
        return { kind: 'load' as const, ...rounded, ...rest, powerFactor: Math.round(rest.powerFactor * 100) / 100 };
      }),
  },
);

export const sourceArb: fc.Arbitrary<NodeBody> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ kind: fc.constant('utility' as const), voltsLL: fc.constantFrom(480, 208, 240, 600), phases: fc.constantFrom(1 as const, 3 as const) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('generator' as const), voltsLL: fc.constantFrom(480, 208), phases: fc.constant(3 as const), kva: fc.constantFrom(60, 187.5, 500), overloadPreventedByDesign: fc.boolean() }) },
);

const settingsArb = fc.record(
  {
    codeEdition: fc.constantFrom(2020 as const, 2023 as const),
    manufacturingWallHeightFt: fc.integer({ min: 20, max: 60 }),
    qualifiedMaintenance: fc.boolean(),
    industrialInstallation: fc.boolean(),
  },
  { requiredKeys: [] },
);

/**
 * Typical copper size for a device rating (common practice, 75 °C column), used only to
 * steer random conductors near the interesting boundary: protected, next size up, taps.
 */
const TYPICAL_SIZE: [number, (typeof CONDUCTOR_SIZES)[number]][] = [
  [15, '14'], [20, '12'], [30, '10'], [50, '8'], [60, '6'], [70, '4'], [100, '3'], [110, '2'], [125, '1'],
  [150, '1/0'], [175, '2/0'], [200, '3/0'], [225, '4/0'], [250, '250'], [300, '350'], [400, '600'], [600, '2000'],
];
function sizeNear(ratingA: number, offset: number): (typeof CONDUCTOR_SIZES)[number] {
  const typical = (TYPICAL_SIZE.find(([r]) => r >= ratingA) ?? TYPICAL_SIZE[TYPICAL_SIZE.length - 1]!)[1];
  const i = Math.min(CONDUCTOR_SIZES.length - 1, Math.max(0, CONDUCTOR_SIZES.indexOf(typical) + offset));
  return CONDUCTOR_SIZES[i]!;
}

/** One step of a random radial system: which node feeds it, what it is, and how it is joined. */
const stepArb = fc.record({
  /** Most nodes hang from one of the last few drawn, so trees grow deep as real ones do. */
  recent: fc.boolean(),
  parent: fc.nat(),
  /** Size the conductor near the feeding device's rating (-2..+3 sizes) instead of at random. */
  sizeNearRating: fc.option(fc.integer({ min: -2, max: 3 }), { freq: 5, nil: undefined }),
  node: downstreamNodeArb,
  byConductor: rarely(5).map((b) => !b),
  conductor: conductorSpecArb,
});

/** Random radial networks: one or two sources, up to `maxSteps` nodes below them. */
export function treeNetwork(maxSteps = 30): fc.Arbitrary<ProjectInput> {
  return fc
    .record({
      settings: settingsArb,
      sources: fc.array(sourceArb, { minLength: 1, maxLength: 2 }),
      steps: fc.array(stepArb, { minLength: 1, maxLength: maxSteps }),
    })
    .map(({ settings, sources, steps }) => buildTree(settings, sources, steps).build());
}

function buildTree(
  settings: Partial<ProjectInput['project']>,
  sources: NodeBody[],
  steps: { recent: boolean; parent: number; sizeNearRating?: number | undefined; node: NodeBody; byConductor: boolean; conductor: ConductorSpec }[],
) {
  const b = diagram({ name: 'Random radial network', ...settings });
  const feeders: string[] = [];
  const ratingOf = new Map<string, number>();
  // Each source feeds a main device, as a service or a generator does; the rest hangs below the mains.
  sources.forEach((s, i) => {
    b.startTree().node({ ...s, id: `S${i + 1}` } as NodeBody & { id: string });
    const mainA = MAIN_RATINGS[i % MAIN_RATINGS.length]!;
    if (s.kind !== 'splice') b.conductor({ id: `K0-${i + 1}`, size: '600', parallelSets: Math.ceil(mainA / 400), lengthFt: 30 });
    b.breaker(mainA, { id: `M${i + 1}` });
    feeders.push(`M${i + 1}`);
    ratingOf.set(`M${i + 1}`, mainA);
  });
  steps.forEach((step, i) => {
    const parent = step.recent
      ? feeders[Math.max(0, feeders.length - 1 - (step.parent % 3))]!
      : feeders[step.parent % feeders.length]!;
    const id = `N${i + 1}`;
    b.at(parent);
    if (step.byConductor) {
      const rating = ratingOf.get(parent);
      const spec = { ...step.conductor, id: `K${i + 1}` };
      if (rating !== undefined && step.sizeNearRating !== undefined) {
        spec.size = sizeNear(rating, step.sizeNearRating);
        if (CONDUCTOR_SIZES.indexOf(spec.size) < PARALLEL_OK) spec.parallelSets = 1;
      }
      b.conductor(spec);
    }
    b.node({ ...step.node, id } as NodeBody & { id: string });
    // The rating that steers sizing below this node: its own, or the one it is fed under.
    const node = step.node;
    const fedUnder = ratingOf.get(parent);
    if ((node.kind === 'breaker' || node.kind === 'fuse') && node.ratingA !== undefined) ratingOf.set(id, node.ratingA);
    else if (node.kind === 'transformer' && fedUnder !== undefined) ratingOf.set(id, (fedUnder * node.primaryVoltsLL) / node.secondaryVoltsLL);
    else if (node.kind !== 'breaker' && node.kind !== 'fuse' && fedUnder !== undefined) ratingOf.set(id, fedUnder);
    if (step.node.kind !== 'load') feeders.push(id);
  });
  return b;
}

/** Random networks with extra joins on top of a radial one: loops, double feeds, joins across trees. */
export function oddNetwork(maxSteps = 25): fc.Arbitrary<ProjectInput> {
  return fc
    .record({
      settings: settingsArb,
      sources: fc.array(sourceArb, { minLength: 0, maxLength: 3 }),
      steps: fc.array(stepArb, { minLength: 1, maxLength: maxSteps }),
      extra: fc.array(fc.record({ a: fc.nat(), b: fc.nat(), byConductor: fc.boolean(), conductor: conductorSpecArb }), { maxLength: 8 }),
    })
    .map(({ settings, sources, steps, extra }) => {
      // With no source the first step hangs from a bare splice: an island.
      const b = buildTree(settings, sources.length > 0 ? sources : [{ kind: 'splice' }], steps);
      const built = b.build();
      // A load supplies nothing, so no join starts on one.
      const ids = built.nodes.filter((n) => n.kind !== 'load').map((n) => n.id);
      // A source has no line side, so joins never end on one (loadProject refuses that; see the malformed corpus).
      const targets = built.nodes.filter((n) => n.kind !== 'utility' && n.kind !== 'generator').map((n) => n.id);
      extra.forEach((e, i) => {
        const from = ids[e.a % ids.length]!;
        const to = targets[e.b % targets.length]!;
        if (from === to) return;
        b.join(from, to, e.byConductor ? { ...e.conductor, id: `X${i + 1}` } : undefined);
      });
      return b.build();
    });
}
