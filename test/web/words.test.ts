import { describe, expect, it } from 'vitest';
import { count, thousands } from '../../web/src/words';

describe('numbers in words', () => {
  it('separates thousands exactly as en-US number formatting does, for whole numbers of any size and sign', () => {
    for (const n of [0, 7, -7, 999, 1000, -1000, 12_345, 999_999, 1_000_000, 40_013, -1_234_567, 2 ** 40]) expect(thousands(n)).toBe(n.toLocaleString('en-US'));
    expect(thousands(1234.5)).toBe('1,234.5');
    expect(count(10_000, 'conductor')).toBe('10,000 conductors');
    expect(count(1, 'conductor')).toBe('1 conductor');
  });
});
