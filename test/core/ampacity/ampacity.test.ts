import { describe, expect, it } from 'vitest';
import { computeAmpacity, smallestSizeWithAmpacity, type AmpacityInput } from '../../../core/src/ampacity/ampacity';
import type { AmpacityWorking } from '../../../core/src/analyze/types';
import { CONDUCTOR_SIZES, INSULATIONS, MATERIALS, type ConductorSize } from '../../../core/src/model/schema';
import { baseAmpacityA } from '../../../core/src/tables/ampacity310_16';
import { insulationRating } from '../../../core/src/tables/insulation';

/** One conductor, three current-carrying in raceway, 30 °C, 75 °C terminations, NEC 2023 (common defaults). */
function run(over: Partial<AmpacityInput> = {}): AmpacityInput {
  return {
    material: 'cu',
    size: '3/0',
    insulation: 'THHN',
    parallelSets: 1,
    ambientC: 30,
    currentCarrying: 3,
    terminalTempC: 75,
    edition: 2023,
    ...over,
  };
}

function working(over: Partial<AmpacityInput>): AmpacityWorking {
  const r = computeAmpacity(run(over));
  if (!r.ok) throw new Error(`expected an ampacity, got ${r.field}: ${r.message}`);
  return r.working;
}

describe('computeAmpacity: worked cases (NFPA 70-2023 Table 310.16, 310.15, 110.14(C))', () => {
  it('3/0 Cu THHN 90 °C, 40 °C ambient: 225 × 0.91 = 204.75 A, capped at 200 A by 75 °C terminals (110.14(C))', () => {
    const w = working({ size: '3/0', ambientC: 40 });
    expect(w).toMatchObject({
      insulationTempC: 90,
      baseA: 225,
      ambientFactor: 0.91,
      adjustmentFactor: 1,
      correctedA: 204.75,
      terminalLimitA: 200,
      perSetA: 200,
      parallelSets: 1,
      ampacityA: 200,
      governedBy: 'terminal-rating',
      smallConductorMaxOcpdA: null,
    });
  });

  it('six current-carrying 4/0 Cu THHN: 260 × 0.80 = 208 A (Table 310.15(C)(1)), under the 230 A terminal limit', () => {
    const w = working({ size: '4/0', currentCarrying: 6 });
    expect(w.correctedA).toBe(208);
    expect(w.terminalLimitA).toBe(230);
    expect(w.ampacityA).toBe(208);
    expect(w.governedBy).toBe('correction-and-adjustment');
  });

  it('250 kcmil Cu THHN, 45 °C, nine conductors: 290 × 0.87 × 0.70 = 176.61 A (no float noise)', () => {
    const w = working({ size: '250', ambientC: 45, currentCarrying: 9 });
    expect(w.correctedA).toBe(176.61);
    expect(w.ampacityA).toBe(176.61);
  });

  it('60 °C terminals: 85 A tap needs 3 AWG Cu, not 4 AWG (DOMAIN common practice; 110.14(C))', () => {
    expect(working({ size: '4', terminalTempC: 60 }).ampacityA).toBe(70);
    expect(working({ size: '3', terminalTempC: 60 }).ampacityA).toBe(85);
    const found = smallestSizeWithAmpacity({ ...run({ terminalTempC: 60 }) }, 85);
    expect(found?.size).toBe('3');
    expect(found?.working.governedBy).toBe('terminal-rating');
  });

  it('two sets of 500 kcmil Cu 75 °C = 2 × 380 = 760 A (310.10(G))', () => {
    const w = working({ size: '500', insulation: 'THWN', parallelSets: 2 });
    expect(w.perSetA).toBe(380);
    expect(w.ampacityA).toBe(760);
    expect(w.governedBy).toBe('insulation-column');
  });

  it('two sets of 4/0 Cu THHN in one raceway, six current-carrying: 2 × (260 × 0.80) = 416 A', () => {
    expect(working({ size: '4/0', parallelSets: 2, currentCarrying: 6 }).ampacityA).toBe(416);
  });

  it('parallel 2 AWG rejected (310.10(G): 1/0 AWG and larger only)', () => {
    const r = computeAmpacity(run({ size: '2', parallelSets: 2 }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.field).toBe('parallelSets');
    expect(r.message).toContain('310.10(G)');
    expect(r.message).toContain('1/0 AWG');
  });

  it('parallel 1/0 accepted: 2 × 150 A = 300 A at 75 °C terminals', () => {
    expect(working({ size: '1/0', parallelSets: 2 }).ampacityA).toBe(300);
  });

  it('aluminum 14 AWG not in table (Table 310.16)', () => {
    const r = computeAmpacity(run({ material: 'al', size: '14' }));
    expect(r).toEqual({ ok: false, field: 'size', message: expect.stringContaining('aluminum 14 AWG') });
    if (!r.ok) expect(r.message).toContain('12 AWG or larger');
  });

  it('18 AWG Cu has no Table 310.16 ampacity: field size, use 14 AWG or larger', () => {
    const r = computeAmpacity(run({ size: '18' }));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.field).toBe('size');
      expect(r.message).toContain('14 AWG or larger');
    }
  });

  it('240.4(D): 12 AWG Cu → OCPD at most 20 A, though its ampacity is 25 A at 75 °C terminals', () => {
    const w = working({ size: '12' });
    expect(w.ampacityA).toBe(25);
    expect(w.smallConductorMaxOcpdA).toBe(20);
    expect(w.steps.at(-1)?.id).toBe('small-conductor');
  });

  it('240.4(D): 14 AWG copper-clad aluminum is 10 A in 2023, but Table 310.16 lists no 14 AWG Cu-clad Al ampacity', () => {
    const r = computeAmpacity(run({ material: 'cu-clad-al', size: '14' }));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.field).toBe('size');
      expect(r.message).toContain('240.4(D) names it');
    }
  });

  it('copper-clad aluminum reads the aluminum column: 1/0 THHN at 75 °C terminals = 120 A', () => {
    expect(working({ material: 'cu-clad-al', size: '1/0' }).ampacityA).toBe(120);
  });

  it('aluminum 4/0 XHHW-2 at 75 °C terminals = 180 A (Table 310.16)', () => {
    expect(working({ material: 'al', size: '4/0', insulation: 'XHHW-2' }).ampacityA).toBe(180);
  });

  it('terminals rated above the insulation do not help: 3/0 TW (60 °C) with 75 °C terminals = 165 A', () => {
    const w = working({ insulation: 'TW' });
    expect(w.insulationTempC).toBe(60);
    expect(w.terminalLimitA).toBe(165);
    expect(w.ampacityA).toBe(165);
    expect(w.governedBy).toBe('insulation-column');
  });

  it('90 °C terminals with THHN use the 90 °C column: 3/0 at 30 °C = 225 A', () => {
    expect(working({ terminalTempC: 90 }).ampacityA).toBe(225);
  });

  it('cold ambient: 4/0 THHN at 10 °C: 260 × 1.15 = 299 A, capped at 230 A by 75 °C terminals', () => {
    const w = working({ size: '4/0', ambientC: 10 });
    expect(w.correctedA).toBe(299);
    expect(w.ampacityA).toBe(230);
  });

  it('TW at 58 °C ambient: the 60 °C column has a dash, so field ambientC', () => {
    const r = computeAmpacity(run({ insulation: 'TW', ambientC: 58 }));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.field).toBe('ambientC');
      expect(r.message).toContain('Table 310.15(B)(1)(1)');
    }
  });

  it('bad counts name their field', () => {
    const sets = computeAmpacity(run({ parallelSets: 1.5 }));
    expect(!sets.ok && sets.field).toBe('parallelSets');
    const count = computeAmpacity(run({ currentCarrying: 0 }));
    expect(!count.ok && count.field).toBe('currentCarrying');
    const ambient = computeAmpacity(run({ ambientC: Number.NaN }));
    expect(!ambient.ok && ambient.field).toBe('ambientC');
  });
});

describe('computeAmpacity: steps and citations', () => {
  it('keeps every step in order with the edition’s citation', () => {
    const w = working({ size: '3/0', ambientC: 40 });
    expect(w.steps.map((s) => s.id)).toEqual(['base', 'ambient', 'adjustment', 'corrected', 'terminal', 'per-set', 'parallel']);
    expect(w.steps[0]).toMatchObject({ value: 225, cites: { code: 'NEC', edition: 2023, section: 'Table 310.16' } });
    expect(w.steps[0]!.text).toContain('225 A');
    expect(w.steps[1]).toMatchObject({ value: 0.91, cites: { section: 'Table 310.15(B)(1)(1)' } });
    expect(w.steps[3]!.text).toBe('225 A × 0.91 × 1.00 = 204.75 A');
    expect(w.steps[4]).toMatchObject({ value: 200, cites: { section: '110.14(C)' } });
  });

  it('NFPA 70-2020 cites Table 310.15(B)(1) for the ambient step', () => {
    const w = working({ ambientC: 40, edition: 2020 });
    expect(w.steps[1]!.cites).toEqual({ code: 'NEC', edition: 2020, section: 'Table 310.15(B)(1)' });
    expect(w.steps[1]!.text).toContain('Table 310.15(B)(1),');
  });

  it('each call returns its own working (callers may keep or annotate it)', () => {
    const a = working({});
    const b = working({});
    expect(a).toEqual(b);
    expect(a).not.toBe(b);
    expect(a.steps).not.toBe(b.steps);
  });
});

describe('computeAmpacity: invariants over the whole table', () => {
  it('at 30 °C with three conductors the ampacity is the lower of the insulation and termination columns (110.14(C))', () => {
    let checked = 0;
    for (const material of MATERIALS)
      for (const size of CONDUCTOR_SIZES)
        for (const insulation of INSULATIONS)
          for (const terminalTempC of [60, 75, 90] as const) {
            const r = computeAmpacity(run({ material, size, insulation, terminalTempC }));
            const col = Math.min(insulationRating(insulation).tempC, terminalTempC) as 60 | 75 | 90;
            const expected = baseAmpacityA(material, size, col);
            if (expected === null) {
              expect(r.ok, `${material} ${size}`).toBe(false);
              continue;
            }
            expect(r.ok && r.working.ampacityA, `${material} ${size} ${insulation} ${terminalTempC}`).toBe(expected);
            checked++;
          }
    expect(checked).toBeGreaterThan(3000);
  });

  it('ampacity never exceeds the base value or the terminal limit, per set', () => {
    for (const size of CONDUCTOR_SIZES.slice(2))
      for (const ambientC of [0, 25, 30, 40, 50])
        for (const currentCarrying of [3, 6, 12]) {
          const w = working({ size, ambientC, currentCarrying, insulation: 'XHHW-2' });
          expect(w.perSetA).toBeLessThanOrEqual(w.terminalLimitA);
          expect(w.perSetA).toBeLessThanOrEqual(w.correctedA);
          expect(w.ampacityA).toBe(w.perSetA);
        }
  });
});

describe('smallestSizeWithAmpacity (fix suggestions)', () => {
  it('one third of 600 A is 200 A, so a 25 ft tap needs 3/0 Cu at 75 °C (DOMAIN common practice)', () => {
    expect(smallestSizeWithAmpacity(run({ insulation: 'THWN' }), 600 / 3)?.size).toBe('3/0');
  });

  it('one tenth of 800 A is 80 A, so a field 10 ft tap needs at least 4 AWG Cu (85 A) (DOMAIN common practice)', () => {
    const found = smallestSizeWithAmpacity(run(), 800 / 10);
    expect(found?.size).toBe('4');
    expect(found?.working.ampacityA).toBe(85);
  });

  it('skips sizes under 1/0 for parallel sets: 2 sets for 700 A → 500 kcmil (2 × 380 = 760 A)', () => {
    const found = smallestSizeWithAmpacity(run({ parallelSets: 2 }), 700);
    expect(found?.size).toBe('500');
    expect(found?.working.ampacityA).toBe(760);
  });

  it('skips aluminum 14 AWG: 15 A in Al → 12 AWG (20 A at 75 °C)', () => {
    expect(smallestSizeWithAmpacity(run({ material: 'al' }), 15)?.size).toBe('12');
  });

  it('applies the filter: 240.21(B)(4) minimum 4 AWG Al for a 40 A high-bay tap', () => {
    const atLeast4 = (size: ConductorSize) => CONDUCTOR_SIZES.indexOf(size) >= CONDUCTOR_SIZES.indexOf('4');
    expect(smallestSizeWithAmpacity(run({ material: 'al' }), 40)?.size).toBe('8');
    expect(smallestSizeWithAmpacity(run({ material: 'al' }), 40, atLeast4)?.size).toBe('4');
  });

  it('null when even 2000 kcmil falls short, or when the ambient rules out the insulation', () => {
    expect(smallestSizeWithAmpacity(run(), 1000)).toBeNull();
    expect(smallestSizeWithAmpacity(run({ insulation: 'TW', ambientC: 60 }), 10)).toBeNull();
  });
});
