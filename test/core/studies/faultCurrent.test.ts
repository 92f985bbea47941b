import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Net } from './build';
import { magnitude } from '../../../core/src/studies/faultCurrent/faultCurrent';

/**
 * Worked values computed here independently of the study (all arithmetic in
 * the test), and the point-to-point method as a second method. Point-to-point
 * (a published scalar method of industry handbooks): f = √3·L·I/(C·n·V) with
 * C = 1000/|R + jX|, M = 1/(1 + f); for a transformer behind a finite source
 * f = I_p·V_p·√3·%Z/(100 000·kVA). It adds magnitudes, so it never exceeds
 * the phasor (ohmic) result and agrees within a few per cent when the
 * impedance angles are alike. Stated tolerance: 2 %.
 */
const SQRT3 = Math.sqrt(3);
const PTP_TOLERANCE = 0.02;

const transformer1000 = (xOverR = 5.8) =>
  new Net()
    .node('U', 'utility', { voltsLL: 480, phases: 3 })
    .node('T', 'transformer', { kva: 1000, primaryVoltsLL: 480, secondaryVoltsLL: 480, phases: 3, impedancePct: 5.75, xOverR, connection: 'delta-wye' })
    .link('L0', 'U', 'T');

describe('short-circuit study, ohmic method (IEEE Std 141 / 551)', () => {
  it('infinite bus: 1000 kVA, 480 V, 5.75 %Z: secondary FLA / per-unit Z = (1 000 000/(√3·480))/0.0575 = 20 918 A', () => {
    const s = transformer1000().study();
    const fla = 1_000_000 / (SQRT3 * 480);
    expect(fla).toBeCloseTo(1202.8, 1);
    expect(s.kA('T') * 1000).toBeCloseTo(fla / 0.0575, 0);
    expect(s.kA('T') * 1000).toBeCloseTo(20_918, -1);
    expect(s.xr('T')).toBeCloseTo(5.8, 6);
    expect(s.fault.notes.join(' ')).toMatch(/infinite bus/);
  });

  it('the line-to-ground fault at a delta-wye secondary equals the three-phase one (Z0 = Z1, common practice), and is not claimed beyond the terminals', () => {
    const s = transformer1000().node('B', 'bus', { busType: 'switchboard' }).link('L1', 'T', 'B').node('P', 'bus', { busType: 'panelboard' }).wire('F', 'B', 'P', { size: '500', lengthFt: 100 }).study();
    expect(s.fault.lineToGroundKA[s.g.nodeIndex.get('B')!]).toBeCloseTo(s.kA('B'), 9);
    expect(Number.isNaN(s.fault.lineToGroundKA[s.g.nodeIndex.get('P')!]!)).toBe(true);
  });

  it('feeder: 100 ft of 2 sets of 500 kcmil Cu in steel (R 0.029, X 0.048) after the 1000 kVA transformer at X/R 5.8: |Z| = |0.003701 + j0.015455| = 0.015892 Ω, I = 277.13/0.015892 = 17 438 A', () => {
    const s = transformer1000().node('P', 'bus', { busType: 'switchboard' }).wire('F', 'T', 'P', { size: '500', lengthFt: 100, parallelSets: 2 }).study();
    expect(s.kA('P') * 1000).toBeCloseTo(17_438, -1);
    // Point-to-point from 20 918 A: C = 1000/|0.029 + j0.048| = 17 832; f = √3·100·20 918/(17 832·2·480) = 0.2117; I = 17 264 A.
    const c = 1000 / Math.hypot(0.029, 0.048);
    const f = (SQRT3 * 100 * 20_918) / (c * 2 * 480);
    const ptp = 20_918 / (1 + f);
    expect(ptp).toBeCloseTo(17_264, -1);
    expect(ptp).toBeLessThanOrEqual(s.kA('P') * 1000);
    expect(1 - ptp / (s.kA('P') * 1000)).toBeLessThan(PTP_TOLERANCE);
  });

  it('transformer behind a finite utility: 25 kA at 12 470 V, 1000 kVA 12 470–480 V 5.75 %Z: point-to-point f = 25 000·12 470·√3·5.75/(100 000·1000) = 31.05, I = (12 470/480)·25 000/(1 + f) = 20 266 A', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 12_470, phases: 3, availableFaultKA: 25, xOverR: 5.8 })
      .node('T', 'transformer', { kva: 1000, primaryVoltsLL: 12_470, secondaryVoltsLL: 480, phases: 3, impedancePct: 5.75, xOverR: 5.8, connection: 'delta-wye' })
      .link('L0', 'U', 'T')
      .study(true);
    const f = (25_000 * 12_470 * SQRT3 * 5.75) / (100_000 * 1000);
    expect(f).toBeCloseTo(31.05, 2);
    const ptp = ((12_470 / 480) * 25_000) / (1 + f);
    expect(ptp).toBeCloseTo(20_266, -1);
    // Equal X/R on both sides: the phasor sum equals the scalar sum, so the two methods agree.
    expect(s.kA('T') * 1000).toBeCloseTo(ptp, -1);
    expect(s.kA('T') * 1000).toBeLessThan(20_918);
  });

  it('finite utility at 480 V (50 kA, X/R 8) ahead of a 480–208 V 150 kVA transformer at 2.5 %Z, X/R 3: within 2 % above point-to-point', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 480, phases: 3, availableFaultKA: 50, xOverR: 8 })
      .node('T', 'transformer', { kva: 150, primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3, impedancePct: 2.5, xOverR: 3, connection: 'delta-wye' })
      .link('L0', 'U', 'T')
      .study();
    const f = (50_000 * 480 * SQRT3 * 2.5) / (100_000 * 150);
    const ptp = ((480 / 208) * 50_000) / (1 + f);
    expect(ptp).toBeLessThanOrEqual(s.kA('T') * 1000);
    expect(1 - ptp / (s.kA('T') * 1000)).toBeLessThan(PTP_TOLERANCE);
  });

  // The angles differ most here (transformer 71.6°, 4 AWG in steel 10.9°), so the scalar sum overstates |Z| by more: stated tolerance 6 %.
  it('long feeder: 400 ft of 4 AWG Cu in steel at 208 V from a 75 kVA, 2.7 %Z, X/R 3 transformer on an infinite bus: point-to-point within 6 % below the ohmic value', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 480, phases: 3 })
      .node('T', 'transformer', { kva: 75, primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3, impedancePct: 2.7, xOverR: 3, connection: 'delta-wye' })
      .link('L0', 'U', 'T')
      .node('P', 'bus', { busType: 'panelboard' })
      .wire('F', 'T', 'P', { size: '4', lengthFt: 400 })
      .study();
    const iT = (75_000 / (SQRT3 * 208)) / 0.027;
    expect(s.kA('T') * 1000).toBeCloseTo(iT, 0);
    const c = 1000 / Math.hypot(0.31, 0.06);
    const f = (SQRT3 * 400 * iT) / (c * 208);
    const ptp = iT / (1 + f);
    expect(ptp).toBeLessThanOrEqual(s.kA('P') * 1000);
    expect(1 - ptp / (s.kA('P') * 1000)).toBeLessThan(0.06);
    expect(s.kA('P')).toBeLessThan(s.kA('T') / 2);
  });

  it('generator: initial symmetrical current = rated current / |Z″|: 500 kVA 480 V at X″d 0.14 pu, X/R 20: 601.4/(0.14·√(1 + 1/20²)) = 4290 A', () => {
    const s = new Net().node('G', 'generator', { voltsLL: 480, phases: 3, kva: 500, subtransientReactancePu: 0.14, xOverR: 20 }).study();
    expect(s.kA('G') * 1000).toBeCloseTo(500_000 / (SQRT3 * 480) / (0.14 * Math.sqrt(1 + 1 / 400)), 0);
    expect(s.kA('G') * 1000).toBeCloseTo(4290, -1);
  });

  it('generator without X″d uses the typical 0.12 pu and says so (common practice)', () => {
    const s = new Net().node('G', 'generator', { voltsLL: 480, phases: 3, kva: 500 }).study();
    expect(s.kA('G') * 1000).toBeCloseTo(500_000 / (SQRT3 * 480) / (0.12 * Math.sqrt(1 + 1 / 15 ** 2)), 0);
    expect(s.fault.notes.join(' ')).toMatch(/X″d not given/);
  });

  it('single-phase 50 kVA 240 V transformer at 2 %Z on an infinite bus: (50 000/240)/0.02 = 10 417 A line to line; line to neutral about 1.5 × at the terminals (common practice)', () => {
    const s = new Net()
      .node('U', 'utility', { voltsLL: 480, phases: 3 })
      .node('T', 'transformer', { kva: 50, primaryVoltsLL: 480, secondaryVoltsLL: 240, phases: 1, impedancePct: 2, xOverR: 2, connection: 'single-phase-3w' })
      .link('L0', 'U', 'T')
      .study();
    expect(s.kA('T') * 1000).toBeCloseTo(50_000 / 240 / 0.02, 0);
    expect(s.fault.lineToGroundKA[s.g.nodeIndex.get('T')!]).toBeCloseTo(1.5 * s.kA('T'), 9);
  });

  it('motor contribution: 4 × 100 A FLC adds 0.4 kA at every point of the zone (common practice, 4 × FLC for induction motors)', () => {
    const base = transformer1000().node('M', 'load', { currentA: 100 }).link('L1', 'T', 'M');
    const without = base.study();
    base.nodes[2] = { ...base.nodes[2], faultContributionXFlc: 4 };
    const withMotor = base.study();
    expect(withMotor.kA('T') - without.kA('T')).toBeCloseTo(0.4, 9);
  });

  it('a utility without available fault current and no transformer leaves the fault unknown with the reason', () => {
    const s = new Net().node('U', 'utility', { voltsLL: 480, phases: 3 }).node('B', 'bus', { busType: 'switchboard' }).wire('S', 'U', 'B', { size: '500', lengthFt: 50 }).study();
    expect(Number.isNaN(s.kA('B'))).toBe(true);
    expect(s.fault.unknownWhy[s.g.nodeIndex.get('B')!]).toMatch(/infinite bus/);
  });

  it('a conductor without a length is zero impedance and marks everything below as an upper bound', () => {
    const s = transformer1000().node('P', 'bus', { busType: 'panelboard' }).wire('F', 'T', 'P', { size: '4' }).study();
    expect(s.kA('P')).toBeCloseTo(s.kA('T'), 9);
    expect(s.fault.upperBound[s.g.nodeIndex.get('P')!]).toBe(1);
  });

  it('property: fault current never rises downstream of a series impedance (random radial chains)', () => {
    const sizes = ['14', '10', '6', '2', '1/0', '4/0', '350', '500', '1000'] as const;
    fc.assert(
      fc.property(
        fc.array(fc.record({ size: fc.constantFrom(...sizes), lengthFt: fc.integer({ min: 1, max: 2000 }), parallelSets: fc.integer({ min: 1, max: 4 }), wiring: fc.constantFrom('steel-conduit', 'pvc-conduit', 'aluminum-conduit'), material: fc.constantFrom('cu', 'al') }), { minLength: 1, maxLength: 8 }),
        fc.option(fc.double({ min: 5, max: 100, noNaN: true }), { nil: undefined }),
        (segs, utilityKA) => {
          const net = new Net().node('U', 'utility', { voltsLL: 480, phases: 3, ...(utilityKA ? { availableFaultKA: utilityKA, xOverR: 6 } : {}) });
          net.node('T', 'transformer', { kva: 500, primaryVoltsLL: 480, secondaryVoltsLL: 480, phases: 3, impedancePct: 5, connection: 'delta-wye' }).link('L0', 'U', 'T');
          let prev = 'T';
          segs.forEach((s, i) => {
            const size = s.material === 'al' && s.size === '14' ? '12' : s.size;
            net.node(`N${i}`, 'splice').wire(`C${i}`, prev, `N${i}`, { ...s, size });
            prev = `N${i}`;
          });
          const st = net.study();
          let last = st.kA('T');
          for (let i = 0; i < segs.length; i++) {
            const k = st.kA(`N${i}`);
            expect(k).toBeLessThanOrEqual(last + 1e-12);
            last = k;
          }
          if (utilityKA) expect(st.kA('T')).toBeLessThanOrEqual(st.kA('U'));
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('|R + jX|', () => {
  // The study's magnitude must equal Math.hypot to the last bit (the reports print full precision):
  // the 3-4-5 right triangle (common practice) and random pairs across the magnitudes a drawing gives.
  it('is √(R² + X²): 3, 4 → 5; 0, 0 → 0; a sign does not matter', () => {
    expect(magnitude(3, 4)).toBe(5);
    expect(magnitude(-3, 4)).toBe(5);
    expect(magnitude(0, 0)).toBe(0);
    expect(magnitude(0, 0.25)).toBe(0.25);
  });

  it('equals Math.hypot bit for bit, infinite and NaN parts included', () => {
    const part = fc.oneof(fc.double({ min: -1e20, max: 1e20 }), fc.double({ min: -1e-3, max: 1e-3, noNaN: true }), fc.constantFrom(0, -0, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, Number.NaN, Number.MIN_VALUE, Number.MAX_VALUE));
    fc.assert(
      fc.property(part, part, (r, x) => Object.is(magnitude(r, x), Math.hypot(r, x))),
      { numRuns: 20_000 },
    );
  });
});
