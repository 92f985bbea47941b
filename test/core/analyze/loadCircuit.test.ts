import { describe, expect, it } from 'vitest';
import type { NodeOfKind } from '@linewright/core';
import { loadCircuit } from '../../../core/src/analyze/loads';

const load = (fields: Partial<NodeOfKind<'load'>>): NodeOfKind<'load'> => ({ id: 'L1', kind: 'load', continuous: false, powerFactor: 0.9, ...fields }) as NodeOfKind<'load'>;

describe('a load circuit and its working text (written on first read)', () => {
  it('1.2 kVA line to neutral on 208Y/120 V draws 1200 / 120 = 10 A (I = S / V)', () => {
    const c = loadCircuit(load({ kva: 1.2, connection: 'line-to-neutral', phases: 1 }), 208, 3, 120)!;
    expect(c.lineA).toBe(10);
    expect(c.basis).toBe('single-phase line to neutral at 120 V: VA / 120 V');
  });

  it('30 kVA three-phase on 480 V: 30000 / (√3 × 480) = 36.08 A', () => {
    const c = loadCircuit(load({ kva: 30 }), 480, 3, 277)!;
    expect(c.lineA).toBe(36.08);
    expect(c.basis).toBe('three-phase at 480 V: VA / (√3 × 480 V)');
  });

  it('16 A single-phase, connection not stated, is taken at 240 V line to line (the larger volt-amperes, common practice)', () => {
    const c = loadCircuit(load({ currentA: 16, phases: 1 }), 240, 1, 120)!;
    expect(c.connection).toBe('line-to-line');
    expect(c.va).toBe(16 * 240);
    expect(c.basis).toBe('16 A; single-phase, connection not stated: 16 A taken at 240 V line to line, the larger volt-amperes');
  });
});
