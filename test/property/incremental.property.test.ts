/**
 * The incremental analysis (core/src/analyze/incremental.ts) against the whole one: after every edit
 * of a random sequence, `session.update(next)` must equal `analyze(next)` deeply. Networks are the
 * benchmark's synthetic campus (many branch circuits, the edit the session re-checks on its own) and
 * random radial trees (test/helpers/networks.ts); edits keep the objects they do not touch, as an
 * immer edit in the editor does. Seeded like the other property tests (FC_SEED, FC_PATH, FC_RUNS).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CONDUCTOR_SIZES, INSULATIONS, MATERIALS, WIRING_METHODS, analyze, conductor as conductorSchema, createAnalysis, equipmentNode, loadProject, type Conductor, type Project, type ProjectInput } from '@linewright/core';
import { generateProject } from '../../core/bench/generateProject';
import { treeNetwork } from '../helpers/networks';

const runs = (n: number) => Number(process.env.FC_RUNS ?? n);
const DEFAULT_SEED = 20261202;
const seed = process.env.FC_SEED ? Number(process.env.FC_SEED) : process.env.FC_RUNS ? undefined : DEFAULT_SEED;
const settings = (numRuns: number): fc.Parameters<unknown> => ({
  numRuns: runs(numRuns),
  ...(seed === undefined ? {} : { seed }),
  ...(process.env.FC_PATH ? { path: process.env.FC_PATH } : {}),
});
const LIMIT_MS = process.env.FC_RUNS ? 3_600_000 : 120_000;

function load(input: ProjectInput): Project {
  const loaded = loadProject(JSON.parse(JSON.stringify(input)));
  if (!loaded.ok) throw new Error(`generated network refused: ${JSON.stringify(loaded.errors.slice(0, 5))}`);
  return loaded.project;
}

/** One edit: which element (an index taken modulo the count) and the new value. */
type Edit =
  | { kind: 'length'; at: number; lengthFt: number | undefined }
  | { kind: 'size'; at: number; size: number }
  | { kind: 'material'; at: number; material: number }
  | { kind: 'sets'; at: number; sets: number }
  | { kind: 'wiring'; at: number; wiring: number }
  | { kind: 'insulation'; at: number; insulation: number }
  | { kind: 'conductorFacts'; at: number; change: ConductorChange }
  | { kind: 'rating'; at: number; ratingA: number }
  | { kind: 'load'; at: number; kva: number }
  | { kind: 'loadData'; at: number; change: LoadChange }
  | { kind: 'move'; at: number; dx: number }
  | { kind: 'device'; at: number; change: DeviceChange }
  | { kind: 'add'; at: number }
  | { kind: 'delete'; at: number }
  | { kind: 'addEquipment'; at: number; equipment: NewEquipment }
  | { kind: 'addAlone'; at: number; equipment: NewEquipment }
  | { kind: 'connect'; at: number; to: number }
  | { kind: 'paste'; at: number }
  | { kind: 'deleteBranch'; at: number }
  | { kind: 'rename'; at: number; label: string };

/**
 * A piece of equipment the editor's "add equipment" puts below the one selected (web/src/editor/commands/addEquipment.ts):
 * a device below a bus is bus-linked to it, anything else gets a conductor, sized or not (the editor's new conductor has
 * neither size nor length).
 */
interface NewEquipment {
  kind: 'load' | 'breaker' | 'fuse' | 'bus' | 'disconnect' | 'splice' | 'transformer';
  conductor: { size: number; lengthFt: number } | null;
  /** A load's data. */
  kva: number | undefined;
  phases: 1 | 3 | undefined;
  continuous: boolean;
  /** A device's rating and interrupting rating. */
  ratingA: number;
  interruptingKA: number | undefined;
}

const newEquipmentArb: fc.Arbitrary<NewEquipment> = fc.record({
  kind: fc.constantFrom('load', 'load', 'load', 'breaker', 'breaker', 'fuse', 'bus', 'disconnect', 'splice', 'transformer'),
  conductor: fc.option(fc.record({ size: fc.nat({ max: CONDUCTOR_SIZES.length - 1 }), lengthFt: fc.integer({ min: 5, max: 300 }) }), { nil: null, freq: 3 }),
  kva: fc.option(fc.integer({ min: 1, max: 60 }), { nil: undefined, freq: 6 }),
  phases: fc.constantFrom(1 as const, 3 as const, undefined),
  continuous: fc.boolean(),
  ratingA: fc.constantFrom(15, 20, 30, 60, 100, 225),
  interruptingKA: fc.option(fc.constantFrom(10, 22, 65), { nil: undefined }),
});

const EQUIPMENT_FEEDS: ReadonlySet<string> = new Set(['bus', 'breaker', 'fuse', 'disconnect', 'splice', 'transformer', 'utility']);

/** The new node as the editor makes it (its kind's defaults, parsed by the schema). */
function newNode(id: string, e: NewEquipment): Project['nodes'][number] {
  switch (e.kind) {
    case 'load':
      return equipmentNode.parse({ id, kind: 'load', ...(e.kva === undefined ? { currentA: 12 } : { kva: e.kva }), powerFactor: 0.9, continuous: e.continuous, ...(e.phases ? { phases: e.phases } : {}) });
    case 'breaker':
    case 'fuse':
      return equipmentNode.parse({ id, kind: e.kind, ratingA: e.ratingA, ...(e.interruptingKA ? { interruptingKA: e.interruptingKA } : {}) });
    case 'bus':
      return equipmentNode.parse({ id, kind: 'bus', busType: 'panelboard', busRatingA: 225 });
    case 'disconnect':
      return equipmentNode.parse({ id, kind: 'disconnect', ratingA: e.ratingA });
    case 'splice':
      return equipmentNode.parse({ id, kind: 'splice' });
    case 'transformer':
      return equipmentNode.parse({ id, kind: 'transformer', kva: 75, primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3, impedancePct: 5, connection: 'delta-wye' });
  }
}

/** A new conductor as the editor adds it: the schema's defaults, with a size and length when given. */
function newConductor(id: string, from: string, to: string, sized: NewEquipment['conductor']): Conductor {
  return conductorSchema.parse({ id, from, to, ...(sized ? { size: CONDUCTOR_SIZES[sized.size], lengthFt: sized.lengthFt } : {}) });
}

const isDevice = (kind: string) => kind === 'breaker' || kind === 'fuse' || kind === 'disconnect';

/** A change of a conductor's other facts: what its ampacity, its run's 240.21 conditions and its findings read. */
type ConductorChange =
  | { field: 'ambientC'; value: number }
  | { field: 'outdoors' }
  | { field: 'leavesEnclosure' }
  | { field: 'damageProtection'; value: Conductor['damageProtection'] }
  | { field: 'terminalTempC'; value: 60 | 75 | 90 | undefined }
  | { field: 'label'; label: string | undefined };

const conductorChangeArb: fc.Arbitrary<ConductorChange> = fc.oneof(
  fc.record({ field: fc.constant('ambientC' as const), value: fc.constantFrom(20, 30, 40, 50) }),
  fc.record({ field: fc.constant('outdoors' as const) }),
  fc.record({ field: fc.constant('leavesEnclosure' as const) }),
  fc.record({ field: fc.constant('damageProtection' as const), value: fc.constantFrom('raceway', 'other-approved-means', 'none') }),
  fc.record({ field: fc.constant('terminalTempC' as const), value: fc.option(fc.constantFrom(60 as const, 75 as const, 90 as const), { nil: undefined }) }),
  fc.record({ field: fc.constant('label' as const), label: fc.option(fc.constantFrom('Feeder F-1', 'Tap T-3', ' '), { nil: undefined }) }),
);

/** `o` without its optional field `key` (absent, as in a drawing that never had it). */
function without<T extends object>(o: T, key: keyof T & string): T {
  const copy = { ...o } as Record<string, unknown>;
  delete copy[key];
  return copy as T;
}

/** The conductor after one change of its other facts. */
function changeConductor(c: Conductor, change: ConductorChange): Conductor {
  switch (change.field) {
    case 'ambientC':
      return { ...c, ambientC: change.value };
    case 'outdoors':
      return { ...c, outdoors: !c.outdoors };
    case 'leavesEnclosure':
      return { ...c, leavesEnclosure: !c.leavesEnclosure };
    case 'damageProtection':
      return { ...c, damageProtection: change.value };
    case 'terminalTempC':
      return change.value === undefined ? without(c, 'terminalTempC') : { ...c, terminalTempC: change.value };
    case 'label':
      return change.label === undefined ? without(c, 'label') : { ...c, label: change.label };
  }
}

/** A change of a load's own data: what the roll-up, the motor and HVAC rules and the voltage drop read. */
type LoadChange =
  | { field: 'currentA'; value: number }
  | { field: 'continuous' }
  | { field: 'powerFactor'; value: number }
  | { field: 'motor'; hp: number | undefined }
  | { field: 'hvac'; mcaA: number | undefined }
  | { field: 'label'; label: string | undefined };

const loadChangeArb: fc.Arbitrary<LoadChange> = fc.oneof(
  fc.record({ field: fc.constant('currentA' as const), value: fc.integer({ min: 1, max: 400 }) }),
  fc.record({ field: fc.constant('continuous' as const) }),
  fc.record({ field: fc.constant('powerFactor' as const), value: fc.constantFrom(0.7, 0.8, 0.85, 0.9, 0.95, 1) }),
  fc.record({ field: fc.constant('motor' as const), hp: fc.option(fc.constantFrom(0.5, 1, 5, 10, 25, 50), { nil: undefined }) }),
  fc.record({ field: fc.constant('hvac' as const), mcaA: fc.option(fc.constantFrom(12, 28, 45, 90), { nil: undefined }) }),
  fc.record({ field: fc.constant('label' as const), label: fc.option(fc.constantFrom('Lighting', 'Pump P-2', ' '), { nil: undefined }) }),
);

type LoadNode = Extract<Project['nodes'][number], { kind: 'load' }>;
type DeviceNode = Extract<Project['nodes'][number], { kind: 'breaker' | 'fuse' }>;

/** A change of an OCPD's rating or type: what the supply facts, terminations, 408.36 and 450.3(B) read. */
type DeviceChange =
  | { field: 'ratingA'; value: number | undefined }
  | { field: 'type' }
  | { field: 'adjustableTrip'; maxSettingA: number | undefined; restrictedAccess: boolean }
  | { field: 'arrangement' }
  | { field: 'atDisconnectingMeans' }
  | { field: 'clearingTimeS'; value: number | undefined }
  | { field: 'interruptingKA'; value: number | undefined };

const deviceChangeArb: fc.Arbitrary<DeviceChange> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ field: fc.constant('ratingA' as const), value: fc.option(fc.constantFrom(15, 20, 30, 60, 100, 125, 225, 400, 600, 800, 1200), { nil: undefined, freq: 8 }) }) },
  { weight: 2, arbitrary: fc.record({ field: fc.constant('type' as const) }) },
  { weight: 1, arbitrary: fc.record({ field: fc.constant('adjustableTrip' as const), maxSettingA: fc.option(fc.constantFrom(100, 400, 800), { nil: undefined }), restrictedAccess: fc.boolean() }) },
  { weight: 1, arbitrary: fc.record({ field: fc.constant('arrangement' as const) }) },
  { weight: 1, arbitrary: fc.record({ field: fc.constant('atDisconnectingMeans' as const) }) },
  { weight: 1, arbitrary: fc.record({ field: fc.constant('clearingTimeS' as const), value: fc.option(fc.constantFrom(0.02, 0.1, 0.5), { nil: undefined }) }) },
  { weight: 2, arbitrary: fc.record({ field: fc.constant('interruptingKA' as const), value: fc.option(fc.constantFrom(10, 14, 22, 35, 65), { nil: undefined, freq: 6 }) }) },
);

/** The device after one change of its rating or type. */
function changeDevice(node: DeviceNode, change: DeviceChange): DeviceNode {
  switch (change.field) {
    case 'ratingA':
      return change.value === undefined ? without(node, 'ratingA') : { ...node, ratingA: change.value };
    case 'type':
      if (node.kind === 'breaker') return { ...node, tripType: node.tripType === 'instantaneous' ? 'inverse-time' : 'instantaneous' };
      return node.timeDelay === undefined ? { ...node, timeDelay: true } : node.timeDelay ? { ...node, timeDelay: false } : without(node, 'timeDelay');
    case 'adjustableTrip':
      if (node.kind !== 'breaker') return node;
      return change.maxSettingA === undefined ? without(node, 'adjustableTrip') : { ...node, adjustableTrip: { maxSettingA: change.maxSettingA, longTimeSettingA: change.maxSettingA / 2, restrictedAccess: change.restrictedAccess } };
    case 'arrangement':
      return { ...node, arrangement: node.arrangement === 'single' ? 'group' : 'single' };
    case 'atDisconnectingMeans':
      return { ...node, atDisconnectingMeans: !node.atDisconnectingMeans };
    case 'clearingTimeS':
      return change.value === undefined ? without(node, 'clearingTimeS') : { ...node, clearingTimeS: change.value };
    case 'interruptingKA':
      return change.value === undefined ? without(node, 'interruptingKA') : { ...node, interruptingKA: change.value };
  }
}

/** The load after one change of its data; the same object when the change does not apply to it. */
function changeLoad(node: LoadNode, change: LoadChange): LoadNode {
  switch (change.field) {
    case 'currentA':
      return node.currentA === undefined ? node : { ...node, currentA: change.value };
    case 'continuous':
      return { ...node, continuous: !node.continuous };
    case 'powerFactor':
      return { ...node, powerFactor: change.value };
    case 'motor': {
      const { motor: _, ...rest } = node;
      return change.hp === undefined ? rest : { ...node, motor: { hp: change.hp } };
    }
    case 'hvac': {
      const { hvac: _, ...rest } = node;
      return change.mcaA === undefined ? rest : { ...node, hvac: { mcaA: change.mcaA, mopA: change.mcaA * 2 } };
    }
    case 'label': {
      const { label: _, ...rest } = node;
      return change.label === undefined ? rest : { ...node, label: change.label };
    }
  }
}

const at = fc.nat({ max: 1_000_000 });
const editArb: fc.Arbitrary<Edit> = fc.oneof(
  { weight: 6, arbitrary: fc.record({ kind: fc.constant('length' as const), at, lengthFt: fc.option(fc.integer({ min: 1, max: 600 }), { nil: undefined, freq: 8 }) }) },
  { weight: 4, arbitrary: fc.record({ kind: fc.constant('size' as const), at, size: fc.nat({ max: CONDUCTOR_SIZES.length - 1 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('material' as const), at, material: fc.nat({ max: MATERIALS.length - 1 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('sets' as const), at, sets: fc.integer({ min: 1, max: 4 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('wiring' as const), at, wiring: fc.nat({ max: WIRING_METHODS.length - 1 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('insulation' as const), at, insulation: fc.nat({ max: INSULATIONS.length - 1 }) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('conductorFacts' as const), at, change: conductorChangeArb }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('rating' as const), at, ratingA: fc.constantFrom(15, 20, 30, 60, 100, 225, 400, 800) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('load' as const), at, kva: fc.integer({ min: 1, max: 500 }) }) },
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('loadData' as const), at, change: loadChangeArb }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('move' as const), at, dx: fc.integer({ min: -200, max: 200 }) }) },
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('device' as const), at, change: deviceChangeArb }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('add' as const), at }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('delete' as const), at }) },
  { weight: 6, arbitrary: fc.record({ kind: fc.constant('addEquipment' as const), at, equipment: newEquipmentArb }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('addAlone' as const), at, equipment: newEquipmentArb }) },
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('connect' as const), at, to: at }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('paste' as const), at }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('deleteBranch' as const), at }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('rename' as const), at, label: fc.constantFrom('Spare', 'Pump P-4', 'Panel LP-2') }) },
);

/** The project after one edit; every element the edit does not touch is the same object as before. */
function applyEdit(p: Project, e: Edit, step: number): Project {
  const withConductor = (i: number, c: Conductor): Project => ({ ...p, conductors: p.conductors.map((x, k) => (k === i ? c : x)) });
  const n = p.conductors.length;
  if (n === 0) return p;
  const i = e.at % n;
  const c = p.conductors[i]!;
  switch (e.kind) {
    case 'length': {
      const { lengthFt: _, ...rest } = c;
      return withConductor(i, e.lengthFt === undefined ? (rest as Conductor) : { ...c, lengthFt: e.lengthFt });
    }
    case 'size':
      return withConductor(i, { ...c, size: CONDUCTOR_SIZES[e.size]! });
    case 'material':
      return withConductor(i, { ...c, material: MATERIALS[e.material]! });
    case 'sets':
      return withConductor(i, { ...c, parallelSets: e.sets });
    case 'wiring':
      return withConductor(i, { ...c, wiring: WIRING_METHODS[e.wiring]! });
    case 'insulation':
      return withConductor(i, { ...c, insulation: INSULATIONS[e.insulation]! });
    case 'conductorFacts':
      return withConductor(i, changeConductor(c, e.change));
    case 'add':
      return { ...p, conductors: [...p.conductors, { ...c, id: `${c.id}-X${step}` as Conductor['id'] }] };
    case 'addEquipment': {
      // Below a piece that can feed it, as the editor does with one piece selected.
      const feeders = p.nodes.filter((x) => EQUIPMENT_FEEDS.has(x.kind));
      if (feeders.length === 0) return p;
      const from = feeders[e.at % feeders.length]!;
      const node = newNode(`new-${step}`, e.equipment);
      if (from.kind === 'bus' && isDevice(node.kind)) return { ...p, nodes: [...p.nodes, node], busLinks: [...p.busLinks, { id: `bl-new-${step}` as Project['busLinks'][number]['id'], from: from.id, to: node.id }] };
      return { ...p, nodes: [...p.nodes, node], conductors: [...p.conductors, newConductor(`c-new-${step}`, from.id, node.id, e.equipment.conductor)] };
    }
    case 'addAlone':
      // Equipment added with nothing selected: connected to nothing, until a connect.
      return { ...p, nodes: [...p.nodes, newNode(`alone-${step}`, e.equipment)] };
    case 'connect': {
      // A conductor between two pieces already drawn (the editor's connect): to one drawn on its own when there is one.
      const connected = new Set([...p.conductors, ...p.busLinks].flatMap((x) => [x.from as string, x.to as string]));
      const alone = p.nodes.filter((x) => !connected.has(x.id));
      const feeders = p.nodes.filter((x) => EQUIPMENT_FEEDS.has(x.kind) && connected.has(x.id));
      const to = alone.length > 0 ? alone[e.to % alone.length]! : p.nodes[e.to % p.nodes.length]!;
      const from = alone.length > 0 && feeders.length > 0 ? feeders[e.at % feeders.length]! : p.nodes[e.at % p.nodes.length]!;
      if (from === to) return p;
      return { ...p, conductors: [...p.conductors, newConductor(`c-link-${step}`, from.id, to.id, { size: 10, lengthFt: 50 })] };
    }
    case 'paste': {
      // A breaker and its load with the conductor between them, pasted and connected below a bus.
      const buses = p.nodes.filter((x) => x.kind === 'bus');
      if (buses.length === 0) return p;
      const bus = buses[e.at % buses.length]!;
      const breaker = newNode(`paste-${step}-cb`, { kind: 'breaker', conductor: null, kva: undefined, phases: undefined, continuous: false, ratingA: 20, interruptingKA: undefined });
      const load = newNode(`paste-${step}-ld`, { kind: 'load', conductor: null, kva: 2, phases: 1, continuous: true, ratingA: 20, interruptingKA: undefined });
      return {
        ...p,
        nodes: [...p.nodes, breaker, load],
        conductors: [...p.conductors, newConductor(`paste-${step}-c`, breaker.id, load.id, { size: 12, lengthFt: 60 })],
        busLinks: [...p.busLinks, { id: `paste-${step}-bl` as Project['busLinks'][number]['id'], from: bus.id, to: breaker.id }],
      };
    }
    case 'deleteBranch': {
      // The editor's delete of a load: the load and the conductors and links at it go.
      const loads = p.nodes.filter((x) => x.kind === 'load');
      if (loads.length === 0) return p;
      const gone = loads[e.at % loads.length]!.id;
      return { ...p, nodes: p.nodes.filter((x) => x.id !== gone), conductors: p.conductors.filter((x) => x.from !== gone && x.to !== gone), busLinks: p.busLinks.filter((x) => x.from !== gone && x.to !== gone) };
    }
    case 'rename': {
      const devices = p.nodes.flatMap((node, k) => (node.kind === 'breaker' || node.kind === 'fuse' ? [k] : []));
      if (devices.length === 0) return p;
      const k = devices[e.at % devices.length]!;
      return { ...p, nodes: p.nodes.map((x, j) => (j === k ? { ...x, label: e.label } : x)) };
    }
    case 'delete':
      return { ...p, conductors: p.conductors.filter((_, k) => k !== i) };
    case 'move': {
      const k = e.at % p.nodes.length;
      const node = p.nodes[k]!;
      const position = { x: (node.position?.x ?? 0) + e.dx, y: node.position?.y ?? 0 };
      return { ...p, nodes: p.nodes.map((x, j) => (j === k ? { ...node, position } : x)) };
    }
    case 'loadData': {
      const loads = p.nodes.flatMap((node, k) => (node.kind === 'load' ? [k] : []));
      if (loads.length === 0) return p;
      const k = loads[e.at % loads.length]!;
      const next = changeLoad(p.nodes[k] as LoadNode, e.change);
      return next === p.nodes[k] ? p : { ...p, nodes: p.nodes.map((x, j) => (j === k ? next : x)) };
    }
    case 'device': {
      const devices = p.nodes.flatMap((node, k) => (node.kind === 'breaker' || node.kind === 'fuse' ? [k] : []));
      if (devices.length === 0) return p;
      const k = devices[e.at % devices.length]!;
      const next = changeDevice(p.nodes[k] as DeviceNode, e.change);
      return next === p.nodes[k] ? p : { ...p, nodes: p.nodes.map((x, j) => (j === k ? next : x)) };
    }
    case 'rating':
    case 'load': {
      const kinds = e.kind === 'rating' ? ['breaker', 'fuse'] : ['load'];
      const candidates = p.nodes.flatMap((node, k) => (kinds.includes(node.kind) ? [k] : []));
      if (candidates.length === 0) return p;
      const k = candidates[e.at % candidates.length]!;
      const node = p.nodes[k]!;
      const next = node.kind === 'load' ? (e.kind === 'load' && node.kva !== undefined ? { ...node, kva: e.kva } : node) : e.kind === 'rating' ? { ...node, ratingA: e.ratingA } : node;
      return next === node ? p : { ...p, nodes: p.nodes.map((x, j) => (j === k ? next : x)) };
    }
  }
}

/** How many edits of each kind took each way (incremental, full, unchanged). */
type Tally = Record<string, Record<string, number>>;

/** Runs the edits through a session, checking each result against a whole analysis; counts in `tally` how each kind of edit was re-checked. */
function checkSequence(start: Project, edits: readonly Edit[], tally: Tally = {}): number {
  const session = createAnalysis(start);
  expect(session.report).toEqual(analyze(start));
  let project = start;
  let incremental = 0;
  edits.forEach((e, step) => {
    project = applyEdit(project, e, step);
    const report = session.update(project);
    expect(report).toEqual(analyze(project));
    if (session.last.mode === 'incremental') incremental++;
    const ways = (tally[e.kind] ??= {});
    const way = session.last.mode === 'full' && (e.kind === 'addEquipment' || e.kind === 'rename' || e.kind === 'connect' || e.kind === 'paste') ? `full: ${session.last.reason}` : session.last.mode;
    ways[way] = (ways[way] ?? 0) + 1;
  });
  return incremental;
}

describe('incremental analysis equals a whole analysis after every edit', () => {
  it(
    'synthetic campus networks (100–240 conductors), random edit sequences',
    () => {
      let incremental = 0;
      const tally: Tally = {};
      fc.assert(
        fc.property(fc.integer({ min: 100, max: 240 }), fc.integer({ min: 1, max: 1000 }), fc.array(editArb, { minLength: 1, maxLength: 10 }), (conductors, networkSeed, edits) => {
          incremental += checkSequence(load(generateProject({ conductors, seed: networkSeed })), edits, tally);
        }),
        settings(12),
      );
      console.log(`incremental property test, campus networks: how each kind of edit was re-checked ${JSON.stringify(tally)}`);
      // The point of the session: most of these edits are re-checked on their own, added equipment among them.
      expect(incremental).toBeGreaterThan(0);
      if (!process.env.FC_PATH) expect(tally.addEquipment?.incremental ?? 0).toBeGreaterThan(0);
    },
    LIMIT_MS,
  );

  it(
    'random radial networks (every schema field drawn), random edit sequences',
    () => {
      const tally: Tally = {};
      fc.assert(
        fc.property(treeNetwork(), fc.array(editArb, { minLength: 1, maxLength: 10 }), (input, edits) => {
          checkSequence(load(input), edits, tally);
        }),
        settings(40),
      );
      console.log(`incremental property test, random radial networks: how each kind of edit was re-checked ${JSON.stringify(tally)}`);
      if (!process.env.FC_PATH) expect(tally.addEquipment?.incremental ?? 0).toBeGreaterThan(0);
    },
    LIMIT_MS,
  );

  it('a branch-circuit length edit, a load edit, a move and a breaker rating edit are re-checked on their own; a new conductor runs the whole analysis', () => {
    const project = load(generateProject({ conductors: 200, seed: 3 }));
    const session = createAnalysis(project);
    const branch = project.conductors.findIndex((c) => session.report.conductors.find((r) => r.id === c.id)?.role === 'branch' && c.lengthFt !== undefined);
    const edited = applyEdit(project, { kind: 'length', at: branch, lengthFt: 250 }, 0);
    expect(session.update(edited)).toEqual(analyze(edited));
    expect(session.last).toEqual({ mode: 'incremental', conductorId: project.conductors[branch]!.id });
    const loadAt = edited.nodes.findIndex((n) => n.kind === 'load');
    const loadEdit = applyEdit(edited, { kind: 'loadData', at: 0, change: { field: 'currentA', value: 13 } }, 1);
    expect(session.update(loadEdit)).toEqual(analyze(loadEdit));
    expect(session.last).toEqual({ mode: 'incremental', nodeId: edited.nodes[loadAt]!.id, edit: 'load' });
    const moved = applyEdit(loadEdit, { kind: 'move', at: 5, dx: 40 }, 2);
    expect(session.update(moved)).toEqual(analyze(moved));
    expect(session.last).toEqual({ mode: 'incremental', nodeId: moved.nodes[5]!.id, edit: 'layout' });
    const rated = applyEdit(moved, { kind: 'rating', at: 0, ratingA: 30 }, 3);
    expect(session.update(rated)).toEqual(analyze(rated));
    expect(session.last).toEqual({ mode: 'incremental', nodeId: rated.nodes.find((n) => n.kind === 'breaker' || n.kind === 'fuse')!.id, edit: 'device' });
    const added = applyEdit(rated, { kind: 'add', at: branch }, 4);
    expect(session.update(added)).toEqual(analyze(added));
    expect(session.last.mode).toBe('full');
  });

  it('equipment added below a panelboard or a breaker, with its bus link or conductor, is re-checked without the whole analysis', () => {
    let project = load(generateProject({ conductors: 300, seed: 7 }));
    const session = createAnalysis(project);
    const panel = project.nodes.find((n) => n.kind === 'bus' && n.busType === 'panelboard')!;
    const breaker = newNode('added-cb', { kind: 'breaker', conductor: null, kva: undefined, phases: undefined, continuous: false, ratingA: 20, interruptingKA: undefined });
    project = { ...project, nodes: [...project.nodes, breaker], busLinks: [...project.busLinks, { id: 'added-bl' as Project['busLinks'][number]['id'], from: panel.id, to: breaker.id }] };
    expect(session.update(project)).toEqual(analyze(project));
    expect(session.last).toEqual({ mode: 'incremental', nodeId: 'added-cb', edit: 'added' });
    const lamp = newNode('added-load', { kind: 'load', conductor: null, kva: 2, phases: 1, continuous: true, ratingA: 20, interruptingKA: undefined });
    project = { ...project, nodes: [...project.nodes, lamp], conductors: [...project.conductors, newConductor('added-c', breaker.id, lamp.id, { size: CONDUCTOR_SIZES.indexOf('12'), lengthFt: 80 })] };
    expect(session.update(project)).toEqual(analyze(project));
    expect(session.last).toEqual({ mode: 'incremental', nodeId: 'added-load', edit: 'added' });
    // The new branch circuit is judged like any other: 12 AWG on a 20 A breaker (240.4(D)(5), Table 310.16).
    expect(session.report.conductors.find((c) => c.id === 'added-c')?.verdict).toBe('protected');
    // Drawn on its own (a whole analysis: a finding says it is connected to nothing), then connected below the new breaker's panelboard.
    const alone = newNode('alone-cb', { kind: 'breaker', conductor: null, kva: undefined, phases: undefined, continuous: false, ratingA: 30, interruptingKA: 22 });
    project = { ...project, nodes: [...project.nodes, alone] };
    expect(session.update(project)).toEqual(analyze(project));
    project = { ...project, busLinks: [...project.busLinks, { id: 'alone-bl' as Project['busLinks'][number]['id'], from: panel.id, to: alone.id }] };
    expect(session.update(project)).toEqual(analyze(project));
    expect(session.last).toEqual({ mode: 'incremental', nodeId: 'alone-cb', edit: 'connected' });
  });

  it('a feeder, tap, transformer primary or secondary edited (length, size, sets) is re-checked with what is below it, an interrupting rating on its own; a service conductor runs the whole analysis', () => {
    let project = load(generateProject({ conductors: 400, seed: 5 }));
    const session = createAnalysis(project);
    const lines = session.report.conductors;
    const first = (pick: (c: (typeof lines)[number]) => boolean) => lines.findIndex((c) => pick(c) && c.lengthFt !== null);
    const picks = {
      feeder: first((c) => c.role === 'feeder' && c.verdict === 'protected'),
      tap: first((c) => c.verdict === 'tap-10ft'),
      primary: first((c) => c.role === 'transformer-primary'),
      secondary: first((c) => c.role === 'transformer-secondary'),
    };
    let step = 0;
    for (const [what, at] of Object.entries(picks)) {
      expect(at, what).toBeGreaterThanOrEqual(0);
      // Long enough to move the verdict of a tap (past 10 ft, then 25 ft) and the drops below a feeder; then smaller and doubled.
      const edits: Edit[] = [
        { kind: 'length', at, lengthFt: 14 },
        { kind: 'length', at, lengthFt: 400 },
        { kind: 'size', at, size: CONDUCTOR_SIZES.indexOf('6') },
        { kind: 'sets', at, sets: 2 },
        { kind: 'insulation', at, insulation: INSULATIONS.indexOf('TW') },
      ];
      for (const e of edits) {
        project = applyEdit(project, e, step++);
        expect(session.update(project), `${what} ${e.kind}`).toEqual(analyze(project));
        expect(session.last, `${what} ${e.kind}`).toEqual({ mode: 'incremental', conductorId: project.conductors[at]!.id });
      }
    }
    // An OCPD's interrupting rating changed: its 110.9 finding alone (entering one the first time counts the devices without one again).
    const breakers = project.nodes.flatMap((n, k) => (n.kind === 'breaker' ? [k] : []));
    for (const k of [breakers[0]!, breakers[breakers.length - 1]!]) {
      for (const [i, value] of [10, 200, 10, 14].entries()) {
        project = applyEdit(project, { kind: 'device', at: breakers.indexOf(k), change: { field: 'interruptingKA', value } }, step++);
        expect(session.update(project), `interruptingKA ${value}`).toEqual(analyze(project));
        expect(session.last.mode).toBe(i === 0 ? 'full' : 'incremental');
      }
    }
    expect(session.report.findings.some((f) => f.ruleId === 'interrupting-rating' && f.subject.kind === 'node')).toBe(true);
    const service = lines.findIndex((c) => c.role === 'service');
    project = applyEdit(project, { kind: 'length', at: service, lengthFt: 60 }, step);
    expect(session.update(project)).toEqual(analyze(project));
    expect(session.last).toEqual({ mode: 'full', reason: 'the conductor is a service conductor' });
  });
});
