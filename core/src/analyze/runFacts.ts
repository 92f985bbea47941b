import type { Conductor } from '../model/schema';
import type { RunFacts } from '../rules/facts';
import type { AnalysisContext } from './context';
import { terminationOf } from './equipment';
import { conductorLoadA, type ConductorLoad } from './loads';

const RACEWAYS: ReadonlySet<Conductor['wiring']> = new Set(['steel-conduit', 'aluminum-conduit', 'pvc-conduit']);

/**
 * Facts of each run that do not depend on how anything upstream is judged:
 * ampacity, length, termination, load, installation. Supply facts (R, the
 * transformer, the upstream run) are filled in by the classifier.
 */
export function baseRunFacts(ctx: AnalysisContext): RunFacts[] {
  const site = siteFacts(ctx.project);
  const out: RunFacts[] = new Array(ctx.runs.members.length);
  for (let r = 0; r < out.length; r++) out[r] = runFactsOf(ctx, r, site);
  return out;
}

/** The project settings every run's facts share (one object for all). */
export function siteFacts(project: AnalysisContext['project']): RunFacts['site'] {
  return {
    qualifiedMaintenance: project.project.qualifiedMaintenance,
    industrialInstallation: project.project.industrialInstallation,
    manufacturingWallHeightFt: project.project.manufacturingWallHeightFt ?? null,
    terminationDefault: project.project.terminationDefault,
  };
}

/** The base facts of run `r`. */
export function runFactsOf(ctx: AnalysisContext, r: number, site: RunFacts['site']): RunFacts {
  const { graph: g, runs, loads, ampacities, edition } = ctx;
  const members = runs.members[r]!;
  // The weakest segment names the run: size, material and sets of the lowest ampacity (the first on a tie or when unknown).
  let weakest = g.conductors[members[0]!]!;
  let lengthFt: number | null = 0;
  let ampacityA: number | null = Number.POSITIVE_INFINITY;
  let uncorrectedA: number | null = Number.POSITIVE_INFINITY;
  let small: number | null = null;
  let inRaceway = true;
  let damage: RunFacts['damageProtection'] = 'raceway';
  let outdoors = true;
  let leaves: boolean | null = false;
  let beyond = false;
  let cord = false;
  let highBay: RunFacts['highBay'] = null;
  let sized = true;
  for (const ci of members) {
    const c = g.conductors[ci]!;
    lengthFt = lengthFt === null || c.lengthFt === undefined ? null : lengthFt + c.lengthFt;
    const w = ampacities[ci]!.working;
    if (w === null) ampacityA = uncorrectedA = null;
    else if (ampacityA !== null && uncorrectedA !== null) {
      if (w.ampacityA < ampacityA) {
        ampacityA = w.ampacityA;
        weakest = c;
      }
      const before = Math.round(w.terminalLimitA * w.parallelSets * 100) / 100;
      if (before < uncorrectedA) uncorrectedA = before;
    }
    if (w?.smallConductorMaxOcpdA != null) small = small === null ? w.smallConductorMaxOcpdA : Math.min(small, w.smallConductorMaxOcpdA);
    const conduit = RACEWAYS.has(c.wiring);
    if (!conduit) inRaceway = false;
    // "Protected by a raceway" needs the run to be in one: a cable or open run so marked is not protected.
    if (c.damageProtection === 'none' || (c.damageProtection === 'raceway' && !conduit)) damage = 'none';
    else if (c.damageProtection === 'other-approved-means' && damage === 'raceway') damage = 'other-approved-means';
    if (!c.outdoors) outdoors = false;
    // One segment that leaves makes the run leave; otherwise one unstated segment leaves it unstated.
    if (c.leavesEnclosure === true) leaves = true;
    else if (c.leavesEnclosure === undefined && leaves === false) leaves = null;
    if (c.size === undefined) sized = false;
    beyond ||= c.extendsBeyondEquipment;
    cord ||= c.multioutletCordAndPlug;
    if (highBay === null && c.highBay !== undefined) highBay = c.highBay;
  }
  const lastIndex = members[members.length - 1]!;
  const toNode = g.conductorTo[lastIndex]!;
  const load = conductorLoadA(loads, g.conductorFrom[members[0]!]!, toNode, scratchLoad);
  // The one load the run serves (for a branch circuit: through no OCPD), when it is a motor or HVAC unit.
  const only = toNode >= 0 ? loads.onlyLoad[toNode]! : -1;
  const circuit = only >= 0 && loads.ownArticle[only] === 1 ? loads.loadCircuits[only] ?? null : null;
  return {
    edition,
    conductorIds: idsOf(g, members),
    material: weakest.material,
    size: sized ? weakest.size! : null,
    parallelSets: weakest.parallelSets,
    lengthFt: lengthFt === null ? null : Math.round(lengthFt * 100) / 100,
    ampacityA,
    ampacityUncorrectedA: uncorrectedA,
    smallConductorMaxOcpdA: small,
    supplyOcpdA: null,
    supplyOcpdId: null,
    supplyOcpdKind: null,
    supplyDeviceType: null,
    termination: terminationOf(g, toNode),
    loadA: load?.flowingA ?? null,
    calculatedLoadA: load?.calculatedA ?? null,
    inRaceway,
    damageProtection: damage,
    outdoors,
    leavesEnclosure: leaves,
    extendsBeyondEquipment: beyond,
    multioutletCordAndPlug: cord,
    hasSplices: members.length > 1,
    highBay,
    site,
    transformer: null,
    secondaries: NO_SECONDARIES,
    generator: null,
    motor: circuit?.motor ? { fullLoadA: circuit.motor.fullLoadA, source: circuit.motor.source, motorType: circuit.motor.motorType } : null,
    hvac: circuit?.hvac ?? null,
    suppliedFrom: null,
  };
}

/** The load of the run being read, rewritten for each (its two numbers are copied into the facts). */
const scratchLoad: ConductorLoad = { flowingA: 0, calculatedA: 0 };

/** Shared by every run that ends elsewhere than at a transformer (facts are read-only; the classifier replaces the list, never fills it). */
const NO_SECONDARIES: RunFacts[] = [];

/** The ids of conductors `members`, in order. */
function idsOf(g: AnalysisContext['graph'], members: readonly number[]): Conductor['id'][] {
  const ids = new Array<Conductor['id']>(members.length);
  for (let i = 0; i < members.length; i++) ids[i] = g.conductors[members[i]!]!.id;
  return ids;
}

/**
 * One run made of two joined at a splice or tap box with no branch (the
 * size may change there): the supply facts of the first, the end of the
 * second, the weakest ampacity and the lengths added. Judged as one tap or
 * secondary.
 */
export function joinFacts(a: RunFacts, b: RunFacts): RunFacts {
  const weaker = a.ampacityA === null || (b.ampacityA !== null && a.ampacityA <= b.ampacityA) ? a : b;
  const min = (x: number | null, y: number | null) => (x === null ? y : y === null ? x : Math.min(x, y));
  const damage = a.damageProtection === 'none' || b.damageProtection === 'none' ? 'none' : a.damageProtection === 'raceway' ? b.damageProtection : a.damageProtection;
  return {
    ...b,
    conductorIds: [...a.conductorIds, ...b.conductorIds],
    material: weaker.material,
    size: a.size === null || b.size === null ? null : weaker.size,
    parallelSets: weaker.parallelSets,
    lengthFt: a.lengthFt === null || b.lengthFt === null ? null : Math.round((a.lengthFt + b.lengthFt) * 100) / 100,
    ampacityA: a.ampacityA === null || b.ampacityA === null ? null : weaker.ampacityA,
    smallConductorMaxOcpdA: min(a.smallConductorMaxOcpdA, b.smallConductorMaxOcpdA),
    supplyOcpdA: a.supplyOcpdA,
    supplyOcpdId: a.supplyOcpdId,
    supplyOcpdKind: a.supplyOcpdKind,
    inRaceway: a.inRaceway && b.inRaceway,
    damageProtection: damage,
    outdoors: a.outdoors && b.outdoors,
    leavesEnclosure: a.leavesEnclosure === true || b.leavesEnclosure === true ? true : a.leavesEnclosure === null || b.leavesEnclosure === null ? null : false,
    extendsBeyondEquipment: a.extendsBeyondEquipment || b.extendsBeyondEquipment,
    multioutletCordAndPlug: a.multioutletCordAndPlug || b.multioutletCordAndPlug,
    hasSplices: true,
    highBay: a.highBay ?? b.highBay,
    suppliedFrom: a.suppliedFrom,
  };
}
