import { describe, expect, it } from 'vitest';
import { analyze, applyFix, loadProject, type AnalysisReport, type Project, type ProjectInput } from '@linewright/core';
import { diagram } from '../../helpers/builder';

function project(input: ProjectInput): Project {
  const r = loadProject(input);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return r.project;
}

function run(input: ProjectInput): AnalysisReport {
  return analyze(project(input));
}

function verdictOf(report: AnalysisReport, id: string) {
  const c = report.conductors.find((x) => x.id === id);
  if (!c) throw new Error(`no conductor ${id}`);
  return c;
}

/** utility → 600 A feeder breaker on a switchboard bus → tap conductor → 200 A main breaker → panelboard. */
function feederTap(tap: Record<string, unknown>, opts: { feederA?: number; endA?: number } = {}) {
  return diagram()
    .utility(480, { id: 'U' })
    .conductor({ id: 'SVC', size: '600', parallelSets: 4, lengthFt: 30 })
    .breaker(2000, { id: 'MAIN' })
    .switchboard(2000, { id: 'SWBD' })
    .breaker(opts.feederA ?? 600, { id: 'FDR' })
    .tap({ id: 'TAP', size: '3/0', lengthFt: 20, ...tap })
    .breaker(opts.endA ?? 200, { id: 'END' })
    .panel(225, { id: 'PNL' })
    .conductor({ id: 'BR', size: '12', lengthFt: 50 })
    .breaker(20, { id: 'B20' })
    .build();
}

describe('feeder taps, 240.21(B)', () => {
  it('one third of 600 A is 200 A, so a 20 ft tap of 3/0 Cu at 75 °C (200 A) meets 240.21(B)(2) (DOMAIN.md check value, common practice)', () => {
    const c = verdictOf(run(feederTap({})), 'TAP');
    expect(c.verdict).toBe('tap-25ft');
    expect(c.rule).toBe('tap-25ft');
    expect(c.cites?.section).toBe('240.21(B)(2)');
    expect(c.upstreamDevice?.id).toBe('FDR');
    expect(c.upstreamDevice?.ratingA).toBe(600);
    expect(c.tapLengthFt).toBe(20);
    // Every feeder-tap rule was tried and kept in the working, 240.4 first.
    expect(c.tried.map((t) => t.ruleId)).toEqual(['protected', 'protected-next-size', 'tap-10ft', 'tap-25ft', 'tap-transformer', 'tap-high-bay', 'tap-outside']);
  });

  it('2/0 Cu (175 A) is below 600/3 = 200 A: unprotected, nearest rule 240.21(B)(2), fix: upsize to 3/0 (NFPA 70-2023 240.21(B)(2), Table 310.16)', () => {
    const report = run(feederTap({ size: '2/0' }));
    const c = verdictOf(report, 'TAP');
    expect(c.verdict).toBe('unprotected');
    const f = report.findings.find((x) => x.subject.kind === 'conductor' && x.subject.id === 'TAP' && x.severity === 'violation');
    expect(f?.ruleId).toBe('tap-25ft');
    expect(f?.message).toContain('one third of the 600 A feeder device (200 A)');
    const resize = c.fixes.find((x) => x.kind === 'resize' && x.forRule === 'tap-25ft');
    expect(resize).toMatchObject({ kind: 'resize', size: '3/0', material: 'cu' });
    expect(c.fixes.some((x) => x.kind === 'add-ocpd' && x.ratingA === 175)).toBe(true);
  });

  it('applying the suggested resize is enough: the same tap then meets 240.21(B)(2)', () => {
    const p = project(feederTap({ size: '2/0' }));
    const fix = verdictOf(analyze(p), 'TAP').fixes.find((x) => x.kind === 'resize' && x.forRule === 'tap-25ft')!;
    const fixed = structuredClone(p);
    applyFix(fixed, fix);
    expect(verdictOf(analyze(fixed), 'TAP').verdict).toBe('tap-25ft');
  });

  it('adding the suggested breaker at the tap point makes the run protected under 240.4', () => {
    const p = project(feederTap({ size: '2/0' }));
    const fix = verdictOf(analyze(p), 'TAP').fixes.find((x) => x.kind === 'add-ocpd')!;
    const fixed = structuredClone(p);
    applyFix(fixed, fix);
    const after = verdictOf(analyze(fixed), 'TAP');
    expect(after.verdict).toBe('protected');
    expect(after.upstreamDevice?.ratingA).toBe(175);
  });

  it('a 25 ft tap of 3/0 Cu is exactly at the limit; 25.1 ft is not (240.21(B)(2) "not over 25 ft")', () => {
    expect(verdictOf(run(feederTap({ lengthFt: 25 })), 'TAP').verdict).toBe('tap-25ft');
    const over = verdictOf(run(feederTap({ lengthFt: 25.1 })), 'TAP');
    expect(over.verdict).toBe('unprotected');
    expect(over.fixes).toContainEqual(expect.objectContaining({ kind: 'shorten', maxLengthFt: 25 }));
  });

  it('a 30 ft 3/0 tap is nearest the 25 ft rule (5 ft over), not the 10 ft rule (20 ft over); fixes cheapest first', () => {
    const report = run(feederTap({ lengthFt: 30 }));
    const f = report.findings.find((x) => x.subject.kind === 'conductor' && x.subject.id === 'TAP' && x.severity === 'violation');
    expect(f?.ruleId).toBe('tap-25ft');
    const kinds = verdictOf(report, 'TAP').fixes.map((x) => x.kind);
    expect(kinds.indexOf('add-ocpd')).toBeLessThan(kinds.lastIndexOf('resize'));
  });

  it('10 ft tap: 1/0 Cu (150 A) ending in a 150 A breaker meets 240.21(B)(1) at 10 ft, not at 10.1 ft', () => {
    const at10 = verdictOf(run(feederTap({ size: '1/0', lengthFt: 10 }, { endA: 150 })), 'TAP');
    expect(at10.verdict).toBe('tap-10ft');
    const over = verdictOf(run(feederTap({ size: '1/0', lengthFt: 10.1 }, { endA: 150 })), 'TAP');
    expect(over.verdict).toBe('unprotected');
  });

  it('leaving the enclosure not stated is taken as leaving: 8 ft of 12 AWG Cu off an 800 A feeder into a 20 A breaker fails the one-tenth rule, 25 A < 80 A (NFPA 70-2023 240.21(B)(1)(4))', () => {
    const c = verdictOf(run(feederTap({ size: '12', lengthFt: 8 }, { feederA: 800, endA: 20 })), 'TAP');
    expect(c.verdict).toBe('unprotected');
    const tenth = c.tried.find((t) => t.ruleId === 'tap-10ft')!.conditions.find((x) => x.id === 'fieldTenth')!;
    expect(tenth.status).toBe('fail');
    expect(tenth.text).toContain('not stated, so taken as leaving');
    // Stated as staying inside the enclosure, the same tap is a 10 ft tap.
    expect(verdictOf(run(feederTap({ size: '12', lengthFt: 8, leavesEnclosure: false }, { feederA: 800, endA: 20 })), 'TAP').verdict).toBe('tap-10ft');
  });

  it('one tenth of 800 A is 80 A: a field-installed 10 ft tap leaving the enclosure needs 4 AWG Cu (85 A), 6 AWG (65 A) fails (DOMAIN.md check value, common practice)', () => {
    const ok = verdictOf(run(feederTap({ size: '4', lengthFt: 8, leavesEnclosure: true }, { feederA: 800, endA: 80 })), 'TAP');
    expect(ok.verdict).toBe('tap-10ft');
    const small = verdictOf(run(feederTap({ size: '6', lengthFt: 8, leavesEnclosure: true }, { feederA: 800, endA: 60 })), 'TAP');
    expect(small.verdict).toBe('unprotected');
    const tenFt = small.tried.find((t) => t.ruleId === 'tap-10ft')!;
    expect(tenFt.conditions.find((c) => c.id === 'fieldTenth')?.status).toBe('fail');
  });

  it('with 60 °C terminals an 85 A tap needs 3 AWG Cu, not 4 AWG (110.14(C), NFPA 70-2023 Table 310.16 60 °C column: 4 AWG = 70 A, 3 AWG = 85 A)', () => {
    const four = verdictOf(run(feederTap({ size: '4', lengthFt: 8, terminalTempC: 60 }, { feederA: 800, endA: 85 })), 'TAP');
    expect(four.ampacity?.ampacityA).toBe(70);
    expect(four.verdict).toBe('unprotected');
    const three = verdictOf(run(feederTap({ size: '3', lengthFt: 8, terminalTempC: 60 }, { feederA: 800, endA: 85 })), 'TAP');
    expect(three.verdict).toBe('tap-10ft');
  });

  it('a tap ending on a main-lug panelboard is not a single device, so 240.21(B)(2) fails', () => {
    const input = diagram()
      .utility(480)
      .breaker(600, { id: 'FDR' })
      .tap({ id: 'TAP', size: '3/0', lengthFt: 20 })
      .panel(225, { id: 'MLO' })
      .conductor({ id: 'BR', size: '12', lengthFt: 40 })
      .breaker(20)
      .build();
    const c = verdictOf(run(input), 'TAP');
    expect(c.verdict).toBe('unprotected');
    const t = c.tried.find((x) => x.ruleId === 'tap-25ft')!;
    expect(t.conditions.find((x) => x.id === 'single')?.status).toBe('fail');
  });

  it('two same-size segments through a pass-through splice are one run: 13 ft + 13 ft = 26 ft is over 25 ft', () => {
    const input = diagram()
      .utility(480)
      .breaker(600, { id: 'FDR' })
      .tap({ id: 'A', size: '3/0', lengthFt: 13 })
      .splice({ id: 'SP' })
      .tap({ id: 'B', size: '3/0', lengthFt: 13 })
      .breaker(200)
      .build();
    const report = run(input);
    for (const id of ['A', 'B']) {
      const c = verdictOf(report, id);
      expect(c.chain).toEqual(['A', 'B']);
      expect(c.verdict).toBe('unprotected');
    }
    expect(verdictOf(report, 'A').fixes).toContainEqual(expect.objectContaining({ kind: 'shorten', maxLengthFt: 25 }));
  });

  it('a conductor spliced onto a tap is a tap from a tap (240.21)', () => {
    const input = diagram()
      .utility(480)
      .breaker(600, { id: 'FDR' })
      .tap({ id: 'T1', size: '3/0', lengthFt: 8 })
      .tapBox(200, { id: 'BOX' })
      .tap({ id: 'T2', size: '6', lengthFt: 5 })
      .breaker(60)
      .at('BOX')
      .tap({ id: 'T3', size: '6', lengthFt: 5 })
      .breaker(60)
      .build();
    const report = run(input);
    expect(verdictOf(report, 'T2').verdict).toBe('tap-from-tap');
    expect(verdictOf(report, 'T3').verdict).toBe('tap-from-tap');
    const f = report.findings.find((x) => x.id === 'tap-from-tap:T2:supply');
    expect(f?.severity).toBe('violation');
    expect(f?.related).toContainEqual({ kind: 'conductor', id: 'T1' });
  });

  it('a tap made at a splice on a fully protected feeder is judged against that feeder device', () => {
    const input = diagram()
      .utility(480)
      .breaker(400, { id: 'FDR' })
      .conductor({ id: 'F', size: '600', lengthFt: 100 })
      .splice({ id: 'SP' })
      .conductor({ id: 'F2', size: '600', lengthFt: 50 })
      .breaker(400)
      .at('SP')
      .tap({ id: 'T', size: '1/0', lengthFt: 20 })
      .breaker(150)
      .build();
    const report = run(input);
    expect(verdictOf(report, 'F').verdict).toBe('protected');
    const t = verdictOf(report, 'T');
    // one third of 400 A is 133.3 A; 1/0 Cu at 75 °C is 150 A (Table 310.16).
    expect(t.verdict).toBe('tap-25ft');
    expect(t.upstreamDevice?.id).toBe('FDR');
  });
});

describe('240.4 protection and round-up', () => {
  const feeder = (size: string, sets: number, breakerA: number, extra: Record<string, unknown> = {}) =>
    diagram()
      .utility(480)
      .breaker(breakerA, { id: 'CB' })
      .conductor({ id: 'F', size: size as never, parallelSets: sets, lengthFt: 100, ...extra })
      .panel(breakerA)
      .conductor({ size: '12', lengthFt: 10 })
      .breaker(20)
      .build();

  it('two sets of 500 kcmil Cu at 75 °C = 760 A on an 800 A breaker: protected by the next size up (240.4(B), Table 310.16: 380 A per set)', () => {
    const c = verdictOf(run(feeder('500', 2, 800)), 'F');
    expect(c.ampacity?.ampacityA).toBe(760);
    expect(c.verdict).toBe('protected-next-size');
  });

  it('over 800 A no round-up: three sets of 350 kcmil Cu (930 A) on 1000 A is not protected (240.4(C))', () => {
    const c = verdictOf(run(feeder('350', 3, 1000)), 'F');
    expect(c.ampacity?.ampacityA).toBe(930);
    expect(c.verdict).toBe('unprotected');
  });

  it('240.4(D): 12 AWG Cu (25 A at 75 °C) on a 25 A breaker is unprotected; on 20 A it is protected', () => {
    expect(verdictOf(run(feeder('12', 1, 20)), 'F').verdict).toBe('protected');
    expect(verdictOf(run(feeder('12', 1, 25)), 'F').verdict).toBe('unprotected');
  });

  it('round-up is refused for a multioutlet branch circuit supplying cord-and-plug receptacles (240.4(B)(1))', () => {
    const input = diagram()
      .utility(208)
      .breaker(150)
      .conductor({ id: 'F', size: '1', lengthFt: 40, multioutletCordAndPlug: true })
      .load({ currentA: 100 })
      .build();
    expect(verdictOf(run(input), 'F').verdict).toBe('unprotected');
  });
});

describe('transformer secondaries, 240.21(C) and (B)(3)', () => {
  const xfmr = (secondary: Record<string, unknown>, primaryA = 200, end = 175) =>
    diagram()
      .utility(480)
      .breaker(primaryA, { id: 'PRI' })
      .conductor({ id: 'P', size: '3/0', lengthFt: 40 })
      .transformer({ id: 'TX', kva: 150 })
      .conductor({ id: 'S', size: '2/0', lengthFt: 20, ...secondary })
      .breaker(end, { id: 'SEC' })
      .panel(225)
      .conductor({ size: '12', lengthFt: 30 })
      .breaker(20)
      .build();

  it('one third of 200 A × 480/208 is 153.85 A: 2/0 Cu (175 A) meets 240.21(C)(6) at 20 ft, 1/0 (150 A) does not', () => {
    const ok = verdictOf(run(xfmr({})), 'S');
    expect(ok.verdict).toBe('secondary-25ft');
    expect(ok.rule).toBe('secondary-25ft');
    expect(ok.role).toBe('transformer-secondary');
    const small = verdictOf(run(xfmr({ size: '1/0' }, 200, 150)), 'S');
    expect(small.verdict).toBe('unprotected');
  });

  it('a 10 ft secondary ending in a device no larger than its ampacity meets 240.21(C)(2)', () => {
    expect(verdictOf(run(xfmr({ lengthFt: 8 })), 'S').verdict).toBe('secondary-10ft');
  });

  it('the primary conductor protected at its ampacity stays protected (3/0 Cu 200 A on 200 A)', () => {
    const c = verdictOf(run(xfmr({})), 'P');
    expect(c.verdict).toBe('protected');
    expect(c.role).toBe('transformer-primary');
  });

  it('feeder tap to a transformer, 10 ft + 12 ft ≤ 25 ft, both at least one third (240.21(B)(3))', () => {
    // R = 400 A: primary ≥ 133.3 A (1/0 Cu 150 A); secondary ≥ 400 × 480/208 / 3 = 307.7 A (350 kcmil Cu 310 A).
    const input = diagram()
      .utility(480)
      .breaker(400, { id: 'FDR' })
      .tap({ id: 'P', size: '1/0', lengthFt: 10 })
      .transformer({ id: 'TX', kva: 112.5 })
      .conductor({ id: 'S', size: '350', lengthFt: 12 })
      .breaker(300)
      .panel(400)
      .conductor({ size: '12', lengthFt: 30 })
      .breaker(20)
      .build();
    const report = run(input);
    expect(verdictOf(report, 'P').verdict).toBe('tap-transformer');
    expect(verdictOf(report, 'S').verdict).toBe('tap-transformer');
    expect(verdictOf(report, 'P').tapLengthFt).toBe(22);
  });
});

describe('transformer protection, Table 450.3(B)', () => {
  // 75 kVA, 480 V, three-phase: primary rated current 75 000 / (1.732 × 480) = 90.2 A (formula, common practice).
  const tx = (primaryA: number, secondaryEnd: 'breaker' | 'panel') => {
    const b = diagram().utility(480).breaker(primaryA, { id: 'PRI' }).conductor({ id: 'P', size: '3/0', lengthFt: 30 }).transformer({ id: 'TX', kva: 75 });
    if (secondaryEnd === 'breaker') b.conductor({ id: 'S', size: '250', lengthFt: 10 }).breaker(250).panel(250);
    else b.conductor({ id: 'S', size: '250', lengthFt: 10 }).panel(250);
    return run(b.conductor({ size: '12', lengthFt: 20 }).breaker(20).build());
  };
  const fails = (r: AnalysisReport) => r.findings.some((f) => f.ruleId === 'transformer-protection' && f.subject.kind === 'node' && f.subject.id === 'TX');

  it('primary only: 125 % of 90.2 A = 112.8 A, next standard size 125 A is allowed; 150 A is not', () => {
    expect(fails(tx(125, 'panel'))).toBe(false);
    expect(fails(tx(150, 'panel'))).toBe(true);
  });

  it('with a secondary device of at most 125 % of 208.2 A, the primary may go to 250 % of 90.2 A = 225.5 A: 225 A passes, 250 A fails', () => {
    expect(fails(tx(225, 'breaker'))).toBe(false);
    expect(fails(tx(250, 'breaker'))).toBe(true);
  });
});

describe('services, generators and loads', () => {
  it('conductors from the utility to the service disconnect are service conductors, not taps (240.21(D))', () => {
    const report = run(diagram().utility(480).conductor({ id: 'SVC', size: '500', parallelSets: 2, lengthFt: 60 }).breaker(800).build());
    expect(verdictOf(report, 'SVC').verdict).toBe('service');
    expect(verdictOf(report, 'SVC').role).toBe('service');
  });

  it('a utility transformer ahead of the service disconnect has service conductors on both sides (240.21(D), 230.90(A))', () => {
    const input = diagram()
      .utility(480, { id: 'U' })
      .conductor({ id: 'PRI', size: '4/0', lengthFt: 40 })
      .transformer({ id: 'UTX', kva: 300 })
      .conductor({ id: 'SEC', size: '600', parallelSets: 3, lengthFt: 30 })
      .breaker(1000)
      .build();
    const report = run(input);
    expect(verdictOf(report, 'PRI').verdict).toBe('service');
    expect(verdictOf(report, 'SEC').verdict).toBe('service');
  });

  it('100 kVA at 480 V is 120.3 A; 115 % is 138.3 A, so 1/0 Cu (150 A) serves and 1 AWG (130 A) does not (445.13(A))', () => {
    const gen = (size: string) => run(diagram().generator(100).conductor({ id: 'G', size: size as never, lengthFt: 30 }).breaker(150).build());
    const ok = gen('1/0');
    expect(verdictOf(ok, 'G').verdict).toBe('generator');
    expect(ok.findings.filter((f) => f.severity === 'violation')).toHaveLength(0);
    const small = gen('1');
    expect(verdictOf(small, 'G').verdict).toBe('generator');
    expect(small.findings.some((f) => f.ruleId === 'generator' && f.severity === 'violation')).toBe(true);
  });

  it('continuous load × 1.25: 110 A continuous needs 137.5 A; 1 AWG Cu (130 A) is flagged (215.2(A)(1))', () => {
    const input = diagram()
      .utility(480)
      .breaker(150)
      .conductor({ id: 'F', size: '1', lengthFt: 40 })
      .panel(225)
      .conductor({ size: '1', lengthFt: 10 })
      .breaker(150)
      .load({ currentA: 110, continuous: true })
      .build();
    const report = run(input);
    const c = verdictOf(report, 'F');
    expect(c.load).toEqual({ flowingA: 110, calculatedA: 137.5 });
    expect(report.findings.some((f) => f.id === 'calculated-load:F:below-calculated-load')).toBe(true);
  });

  it('a 100 A load at 208 V draws 100 × 208/480 = 43.33 A on the 480 V primary (current scales by the voltage ratio)', () => {
    const input = diagram()
      .utility(480)
      .breaker(100)
      .conductor({ id: 'P', size: '3', lengthFt: 20 })
      .transformer({ kva: 45 })
      .conductor({ id: 'S', size: '3/0', lengthFt: 8 })
      .breaker(150)
      .load({ currentA: 100 })
      .build();
    const report = run(input);
    expect(verdictOf(report, 'P').load?.flowingA).toBeCloseTo(43.33, 2);
    expect(verdictOf(report, 'S').load?.flowingA).toBeCloseTo(100, 6);
  });
});

describe('odd networks are findings, never exceptions', () => {
  it('a missing tap length gives "incomplete" and says which fact to enter', () => {
    const report = run(feederTap({ lengthFt: undefined }));
    const c = verdictOf(report, 'TAP');
    expect(c.verdict).toBe('incomplete');
    expect(c.summary).toContain('length');
    expect(report.findings.some((f) => f.id === 'incomplete:TAP:missing-data')).toBe(true);
  });

  it('a feeder device with no rating leaves the conductors below it incomplete', () => {
    const input = diagram().utility(480).breaker(undefined, { id: 'CB' }).conductor({ id: 'F', size: '3/0', lengthFt: 50 }).breaker(200).build();
    expect(verdictOf(run(input), 'F').verdict).toBe('incomplete');
  });

  it('a loop is reported and its conductors are incomplete', () => {
    const input = diagram()
      .utility(480)
      .breaker(200, { id: 'CB' })
      .conductor({ id: 'A', size: '3/0', lengthFt: 10 })
      .splice({ id: 'S1' })
      .conductor({ id: 'B', size: '3/0', lengthFt: 10 })
      .splice({ id: 'S2' })
      .join('S2', 'S1', { id: 'C', size: '3/0', lengthFt: 10 })
      .build();
    const report = run(input);
    expect(report.findings.some((f) => f.ruleId === 'topology' && f.messageId === 'cycle')).toBe(true);
    expect(verdictOf(report, 'B').verdict).toBe('incomplete');
    expect(verdictOf(report, 'C').verdict).toBe('incomplete');
  });

  it('equipment fed from two supplies is reported; what it feeds is incomplete', () => {
    const input = diagram()
      .utility(480, { id: 'U' })
      .breaker(400, { id: 'CB1' })
      .conductor({ id: 'A', size: '600', lengthFt: 10 })
      .switchboard(800, { id: 'SB' })
      .conductor({ id: 'OUT', size: '3/0', lengthFt: 10 })
      .breaker(200)
      .startTree()
      .generator(300, { id: 'G' })
      .breaker(400, { id: 'CB2' })
      .build();
    const withSecond = { ...input, conductors: [...input.conductors, { id: 'B', from: 'CB2', to: 'SB', size: '600', lengthFt: 10 }] } as ProjectInput;
    const report = run(withSecond);
    expect(report.findings.some((f) => f.messageId === 'several-supplies' && f.subject.kind === 'node' && f.subject.id === 'SB')).toBe(true);
    expect(verdictOf(report, 'OUT').verdict).toBe('incomplete');
  });

  it('"other approved means" of damage protection is a judgement for the AHJ', () => {
    const report = run(feederTap({ damageProtection: 'other-approved-means' }));
    expect(verdictOf(report, 'TAP').verdict).toBe('tap-25ft');
    expect(report.findings.find((f) => f.subject.kind === 'conductor' && f.subject.id === 'TAP')?.severity).toBe('needs-ahj');
  });

  it('cites the project edition and carries the caution; never says "approved" as a verdict', () => {
    const input = feederTap({});
    input.project.codeEdition = 2020;
    const report = run(input);
    expect(report.edition).toBe(2020);
    expect(verdictOf(report, 'TAP').cites).toEqual({ code: 'NEC', edition: 2020, section: '240.21(B)(2)' });
    expect(report.caution).toMatch(/authority having jurisdiction/);
    expect(JSON.stringify(report)).not.toMatch(/"approved"/i);
  });
});
