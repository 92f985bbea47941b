import { describe, expect, it } from 'vitest';
import { analyze } from '../../../core/src/analyze/analyze';
import { createAnalysis } from '../../../core/src/analyze/incremental';
import type { Project } from '../../../core/src/model/schema';
import { Net } from './build';

/**
 * The studies' row tables (a fault row per node, a drop row per conductor) are built when a report
 * first reads them; an incremental re-check changes the study arrays in place. A report read late
 * must still carry the figures of the analysis that made it, as a report read at once does.
 */
const branch = (lengthFt: number): Project =>
  new Net()
    .node('U', 'utility', { voltsLL: 480, phases: 3, availableFaultKA: 30, xOverR: 6 })
    .node('B', 'breaker', { ratingA: 100, interruptingKA: 65 })
    .node('M', 'load', { kva: 40, phases: 3, powerFactor: 0.85 })
    .wire('S', 'U', 'B', { size: '3', lengthFt: 50 })
    .wire('W', 'B', 'M', { size: '3', lengthFt })
    .project();

describe('study tables built on first read', () => {
  it('a report read after an incremental re-check still has its own fault and drop rows', () => {
    const before = branch(100);
    const edited: Project = { ...before, conductors: before.conductors.map((c) => (c.id === 'W' ? { ...c, lengthFt: 300 } : c)) };
    const session = createAnalysis(before);
    const first = session.report;
    const second = session.update(edited);
    expect(session.last).toMatchObject({ mode: 'incremental' });
    // The first report's tables are read only now, after the session changed the study in place.
    expect(JSON.stringify(first.studies)).toBe(JSON.stringify(analyze(before).studies));
    expect(JSON.stringify(second.studies)).toBe(JSON.stringify(analyze(edited).studies));
    // The longer branch conductor moved the figures at the load: the two reports differ there.
    const at = (r: typeof first) => r.studies!.faults.find((f) => f.nodeId === 'M')!.kA;
    expect(at(second)!).toBeLessThan(at(first)!);
    const drop = (r: typeof first) => r.studies!.voltageDrop.conductors.find((d) => d.conductorId === 'W')!.pct;
    expect(drop(second)!).toBeGreaterThan(drop(first)!);
  });

  it('the tables read like plain arrays: keys in order, replaceable', () => {
    const report = analyze(branch(100));
    const s = report.studies!;
    expect(Object.keys(s)).toEqual(['notes', 'faults', 'voltageDrop', 'serviceMarkings', 'withstand']);
    expect(Object.keys(s.voltageDrop)).toEqual(['circuitLimitPct', 'totalLimitPct', 'conductors']);
    expect(s.faults.map((f) => f.nodeId)).toEqual(['U', 'B', 'M']);
    s.faults = [];
    expect(s.faults).toEqual([]);
  });
});
