/**
 * The synthetic one-lines behind `npm run bench` (and the browser benchmark):
 * for any size and seed, exactly the conductors asked for, a file loadProject
 * accepts, the same file for the same seed, drawn top to bottom without two
 * nodes on one spot, and compact (no field spelled out at its schema default).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { VERDICTS, analyze, loadProject } from '@linewright/core';
import { generateProject } from '../../core/bench/generateProject';

const params = { numRuns: Number(process.env.FC_RUNS ?? 15), ...(process.env.FC_RUNS ? {} : { seed: 20261201 }) };

describe('generateProject', () => {
  it('gives exactly the conductors asked for, in a file that loads and analyzes', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1500 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }), (conductors, seed) => {
        const input = generateProject({ conductors, seed });
        expect(input.conductors).toHaveLength(conductors);
        const loaded = loadProject(JSON.stringify(input));
        expect(loaded.ok ? [] : loaded.errors.slice(0, 3)).toEqual([]);
        if (!loaded.ok) return;
        const report = analyze(loaded.project);
        expect(report.conductors).toHaveLength(conductors);
        for (const c of report.conductors) expect(VERDICTS).toContain(c.verdict);
      }),
      params,
    );
  }, 120_000);

  it('is deterministic for a seed and differs between seeds', () => {
    const a = JSON.stringify(generateProject({ conductors: 800, seed: 7 }));
    expect(JSON.stringify(generateProject({ conductors: 800, seed: 7 }))).toBe(a);
    expect(JSON.stringify(generateProject({ conductors: 800, seed: 8 }))).not.toBe(a);
  });

  it('lays nodes out top to bottom with no two on one spot', () => {
    const input = generateProject({ conductors: 3000, seed: 3 });
    const pos = new Map(input.nodes.map((n) => [n.id, n.position!]));
    expect(input.nodes.every((n) => n.position)).toBe(true);
    expect(new Set(input.nodes.map((n) => `${n.position!.x},${n.position!.y}`)).size).toBe(input.nodes.length);
    const upward = [...input.conductors, ...(input.busLinks ?? [])].filter((e) => pos.get(e.to)!.y <= pos.get(e.from)!.y);
    expect(upward.map((e) => e.id)).toEqual([]);
  });

  it('leaves out fields whose schema default fits', () => {
    const input = generateProject({ conductors: 2000, seed: 5 });
    const spelledDefaults = input.conductors.filter(
      (c) => c.material === 'cu' || c.parallelSets === 1 || c.insulation === 'THHN' || c.terminalTempC === 75 || c.ambientC === 30,
    );
    expect(spelledDefaults.map((c) => c.id)).toEqual([]);
  });

  it('has the shape of a real riser: feeders, taps, transformers, panels and some violations', () => {
    const loaded = loadProject(generateProject({ conductors: 5000, seed: 1 }));
    if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors.slice(0, 3)));
    const byVerdict = analyze(loaded.project).counts.byVerdict;
    for (const v of ['service', 'protected', 'protected-next-size', 'tap-10ft', 'tap-25ft', 'secondary-25ft', 'unprotected'] as const) {
      expect(byVerdict[v], v).toBeGreaterThan(0);
    }
    expect(loaded.project.nodes.filter((n) => n.kind === 'transformer').length).toBeGreaterThan(0);
  });
});
