import { describe, expect, it } from 'vitest';
import { analyze, buildTakeoff, loadProject, type Project, type ProjectInput } from '@linewright/core';
import { diagram } from '../../helpers/builder';

function load(input: ProjectInput): Project {
  const loaded = loadProject(JSON.parse(JSON.stringify(input)));
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return loaded.project;
}

/** The ampacity check's count and factor and the takeoff's count for conductor `id`. */
function bothCounts(input: ProjectInput, id = 'C') {
  const p = load(input);
  const report = analyze(p);
  const takeoff = buildTakeoff(p, report);
  const ci = p.conductors.findIndex((c) => c.id === id);
  const working = report.conductors[ci]!.ampacity!;
  const run = takeoff.runs[ci]!;
  return { ampacityCount: working.currentCarrying, factor: working.adjustmentFactor, takeoffCount: run.currentCarrying.adjustmentCount, run };
}

// NFPA 70-2023 Table 310.15(C)(1) (from memory, checked against public reproductions; tables/adjustment.ts):
// 4–6 conductors 80 %, 7–9 70 %; three or fewer 100 %.
describe('310.15(E): the ampacity adjustment and the takeoff count the same current-carrying conductors', () => {
  // currentCarrying: 1 states no other circuit in the raceway, so the circuit's own count decides.
  const alone = { currentCarrying: 1 } as const;

  it('3-phase 4-wire wye feeder to a panelboard, balanced: the neutral does not count (310.15(E)(1)), 3 conductors, × 1.00', () => {
    const r = bothCounts(diagram().utility(480).breaker(200).conductor({ id: 'C', size: '3/0', lengthFt: 60, ...alone }).panel(225).build());
    expect(r.run.circuit).toMatchObject({ kind: 'three-phase-4w', hasNeutral: true });
    expect(r.run.currentCarrying.section).toBe('310.15(E)(1)');
    expect([r.ampacityCount, r.takeoffCount, r.factor]).toEqual([3, 3, 1]);
  });

  it('the same feeder whose load is mainly nonlinear: the neutral counts (310.15(E)(3)), 4 conductors, × 0.80: 3/0 Cu THHN 225 A × 0.80 = 180 A (below the 200 A 75 °C column)', () => {
    const r = bothCounts(diagram().utility(480).breaker(200).conductor({ id: 'C', size: '3/0', lengthFt: 60, nonlinearLoad: true, ...alone }).panel(225).build());
    expect(r.run.currentCarrying.section).toBe('310.15(E)(3)');
    expect([r.ampacityCount, r.takeoffCount, r.factor]).toEqual([4, 4, 0.8]);
    const p = load(diagram().utility(480).breaker(200).conductor({ id: 'C', size: '3/0', lengthFt: 60, nonlinearLoad: true, ...alone }).panel(225).build());
    expect(analyze(p).conductors[0]!.ampacity!.ampacityA).toBe(180);
  });

  it('two phases and the neutral of a 208Y/120 V wye (a 208 V and a 120 V load on one circuit): the neutral counts (310.15(E)(2)), 3 conductors, × 1.00', () => {
    const net = diagram().utility(208).breaker(30).conductor({ id: 'C', size: '10', lengthFt: 40, ...alone }).splice({ id: 'J' })
      .conductor({ id: 'C-LL', size: '10', lengthFt: 10 }).load({ currentA: 12, phases: 1, connection: 'line-to-line' })
      .at('J').conductor({ id: 'C-LN', size: '10', lengthFt: 10 }).load({ currentA: 8, phases: 1, connection: 'line-to-neutral' })
      .build();
    const r = bothCounts(net);
    expect(r.run.circuit).toMatchObject({ kind: 'two-phase-and-neutral-of-wye', ungroundedPerSet: 2, hasNeutral: true });
    expect(r.run.currentCarrying).toMatchObject({ section: '310.15(E)(2)', neutralCounts: true });
    expect([r.ampacityCount, r.takeoffCount, r.factor]).toEqual([3, 3, 1]);
  });

  it("a 208 V single-phase load with its neutral stated ('yes') on a wye: two phases and the neutral, 310.15(E)(2)", () => {
    const r = bothCounts(diagram().utility(208).breaker(30).conductor({ id: 'C', size: '10', lengthFt: 40, neutral: 'yes', ...alone }).load({ currentA: 20, phases: 1, connection: 'line-to-line' }).build());
    expect(r.run.currentCarrying.section).toBe('310.15(E)(2)');
    expect([r.ampacityCount, r.takeoffCount]).toEqual([3, 3]);
  });

  it('single-phase 3-wire 120/240 V feeder to a panelboard: the neutral carries only the unbalance and does not count (310.15(E)(1)), 2 conductors', () => {
    const r = bothCounts(diagram().utility(240, { phases: 1 }).breaker(100).conductor({ id: 'C', size: '3', lengthFt: 50, ...alone }).panel(100).build());
    expect(r.run.circuit.kind).toBe('single-phase-3w');
    expect(r.run.currentCarrying).toMatchObject({ count: 2, neutralCounts: false });
    expect([r.ampacityCount, r.takeoffCount, r.factor]).toEqual([2, 2, 1]);
  });

  it('a stated count larger than the circuit (other circuits share the raceway) governs both: 9 stated → × 0.70 on both sides', () => {
    const r = bothCounts(diagram().utility(480).breaker(200).conductor({ id: 'C', size: '3/0', lengthFt: 60, currentCarrying: 9 }).panel(225).build());
    expect(r.run.currentCarrying.count).toBe(3);
    expect([r.ampacityCount, r.takeoffCount, r.factor]).toEqual([9, 9, 0.7]);
  });

  it('two parallel sets of a nonlinear 4-wire feeder, each in its own raceway: 4 per raceway, not 8 (310.10(G), one set per raceway)', () => {
    const r = bothCounts(diagram().utility(480).breaker(400).conductor({ id: 'C', size: '3/0', parallelSets: 2, lengthFt: 60, nonlinearLoad: true, ...alone }).panel(400).build());
    expect([r.ampacityCount, r.takeoffCount, r.factor]).toEqual([4, 4, 0.8]);
  });
});

describe('the automatic neutral reads the loads\' own connection (common practice)', () => {
  const takeoffRun = (input: ProjectInput) => {
    const p = load(input);
    return buildTakeoff(p, analyze(p)).runs[0]!;
  };

  it('a 277 V lighting load (line to neutral on 480Y/277) gets one phase and a neutral: 2 current-carrying (the grounded conductor of a 2-wire circuit)', () => {
    const run = takeoffRun(diagram().utility(480).breaker(20).conductor({ size: '12', lengthFt: 70 }).load({ currentA: 10, phases: 1, connection: 'line-to-neutral' }).build());
    expect(run).toMatchObject({ phaseConductors: 1, neutralConductors: 1 });
    expect(run.circuit.kind).toBe('two-wire');
  });

  it('a 480 V single-phase load (line to line) gets two phases and no neutral', () => {
    const run = takeoffRun(diagram().utility(480).breaker(20).conductor({ size: '12', lengthFt: 70 }).load({ currentA: 10, phases: 1, connection: 'line-to-line' }).build());
    expect(run).toMatchObject({ phaseConductors: 2, neutralConductors: 0 });
    expect(run.circuit.neutralReason).toMatch(/line-to-line/);
  });

  it('connection not stated: a kVA load is taken line to neutral (neutral), a load in amperes line to line (none), as the load calculation takes them (loads.ts)', () => {
    const kva = takeoffRun(diagram().utility(208).breaker(20).conductor({ size: '12', lengthFt: 30 }).load({ kva: 1.2, phases: 1 }).build());
    expect(kva).toMatchObject({ phaseConductors: 1, neutralConductors: 1 });
    const amps = takeoffRun(diagram().utility(208).breaker(20).conductor({ size: '12', lengthFt: 30 }).load({ currentA: 10, phases: 1 }).build());
    expect(amps).toMatchObject({ phaseConductors: 2, neutralConductors: 0 });
  });

  it('a feeder serving a 3-phase motor and a 277 V load carries a neutral; one serving a 3-phase motor and a 480 V single-phase load does not', () => {
    const withLn = diagram().utility(480).breaker(100).conductor({ size: '3', lengthFt: 50 }).splice({ id: 'J' })
      .conductor({ size: '6', lengthFt: 5 }).load({ currentA: 40, phases: 3 })
      .at('J').conductor({ size: '12', lengthFt: 5 }).load({ currentA: 10, phases: 1, connection: 'line-to-neutral' }).build();
    expect(takeoffRun(withLn)).toMatchObject({ phaseConductors: 3, neutralConductors: 1 });
    const withLl = diagram().utility(480).breaker(100).conductor({ size: '3', lengthFt: 50 }).splice({ id: 'J' })
      .conductor({ size: '6', lengthFt: 5 }).load({ currentA: 40, phases: 3 })
      .at('J').conductor({ size: '12', lengthFt: 5 }).load({ currentA: 10, phases: 1, connection: 'line-to-line' }).build();
    expect(takeoffRun(withLl)).toMatchObject({ phaseConductors: 3, neutralConductors: 0 });
  });
});
