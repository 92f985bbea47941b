import { smallestSizeWithAmpacity } from '../ampacity/ampacity';
import { largestProtectingRatingA } from '../analyze/fixes';
import type { ConductorReport } from '../analyze/types';
import type { CodeEdition, Conductor, ConductorSize } from '../model/schema';
import { conductorAreaCmil } from '../tables/conductorProperties';
import { egcSizeForOcpd, smallestSizeWithAreaCmil } from '../tables/egc250_122';
import { supplySideBondingJumper } from '../tables/bondingJumper250_102';
import { materialLabel, sizeIndexOf, sizeLabel } from '../tables/sizes';
import type { EgcSizing } from './types';

type EgcConductor = Pick<
  Conductor,
  'material' | 'size' | 'insulation' | 'parallelSets' | 'ambientC' | 'terminalTempC' | 'multioutletCordAndPlug' | 'egcSize'
>;

/**
 * 250.122(B): where the ungrounded conductors are larger than the circuit
 * needs, a wire-type EGC grows by the same circular-mil ratio. The ratio is
 * taken per set (the sets are equal, so it is also the ratio of the totals);
 * the result is the smallest size with at least the increased area.
 */
export function proportionalEgcSize(
  tableSize: ConductorSize,
  minimumPhaseSize: ConductorSize,
  actualPhaseSize: ConductorSize,
): { size: ConductorSize | null; ratio: number; neededCmil: number } {
  const ratio = conductorAreaCmil(actualPhaseSize) / conductorAreaCmil(minimumPhaseSize);
  if (ratio <= 1) return { size: tableSize, ratio: 1, neededCmil: conductorAreaCmil(tableSize) };
  const neededCmil = conductorAreaCmil(tableSize) * ratio;
  return { size: smallestSizeWithAreaCmil(neededCmil), ratio, neededCmil };
}

/**
 * The smallest phase size, all else as drawn, that the OCPD ahead protects
 * (240.4 with (B) and (D)) and that carries the calculated load: the
 * baseline 250.122(B) measures an increase from. Ambient correction and
 * bundling adjustment stay in, since increases made for them do not count.
 */
export function minimumPhaseSize(c: EgcConductor, ocpdA: number, calculatedLoadA: number | null, currentCarrying: number, edition: CodeEdition): ConductorSize | null {
  const found = smallestSizeWithAmpacity(
    {
      material: c.material,
      insulation: c.insulation,
      parallelSets: c.parallelSets,
      ambientC: c.ambientC,
      currentCarrying,
      // Not stated: the project default (110.14(C)(1)) is not passed here; 75 °C, the listed-equipment default.
      terminalTempC: c.terminalTempC ?? 75,
      edition,
    },
    calculatedLoadA ?? 0,
    (_size, w) => {
      const max = largestProtectingRatingA(
        { ampacityA: w.ampacityA, smallConductorMaxOcpdA: w.smallConductorMaxOcpdA, multioutletCordAndPlug: c.multioutletCordAndPlug },
        edition,
      );
      return max !== null && ocpdA <= max;
    },
  );
  return found?.size ?? null;
}

const SUPPLY_SIDE_ROLES: ReadonlySet<ConductorReport['role']> = new Set(['service', 'transformer-secondary', 'generator']);
const TAP_VERDICTS: ReadonlySet<ConductorReport['verdict']> = new Set(['tap-10ft', 'tap-25ft', 'tap-transformer', 'tap-high-bay', 'tap-outside']);

/**
 * The wire-type EGC of one run: Table 250.122 from the OCPD ahead; increased
 * by 250.122(B) where the phase conductors are larger than needed; one in
 * each raceway, full size, for parallel sets (250.122(F)); a feeder tap's
 * from the feeder OCPD (250.122(G)); never larger than the phase conductors
 * (250.122(A)). Service, generator and transformer-secondary conductors have
 * no OCPD at their supply end: what runs with them is a supply-side bonding
 * jumper, sized by Table 250.102(C)(1) (see sizeSupplySideJumper).
 */
export function sizeEgc(
  c: EgcConductor,
  report: Pick<ConductorReport, 'role' | 'verdict' | 'upstreamDevice' | 'load'>,
  currentCarrying: number,
  edition: CodeEdition,
): EgcSizing {
  const material = c.material;
  const sets = c.parallelSets;
  const base = { material, tableSize: null, minimumPhaseSize: null, increaseRatio: 1, ocpdA: null } as const;
  const stated = c.egcSize ?? null;

  if (SUPPLY_SIDE_ROLES.has(report.role)) return sizeSupplySideJumper(c, report.role, edition);

  const ocpdA = report.upstreamDevice?.ratingA ?? null;
  if (ocpdA === null) {
    if (stated !== null) return { ...base, size: stated, count: sets, cites: [], reason: 'as stated on the run', problem: 'no OCPD rating ahead to check the stated EGC against' };
    return { ...base, size: null, count: 0, cites: ['Table 250.122'], reason: 'no OCPD rating ahead: Table 250.122 cannot be read', problem: 'EGC not counted: give the OCPD ahead a rating' };
  }
  const tableSize = egcSizeForOcpd(ocpdA, material, edition);
  if (tableSize === null) {
    const reason = `${ocpdA} A is above the largest row of Table 250.122 (6000 A)`;
    return { ...base, ocpdA, size: stated, count: stated ? sets : 0, cites: ['Table 250.122'], reason, problem: stated ? null : `EGC not counted: ${reason}` };
  }

  const cites = ['Table 250.122'];
  const notes: string[] = [`Table 250.122, ${ocpdA} A: ${sizeLabel(tableSize)}`];
  let size: ConductorSize = tableSize;
  let minimum: ConductorSize | null = null;
  let ratio = 1;
  const phase = c.size;
  if (TAP_VERDICTS.has(report.verdict)) {
    cites.push('250.122(G)');
    notes.push('feeder tap: from the feeder OCPD (250.122(G))');
  } else if (phase === undefined) {
    notes.push('phase conductor size unknown: 250.122(A) and (B) not checked');
  } else {
    minimum = minimumPhaseSize(c, ocpdA, report.load?.calculatedA ?? null, currentCarrying, edition);
    if (minimum !== null && sizeIndexOf(phase) > sizeIndexOf(minimum)) {
      const p = proportionalEgcSize(tableSize, minimum, phase);
      ratio = p.ratio;
      if (p.size !== null) size = p.size;
      cites.push('250.122(B)');
      notes.push(
        `phase conductors ${sizeLabel(phase)} where ${sizeLabel(minimum)} would do: × ${ratio.toFixed(3)} = ${Math.round(p.neededCmil)} cmil → ${sizeLabel(size)} (250.122(B))`,
      );
    }
  }
  if (phase !== undefined && sizeIndexOf(size) > sizeIndexOf(phase)) {
    size = phase;
    cites.push('250.122(A)');
    notes.push(`not larger than the phase conductors: ${sizeLabel(phase)} (250.122(A))`);
  }
  if (sets > 1) {
    cites.push('250.122(F)');
    notes.push(`one full-size EGC in each of ${sets} raceways (250.122(F))`);
  }
  const computed = { material, tableSize, minimumPhaseSize: minimum, increaseRatio: ratio, ocpdA, count: sets, cites };
  if (stated !== null) {
    const below = sizeIndexOf(stated) < sizeIndexOf(size);
    return {
      ...computed,
      size: stated,
      reason: `stated ${sizeLabel(stated)}; minimum ${sizeLabel(size)}: ${notes.join('; ')}`,
      problem: below ? `the stated EGC ${sizeLabel(stated)} is below the 250.122 minimum ${sizeLabel(size)}` : null,
    };
  }
  return { ...computed, size, reason: notes.join('; '), problem: null };
}

/**
 * The supply-side bonding jumper of a service, generator or transformer-secondary run (250.92(B) and
 * 250.102(C) at a service, 250.30(A)(2) at a separately derived system): Table 250.102(C)(1) by the
 * ungrounded conductors in each raceway (250.102(C)(2): one jumper per raceway, sized by that
 * raceway's conductors), 12.5 % of their area above 1100 kcmil Cu / 1750 kcmil Al, of the supply
 * conductors' material. A stated size below that is flagged.
 */
function sizeSupplySideJumper(c: EgcConductor, role: ConductorReport['role'], edition: CodeEdition): EgcSizing {
  const sets = c.parallelSets;
  if (c.size === undefined) {
    // The table reads the ungrounded conductors' size: unknown, so the jumper is counted only as stated.
    const stated = c.egcSize ?? null;
    const reason = `${role} conductors have no OCPD at their supply end: a supply-side bonding jumper sized by the ungrounded conductors (Table 250.102(C)(1)), whose size is unknown`;
    const base = { material: c.material, tableSize: null, minimumPhaseSize: null, increaseRatio: 1, ocpdA: null, cites: ['Table 250.102(C)(1)'] };
    if (stated !== null) return { ...base, size: stated, count: sets, reason: `stated ${sizeLabel(stated)}; minimum unknown: ${reason}`, problem: null };
    return { ...base, size: null, count: 0, reason, problem: 'supply-side bonding jumper not counted: enter the conductor size' };
  }
  const j = supplySideBondingJumper(c.size, c.material, edition);
  const cites = ['Table 250.102(C)(1)'];
  if (j.basis === 'percent') cites.push('250.102(C)(1)');
  if (sets > 1) cites.push('250.102(C)(2)');
  const why =
    j.basis === 'table'
      ? `Table 250.102(C)(1), ${sizeLabel(c.size)} ${materialLabel(c.material)} ungrounded conductors: ${sizeLabel(j.size!)}`
      : `above the table (over 1100 kcmil Cu / 1750 kcmil Al): 12.5 % of ${sizeLabel(c.size)} = ${Math.round(j.neededCmil!)} cmil → ${sizeLabel(j.size!)} (250.102(C)(1))`;
  const notes = [`${role} conductors have no OCPD at their supply end: a supply-side bonding jumper`, why];
  if (sets > 1) notes.push(`one in each of ${sets} raceways, sized by the conductors in that raceway (250.102(C)(2))`);
  const base = { material: c.material, tableSize: j.size, minimumPhaseSize: null, increaseRatio: 1, ocpdA: null, count: sets, cites };
  const stated = c.egcSize ?? null;
  if (stated !== null) {
    const below = j.size !== null && sizeIndexOf(stated) < sizeIndexOf(j.size);
    return {
      ...base,
      size: stated,
      reason: `stated ${sizeLabel(stated)}; minimum ${j.size === null ? 'unknown' : sizeLabel(j.size)}: ${notes.join('; ')}`,
      problem: below ? `the stated supply-side bonding jumper ${sizeLabel(stated)} is below the 250.102(C)(1) minimum ${sizeLabel(j.size!)}` : null,
    };
  }
  return { ...base, size: j.size, reason: notes.join('; '), problem: null };
}
