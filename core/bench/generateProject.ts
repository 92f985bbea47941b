/**
 * Deterministic synthetic one-line diagrams for the benchmarks (core and web).
 *
 * Shape, top to bottom: a campus of buildings, each with its own service:
 * utility → service conductors → 4000 A main breaker → main switchgear → 800 A
 * feeders to twelve distribution switchboards → feeder units on each
 * distribution board (twelve boards keep the service's calculated load under its
 * 4000 A main, so a large campus is many services, not one overloaded service
 * whose voltage drop flags every load). A feeder unit is one of
 *   - a 600 A riser to a tap box with a 10 ft tap and a 25 ft tap to panelboards,
 *   - a 125 A feeder to a 75 kVA 480–208Y/120 V transformer, 18 ft secondary to a panel,
 *   - a 225 A feeder to a panelboard without a main,
 * and each panel feeds 20 A branch circuits to loads. About one riser in ten has
 * a 25 ft tap one size too small and one in twenty a 10 ft tap run to 12 ft, so
 * the analyzer has violations to report. The output is compact: fields whose
 * schema default fits are left out, as a designer's saved file would.
 *
 * `conductors` is met exactly; `seed` picks a different but repeatable network.
 */
import { PROJECT_VERSION, type ProjectInput } from '../src/model/schema';

type NodeInput = ProjectInput['nodes'][number];
type ConductorInput = ProjectInput['conductors'][number];
type BusLinkInput = NonNullable<ProjectInput['busLinks']>[number];

export interface GenerateOptions {
  /** Exact number of conductors in the result (≥ 1). */
  conductors: number;
  /** PRNG seed; the same seed and size give the same file. Default 1. */
  seed?: number;
}

/** mulberry32: small, fast, deterministic; statistical quality is not the point here. Also the fuzz harness's generator. */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const COLUMN_PX = 140;
const ROW_PX = 100;
/** Rows of a building's service: utility, main, switchgear. */
const SERVICE_ROWS = 3;
/** Feeder units per distribution board, and distribution boards per band of rows (one building, one service). */
const UNITS_PER_BOARD = 8;
const BOARDS_PER_BAND = 12;
/** Columns one feeder unit spans: two panels of up to six branch circuits, half a column apart. */
const UNIT_COLUMNS = 6.5;
/** Rows a band of boards occupies: board, unit breakers, feeders, tap box, taps, panel, branch, loads. */
const ROWS_PER_BAND = 10;

/** Build a deterministic synthetic project with exactly `conductors` conductors. */
export function generateProject({ conductors, seed = 1 }: GenerateOptions): ProjectInput {
  if (!Number.isInteger(conductors) || conductors < 1) throw new RangeError('conductors must be a positive integer');
  const rand = prng(seed);
  const pick = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1));

  const nodes: NodeInput[] = [];
  const wires: ConductorInput[] = [];
  const links: BusLinkInput[] = [];
  let budget = conductors;
  let linkSeq = 0;

  const at = (col: number, row: number) => ({ x: Math.round(col * COLUMN_PX), y: row * ROW_PX });
  const node = (n: NodeInput) => {
    nodes.push(n);
    return n.id;
  };
  const wire = (c: ConductorInput) => {
    wires.push(c);
    budget -= 1;
  };
  const link = (from: string, to: string) => links.push({ id: `BL${++linkSeq}`, from, to });

  /** A building's service, three rows at `top`: utility, service conductors (one conductor), main, switchgear. */
  const service = (building: number, top: number) => {
    const n = building + 1;
    node({ id: `U${n}`, kind: 'utility', label: `Utility 480Y/277 V, building ${n}`, voltsLL: 480, phases: 3, availableFaultKA: 50, position: at(0, top) });
    node({ id: `MAIN${n}`, kind: 'breaker', label: `Main 4000 A, building ${n}`, ratingA: 4000, position: at(0, top + 1) });
    const msb = node({ id: `MSB${n}`, kind: 'bus', busType: 'switchgear', label: `Main switchgear, building ${n}`, busRatingA: 4000, position: at(0, top + 2) });
    wire({ id: `SVC${n}`, from: `U${n}`, to: `MAIN${n}`, size: '600', parallelSets: 11, lengthFt: 40 });
    link(`MAIN${n}`, msb);
    return msb;
  };

  /** Branch circuits off a panel bus: breaker, 12 AWG, load. One conductor each. */
  const branches = (panel: string, count: number, col: number, row: number) => {
    for (let i = 0; i < count && budget > 0; i++) {
      const b = node({ id: `${panel}-${i + 1}`, kind: 'breaker', ratingA: 20, position: at(col + i * 0.5, row) });
      const ld = node({
        id: `${panel}-${i + 1}-L`, kind: 'load', currentA: pick(4, 15), continuous: rand() < 0.4, phases: 1,
        position: at(col + i * 0.5, row + 1),
      });
      link(panel, b);
      wire({ id: `${b}-C`, from: b, to: ld, size: '12', lengthFt: pick(20, 150) });
    }
  };

  /** A panelboard with a main breaker, fed from `from` by one conductor `${id}-F`. */
  const panelWithMain = (id: string, from: string, mainA: number, size: ConductorInput['size'], lengthFt: number, col: number, row: number) => {
    const main = node({ id: `${id}-M`, kind: 'breaker', label: `${id} main ${mainA} A`, ratingA: mainA, position: at(col, row) });
    const bus = node({ id, kind: 'bus', busType: 'panelboard', label: id, busRatingA: Math.max(225, mainA), position: at(col, row + 1) });
    wire({ id: `${id}-F`, from, to: main, size, lengthFt });
    link(main, bus);
    branches(bus, pick(2, 6), col, row + 2);
  };

  let board = 0;
  let msb = '';
  while (budget > 0) {
    // A band of boards is one building: its service sits above the band's first board.
    const band = Math.floor(board / BOARDS_PER_BAND);
    const bandTop = band * (SERVICE_ROWS + ROWS_PER_BAND);
    if (board % BOARDS_PER_BAND === 0) {
      msb = service(band, bandTop);
      if (budget === 0) break;
    }
    const bandCol = (board % BOARDS_PER_BAND) * (UNITS_PER_BOARD * UNIT_COLUMNS);
    const top = bandTop + SERVICE_ROWS;
    const dsb = `DSB${board + 1}`;
    const fb = node({ id: `${msb}-${board + 1}`, kind: 'breaker', ratingA: 800, position: at(bandCol, top) });
    link(msb, fb);
    node({ id: dsb, kind: 'bus', busType: 'switchboard', label: `Distribution board ${board + 1}`, busRatingA: 800, position: at(bandCol, top + 1) });
    // 2 sets 500 kcmil Cu = 760 A on 800 A: 240.4(B) next size up.
    wire({ id: `${dsb}-F`, from: fb, to: dsb, size: '500', parallelSets: 2, lengthFt: pick(50, 300) });

    for (let u = 0; u < UNITS_PER_BOARD && budget > 0; u++) {
      const col = bandCol + u * UNIT_COLUMNS;
      const row = top + 2;
      const id = `${dsb}U${u + 1}`;
      const kind = rand();
      if (kind < 0.45 && budget >= 3) {
        // 600 A riser, tap box, 10 ft and 25 ft taps.
        const brk = node({ id: `${id}-B`, kind: 'breaker', ratingA: 600, position: at(col, row) });
        link(dsb, brk);
        const tb = node({ id: `${id}-TB`, kind: 'bus', busType: 'tap-box', position: at(col, row + 1) });
        wire({ id: `${id}-R`, from: brk, to: tb, size: '350', parallelSets: 2, lengthFt: pick(20, 200) });
        const tooLong = rand() < 0.05;
        panelWithMain(`${id}-PA`, tb, 150, '1/0', tooLong ? 12 : pick(4, 10), col, row + 2);
        if (budget > 0) {
          const undersized = rand() < 0.1;
          panelWithMain(`${id}-PB`, tb, undersized ? 175 : 200, undersized ? '2/0' : '3/0', pick(11, 25), col + UNIT_COLUMNS / 2, row + 2);
        }
      } else if (kind < 0.75 && budget >= 2) {
        // Transformer: primary protected at 125 A, 18 ft secondary under 240.21(C)(6).
        const brk = node({ id: `${id}-B`, kind: 'breaker', ratingA: 125, position: at(col, row) });
        link(dsb, brk);
        const xf = node({
          id: `${id}-T`, kind: 'transformer', kva: 75, primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3,
          connection: 'delta-wye', impedancePct: 4.5, position: at(col, row + 1),
        });
        wire({ id: `${id}-P`, from: brk, to: xf, size: '1', lengthFt: pick(10, 120) });
        panelWithMain(`${id}-PR`, xf, 250, '250', pick(6, 25), col, row + 2);
      } else {
        // 225 A feeder to a main-lugs panelboard.
        const brk = node({ id: `${id}-B`, kind: 'breaker', ratingA: 225, position: at(col, row) });
        link(dsb, brk);
        const bus = node({ id: `${id}-PL`, kind: 'bus', busType: 'panelboard', busRatingA: 225, position: at(col, row + 2) });
        wire({ id: `${id}-F`, from: brk, to: bus, size: '4/0', lengthFt: pick(20, 250) });
        branches(bus, pick(2, 8), col, row + 4);
      }
    }
    board += 1;
  }

  return {
    format: 'linewright-project',
    version: PROJECT_VERSION,
    project: { name: `Synthetic one-line, ${conductors} conductors (seed ${seed})` },
    nodes,
    conductors: wires,
    busLinks: links,
  };
}
