import { describe, expect, it } from 'vitest';
import { analyze } from '../../../core/src/analyze/analyze';
import type { Project } from '../../../core/src/model/schema';
import { Net } from './build';

/**
 * 110.9: a breaker's interrupting rating must be at least the fault current available at its line
 * terminals; 240.86: a declared series combination rating may stand in for it when the line-side
 * device is ahead. 110.10: equipment's short-circuit current rating likewise. The available current
 * here is whatever the study finds (its own tests check the figure); these check which devices are
 * judged against it and how, with ratings well above and well below it.
 */
const net = (feeder: Record<string, unknown>, bus: Record<string, unknown> = {}) =>
  new Net()
    .node('U', 'utility', { voltsLL: 480, phases: 3, availableFaultKA: 30, xOverR: 6 })
    .node('M', 'breaker', { ratingA: 400, interruptingKA: 65 })
    .node('P', 'bus', { busType: 'panelboard', ...bus })
    .node('F', 'breaker', { ratingA: 100, ...feeder })
    .node('L', 'load', { kva: 40, phases: 3, powerFactor: 0.9 })
    .wire('S', 'U', 'M', { size: '500', lengthFt: 10 })
    .wire('W1', 'M', 'P', { size: '500', lengthFt: 10 })
    .link('K', 'P', 'F')
    .wire('W2', 'F', 'L', { size: '3', lengthFt: 50 });

const faultDuty = (p: Project) => analyze(p).findings.filter((f) => f.ruleId === 'interrupting-rating' || f.ruleId === 'equipment-sccr').map((f) => `${f.ruleId} ${f.subject.kind === 'project' ? 'project' : f.subject.id} ${f.messageId}`);

describe('110.9 and 110.10 against the available fault current', () => {
  it('available at the panel: between 10 and 65 kA (the ratings below are chosen either side of it)', () => {
    const kA = analyze(net({ interruptingKA: 65 }).project()).studies!.faults.find((f) => f.nodeId === 'F')!.kA!;
    expect(kA).toBeGreaterThan(10);
    expect(kA).toBeLessThan(65);
  });

  it('a 65 kA device holds; a 10 kA device fails 110.9; a device without a rating is counted once for the project', () => {
    expect(faultDuty(net({ interruptingKA: 65 }).project())).toEqual([]);
    expect(faultDuty(net({ interruptingKA: 10 }).project())).toEqual(['interrupting-rating F rating']);
    expect(faultDuty(net({}).project())).toEqual(['interrupting-rating project no-rating']);
  });

  it('240.86: a declared 65 kA combination with the main ahead covers the 10 kA device; a 10 kA combination does not; a line side not ahead never does', () => {
    const withSeries = (lineSideId: string, combinationKA: number): Project => ({ ...net({ interruptingKA: 10 }).project(), seriesRatings: [{ lineSideId, loadSideId: 'F', combinationKA }] } as Project);
    expect(faultDuty(withSeries('M', 65))).toEqual([]);
    expect(faultDuty(withSeries('M', 10))).toEqual(['interrupting-rating F series']);
    expect(faultDuty(withSeries('F', 65))).toEqual(['interrupting-rating F series']);
  });

  it('110.10: a panel rated 10 kA fails, one rated 65 kA holds', () => {
    expect(faultDuty(net({ interruptingKA: 65 }, { sccrKA: 10 }).project())).toEqual(['equipment-sccr P sccr']);
    expect(faultDuty(net({ interruptingKA: 65 }, { sccrKA: 65 }).project())).toEqual([]);
  });
});
