import { computeAmpacity } from '../ampacity/ampacity';
import { INSULATIONS, type CodeEdition, type Conductor, type EquipmentNode, type Project } from '../model/schema';
import { materialIndexOf, sizeIndexOf } from '../tables/sizes';
import type { RunFacts, Termination } from '../rules/facts';
import { transformerFullLoadA } from '../tables/transformer';
import type { Graph } from '../topology/graph';
import type { Runs } from '../topology/runs';
import { conductorLoadA, type SystemLoads } from './loads';
import type { AmpacityWorking } from './types';

/** The rating that counts for an OCPD node (240.6): adjustable trips count their maximum setting unless access is restricted. */
export function effectiveRatingA(node: EquipmentNode): number | null {
  if (node.kind === 'breaker') {
    const t = node.adjustableTrip;
    if (t) return t.restrictedAccess ? t.longTimeSettingA : t.maxSettingA;
    return node.ratingA ?? null;
  }
  if (node.kind === 'fuse') return node.ratingA ?? null;
  return null;
}

export const isOcpd = (node: EquipmentNode): boolean => node.kind === 'breaker' || node.kind === 'fuse';

export function nodeLabel(node: EquipmentNode): string {
  return node.label && node.label.trim() !== '' ? node.label : node.id;
}

export function terminationOf(g: Graph, v: number): Termination {
  if (v < 0) return termination('none', null, '', false, null);
  const node = g.nodes[v]!;
  const label = nodeLabel(node);
  switch (node.kind) {
    case 'breaker':
    case 'fuse': {
      const t = termination('ocpd', node.id, label, node.arrangement === 'single', effectiveRatingA(node));
      t.atDisconnectingMeans = node.atDisconnectingMeans;
      t.disconnectLocation = node.disconnectLocation ?? null;
      return t;
    }
    case 'bus': {
      let sum = 0;
      let devices = 0;
      for (const e of g.outEdges[v]!) {
        const w = e < 0 ? g.linkTo[-e - 1]! : -1;
        if (w < 0 || !isOcpd(g.nodes[w]!)) continue;
        const r = effectiveRatingA(g.nodes[w]!);
        devices++;
        sum = r === null || Number.isNaN(sum) ? Number.NaN : sum + r;
      }
      const t = termination('bus', node.id, label, false, node.busRatingA ?? null);
      t.busType = node.busType;
      t.groupedOcpdSumA = devices === 0 || Number.isNaN(sum) ? null : sum;
      return t;
    }
    case 'disconnect':
      return termination('disconnect', node.id, label, false, node.ratingA ?? null);
    case 'transformer':
    case 'load':
    case 'splice':
      return termination(node.kind, node.id, label, false, null);
    default:
      return termination('none', node.id, label, false, null);
  }
}

function termination(kind: Termination['kind'], nodeId: Termination['nodeId'], label: string, single: boolean, ratingA: number | null): Termination {
  return { kind, nodeId, label, single, ratingA, atDisconnectingMeans: false, disconnectLocation: null, busType: null, groupedOcpdSumA: null };
}

const RACEWAYS: ReadonlySet<Conductor['wiring']> = new Set(['steel-conduit', 'aluminum-conduit', 'pvc-conduit']);

export interface ConductorAmpacity {
  working: AmpacityWorking | null;
  /** Why there is no ampacity: the field and how to fix it. */
  problem: { field: string; message: string } | null;
}

/**
 * Ampacity of one conductor. A riser repeats a few dozen combinations of
 * size, material and conditions thousands of times, so equal inputs share one
 * frozen result; the working is read-only.
 */
const ampacityMemo = new Map<number, ConductorAmpacity>();
const MAX_MEMO = 8192;
const INSULATION_INDEX = new Map<string, number>(INSULATIONS.map((x, i) => [x, i]));

/**
 * The inputs packed into one exact integer (mixed radix, under 2^53), so the
 * memo needs no string per conductor; NaN when an input falls outside the
 * packing (an ambient with more than two decimals), which skips the memo.
 */
function ampacityKey(c: Conductor, edition: CodeEdition): number {
  const ambient = Math.round(c.ambientC * 100);
  if (ambient !== c.ambientC * 100) return Number.NaN;
  const term = c.terminalTempC === 60 ? 0 : c.terminalTempC === 75 ? 1 : 2;
  let k = materialIndexOf(c.material);
  k = k * 30 + sizeIndexOf(c.size);
  k = k * 14 + (INSULATION_INDEX.get(c.insulation) ?? 0);
  k = k * 21 + c.parallelSets;
  k = k * 13_001 + (ambient + 4000);
  k = k * 201 + c.currentCarrying;
  return (k * 3 + term) * 2 + (edition === 2020 ? 0 : 1);
}

export function conductorAmpacity(c: Conductor, edition: CodeEdition): ConductorAmpacity {
  const key = ampacityKey(c, edition);
  let hit = ampacityMemo.get(key);
  if (hit) return hit;
  const r = computeAmpacity({
    material: c.material,
    size: c.size,
    insulation: c.insulation,
    parallelSets: c.parallelSets,
    ambientC: c.ambientC,
    currentCarrying: c.currentCarrying,
    terminalTempC: c.terminalTempC,
    edition,
  });
  hit = Object.freeze(r.ok ? { working: deepFreeze(r.working), problem: null } : { working: null, problem: Object.freeze({ field: r.field, message: r.message }) });
  if (!Number.isNaN(key)) {
    if (ampacityMemo.size >= MAX_MEMO) ampacityMemo.clear();
    ampacityMemo.set(key, hit);
  }
  return hit;
}

function deepFreeze<T extends object>(o: T): T {
  for (const v of Object.values(o)) if (v && typeof v === 'object' && !Object.isFrozen(v)) deepFreeze(v as object);
  return Object.freeze(o);
}

/**
 * Facts of each run that do not depend on how anything upstream is judged:
 * ampacity, length, termination, load, installation. Supply facts (R, the
 * transformer, the upstream run) are filled in by the classifier.
 */
export function baseRunFacts(
  project: Project,
  g: Graph,
  runs: Runs,
  loads: SystemLoads,
  ampacities: readonly ConductorAmpacity[],
): RunFacts[] {
  const edition = project.project.codeEdition;
  const site = {
    qualifiedMaintenance: project.project.qualifiedMaintenance,
    industrialInstallation: project.project.industrialInstallation,
    manufacturingWallHeightFt: project.project.manufacturingWallHeightFt ?? null,
  };
  const out: RunFacts[] = new Array(runs.members.length);
  for (let r = 0; r < runs.members.length; r++) {
    const members = runs.members[r]!;
    const first = g.conductors[members[0]!]!;
    let lengthFt: number | null = 0;
    let ampacityA: number | null = Number.POSITIVE_INFINITY;
    let small: number | null = null;
    let inRaceway = true;
    let damage: RunFacts['damageProtection'] = 'raceway';
    let outdoors = true;
    let leaves: boolean | null = false;
    let beyond = false;
    let cord = false;
    for (const ci of members) {
      const c = g.conductors[ci]!;
      lengthFt = lengthFt === null || c.lengthFt === undefined ? null : lengthFt + c.lengthFt;
      const w = ampacities[ci]!.working;
      if (w === null) ampacityA = null;
      else if (ampacityA !== null && w.ampacityA < ampacityA) ampacityA = w.ampacityA;
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
      beyond ||= c.extendsBeyondEquipment;
      cord ||= c.multioutletCordAndPlug;
    }
    const lastIndex = members[members.length - 1]!;
    const toNode = g.conductorTo[lastIndex]!;
    const load = conductorLoadA(loads, g.conductorFrom[members[0]!]!, toNode);
    out[r] = {
      edition,
      conductorIds: members.map((ci) => g.conductors[ci]!.id),
      material: first.material,
      size: first.size,
      parallelSets: first.parallelSets,
      lengthFt: lengthFt === null ? null : Math.round(lengthFt * 100) / 100,
      ampacityA,
      smallConductorMaxOcpdA: small,
      supplyOcpdA: null,
      supplyOcpdId: null,
      supplyOcpdKind: null,
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
      highBay: first.highBay ?? null,
      site,
      transformer: null,
      secondaries: [],
      generator: null,
      suppliedFrom: null,
    };
  }
  return out;
}

export function transformerFacts(g: Graph, v: number, primaryOcpd: { ratingA: number | null; id: string | null }): NonNullable<RunFacts['transformer']> {
  const t = g.nodes[v]!;
  if (t.kind !== 'transformer') throw new Error(`node ${t.id} is not a transformer`);
  return {
    id: t.id,
    label: nodeLabel(t),
    kva: t.kva,
    primaryVoltsLL: t.primaryVoltsLL,
    secondaryVoltsLL: t.secondaryVoltsLL,
    phases: t.phases,
    connection: t.connection,
    primaryFlaA: transformerFullLoadA(t.kva, t.primaryVoltsLL, t.phases),
    secondaryFlaA: transformerFullLoadA(t.kva, t.secondaryVoltsLL, t.phases),
    primaryOcpdA: primaryOcpd.ratingA,
    primaryOcpdId: (primaryOcpd.id as NonNullable<RunFacts['transformer']>['primaryOcpdId']) ?? null,
  };
}
