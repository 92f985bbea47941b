import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  analyze,
  applyFix,
  computeAmpacity,
  configsByCost,
  costPerFt,
  loadProject,
  sizeConductor,
  standardRatingsA,
  type AnalysisReport,
  type Project,
  type ProjectInput,
  type SizingResult,
} from '@linewright/core';
import { diagram } from '../../helpers/builder';

function project(input: ProjectInput): Project {
  const r = loadProject(input);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return r.project;
}

function sample(name: string): Project {
  return project(JSON.parse(readFileSync(new URL(`../../../samples/${name}.json`, import.meta.url), 'utf8')) as ProjectInput);
}

/** utility → 2000 A switchboard → 600 A breaker → branch conductor F → one continuous load of `loadA`. */
function feeder600(loadA: number, settings: Record<string, unknown> = {}): Project {
  return project(
    diagram(settings)
      .utility(480, { id: 'U' })
      .conductor({ id: 'SVC', size: '600', parallelSets: 4, lengthFt: 30 })
      .breaker(2000, { id: 'MAIN' })
      .switchboard(2000, { id: 'SWBD' })
      .breaker(600, { id: 'FDR' })
      .conductor({ id: 'F', size: '4/0', lengthFt: 50 })
      .load({ id: 'L', currentA: loadA, continuous: true })
      .build(),
  );
}

const ACCEPTED = new Set(['unprotected', 'tap-from-tap', 'incomplete']);

/** The analyzer's word on a run, checked here without the assistant's own judge: a verdict that is not failing or incomplete, and no violation on its segments. */
function analyzerAccepts(report: AnalysisReport, runIds: readonly string[]): boolean {
  const c = report.conductors.find((x) => x.id === runIds[0]);
  if (!c || ACCEPTED.has(c.verdict)) return false;
  return !report.findings.some((f) => f.severity === 'violation' && f.subject.kind === 'conductor' && runIds.includes(f.subject.id));
}

function applied(p: Project, c: SizingResult['candidates'][number]): Project {
  const copy = structuredClone(p);
  for (const f of c.fixes) applyFix(copy, f);
  return copy;
}

describe('Table 310.16 values the worked cases rest on (NFPA 70-2023 Table 310.16, 75 °C column, copper)', () => {
  const at75 = (size: string, parallelSets = 1) => {
    const r = computeAmpacity({ material: 'cu', size: size as never, insulation: 'THHN', parallelSets, ambientC: 30, currentCarrying: 3, terminalTempC: 75, edition: 2023 });
    if (!r.ok) throw new Error(r.message);
    return r.working.ampacityA;
  };
  it('300 kcmil 285 A, 350 kcmil 310 A, 1250 kcmil 590 A, 1500 kcmil 625 A', () => {
    expect([at75('300'), at75('350'), at75('1250'), at75('1500')]).toEqual([285, 310, 590, 625]);
  });
  it('2 sets of 350 kcmil: 2 × 310 = 620 A (310.10(G)); 2 sets of 300 kcmil: 2 × 285 = 570 A', () => {
    expect([at75('350', 2), at75('300', 2)]).toEqual([620, 570]);
  });
});

describe('the cost proxy and the configurations searched', () => {
  it('is monotone: a larger size or one more set never costs less (stated proxy, common practice)', () => {
    const list = configsByCost(['cu', 'al']);
    const cu = list.filter((c) => c.material === 'cu' && c.parallelSets === 1);
    for (let i = 1; i < cu.length; i++) expect(costPerFt(cu[i]!)).toBeGreaterThan(costPerFt(cu[i - 1]!));
    for (let sets = 1; sets < 8; sets++) expect(costPerFt({ size: '500', material: 'cu', parallelSets: sets + 1 })).toBeGreaterThan(costPerFt({ size: '500', material: 'cu', parallelSets: sets }));
    expect(costPerFt({ size: '500', material: 'al', parallelSets: 1 })).toBeLessThan(costPerFt({ size: '500', material: 'cu', parallelSets: 1 }));
  });
  it('offers parallel sets only at 1/0 AWG and larger (NFPA 70-2023 310.10(G)(1))', () => {
    const small = configsByCost(['cu', 'al']).filter((c) => c.parallelSets > 1 && ['14', '12', '10', '8', '6', '4', '3', '2', '1'].includes(c.size));
    expect(small).toEqual([]);
    expect(configsByCost(['cu']).some((c) => c.parallelSets === 2 && c.size === '1/0')).toBe(true);
  });
});

describe('sizing a 600 A continuous load (NFPA 70-2023 210.19(A)(1)(a), Table 310.16, 310.10(G))', () => {
  // 480 A continuous × 1.25 = 600 A: the ampacity before correction must be at least 600 A.
  const p = feeder600(480, { name: 'worked case', codeEdition: 2023, sizingMaterials: ['cu'] });
  const r = sizeConductor(p, 'F', { maxSets: 2 });

  it('two sets: 350 kcmil Cu (2 × 310 = 620 A ≥ 600 A); 300 kcmil (570 A) fails 210.19(A)(1)', () => {
    const two = r.candidates.find((c) => c.config.parallelSets === 2)!;
    expect(two.config).toEqual({ size: '350', material: 'cu', parallelSets: 2 });
    expect(two.ampacityA).toBe(620);
    expect(two.smallerFails?.config).toEqual({ size: '300', material: 'cu', parallelSets: 2 });
    expect(two.smallerFails?.binding.section).toBe('210.19(A)(1)');
  });
  it('one set needs 1500 kcmil (625 A); 1250 kcmil gives only 590 A', () => {
    const one = r.candidates.find((c) => c.config.parallelSets === 1)!;
    expect(one.config.size).toBe('1500');
    expect(one.smallerFails?.config.size).toBe('1250');
    expect(one.smallerFails?.binding.text).toContain('590');
  });
  it('the two sets are the cheaper by the stated proxy (2 × (350 + 250) < 1500 + 250) and come first', () => {
    expect(r.candidates[0]!.config).toEqual({ size: '350', material: 'cu', parallelSets: 2 });
    expect(r.costBasis).toMatch(/proxy/);
    expect(r.present.passes).toBe(false);
  });
  it('each candidate says why it passes, naming the section', () => {
    expect(r.candidates[0]!.reasons.join(' ')).toMatch(/240\.4/);
    expect(r.candidates[0]!.reasons.join(' ')).toMatch(/Ampacity 620 A/);
  });
  it('with aluminum allowed, a cheaper aluminum choice is listed too (Al 500 kcmil 310 A: 2 sets = 620 A)', () => {
    const al = sizeConductor(p, 'F', { materials: ['cu', 'al'], maxSets: 2 });
    const twoAl = al.candidates.find((c) => c.config.material === 'al' && c.config.parallelSets === 2)!;
    expect(twoAl.config.size).toBe('500');
    expect(al.candidates[0]!.cost).toBeLessThanOrEqual(r.candidates[0]!.cost);
  });
});

describe('the device ahead (240.6(A), 240.4(D), 210.20(A))', () => {
  it('a branch circuit may lower its breaker to a standard rating not below the calculated load, never above 240.4(D)', () => {
    const p = sample('cold-storage');
    const r = sizeConductor(p, 'B-LEV');
    const lowered = r.candidates.filter((c) => c.deviceRatingA !== null);
    expect(lowered.length).toBeGreaterThan(0);
    for (const c of lowered) {
      expect(standardRatingsA(2020, 'breaker')).toContain(c.deviceRatingA);
      // 240.4(D): 14 AWG Cu 15 A, 12 AWG Cu 20 A, 10 AWG Cu 30 A.
      const limit = { '14': 15, '12': 20, '10': 30 }[c.config.size as '14' | '12' | '10'];
      if (limit !== undefined) expect(c.deviceRatingA!).toBeLessThanOrEqual(limit);
    }
  });
  it('240.4(B) only up to 800 A: every choice that keeps a 1000 A device has at least 1000 A of ampacity (F-RMB)', () => {
    const r = sizeConductor(sample('cold-storage'), 'F-RMB');
    expect(r.candidates.length).toBeGreaterThan(0);
    for (const c of r.candidates) expect(c.ampacityA!).toBeGreaterThanOrEqual(1000);
  });
});

describe('the cold-storage shop tap (issue item: parallel sets where one huge conductor is the only single size)', () => {
  it('the fix the device ahead would protect is 2 sets of 250 kcmil Cu (2 × 255 = 510 A, next standard rating 600 A, 240.4(B)), not 900 kcmil', () => {
    const p = sample('cold-storage');
    const report = analyze(p);
    const tap = report.conductors.find((c) => c.id === 'TAP-6A')!;
    const parallel = tap.fixes.find((f) => f.kind === 'resize' && f.parallelSets > 1);
    expect(parallel).toMatchObject({ kind: 'resize', size: '250', material: 'cu', parallelSets: 2, forRule: 'protected-next-size' });
    expect(tap.fixes.some((f) => f.kind === 'resize' && f.size === '900')).toBe(false);
    const fixed = structuredClone(p);
    applyFix(fixed, parallel!);
    expect(analyze(fixed).conductors.find((c) => c.id === 'TAP-6A')!.verdict).toBe('protected-next-size');
  });
  it('the assistant on the same tap lists 3/0 Cu under 240.21(B)(2) and says 2/0 fails one third of 600 A', () => {
    const r = sizeConductor(sample('cold-storage'), 'TAP-6B');
    expect(r.runIds).toEqual(['TAP-6A', 'TAP-6B']);
    const cu = r.candidates.find((c) => c.config.material === 'cu' && c.config.parallelSets === 1)!;
    expect(cu.config.size).toBe('3/0');
    expect(cu.verdict).toBe('tap-25ft');
    expect(cu.smallerFails?.binding.text).toMatch(/one third of the 600 A/);
  });
});

describe('a tap from a tap is not a sizing question (240.21)', () => {
  it('says so and lists nothing: two 1/0 taps off a tap box that a 10 ft tap feeds', () => {
    const p = project(
      diagram()
        .utility(480)
        .conductor({ size: '600', parallelSets: 4, lengthFt: 30 })
        .breaker(2000)
        .switchboard(2000)
        .breaker(600, { id: 'FDR' })
        .tap({ id: 'T1', size: '3/0', lengthFt: 8, leavesEnclosure: false })
        .tapBox(200, { id: 'TB' })
        .tap({ id: 'T2', size: '1/0', lengthFt: 5 })
        .breaker(100)
        .panel(100)
        .at('TB')
        .tap({ id: 'T3', size: '1/0', lengthFt: 5 })
        .breaker(100)
        .panel(100)
        .build(),
    );
    expect(analyze(p).conductors.find((c) => c.id === 'T2')!.verdict).toBe('tap-from-tap');
    const r = sizeConductor(p, 'T2');
    expect(r.candidates).toEqual([]);
    expect(r.problem).toMatch(/240\.21/);
  });
  it('an unknown conductor id is refused with the id named', () => {
    expect(() => sizeConductor(feeder600(100), 'NOPE')).toThrow(/NOPE/);
  });
});

describe('property: the assistant never proposes what the analyzer then flags', () => {
  for (const name of ['cold-storage', 'demo-clinic', 'motor-shop', 'mixed-use']) {
    it(`${name}: every candidate for failing conductors first, then passing ones, passes after it is applied and the project re-analyzed`, () => {
      const p = sample(name);
      const report = analyze(p);
      const fails = (c: AnalysisReport['conductors'][number]) => ACCEPTED.has(c.verdict) || report.findings.some((f) => f.severity === 'violation' && f.subject.kind === 'conductor' && f.subject.id === c.id);
      const chosen = [...report.conductors.filter(fails), ...report.conductors.filter((c) => !fails(c))].slice(0, 6);
      let checked = 0;
      for (const c of chosen) {
        const r = sizeConductor(p, c.id, { top: 2 });
        for (const cand of r.candidates) {
          expect(analyzerAccepts(analyze(applied(p, cand)), r.runIds), `${c.id}: ${cand.label}`).toBe(true);
          checked++;
        }
      }
      expect(checked).toBeGreaterThan(0);
    });
  }
});
