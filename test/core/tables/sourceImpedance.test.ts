import { describe, expect, it } from 'vitest';
import { defaultClearingTime } from '../../../core/src/tables/clearingTime';
import { TYPICAL_GENERATOR_XDPP_PU, typicalTransformerXOverR } from '../../../core/src/tables/sourceImpedance';

describe('typical source impedances (common practice, IEEE Std 141 typical values)', () => {
  it('transformer X/R never falls as kVA rises', () => {
    const kvas = [15, 30, 45, 75, 112.5, 150, 225, 300, 500, 750, 1000, 1500, 2000, 2500, 5000];
    const xrs = kvas.map(typicalTransformerXOverR);
    for (let i = 1; i < xrs.length; i++) expect(xrs[i]!).toBeGreaterThanOrEqual(xrs[i - 1]!);
  });

  it.each([
    [112.5, 3, 4],
    [300, 4, 5],
    [500, 3.5, 5],
    [750, 4, 6],
    [1000, 5, 7],
    [1500, 6, 8],
    [2500, 7, 10],
  ])('%f kVA lies in the typical range %f–%f (liquid-filled and dry-type together)', (kva, lo, hi) => {
    expect(typicalTransformerXOverR(kva)).toBeGreaterThanOrEqual(lo);
    expect(typicalTransformerXOverR(kva)).toBeLessThanOrEqual(hi);
  });

  it('generator X″d is within the typical 0.10–0.25 per unit', () => {
    expect(TYPICAL_GENERATOR_XDPP_PU).toBeGreaterThanOrEqual(0.1);
    expect(TYPICAL_GENERATOR_XDPP_PU).toBeLessThanOrEqual(0.25);
  });

  it('clearing times in cycles at 60 Hz (common practice): current-limiting fuse ½, molded-case breaker 1.5 = 0.025 s, adjustable-trip breaker 3 = 0.05 s', () => {
    expect(defaultClearingTime({ kind: 'fuse', currentLimiting: true }).seconds * 60).toBeCloseTo(0.5, 9);
    expect(defaultClearingTime({ kind: 'breaker' }).seconds).toBeCloseTo(0.025, 9);
    expect(defaultClearingTime({ kind: 'breaker', adjustableTrip: {} }).seconds).toBeCloseTo(0.05, 9);
    expect(defaultClearingTime({ kind: 'fuse', currentLimiting: false }).seconds * 60).toBeCloseTo(1, 9);
  });
});
