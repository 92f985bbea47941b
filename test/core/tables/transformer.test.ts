import { describe, expect, it } from 'vitest';
import { maxPrimaryOcpd, maxSecondaryOcpd, transformerFullLoadA } from '../../../core/src/tables/transformer';

describe('transformer full-load current (kVA·1000 / (√3·V), common practice)', () => {
  it('75 kVA, 480 V, 3-phase: 75 000 / (1.732 × 480) = 90.2 A', () => {
    expect(transformerFullLoadA(75, 480, 3)).toBeCloseTo(90.21, 2);
  });
  it('75 kVA, 208 V, 3-phase: 75 000 / (1.732 × 208) = 208.2 A', () => {
    expect(transformerFullLoadA(75, 208, 3)).toBeCloseTo(208.18, 2);
  });
  it('25 kVA, 240 V, single-phase: 25 000 / 240 = 104.2 A', () => {
    expect(transformerFullLoadA(25, 240, 1)).toBeCloseTo(104.17, 2);
  });
});

describe('Table 450.3(B) (NFPA 70-2023 / 2020, ≤1000 V, from memory)', () => {
  it('primary only, 90.2 A: 125 % = 112.76 A, Note 1 allows the next standard size, 125 A', () => {
    const fla = transformerFullLoadA(75, 480, 3);
    expect(maxPrimaryOcpd(fla, 'primary-only', 2023, 'breaker')).toEqual({ maxPct: 125, maxA: 112.76, nextStandardAllowed: true, allowedA: 125 });
  });

  it('primary only, 125 % landing on a standard rating stays there: 80 A × 1.25 = 100 A', () => {
    expect(maxPrimaryOcpd(80, 'primary-only', 2023, 'breaker').allowedA).toBe(100);
  });

  it('primary only, 2 A to under 9 A: 167 % with no round-up: 5 A × 1.67 = 8.35 A → 6 A fuse, no breaker', () => {
    expect(maxPrimaryOcpd(5, 'primary-only', 2023, 'fuse')).toEqual({ maxPct: 167, maxA: 8.35, nextStandardAllowed: false, allowedA: 6 });
    expect(maxPrimaryOcpd(5, 'primary-only', 2023, 'breaker').allowedA).toBeNull();
  });

  it('primary only, under 2 A: 300 %: 1.5 A × 3 = 4.5 A → 3 A fuse', () => {
    expect(maxPrimaryOcpd(1.5, 'primary-only', 2023, 'fuse')).toEqual({ maxPct: 300, maxA: 4.5, nextStandardAllowed: false, allowedA: 3 });
  });

  it('primary and secondary: primary 250 % with no round-up: 90.21 A × 2.5 = 225.53 A → 225 A', () => {
    const fla = transformerFullLoadA(75, 480, 3);
    expect(maxPrimaryOcpd(fla, 'primary-and-secondary', 2023, 'breaker')).toEqual({ maxPct: 250, maxA: 225.53, nextStandardAllowed: false, allowedA: 225 });
  });

  it('secondary 125 % with Note 1: 208.179 A × 1.25 = 260.22 A → next standard size 300 A', () => {
    const fla = transformerFullLoadA(75, 208, 3);
    expect(maxSecondaryOcpd(fla, 2023, 'breaker')).toEqual({ maxPct: 125, maxA: 260.22, nextStandardAllowed: true, allowedA: 300 });
  });

  it('secondary under 9 A: 167 %: 6 A × 1.67 = 10.02 A → 10 A (2023 breaker) / no 2020 breaker', () => {
    expect(maxSecondaryOcpd(6, 2023, 'breaker')).toEqual({ maxPct: 167, maxA: 10.02, nextStandardAllowed: false, allowedA: 10 });
    expect(maxSecondaryOcpd(6, 2020, 'breaker').allowedA).toBeNull();
  });
});
