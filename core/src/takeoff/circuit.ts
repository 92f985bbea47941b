import type { ConductorRole } from '../analyze/types';
import type { Conductor } from '../model/schema';
import { systemHasNeutral, type Serves } from './system';
import type { CircuitMakeup, CurrentCarryingCount, SystemAt } from './types';

/**
 * The conductors of one circuit: how many ungrounded conductors per set and
 * whether a neutral rides along. Decided once here; the raceway fill, the
 * wire feet and the 310.15(E) count all read this.
 *
 * 'auto' neutral (common practice, stated on the takeoff): where the supply
 * has a neutral, the service always brings it (250.24(C)); a run that serves
 * distribution equipment (panelboards, switchboards, tap boxes) or any
 * single-phase load carries one; a run serving only 3-phase loads or a
 * transformer primary does not. A run serving nothing but single-phase loads
 * (from a 3-phase system, or a branch circuit) is taken as line to neutral
 * (one ungrounded conductor and the neutral) when it has a neutral,
 * otherwise as line to line.
 */
export function circuitMakeup(c: Pick<Conductor, 'neutral'>, role: ConductorRole, system: SystemAt, serves: Serves): CircuitMakeup {
  const available = systemHasNeutral(system);
  const onlySinglePhase = serves.singlePhaseLoads && !serves.threePhaseLoads && !serves.distribution;
  let hasNeutral: boolean;
  let neutralReason: string;
  const choice = c.neutral ?? 'auto';
  if (choice === 'yes') {
    hasNeutral = true;
    neutralReason = available ? 'neutral: stated on the run' : 'neutral: stated on the run, though the supply shows no neutral; check the system';
  } else if (choice === 'no') {
    hasNeutral = system.arrangement === 'single-2w';
    neutralReason = hasNeutral ? 'grounded conductor: a 2-wire system needs one' : 'no neutral: stated on the run';
  } else if (!available) {
    hasNeutral = false;
    neutralReason = system.arrangement === 'unknown' ? 'no neutral: the supply system is unknown' : 'no neutral: the supply has none (3-wire delta)';
  } else if (system.arrangement === 'single-2w') {
    hasNeutral = true;
    neutralReason = 'grounded conductor of a 2-wire system';
  } else if (role === 'service') {
    hasNeutral = true;
    neutralReason = 'neutral: the grounded conductor is brought to the service (250.24(C))';
  } else if (role === 'transformer-primary') {
    hasNeutral = false;
    neutralReason = 'no neutral: a transformer primary';
  } else if (serves.distribution || serves.singlePhaseLoads) {
    hasNeutral = true;
    neutralReason = serves.distribution ? 'neutral: serves distribution equipment on a system with a neutral (auto)' : 'neutral: serves single-phase loads (auto)';
  } else {
    hasNeutral = false;
    neutralReason = serves.threePhaseLoads ? 'no neutral: serves 3-phase loads only (auto)' : 'no neutral: serves nothing drawn (auto)';
  }

  if (system.arrangement === 'single-2w') return { ungroundedPerSet: 1, hasNeutral: true, neutralReason, kind: 'two-wire' };
  const threePhase = system.phases !== 1;
  // A single-phase circuit off a 3-phase system, or a branch circuit off a 3-wire single-phase one; a service or
  // a single-phase feeder keeps every line of its system.
  if (onlySinglePhase && role !== 'service' && (threePhase || role === 'branch')) {
    return hasNeutral
      ? { ungroundedPerSet: 1, hasNeutral, neutralReason, kind: 'two-wire' }
      : { ungroundedPerSet: 2, hasNeutral, neutralReason, kind: 'line-to-line-2w' };
  }
  if (!threePhase) return { ungroundedPerSet: 2, hasNeutral, neutralReason, kind: hasNeutral ? 'single-phase-3w' : 'line-to-line-2w' };
  return { ungroundedPerSet: 3, hasNeutral, neutralReason, kind: hasNeutral ? 'three-phase-4w' : 'three-phase-3w' };
}

/**
 * 310.15(E): the current-carrying conductors in one raceway holding one set
 * of this circuit. The ampacity adjustment of Table 310.15(C)(1) and the
 * takeoff both read this one count.
 * - (E)(1): a neutral that carries only the unbalanced current of the same
 *   circuit does not count (3-phase 4-wire, single-phase 3-wire).
 * - (E)(2): the neutral of a 3-wire circuit taken from two phases of a 4-wire
 *   wye counts.
 * - (E)(3): on a 4-wire 3-phase wye circuit whose load is mainly nonlinear,
 *   the neutral counts.
 * - A 2-wire circuit's grounded conductor carries the whole current: it counts.
 */
export function countCurrentCarrying(makeup: Pick<CircuitMakeup, 'ungroundedPerSet' | 'hasNeutral' | 'kind'>, nonlinearLoad: boolean): CurrentCarryingCount {
  const n = makeup.ungroundedPerSet;
  if (!makeup.hasNeutral) return { count: n, neutralCounts: false, section: null, reason: `${n} ungrounded conductors; no neutral` };
  switch (makeup.kind) {
    case 'two-wire':
      return { count: n + 1, neutralCounts: true, section: '2-wire', reason: 'a 2-wire circuit: the grounded conductor carries the load current and counts' };
    case 'two-phase-and-neutral-of-wye':
      return { count: n + 1, neutralCounts: true, section: '310.15(E)(2)', reason: 'two phases and the neutral of a 4-wire wye: the neutral counts' };
    case 'three-phase-4w':
      return nonlinearLoad
        ? { count: n + 1, neutralCounts: true, section: '310.15(E)(3)', reason: 'a 4-wire wye circuit whose load is mainly nonlinear: the neutral counts' }
        : { count: n, neutralCounts: false, section: '310.15(E)(1)', reason: 'the neutral carries only the unbalanced current: it does not count' };
    default:
      return { count: n, neutralCounts: false, section: '310.15(E)(1)', reason: 'the neutral carries only the unbalanced current: it does not count' };
  }
}
