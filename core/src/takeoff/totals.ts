import type { ConductorSize, Insulation, Material, RacewayKind } from '../model/schema';
import { TRADE_SIZES, type TradeSize } from '../tables/chapter9Table4';
import { sizeIndexOf } from '../tables/sizes';
import type { Takeoff } from './types';

/** Feet of one wire size × material × insulation, split by use. */
export interface WireTotal {
  /** Null: conductors drawn without a size, listed as "size unknown" (after every size), never counted as a size. */
  size: ConductorSize | null;
  material: Material;
  /** Insulation type, or 'bare' for bare EGCs. */
  insulation: Insulation | 'bare';
  phaseFt: number;
  neutralFt: number;
  egcFt: number;
  totalFt: number;
}

export interface RacewayTotal {
  kind: RacewayKind;
  tradeSize: TradeSize;
  raceways: number;
  feet: number;
}

export interface DeviceTotal {
  kind: 'breaker' | 'fuse';
  ratingA: number | null;
  poles: number | null;
  interruptingKA: number | null;
  count: number;
}

export interface BusTotal {
  busType: string;
  ratingA: number | null;
  system: string;
  count: number;
}

export interface TransformerTotal {
  kva: number;
  primaryVoltsLL: number;
  secondaryVoltsLL: number;
  phases: 1 | 3;
  connection: string;
  count: number;
}

export interface DisconnectTotal {
  ratingA: number | null;
  poles: number | null;
  fused: boolean;
  count: number;
}

export interface TerminationTotal {
  /** Null: conductors drawn without a size. */
  size: ConductorSize | null;
  material: Material;
  terminations: number;
}

export interface TakeoffTotals {
  wire: WireTotal[];
  raceway: RacewayTotal[];
  devices: DeviceTotal[];
  buses: BusTotal[];
  transformers: TransformerTotal[];
  disconnects: DisconnectTotal[];
  terminations: TerminationTotal[];
  /** Runs with something to resolve before pricing. */
  flaggedRuns: number;
}

/** Adds `row` into the group of `key`, creating it from `make` the first time. */
function groupInto<T>(map: Map<string, T>, key: string, make: () => T, add: (t: T) => void): void {
  let t = map.get(key);
  if (t === undefined) map.set(key, (t = make()));
  add(t);
}

const r2 = (x: number): number => Math.round(x * 100) / 100;
const MATERIAL_ORDER: Readonly<Record<Material, number>> = { cu: 0, al: 1, 'cu-clad-al': 2 };
/** Unknown size sorts after every size. */
const sizeOrder = (s: ConductorSize | null): number => (s === null ? Number.MAX_SAFE_INTEGER : sizeIndexOf(s));
const bySizeThenMaterial = (a: { size: ConductorSize | null; material: Material }, b: { size: ConductorSize | null; material: Material }) =>
  MATERIAL_ORDER[a.material] - MATERIAL_ORDER[b.material] || sizeOrder(a.size) - sizeOrder(b.size);
const nullsLast = (a: number | null, b: number | null) => (a ?? Number.POSITIVE_INFINITY) - (b ?? Number.POSITIVE_INFINITY);

/** Every total of the takeoff, each the plain sum of its rows (the property tests hold it to that). */
export function takeoffTotals(t: Takeoff): TakeoffTotals {
  const wire = new Map<string, WireTotal>();
  const raceway = new Map<string, RacewayTotal>();
  const terminations = new Map<string, TerminationTotal>();
  const addWire = (size: ConductorSize | null, material: Material, insulation: Insulation | 'bare', use: 'phaseFt' | 'neutralFt' | 'egcFt', ft: number | null) => {
    if (ft === null || ft === 0) return;
    groupInto(wire, `${size ?? '?'}|${material}|${insulation}`, () => ({ size, material, insulation, phaseFt: 0, neutralFt: 0, egcFt: 0, totalFt: 0 }), (w) => {
      w[use] = r2(w[use] + ft);
      w.totalFt = r2(w.totalFt + ft);
    });
  };
  const addEnds = (size: ConductorSize | null, material: Material, conductors: number) => {
    if (conductors === 0) return;
    groupInto(terminations, `${size ?? '?'}|${material}`, () => ({ size, material, terminations: 0 }), (x) => {
      x.terminations += 2 * conductors;
    });
  };
  let flaggedRuns = 0;
  for (const run of t.runs) {
    if (run.flags.length > 0) flaggedRuns++;
    addWire(run.size, run.material, run.insulation, 'phaseFt', run.phaseFt);
    addEnds(run.size, run.material, run.phaseConductors);
    // A neutral of unknown size (the phase size is unknown) still has feet: they go under "size unknown".
    if (run.neutralConductors > 0) {
      addWire(run.neutralSize, run.material, run.insulation, 'neutralFt', run.neutralFt);
      addEnds(run.neutralSize, run.material, run.neutralConductors);
    }
    if (run.egc.size !== null && run.egc.count > 0) {
      addWire(run.egc.size, run.egc.material, run.egcBare ? 'bare' : run.insulation, 'egcFt', run.egcFt);
      addEnds(run.egc.size, run.egc.material, run.egc.count);
    }
    const rw = run.raceway;
    if (rw.kind !== null && rw.tradeSize !== null && rw.count > 0) {
      const kind = rw.kind;
      const tradeSize = rw.tradeSize;
      groupInto(raceway, `${kind}|${tradeSize}`, () => ({ kind, tradeSize, raceways: 0, feet: 0 }), (x) => {
        x.raceways += rw.count;
        x.feet = r2(x.feet + (run.racewayFt ?? 0));
      });
    }
  }

  const devices = new Map<string, DeviceTotal>();
  for (const d of t.devices) {
    groupInto(devices, `${d.kind}|${d.ratingA}|${d.poles}|${d.interruptingKA}`, () => ({ kind: d.kind, ratingA: d.ratingA, poles: d.poles, interruptingKA: d.interruptingKA, count: 0 }), (x) => {
      x.count++;
    });
  }
  const buses = new Map<string, BusTotal>();
  const transformers = new Map<string, TransformerTotal>();
  const disconnects = new Map<string, DisconnectTotal>();
  for (const e of t.equipment) {
    if (e.kind === 'bus') {
      groupInto(buses, `${e.busType}|${e.ratingA}|${e.system}`, () => ({ busType: e.busType, ratingA: e.ratingA, system: e.system, count: 0 }), (x) => {
        x.count++;
      });
    } else if (e.kind === 'transformer') {
      const key = `${e.kva}|${e.primaryVoltsLL}|${e.secondaryVoltsLL}|${e.phases}|${e.connection}`;
      const make = () => ({ kva: e.kva, primaryVoltsLL: e.primaryVoltsLL, secondaryVoltsLL: e.secondaryVoltsLL, phases: e.phases, connection: e.connection, count: 0 });
      groupInto(transformers, key, make, (x) => {
        x.count++;
      });
    } else {
      groupInto(disconnects, `${e.ratingA}|${e.poles}|${e.fused}`, () => ({ ratingA: e.ratingA, poles: e.poles, fused: e.fused, count: 0 }), (x) => {
        x.count++;
      });
    }
  }

  return {
    wire: [...wire.values()].sort((a, b) => bySizeThenMaterial(a, b) || a.insulation.localeCompare(b.insulation)),
    raceway: [...raceway.values()].sort((a, b) => a.kind.localeCompare(b.kind) || TRADE_SIZES.indexOf(a.tradeSize) - TRADE_SIZES.indexOf(b.tradeSize)),
    devices: [...devices.values()].sort((a, b) => a.kind.localeCompare(b.kind) || nullsLast(a.ratingA, b.ratingA) || nullsLast(a.poles, b.poles) || nullsLast(a.interruptingKA, b.interruptingKA)),
    buses: [...buses.values()].sort((a, b) => a.busType.localeCompare(b.busType) || nullsLast(a.ratingA, b.ratingA) || a.system.localeCompare(b.system)),
    transformers: [...transformers.values()].sort((a, b) => a.kva - b.kva || a.primaryVoltsLL - b.primaryVoltsLL || a.secondaryVoltsLL - b.secondaryVoltsLL),
    disconnects: [...disconnects.values()].sort((a, b) => nullsLast(a.ratingA, b.ratingA) || nullsLast(a.poles, b.poles) || Number(a.fused) - Number(b.fused)),
    terminations: [...terminations.values()].sort(bySizeThenMaterial),
    flaggedRuns,
  };
}
