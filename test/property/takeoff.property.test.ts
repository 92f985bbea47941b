/**
 * Properties of the takeoff over random, schema-valid networks (fast-check,
 * fixed seed as in analyze.property.test.ts): every total is the sum of the
 * rows it groups, and drawing one more run never lowers a grand total.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyze, buildTakeoff, loadProject, takeoffTables, takeoffTotals, type Project, type ProjectInput, type Takeoff } from '@linewright/core';
import { oddNetwork, treeNetwork } from '../helpers/networks';

const seed = process.env.FC_SEED ? Number(process.env.FC_SEED) : process.env.FC_RUNS ? undefined : 20261202;
const settings = (numRuns: number): fc.Parameters<unknown> => ({ numRuns: Number(process.env.FC_RUNS ?? numRuns), ...(seed === undefined ? {} : { seed }) });

function load(input: ProjectInput): Project {
  const loaded = loadProject(JSON.parse(JSON.stringify(input)));
  if (!loaded.ok) throw new Error(`generated network refused: ${JSON.stringify(loaded.errors.slice(0, 5))}`);
  return loaded.project;
}

function takeoffOf(input: ProjectInput): Takeoff {
  const p = load(input);
  return buildTakeoff(p, analyze(p));
}

const sum = (xs: readonly (number | null)[]) => Math.round(xs.reduce<number>((s, x) => s + (x ?? 0), 0) * 100) / 100;
/** Equal within rounding to 0.01 ft per row summed (0.05 ft), plus a relative hair for large sums. */
const close = (a: number, b: number) => Math.abs(a - b) <= 0.05 + 1e-4 * Math.abs(b);

/** True when a load or a bus hangs at or below node `id` (plain walk over the file, independent of the takeoff). */
function servesSomething(input: ProjectInput, id: string, seen = new Set<string>()): boolean {
  if (seen.has(id)) return false;
  seen.add(id);
  const node = input.nodes.find((n) => n.id === id);
  if (!node) return false;
  if (node.kind === 'load' || node.kind === 'bus') return true;
  if (node.kind === 'transformer') return false;
  const next = [...input.conductors, ...(input.busLinks ?? [])].filter((e) => e.from === id).map((e) => e.to);
  return next.some((to) => servesSomething(input, to, seen));
}

/** The grand totals an estimator prices from. */
function grand(t: Takeoff) {
  const x = takeoffTotals(t);
  return {
    wireFt: sum(x.wire.map((w) => w.totalFt)),
    racewayFt: sum(x.raceway.map((r) => r.feet)),
    raceways: sum(x.raceway.map((r) => r.raceways)),
    terminations: sum(x.terminations.map((r) => r.terminations)),
    devices: sum(x.devices.map((d) => d.count)),
    equipment: sum([...x.buses, ...x.transformers, ...x.disconnects].map((e) => e.count)),
  };
}

describe('takeoff totals (property)', () => {
  it('every total equals the sum of the rows it groups, and each table total row sums its column', () => {
    fc.assert(
      fc.property(fc.oneof(treeNetwork(), oddNetwork()), (input) => {
        const t = takeoffOf(input);
        const x = takeoffTotals(t);
        expect(close(sum(x.wire.map((w) => w.totalFt)), sum(t.runs.flatMap((r) => [r.phaseFt, r.neutralFt, r.egcFt])))).toBe(true);
        for (const w of x.wire) expect(close(w.totalFt, w.phaseFt + w.neutralFt + w.egcFt)).toBe(true);
        const sized = t.runs.filter((r) => r.raceway.tradeSize !== null);
        expect(close(sum(x.raceway.map((r) => r.feet)), sum(sized.map((r) => r.racewayFt)))).toBe(true);
        expect(sum(x.raceway.map((r) => r.raceways))).toBe(sum(sized.map((r) => r.raceway.count)));
        const ends = sum(t.runs.map((r) => 2 * (r.phaseConductors + r.neutralConductors + (r.egc.size === null ? 0 : r.egc.count))));
        expect(sum(x.terminations.map((e) => e.terminations))).toBe(ends);
        expect(sum(x.devices.map((d) => d.count))).toBe(t.devices.length);
        expect(sum([...x.buses, ...x.transformers, ...x.disconnects].map((e) => e.count))).toBe(t.equipment.length);
        for (const table of takeoffTables(t, x)) {
          if (!table.totals) continue;
          table.columns.forEach((c, i) => {
            if (c.sum) expect(close(table.totals![i] as number, sum(table.rows.map((r) => r[i] as number | null)))).toBe(true);
          });
        }
      }),
      settings(60),
    );
  });

  it('adding a run never lowers a grand total (wire feet, raceway feet and count, terminations, devices, equipment)', () => {
    const extra = fc.record({
      size: fc.constantFrom('12', '10', '6', '2', '1/0', '4/0', '500') as fc.Arbitrary<'12'>,
      lengthFt: fc.integer({ min: 1, max: 400 }),
      phases: fc.constantFrom(1, 3) as fc.Arbitrary<1 | 3>,
      at: fc.nat(),
    });
    fc.assert(
      fc.property(treeNetwork(), extra, (input, add) => {
        const before = grand(takeoffOf(input));
        // A run drawn to nothing is counted with every line of its system until its load is drawn, so drawing a
        // single-phase load there is new information, not an added run: the new run hangs below equipment that
        // already serves a load or a bus (every run above it then serves something too).
        const parents = input.nodes.filter((n) => n.kind !== 'load' && servesSomething(input, n.id));
        fc.pre(parents.length > 0);
        const parent = parents[add.at % parents.length]!;
        const more: ProjectInput = {
          ...input,
          nodes: [...input.nodes, { id: 'X-LOAD', kind: 'load', currentA: 5, phases: add.phases }],
          conductors: [...input.conductors, { id: 'X-RUN', from: parent.id, to: 'X-LOAD', size: add.size, lengthFt: add.lengthFt }],
        };
        const after = grand(takeoffOf(more));
        for (const k of Object.keys(before) as (keyof typeof before)[]) expect(after[k], k).toBeGreaterThanOrEqual(before[k] - 0.01);
      }),
      settings(60),
    );
  });
});
