import { describe, expect, it } from 'vitest';
import type { ConductorSize } from '@linewright/core';
import { diagram } from '../../helpers/builder';
import { conductor, run } from '../../helpers/analyzeInput';

/**
 * Verdicts that depend on the shape of the network (issue 6, items 10, 11,
 * 12, 15): fusible switches, joints that change size, feeders into
 * distribution equipment, and what a run is fed from. Ampacities are NFPA
 * 70-2023 Table 310.16 at 75 °C unless stated.
 */


/** utility → 2000 A main → switchboard → 600 A feeder breaker: the top of every case. */
const top = () =>
  diagram()
    .utility(480, { id: 'U' })
    .conductor({ id: 'SVC', size: '600', parallelSets: 6, lengthFt: 30 })
    .breaker(2000, { id: 'MAIN' })
    .switchboard(2000, { id: 'SWBD' })
    .breaker(600, { id: 'FDR' });

describe('a tap ending in a fusible switch (item 10)', () => {
  it('20 ft of 3/0 Cu (200 A ≥ 600/3) into a disconnect with 200 A fuses bus-linked inside: the fuses are the single device, 240.21(B)(2) holds (NFPA 70-2023 240.21(B)(2))', () => {
    const report = run(
      top()
        .tap({ id: 'TAP', size: '3/0', lengthFt: 20 })
        .disconnect({ id: 'DS', ratingA: 200 })
        .fuse(200, { id: 'FU' })
        .conductor({ id: 'LD', size: '3/0', lengthFt: 40 })
        .load({ currentA: 150 })
        .build(),
    );
    const c = conductor(report, 'TAP');
    expect(c.verdict).toBe('tap-25ft');
    const single = c.tried.find((t) => t.ruleId === 'tap-25ft')!.conditions.find((x) => x.id === 'single')!;
    expect(single.status).toBe('pass');
    expect(single.text).toContain('FU in DS');
  });
});

describe('a joint that only changes size (item 11)', () => {
  const chain = (second: ConductorSize, secondFt = 12) =>
    top()
      .tap({ id: 'T1', size: '3/0', lengthFt: 10 })
      .splice({ id: 'SP' })
      .conductor({ id: 'T2', size: second, lengthFt: secondFt })
      .breaker(200, { id: 'END' })
      .panel(225, { id: 'PNL' })
      .build();

  it('3/0 spliced to 4/0, 10 + 12 = 22 ft on a 600 A feeder: one 25 ft tap judged on the 3/0 (200 A ≥ 200 A), no tap from a tap (NFPA 70-2023 240.21(B)(2))', () => {
    const report = run(chain('4/0'));
    for (const id of ['T1', 'T2']) {
      const c = conductor(report, id);
      expect(c.verdict, id).toBe('tap-25ft');
      expect(c.chain).toEqual(['T1', 'T2']);
      expect(c.tapLengthFt).toBe(22);
    }
    expect(report.findings.filter((f) => f.severity === 'violation')).toEqual([]);
  });

  it('the same joint at 10 + 16 = 26 ft is one run over 25 ft: one finding for the run, shown on both segments (NFPA 70-2023 240.21(B)(2) "not over 25 ft")', () => {
    const report = run(chain('4/0', 16));
    const violations = report.findings.filter((f) => f.severity === 'violation' && f.subject.kind === 'conductor');
    expect(violations.map((f) => f.subject)).toEqual([{ kind: 'conductor', id: 'T1' }]);
    expect(violations[0]!.message).toContain('T1 → T2');
    expect(conductor(report, 'T2').findingIds).toEqual(conductor(report, 'T1').findingIds);
    expect(conductor(report, 'T2').tapLengthFt).toBe(26);
  });

  it('a tap box with one conductor in and one out is a joint too', () => {
    const report = run(
      top()
        .tap({ id: 'T1', size: '3/0', lengthFt: 10 })
        .tapBox(400, { id: 'TB' })
        .conductor({ id: 'T2', size: '4/0', lengthFt: 12 })
        .breaker(200, { id: 'END' })
        .panel(225, { id: 'PNL' })
        .build(),
    );
    expect(conductor(report, 'T2').verdict).toBe('tap-25ft');
    expect(conductor(report, 'T2').tapLengthFt).toBe(22);
  });

  it('on a protected feeder the smaller conductor after a joint is a tap made there: 500 kcmil (380 A) on 400 A, then 3/0 for 20 ft (NFPA 70-2023 240.4(B), 240.21(B)(2))', () => {
    const report = run(
      diagram()
        .utility(480, { id: 'U' })
        .conductor({ id: 'SVC', size: '600', parallelSets: 6, lengthFt: 30 })
        .breaker(2000, { id: 'MAIN' })
        .switchboard(2000, { id: 'SWBD' })
        .breaker(400, { id: 'FDR' })
        .conductor({ id: 'F', size: '500', lengthFt: 100 })
        .splice({ id: 'SP' })
        .tap({ id: 'T', size: '3/0', lengthFt: 20 })
        .breaker(200, { id: 'END' })
        .build(),
    );
    expect(conductor(report, 'F').verdict).toBe('protected-next-size');
    expect(conductor(report, 'T').verdict).toBe('tap-25ft');
    expect(conductor(report, 'T').tapLengthFt).toBe(20);
  });
});

describe('conductors into distribution equipment are feeders (item 12)', () => {
  it('3/0 Cu (200 A) for 20 ft from a 600 A breaker into a 225 A panelboard with nothing drawn below: a feeder, and the tap rules are tried (NFPA 70-2023 240.21(B))', () => {
    const report = run(top().tap({ id: 'TAP', size: '3/0', lengthFt: 20 }).panel(225, { id: 'PNL' }).build());
    const c = conductor(report, 'TAP');
    expect(c.role).toBe('feeder');
    expect(c.tried.map((t) => t.ruleId)).toContain('tap-10ft');
  });
});

describe('what a run is fed from (item 15)', () => {
  it('a conductor spliced onto a tap that fails is "fed from unprotected conductor", not a tap from a tap (NFPA 70-2023 240.21, 240.4)', () => {
    const report = run(
      top()
        .tap({ id: 'BAD', size: '2/0', lengthFt: 20 })
        .tapBox(400, { id: 'TB' })
        .conductor({ id: 'A', size: '4', lengthFt: 5 })
        .breaker(60, { id: 'CB-A' })
        .at('TB')
        .conductor({ id: 'B', size: '4', lengthFt: 5 })
        .breaker(60, { id: 'CB-B' })
        .build(),
    );
    expect(conductor(report, 'BAD').verdict).toBe('unprotected');
    const a = conductor(report, 'A');
    expect(a.verdict).toBe('unprotected');
    expect(a.summary).toContain('fed from unprotected conductor BAD');
    const f = report.findings.find((x) => x.subject.kind === 'conductor' && x.subject.id === 'A')!;
    expect(f.messageId).toBe('fed-from-unprotected');
    expect(f.message).not.toContain('tapped from');
  });

  it('a conductor leaving the tap box of an 8 ft 3/0 tap (a 10 ft tap that holds) is still a tap from a tap (NFPA 70-2023 240.21, 240.21(B)(1))', () => {
    const report = run(
      top()
        .tap({ id: 'OK', size: '3/0', lengthFt: 8 })
        .tapBox(200, { id: 'TB' })
        .conductor({ id: 'A', size: '4', lengthFt: 5 })
        .breaker(60, { id: 'CB-A' })
        .at('TB')
        .conductor({ id: 'B', size: '4', lengthFt: 5 })
        .breaker(60, { id: 'CB-B' })
        .build(),
    );
    expect(conductor(report, 'A').verdict).toBe('tap-from-tap');
  });
});
