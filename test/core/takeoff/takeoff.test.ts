import { describe, expect, it } from 'vitest';
import { analyze, buildTakeoff, countCurrentCarrying, loadProject, proportionalEgcSize, takeoffTotals, type Project, type ProjectInput, type Takeoff } from '@linewright/core';
import { diagram } from '../../helpers/builder';

function load(input: ProjectInput): Project {
  const loaded = loadProject(JSON.parse(JSON.stringify(input)));
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return loaded.project;
}

function takeoffOf(input: ProjectInput): Takeoff {
  const p = load(input);
  return buildTakeoff(p, analyze(p));
}

const circleArea = (d: number) => (Math.PI / 4) * d * d;

describe('250.122(B): EGC increased in proportion to upsized phase conductors', () => {
  it('100 A breaker, 3 AWG Cu would do, 1/0 Cu installed: 16 510 × 105 600 / 52 620 = 33 133 cmil → 4 AWG Cu (DOMAIN-2 E6, arithmetic in the test)', () => {
    const ratio = 105_600 / 52_620; // Chapter 9 Table 8: 1/0 and 3 AWG
    const need = 16_510 * ratio; // Table 250.122, 100 A: 8 AWG Cu = 16 510 cmil
    expect(Math.round(need)).toBe(33_133);
    const p = proportionalEgcSize('8', '3', '1/0');
    expect(p.ratio).toBeCloseTo(ratio, 6);
    expect(p.neededCmil).toBeCloseTo(need, 3);
    expect(p.size).toBe('4'); // 6 AWG = 26 240 < 33 133 ≤ 41 740 = 4 AWG
  });

  it('the same circuit drawn: the takeoff finds 3 AWG as the minimum (4 AWG = 85 A; 90 A, not 100 A, is the next rating up, 240.4(B)) and sizes 4 AWG Cu', () => {
    const t = takeoffOf(diagram().utility(480).breaker(100).conductor({ id: 'F', size: '1/0', insulation: 'THHN', lengthFt: 100 }).load({ currentA: 80, phases: 3 }).build());
    const egc = t.runs[0]!.egc;
    expect(egc.tableSize).toBe('8');
    expect(egc.minimumPhaseSize).toBe('3');
    expect(egc.size).toBe('4');
    expect(egc.cites).toContain('250.122(B)');
  });

  it('not increased when the phase conductors are the minimum: 3 AWG Cu on 100 A → 8 AWG Cu (Table 250.122)', () => {
    const t = takeoffOf(diagram().utility(480).breaker(100).conductor({ size: '3', lengthFt: 50 }).load({ currentA: 80, phases: 3 }).build());
    expect(t.runs[0]!.egc.size).toBe('8');
    expect(t.runs[0]!.egc.increaseRatio).toBe(1);
  });

  it('250.122(F): an 800 A feeder of 2 × 500 kcmil Cu (2 × 380 = 760 A, next rating up 800 A) in two raceways has a 1/0 Cu EGC in each (DOMAIN-2 E6 variant)', () => {
    const t = takeoffOf(diagram().utility(480).breaker(800).conductor({ size: '500', parallelSets: 2, lengthFt: 100 }).switchboard(800).build());
    const run = t.runs[0]!;
    expect(run.egc.size).toBe('1/0');
    expect(run.egc.count).toBe(2);
    expect(run.raceway.count).toBe(2);
    expect(run.egc.cites).toContain('250.122(F)');
  });

  it('250.122(G): a feeder tap takes its EGC from the feeder OCPD, not larger than the tap (600 A feeder, 3/0 tap → 1 AWG Cu)', () => {
    const t = takeoffOf(
      diagram().utility(480).breaker(600).conductor({ size: '350', parallelSets: 2, lengthFt: 30 }).tapBox(600)
        .tap({ id: 'TAP', size: '3/0', lengthFt: 20 }).breaker(200).panel(225).build(),
    );
    const tap = t.runs.find((r) => r.conductorId === 'TAP')!;
    expect(tap.verdict).toBe('tap-25ft');
    expect(tap.egc.size).toBe('1');
    expect(tap.egc.cites).toContain('250.122(G)');
  });

  it('a service has no OCPD ahead: its supply-side bonding jumper is sized by Table 250.102(C)(1): 500 kcmil Cu (over 350 through 600) → 1/0 Cu', () => {
    const t = takeoffOf(diagram().utility(480).conductor({ size: '500', lengthFt: 20 }).breaker(400).switchboard(400).build());
    expect(t.runs[0]!.egc).toMatchObject({ size: '1/0', count: 1, cites: ['Table 250.102(C)(1)'], problem: null });
    const stated = takeoffOf(diagram().utility(480).conductor({ size: '500', lengthFt: 20, egcSize: '2/0' }).breaker(400).switchboard(400).build());
    expect(stated.runs[0]!.egc.size).toBe('2/0');
    const below = takeoffOf(diagram().utility(480).conductor({ size: '500', lengthFt: 20, egcSize: '2' }).breaker(400).switchboard(400).build());
    expect(below.runs[0]!.flags.join(' ')).toMatch(/below the 250\.102\(C\)\(1\) minimum 1\/0 AWG/);
  });

  it('250.102(C)(2): a service of 4 × 600 kcmil Cu in four raceways has a 1/0 Cu jumper in each (sized by one raceway, not by the 2400 kcmil total)', () => {
    const t = takeoffOf(diagram().utility(480).conductor({ size: '600', parallelSets: 4, lengthFt: 20 }).breaker(2000).switchboard(2000).build());
    expect(t.runs[0]!.egc).toMatchObject({ size: '1/0', count: 4 });
    expect(t.runs[0]!.egc.cites).toContain('250.102(C)(2)');
  });

  it('250.102(C)(1) above the table: a transformer secondary of 1500 kcmil Cu needs 12.5 % × 1 500 000 = 187 500 cmil → 4/0 Cu (211 600 cmil, Chapter 9 Table 8)', () => {
    const t = takeoffOf(
      diagram().utility(480).breaker(1200).conductor({ size: '600', parallelSets: 3, lengthFt: 20 }).transformer({ kva: 500, impedancePct: 5 })
        .conductor({ id: 'SEC', size: '1500', parallelSets: 1, lengthFt: 10 }).breaker(1200).switchboard(1600).build(),
    );
    const sec = t.runs.find((r) => r.conductorId === 'SEC')!;
    expect(0.125 * 1_500_000).toBe(187_500);
    expect(sec.egc).toMatchObject({ size: '4/0', cites: ['Table 250.102(C)(1)', '250.102(C)(1)'] });
  });

  it('a stated EGC below the minimum is flagged: 10 AWG on a 100 A circuit (Table 250.122: 8 AWG)', () => {
    const t = takeoffOf(diagram().utility(480).breaker(100).conductor({ size: '3', lengthFt: 50, egcSize: '10' }).load({ currentA: 80, phases: 3 }).build());
    expect(t.runs[0]!.flags.join(' ')).toMatch(/below the 250\.122 minimum 8 AWG/);
  });
});

describe('Chapter 9 raceway fill', () => {
  it('4 × 500 kcmil THHN + 3 AWG THHN EGC in EMT: 2.9267 in² needs 3 in EMT (2-1/2 in holds 2.343 in² at 40 %); areas from π/4 × d², Table 5 diameters and Table 4 IDs', () => {
    // Independent arithmetic: Table 5 diameters 0.949 in (500 kcmil) and 0.352 in (3 AWG); Table 4 EMT IDs 2.731 in and 3.356 in.
    const fill = 4 * circleArea(0.949) + circleArea(0.352);
    expect(fill).toBeGreaterThan(0.4 * circleArea(2.731));
    expect(fill).toBeLessThanOrEqual(0.4 * circleArea(3.356));
    // 400 A breaker: 500 kcmil Cu (380 A at 75 °C, next rating up 400 A) is the minimum, so Table 250.122 gives 3 AWG Cu unchanged.
    const t = takeoffOf(
      diagram().utility(480).breaker(400).conductor({ size: '500', insulation: 'THHN', lengthFt: 80, raceway: 'EMT', neutral: 'yes' }).panel(400).build(),
    );
    const run = t.runs[0]!;
    expect(run.egc.size).toBe('3');
    expect(run.raceway.conductorsPerRaceway).toBe(5);
    expect(run.raceway.conductorAreaIn2).toBeCloseTo(fill, 3);
    expect(run.raceway.tradeSize).toBe('3');
    expect(run.raceway.fillPct).toBeCloseTo((100 * fill) / circleArea(3.356), 0);
  });

  it('flags a run whose fill exceeds the largest trade size of its kind: 4 × 1000 kcmil THHN + 3/0 EGC = 5.659 in² > 5.452 in² (4 in IMC at 40 %, the largest 342.20(B) permits)', () => {
    const t = takeoffOf(
      diagram().utility(480).breaker(1200).conductor({ size: '1000', lengthFt: 50, neutral: 'yes', egcSize: '3/0', raceway: 'IMC' }).switchboard(1200).build(),
    );
    const rw = t.runs[0]!.raceway;
    expect(4 * circleArea(1.31) + circleArea(0.584)).toBeGreaterThan(0.4 * circleArea(4.166));
    expect(rw.tradeSize).toBeNull();
    expect(rw.problem).toMatch(/exceeds/);
    expect(t.runs[0]!.flags.some((f) => f.includes('exceeds'))).toBe(true);
  });

  it('the same contents in PVC Schedule 80 go to trade size 5: 5.659 in² > 4.503 (4 in) and ≤ 7.142 in² (5 in, 40 %)', () => {
    const t = takeoffOf(
      diagram().utility(480).breaker(1200).conductor({ size: '1000', lengthFt: 50, neutral: 'yes', egcSize: '3/0', raceway: 'PVC-80' }).switchboard(1200).build(),
    );
    expect(4 * circleArea(1.31) + circleArea(0.584)).toBeLessThan(0.4 * circleArea(4.768));
    expect(t.runs[0]!.raceway).toMatchObject({ tradeSize: '5', problem: null });
  });

  it('a bare EGC counts at its Chapter 9 Table 8 area (Note 8): 3 × 3/0 THHN + 4 AWG bare = 3 × 0.2679 + π/4 × 0.232² = 0.8460 in²; insulated 4 AWG THHN would be 0.8861; the wire totals list it as bare', () => {
    const build = (egcBare: boolean) => diagram().utility(480).breaker(200).conductor({ size: '3/0', lengthFt: 100, egcSize: '4', egcBare }).load({ currentA: 150, phases: 3 }).build();
    const bare = takeoffOf(build(true));
    const insulated = takeoffOf(build(false));
    expect(bare.runs[0]!.raceway.conductorAreaIn2).toBeCloseTo(3 * 0.2679 + Math.round(circleArea(0.232) * 10_000) / 10_000, 4);
    expect(insulated.runs[0]!.raceway.conductorAreaIn2).toBeCloseTo(3 * 0.2679 + 0.0824, 4);
    expect(takeoffTotals(bare).wire.find((w) => w.egcFt > 0)).toMatchObject({ size: '4', insulation: 'bare' });
  });

  it('an insulation without transcribed Table 5 rows is not sized, and says why', () => {
    const t = takeoffOf(diagram().utility(480).breaker(100).conductor({ size: '3', insulation: 'RHW', lengthFt: 50 }).load({ currentA: 80, phases: 3 }).build());
    expect(t.runs[0]!.raceway.tradeSize).toBeNull();
    expect(t.runs[0]!.raceway.problem).toMatch(/Table 5/);
  });

  it('cable and open wiring get no raceway', () => {
    const t = takeoffOf(diagram().utility(480).breaker(100).conductor({ size: '3', wiring: 'cable', lengthFt: 50 }).load({ currentA: 80, phases: 3 }).build());
    expect(t.runs[0]!.raceway.kind).toBeNull();
    expect(t.runs[0]!.racewayFt).toBeNull();
  });
});

describe('310.15(E): current-carrying conductors counted once', () => {
  it('(E)(1) a 3-phase 4-wire neutral carrying only unbalanced current does not count: 3', () => {
    expect(countCurrentCarrying({ ungroundedPerSet: 3, hasNeutral: true, kind: 'three-phase-4w' }, false)).toMatchObject({ count: 3, neutralCounts: false, section: '310.15(E)(1)' });
  });
  it('(E)(3) mainly nonlinear load on a 4-wire wye: the neutral counts, 4', () => {
    expect(countCurrentCarrying({ ungroundedPerSet: 3, hasNeutral: true, kind: 'three-phase-4w' }, true)).toMatchObject({ count: 4, section: '310.15(E)(3)' });
  });
  it('(E)(2) two phases and the neutral of a 4-wire wye: 3', () => {
    expect(countCurrentCarrying({ ungroundedPerSet: 2, hasNeutral: true, kind: 'two-phase-and-neutral-of-wye' }, false)).toMatchObject({ count: 3, neutralCounts: true });
  });
  it('a 2-wire circuit: the grounded conductor carries the load current, 2; a 120/240 V 3-wire neutral does not count, 2', () => {
    expect(countCurrentCarrying({ ungroundedPerSet: 1, hasNeutral: true, kind: 'two-wire' }, false).count).toBe(2);
    expect(countCurrentCarrying({ ungroundedPerSet: 2, hasNeutral: true, kind: 'single-phase-3w' }, false).count).toBe(2);
  });
  it('the drawn nonlinear feeder counts 4 and its ampacity basis follows', () => {
    const t = takeoffOf(diagram().utility(480).breaker(200).conductor({ size: '3/0', lengthFt: 60, nonlinearLoad: true }).panel(225).build());
    expect(t.runs[0]!.currentCarrying.count).toBe(4);
  });
});

describe('neutral and phase conductors per run (auto, common practice)', () => {
  const net = () =>
    diagram().utility(480).breaker(1200, { id: 'MAIN' }).conductor({ id: 'SVC-LESS', size: '1', lengthFt: 10 }).switchboard(1200, { id: 'SB' })
      .breaker(200, { id: 'B-P' }).conductor({ id: 'TO-PANEL', size: '3/0', lengthFt: 40 }).panel(225, { id: 'P' })
      .breaker(20, { id: 'B-L' }).conductor({ id: 'TO-LIGHT', size: '12', lengthFt: 70 }).load({ currentA: 10, phases: 1, connection: 'line-to-neutral' })
      .at('SB').breaker(60, { id: 'B-M' }).conductor({ id: 'TO-MOTOR', size: '6', lengthFt: 30 }).load({ currentA: 40, phases: 3 })
      .at('SB').breaker(100, { id: 'B-T' }).conductor({ id: 'PRIMARY', size: '3', lengthFt: 20 }).transformer({ kva: 45, connection: 'delta-delta-3w', secondaryVoltsLL: 240 })
      .conductor({ id: 'DELTA-SEC', size: '2/0', lengthFt: 10 }).breaker(150).panel(150).build();
  const byId = (t: Takeoff, id: string) => t.runs.find((r) => r.conductorId === id)!;

  it('feeder to a panelboard: 3 phases and a neutral; lighting branch: 1 phase and a neutral; motor: 3 phases, no neutral', () => {
    const t = takeoffOf(net());
    expect(byId(t, 'TO-PANEL')).toMatchObject({ phaseConductors: 3, neutralConductors: 1 });
    expect(byId(t, 'TO-LIGHT')).toMatchObject({ phaseConductors: 1, neutralConductors: 1 });
    expect(byId(t, 'TO-MOTOR')).toMatchObject({ phaseConductors: 3, neutralConductors: 0 });
  });

  it('a transformer primary has no neutral; a 3-wire delta secondary has none', () => {
    const t = takeoffOf(net());
    expect(byId(t, 'PRIMARY').neutralConductors).toBe(0);
    expect(byId(t, 'DELTA-SEC').neutralConductors).toBe(0);
  });

  it("a stated 'no' drops the neutral and makes a single-phase branch line to line (2 phases)", () => {
    const t = takeoffOf(diagram().utility(208).breaker(30).conductor({ size: '10', lengthFt: 40, neutral: 'no' }).load({ currentA: 20, phases: 1 }).build());
    expect(t.runs[0]).toMatchObject({ phaseConductors: 2, neutralConductors: 0 });
  });

  it('a reduced neutral (220.61) is taken at its stated size', () => {
    const t = takeoffOf(diagram().utility(480).breaker(400).conductor({ size: '500', lengthFt: 50, neutralSize: '250' }).panel(400).build());
    expect(t.runs[0]!.neutralSize).toBe('250');
  });
});

describe('wire and raceway feet', () => {
  it('wire = (length + 2 × makeup) × conductors; raceway = length × raceways (makeup 3 ft stated)', () => {
    const input = diagram({ makeupFtPerTermination: 3 }).utility(480).breaker(400).conductor({ size: '250', parallelSets: 2, lengthFt: 100 }).panel(400).build();
    const run = takeoffOf(input).runs[0]!;
    // 2 sets × 3 phases = 6 conductors of 106 ft; 2 neutrals; 2 EGCs.
    expect(run.phaseFt).toBe(6 * 106);
    expect(run.neutralFt).toBe(2 * 106);
    expect(run.egcFt).toBe(2 * 106);
    expect(run.racewayFt).toBe(200);
  });

  it('a run without a length counts no feet and says so', () => {
    const t = takeoffOf(diagram().utility(480).breaker(100).conductor({ size: '3' }).load({ currentA: 80, phases: 3 }).build());
    expect(t.runs[0]!.phaseFt).toBeNull();
    expect(t.runs[0]!.flags.join(' ')).toMatch(/length missing/);
  });

  it('devices by poles: a 3-pole feeder breaker and a 1-pole lighting breaker', () => {
    const t = takeoffOf(
      diagram().utility(480).breaker(200, { id: 'F' }).conductor({ size: '3/0', lengthFt: 40 }).panel(225)
        .breaker(20, { id: 'L' }).conductor({ size: '12', lengthFt: 70 }).load({ currentA: 10, phases: 1, connection: 'line-to-neutral' }).build(),
    );
    const totals = takeoffTotals(t);
    expect(totals.devices).toEqual([
      { kind: 'breaker', ratingA: 20, poles: 1, interruptingKA: null, count: 1 },
      { kind: 'breaker', ratingA: 200, poles: 3, interruptingKA: null, count: 1 },
    ]);
  });
});
