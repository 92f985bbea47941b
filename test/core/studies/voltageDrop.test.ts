import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeAmpacity } from '../../../core/src/ampacity/index';
import { Net } from './build';

const SQRT3 = Math.sqrt(3);

describe('voltage-drop study (Chapter 9 Table 9 effective impedance)', () => {
  it('feeder: 480 V three-phase, 200 A at PF 0.85, 250 ft of 3/0 Cu in steel: Z = 0.079·0.85 + 0.052·0.5268 = 0.09454 Ω/1000 ft, VD = √3·200·0.09454·0.25 = 8.19 V = 1.71 %', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 480, phases: 3 })
      .node('CB', 'breaker', { ratingA: 225 })
      .link('L0', 'U', 'CB')
      .node('M', 'load', { kva: (200 * SQRT3 * 480) / 1000, powerFactor: 0.85 })
      .wire('F', 'CB', 'M', { size: '3/0', lengthFt: 250 })
      .study();
    const zEff = 0.079 * 0.85 + 0.052 * Math.sqrt(1 - 0.85 ** 2);
    expect(zEff).toBeCloseTo(0.09454, 4);
    expect(s.pct('F')).toBeCloseTo((100 * SQRT3 * 200 * zEff * 0.25) / 480, 6);
    expect(s.pct('F')).toBeCloseTo(1.71, 2);
    expect(s.drop.currentA[0]).toBeCloseTo(200, 6);
  });

  it('a motor draws its table full-load current and HVAC equipment its nameplate MCA: 20 hp at 480 V is 27 A (NFPA 70 Table 430.250, 460 V column); VD = √3·27·Z·L over 480 V', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 480, phases: 3 })
      .node('CB', 'breaker', { ratingA: 70 })
      .link('L0', 'U', 'CB')
      .node('MOT', 'load', { phases: 3, motor: { hp: 20 }, powerFactor: 0.85 })
      .wire('CM', 'CB', 'MOT', { size: '10', lengthFt: 100 })
      .node('CB2', 'breaker', { ratingA: 25 })
      .link('L1', 'U', 'CB2')
      .node('RTU', 'load', { phases: 3, hvac: { mcaA: 18, mopA: 25 }, powerFactor: 0.85 })
      .wire('CR', 'CB2', 'RTU', { size: '12', lengthFt: 100 })
      .study();
    // 10 AWG Cu in steel: R 1.2, X 0.063 Ω/1000 ft (Chapter 9 Table 9); 12 AWG: R 2.0, X 0.068.
    const zEff = (r: number, x: number) => r * 0.85 + x * Math.sqrt(1 - 0.85 ** 2);
    expect(s.pct('CM')).toBeCloseTo((100 * SQRT3 * 27 * zEff(1.2, 0.063) * 0.1) / 480, 6);
    expect(s.pct('CR')).toBeCloseTo((100 * SQRT3 * 18 * zEff(2.0, 0.068) * 0.1) / 480, 6);
  });

  it('branch: 277 V single-phase, 16 A at PF 0.90, 150 ft of 10 AWG Cu in EMT (steel column): Z = 1.2·0.9 + 0.063·0.4359 = 1.1075, VD = 2·16·1.1075·0.15 = 5.32 V = 1.92 %; feeder plus branch add to the total', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 277, phases: 1 })
      .node('CB', 'breaker', { ratingA: 20 })
      .link('L0', 'U', 'CB')
      .node('SP', 'splice')
      .node('LT', 'load', { currentA: 16, powerFactor: 0.9 })
      .wire('B1', 'CB', 'SP', { size: '10', lengthFt: 100 })
      .wire('B2', 'SP', 'LT', { size: '10', lengthFt: 50 })
      .study();
    const zEff = 1.2 * 0.9 + 0.063 * Math.sqrt(1 - 0.81);
    expect(zEff).toBeCloseTo(1.1075, 4);
    expect(s.total('LT')).toBeCloseTo((100 * 2 * 16 * zEff * 0.15) / 277, 6);
    expect(s.total('LT')).toBeCloseTo(1.92, 2);
    // Additive along the path: the splice splits the branch, the sum is the same.
    expect(s.pct('B1') + s.pct('B2')).toBeCloseTo(s.total('LT'), 12);
    expect(s.circuit('LT')).toBeCloseTo(s.total('LT'), 12);
  });

  // Each conductor on its own circuit (the load's own connection): single-phase 2-wire VD = 2·I·(R cos θ + X sin θ)·L/1000
  // over the line-to-neutral voltage, line to line over V_LL, three-phase √3·I·(…)·L/1000 over V_LL (IEEE Std 141
  // Chapter 3 approximate formula with the Chapter 9 Table 9 note's effective Z; from memory).
  it('277 V lighting on a 480Y/277 V system, line to neutral: 16 A at PF 0.90, 150 ft of 10 AWG Cu in steel: 2·16·1.1075·0.15 = 5.32 V = 1.92 % of 277 V (not of 480 V)', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 480, phases: 3 })
      .node('CB', 'breaker', { ratingA: 20 })
      .link('L0', 'U', 'CB')
      .node('LT', 'load', { currentA: 16, phases: 1, connection: 'line-to-neutral', powerFactor: 0.9 })
      .wire('B', 'CB', 'LT', { size: '10', lengthFt: 150 })
      .study();
    const zEff = 1.2 * 0.9 + 0.063 * Math.sqrt(1 - 0.81); // Chapter 9 Table 9, 10 AWG Cu, steel conduit
    expect(s.drop.currentA[0]).toBeCloseTo(16, 9);
    expect(s.drop.singlePhase[0]).toBe(1);
    expect(s.pct('B')).toBeCloseTo((100 * 2 * 16 * zEff * 0.15) / 277, 6);
    expect(s.pct('B')).toBeCloseTo(1.92, 2);
  });

  it('120 V load on a 208Y/120 V system, 1.44 kVA at PF 1.0 (12 A), 100 ft of 12 AWG Cu in PVC (R 2.0 Ω/1000 ft): 2·12·2.0·0.1 = 4.8 V = 4.0 % of 120 V', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 208, phases: 3 })
      .node('CB', 'breaker', { ratingA: 20 })
      .link('L0', 'U', 'CB')
      .node('R1', 'load', { kva: 1.44, phases: 1, connection: 'line-to-neutral', powerFactor: 1 })
      .wire('B', 'CB', 'R1', { size: '12', lengthFt: 100, wiring: 'pvc-conduit' })
      .study();
    expect(s.drop.currentA[0]).toBeCloseTo(12, 9);
    expect(s.pct('B')).toBeCloseTo(4.0, 9);
  });

  it('208 V single-phase load, line to line on 208Y/120 V: 20 A at PF 1.0, 100 ft of 10 AWG Cu in PVC (R 1.2): 2·20·1.2·0.1 = 4.8 V = 2.31 % of 208 V', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 208, phases: 3 })
      .node('CB', 'breaker', { ratingA: 30 })
      .link('L0', 'U', 'CB')
      .node('H', 'load', { currentA: 20, phases: 1, connection: 'line-to-line', powerFactor: 1 })
      .wire('B', 'CB', 'H', { size: '10', lengthFt: 100, wiring: 'pvc-conduit' })
      .study();
    expect(s.drop.currentA[0]).toBeCloseTo(20, 9);
    expect(s.pct('B')).toBeCloseTo((100 * 4.8) / 208, 9);
  });

  it('a 3-phase feeder to a panelboard and a 277 V branch below it: the feeder over 480 V by √3, the branch over 277 V by 2, and the total is their sum', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 480, phases: 3 })
      .node('CB1', 'breaker', { ratingA: 100 })
      .link('L0', 'U', 'CB1')
      .node('P', 'bus', { busType: 'panelboard' })
      .wire('F', 'CB1', 'P', { size: '3', lengthFt: 200 })
      .node('CB2', 'breaker', { ratingA: 20 })
      .link('L1', 'P', 'CB2')
      .node('LT', 'load', { currentA: 16, phases: 1, connection: 'line-to-neutral', powerFactor: 1 })
      .wire('B', 'CB2', 'LT', { size: '12', lengthFt: 100 })
      .node('M', 'load', { kva: 50, phases: 3, powerFactor: 1 })
      .link('L2', 'P', 'M')
      .study();
    // Feeder: (50 000 + 16·277) VA / (√3·480) = 66.47 A; 3 AWG Cu in steel R 0.25 (Chapter 9 Table 9) at PF 1.
    const feederA = (50_000 + 16 * 277) / (SQRT3 * 480);
    expect(s.drop.currentA[0]).toBeCloseTo(feederA, 6);
    expect(s.pct('F')).toBeCloseTo((100 * SQRT3 * feederA * 0.25 * 0.2) / 480, 6);
    expect(s.pct('B')).toBeCloseTo((100 * 2 * 16 * 2.0 * 0.1) / 277, 6);
    expect(s.total('LT')).toBeCloseTo(s.pct('F') + s.pct('B'), 12);
  });

  it('a circuit starts again at each device; the total runs on to the transformer or source', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 480, phases: 3 })
      .node('CB1', 'breaker', { ratingA: 400 })
      .link('L0', 'U', 'CB1')
      .node('P', 'bus', { busType: 'panelboard' })
      .wire('F', 'CB1', 'P', { size: '500', lengthFt: 300 })
      .node('CB2', 'breaker', { ratingA: 30 })
      .link('L1', 'P', 'CB2')
      .node('M', 'load', { kva: 20, powerFactor: 0.8 })
      .wire('B', 'CB2', 'M', { size: '10', lengthFt: 200 })
      .node('M2', 'load', { kva: 200, powerFactor: 0.9 })
      .link('L2', 'P', 'M2')
      .study();
    expect(s.circuit('M')).toBeCloseTo(s.pct('B'), 12);
    expect(s.total('M')).toBeCloseTo(s.pct('F') + s.pct('B'), 12);
    // The feeder carries both loads at their combined power factor: P = 16 + 180 kW, Q = 12 + 87.2 kvar.
    const p = 16 + 180;
    const q = 12 + 200 * Math.sqrt(1 - 0.81);
    expect(s.drop.powerFactor[0]).toBeCloseTo(p / Math.hypot(p, q), 9);
  });

  it('property: VD is additive along a path, and adding a parallel set (each set in its own raceway) never lowers ampacity nor raises VD', () => {
    const sizes = ['1/0', '2/0', '4/0', '250', '350', '500'] as const;
    fc.assert(
      fc.property(
        fc.array(fc.record({ size: fc.constantFrom(...sizes), lengthFt: fc.integer({ min: 1, max: 800 }), parallelSets: fc.integer({ min: 1, max: 3 }) }), { minLength: 1, maxLength: 6 }),
        fc.integer({ min: 5, max: 400 }),
        fc.double({ min: 0.5, max: 1, noNaN: true }),
        fc.nat(),
        (segs, kva, pf, pick) => {
          const build = (extraSetAt: number) => {
            const net = new Net().node('U', 'utility', { voltsLL: 480, phases: 3 }).node('CB', 'breaker', { ratingA: 800 }).link('L0', 'U', 'CB');
            let prev = 'CB';
            segs.forEach((seg, i) => {
              const to = i === segs.length - 1 ? 'LD' : `S${i}`;
              if (to === 'LD') net.node('LD', 'load', { kva, powerFactor: pf });
              else net.node(to, 'splice');
              net.wire(`C${i}`, prev, to, { ...seg, parallelSets: seg.parallelSets + (i === extraSetAt ? 1 : 0) });
              prev = to;
            });
            return net.study();
          };
          const a = build(-1);
          const sum = segs.reduce((acc, _s, i) => acc + a.pct(`C${i}`), 0);
          expect(a.total('LD')).toBeCloseTo(sum, 9);
          const i = pick % segs.length;
          const b = build(i);
          expect(b.total('LD')).toBeLessThanOrEqual(a.total('LD') + 1e-12);
          const seg = segs[i]!;
          const base = { material: 'cu' as const, size: seg.size, insulation: 'THHN' as const, ambientC: 30, currentCarrying: 3, terminalTempC: 75 as const, edition: 2023 as const };
          const before = computeAmpacity({ ...base, parallelSets: seg.parallelSets });
          const after = computeAmpacity({ ...base, parallelSets: seg.parallelSets + 1 });
          if (before.ok && after.ok) expect(after.working.ampacityA).toBeGreaterThanOrEqual(before.working.ampacityA);
        },
      ),
      { numRuns: 150 },
    );
  });
});
