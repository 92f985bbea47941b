import { describe, expect, it } from 'vitest';
import { renderText, toConductorScheduleCsv, toJsonReport } from '@linewright/core';
import { diagram } from '../../helpers/builder';
import { conductor, run } from '../../helpers/analyzeInput';


/** utility (480Y/277 V unless given) → breaker → branch conductor BR → one load. */
function branch(load: Record<string, unknown>, opts: { volts?: number; breakerA?: number; size?: string; breaker?: Record<string, unknown>; fuse?: boolean } = {}) {
  const d = diagram().utility(opts.volts ?? 480);
  if (opts.fuse) d.fuse(opts.breakerA ?? 20, opts.breaker ?? {});
  else d.breaker(opts.breakerA ?? 20, opts.breaker ?? {});
  return d.conductor({ id: 'BR', size: (opts.size ?? '12') as '12', lengthFt: 50 }).load(load).build();
}

describe('each load draws current at its own voltage (DOMAIN-2 §1.1, NFPA 70-2023 220.5(A) nominal voltages; I = VA / V, common practice)', () => {
  it('a 4.8 kVA 277 V light on 480Y/277: 4800 / 277 = 17.33 A, not 4800 / (√3 × 480) = 5.77 A', () => {
    const c = conductor(run(branch({ kva: 4.8, phases: 1, connection: 'line-to-neutral' })), 'BR');
    expect(c.load?.flowingA).toBeCloseTo(17.33, 2);
  });

  it('a 9 kVA 208 V single-phase oven on 208Y/120: 9000 / 208 = 43.27 A', () => {
    const c = conductor(run(branch({ kva: 9, phases: 1, connection: 'line-to-line' }, { volts: 208, breakerA: 50, size: '6' })), 'BR');
    expect(c.load?.flowingA).toBeCloseTo(43.27, 2);
  });

  it('a single-phase kVA load whose connection is not stated is taken at the lower voltage, the larger current: 4800 / 277 = 17.33 A', () => {
    const c = conductor(run(branch({ kva: 4.8, phases: 1 })), 'BR');
    expect(c.load?.flowingA).toBeCloseTo(17.33, 2);
  });

  it('a 16 A continuous 277 V load on 12 AWG (25 A): 20 A calculated, within 25 A', () => {
    const report = run(branch({ kva: (16 * 277) / 1000, phases: 1, connection: 'line-to-neutral', continuous: true }));
    expect(conductor(report, 'BR').load?.calculatedA).toBeCloseTo(20, 2);
    expect(report.findings.filter((f) => f.ruleId === 'calculated-load')).toEqual([]);
  });

  it('an undersized 277 V branch circuit is caught: 7.2 kVA / 277 V = 25.99 A > 12 AWG at 75 °C (25 A)', () => {
    const report = run(branch({ kva: 7.2, phases: 1, connection: 'line-to-neutral' }));
    expect(report.findings.some((f) => f.id === 'calculated-load:BR:below-load')).toBe(true);
  });

  it('a feeder serving one 277 V load carries that load on one phase: never less than 17.33 A, though the balanced share is 5.77 A', () => {
    const input = diagram()
      .utility(480)
      .breaker(100)
      .conductor({ id: 'F', size: '3', lengthFt: 40 })
      .panel(100)
      .breaker(20)
      .conductor({ size: '12', lengthFt: 30 })
      .load({ kva: 4.8, phases: 1, connection: 'line-to-neutral' })
      .build();
    expect(conductor(run(input), 'F').load?.flowingA).toBeCloseTo(17.33, 2);
  });

  it('three 10 kVA 277 V loads roll up balanced on a feeder: 30 000 / (√3 × 480) = 36.08 A, at least the largest single load (36.10 A)', () => {
    const d = diagram().utility(480).breaker(100).conductor({ id: 'F', size: '3', lengthFt: 40 }).panel(100, { id: 'P' });
    for (let i = 0; i < 3; i++) d.at('P').breaker(50).conductor({ size: '8', lengthFt: 20 }).load({ kva: 10, phases: 1, connection: 'line-to-neutral' });
    expect(conductor(run(d.build()), 'F').load?.flowingA).toBeCloseTo(36.1, 1);
  });

  it('a 25 kVA single-phase transformer on a 480 V three-phase bus draws 25 000 / 480 = 52.08 A on its primary (DOMAIN-2 §1.3)', () => {
    const input = diagram()
      .utility(480)
      .breaker(70)
      .conductor({ id: 'PRI', size: '4', lengthFt: 20 })
      .transformer({ kva: 25, primaryVoltsLL: 480, secondaryVoltsLL: 240, phases: 1, connection: 'single-phase-3w' })
      .conductor({ size: '1/0', lengthFt: 10 })
      .breaker(125)
      .load({ kva: 25, phases: 1, connection: 'line-to-line' })
      .build();
    expect(conductor(run(input), 'PRI').load?.flowingA).toBeCloseTo(52.08, 2);
  });
});

describe('motor and HVAC branch circuits, 240.4(G)', () => {
  it('10 AWG Cu on a 70 A inverse-time breaker for a 20 hp 460 V motor (27 A, Table 430.250) is a motor circuit, no violation (430.22, 430.52)', () => {
    const report = run(branch({ motor: { hp: 20 } }, { breakerA: 70, size: '10' }));
    const c = conductor(report, 'BR');
    expect(c.verdict).toBe('motor-circuit');
    expect(c.cites?.section).toBe('240.4(G)');
    expect(c.load).toEqual({ flowingA: 27, calculatedA: 33.75 });
    expect(report.findings.filter((f) => f.severity === 'violation')).toEqual([]);
  });

  it('an 80 A breaker on that motor is too large; the fix is the 70 A that 430.52 allows, never a breaker at the conductor\'s 240.4 rating', () => {
    const c = conductor(run(branch({ motor: { hp: 20 } }, { breakerA: 80, size: '10' })), 'BR');
    expect(c.verdict).toBe('unprotected');
    expect(c.fixes.some((f) => f.kind === 'add-ocpd')).toBe(false);
    expect(c.fixes).toContainEqual(expect.objectContaining({ kind: 'set-field', field: 'ratingA', value: 70 }));
  });

  it('8 hp is not a table rating: the nameplate full-load current is used (430.6(A))', () => {
    const c = conductor(run(branch({ motor: { hp: 8, fullLoadA: 11.5 } }, { breakerA: 30, size: '12' })), 'BR');
    expect(c.verdict).toBe('motor-circuit');
    expect(c.load?.flowingA).toBe(11.5);
  });

  it('a rooftop unit marked MCA 18 A, MOP 25 A on 14 AWG Cu (20 A at 75 °C) and a 25 A breaker is an HVAC circuit (440.35, 440.22)', () => {
    const report = run(branch({ hvac: { mcaA: 18, mopA: 25 } }, { breakerA: 25, size: '14', volts: 208 }));
    expect(conductor(report, 'BR').verdict).toBe('hvac-circuit');
    expect(report.findings.filter((f) => f.severity === 'violation')).toEqual([]);
  });

  it('a motor behind a disconnect: both conductors of the branch circuit are motor-circuit conductors', () => {
    const input = diagram()
      .utility(480)
      .breaker(70)
      .conductor({ id: 'A', size: '10', lengthFt: 40 })
      .disconnect()
      .conductor({ id: 'B', size: '10', lengthFt: 10 })
      .load({ motor: { hp: 20 } })
      .build();
    const report = run(input);
    expect([conductor(report, 'A').verdict, conductor(report, 'B').verdict]).toEqual(['motor-circuit', 'motor-circuit']);
  });
});

describe('unknown stays unknown (issue: a double-fed node made loads NaN)', () => {
  /** Two sources into one switchboard, a 600 A feeder breaker, a 20 ft 3/0 tap, a 200 A breaker, a 150 A load. */
  function doubleFed(secondVolts: number) {
    return diagram()
      .utility(480, { id: 'U1', label: 'Utility A' })
      .conductor({ size: '600', parallelSets: 4, lengthFt: 30 })
      .switchboard(2000, { id: 'SWBD' })
      .breaker(600, { id: 'FDR' })
      .tap({ id: 'TAP', size: '3/0', lengthFt: 20 })
      .breaker(200)
      .load({ currentA: 150 })
      .startTree()
      .utility(secondVolts, { id: 'U2', label: 'Utility B' })
      .join('U2', 'SWBD', { id: 'SVC2', size: '600', parallelSets: 4, lengthFt: 30 })
      .build();
  }

  it('supplies that disagree on voltage: the tap below is incomplete, never unprotected "(NaN A)"; no NaN anywhere in the reports', () => {
    const report = run(doubleFed(208));
    const tap = conductor(report, 'TAP');
    expect(['tap-25ft', 'incomplete']).toContain(tap.verdict);
    expect(tap.load).toBeNull();
    const json = JSON.stringify(toJsonReport(report));
    expect(json).not.toMatch(/NaN/);
    expect(toConductorScheduleCsv(report)).not.toMatch(/NaN/);
    expect(renderText(report)).not.toMatch(/NaN/);
    const several = report.findings.find((f) => f.messageId === 'several-supplies');
    expect(several?.message).toContain('fed from two sources: Utility A and Utility B');
  });

  it('supplies that agree on voltage give the node its voltage: the good 20 ft 3/0 tap on 600 A is a 25 ft tap (240.21(B)(2))', () => {
    const report = run(doubleFed(480));
    expect(conductor(report, 'TAP').verdict).toBe('tap-25ft');
    expect(conductor(report, 'TAP').load?.flowingA).toBe(150);
  });
});

describe('continuous load against the ampacity before and after derating (215.2(A)(1)(a), (b))', () => {
  it('150 A continuous on 3/0 Cu THHN with six current-carrying conductors: 187.5 A ≤ 200 A (75 °C, before) and 150 A ≤ 180 A (225 × 0.80, after): no violation', () => {
    const input = diagram()
      .utility(480)
      .breaker(175)
      .conductor({ id: 'F', size: '3/0', insulation: 'THHN', currentCarrying: 6, lengthFt: 60 })
      .panel(225)
      .breaker(175)
      .conductor({ size: '3/0', lengthFt: 10 })
      .load({ currentA: 150, continuous: true })
      .build();
    const report = run(input);
    expect(conductor(report, 'F').verdict).toBe('protected');
    expect(report.findings.filter((f) => f.ruleId === 'calculated-load')).toEqual([]);
  });

  it('161 A continuous on the same conductor: 201.25 A > 200 A fails (a)', () => {
    const input = diagram()
      .utility(480)
      .breaker(175)
      .conductor({ id: 'F', size: '3/0', insulation: 'THHN', currentCarrying: 6, lengthFt: 60 })
      .panel(225)
      .breaker(175)
      .conductor({ size: '3/0', lengthFt: 10 })
      .load({ currentA: 161, continuous: true })
      .build();
    const ids = run(input).findings.filter((f) => f.subject.kind === 'conductor' && f.subject.id === 'F' && f.ruleId === 'calculated-load').map((f) => f.messageId);
    expect(ids).toEqual(['below-calculated-load']);
  });
});

describe('termination rating where the conductor states none: a project setting (110.14(C)(1))', () => {
  const circuit = (setting?: 'listed-75' | 'per-110.14(C)(1)') =>
    diagram(setting ? { terminationDefault: setting } : {}).utility(480).breaker(50).conductor({ id: 'BR', size: '8', lengthFt: 40 }).load({ currentA: 30 }).build();

  it('default, 75 °C where the equipment is listed for it: 8 AWG Cu is 50 A, protected at 50 A (Table 310.16 75 °C column)', () => {
    const report = run(circuit());
    expect(conductor(report, 'BR').verdict).toBe('protected');
    expect(conductor(report, 'BR').ampacity?.terminalTempC).toBe(75);
    expect(report.assumptions.join(' ')).toContain('equipment listed and marked for 75 °C');
  });

  it('per 110.14(C)(1): 8 AWG Cu takes the 60 °C column, 40 A, and a 50 A breaker does not protect it (240.4, 240.4(B) allows 40 A only)', () => {
    const report = run(circuit('per-110.14(C)(1)'));
    expect(conductor(report, 'BR').ampacity?.terminalTempC).toBe(60);
    expect(conductor(report, 'BR').verdict).toBe('unprotected');
    expect(report.assumptions.join(' ')).toContain('per 110.14(C)(1): 60 °C for 14 AWG to 1 AWG');
  });

  it('a conductor that states its own rating keeps it whatever the setting', () => {
    const input = circuit('per-110.14(C)(1)');
    input.conductors[0]!.terminalTempC = 75;
    expect(conductor(run(input), 'BR').verdict).toBe('protected');
  });
});

describe('definite violations are violations (310.10(G), 310.14(A)(3): "shall")', () => {
  it('two sets of 2 AWG in parallel: a violation of 310.10(G), not a warning', () => {
    const input = diagram().utility(480).breaker(200).conductor({ id: 'P', size: '2', parallelSets: 2, lengthFt: 40 }).load({ currentA: 150 }).build();
    const f = run(input).findings.find((x) => x.id === 'ampacity:P:no-ampacity-parallelSets');
    expect(f?.severity).toBe('violation');
    expect(f?.cites?.section).toBe('310.10(G)');
  });

  it('TW (60 °C) in a 65 °C ambient: used above its insulation rating, a violation of 310.14(A)(3)', () => {
    const input = diagram().utility(480).breaker(20).conductor({ id: 'H', size: '12', insulation: 'TW', ambientC: 65, lengthFt: 40 }).load({ currentA: 10 }).build();
    const f = run(input).findings.find((x) => x.id === 'ampacity:H:no-ampacity-ambientC');
    expect(f?.severity).toBe('violation');
    expect(f?.cites?.section).toBe('310.14(A)(3)');
  });
});
