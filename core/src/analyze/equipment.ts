import type { EquipmentNode } from '../model/schema';
import type { RunFacts, Termination } from '../rules/facts';
import { transformerFullLoadA } from '../tables/transformer';
import { KIND, type Graph } from '../topology/graph';

/**
 * Facts of one piece of equipment as the rules read them: the rating that
 * counts for an OCPD, what a run ends in, a transformer's or generator's
 * nameplate currents. Plain lookups on the graph; no judgement.
 */

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

/** Table 430.52 column of an OCPD node: a breaker is inverse-time unless stated instantaneous; a fuse's delay may be unstated (null). */
export function deviceTypeOf(node: EquipmentNode): RunFacts['supplyDeviceType'] {
  if (node.kind === 'breaker') return node.tripType === 'instantaneous' ? 'instantaneous' : 'inverse-time';
  if (node.kind === 'fuse') return node.timeDelay === undefined ? null : node.timeDelay ? 'time-delay' : 'non-time-delay';
  return null;
}

export const isOcpd = (node: EquipmentNode): boolean => node.kind === 'breaker' || node.kind === 'fuse';
/** The same by kind code (Graph.nodeKind), without reaching the node. */
export const isOcpdKind = (kind: number): boolean => kind === KIND.breaker || kind === KIND.fuse;

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
      let onlyOcpds = true;
      const outs = g.outEdges[v]!;
      for (let i = 0; i < outs.length; i++) {
        const e = outs[i]!;
        const w = e < 0 ? g.linkTo[-e - 1]! : -1;
        if (w < 0 || !isOcpd(g.nodes[w]!)) {
          onlyOcpds = false;
          continue;
        }
        const r = effectiveRatingA(g.nodes[w]!);
        devices++;
        sum = r === null || Number.isNaN(sum) ? Number.NaN : sum + r;
      }
      const t = termination('bus', node.id, label, false, node.busRatingA ?? null);
      t.busType = node.busType;
      t.groupedOcpdSumA = devices === 0 || Number.isNaN(sum) ? null : sum;
      t.groupedOcpdCount = devices;
      t.onlyOcpdsBelow = onlyOcpds && devices > 0;
      return t;
    }
    case 'disconnect': {
      // A fusible switch: the fuses drawn inside it (its one bus link out, to an OCPD) are where the run ends.
      const outs = g.outEdges[v]!;
      const w = outs.length === 1 && outs[0]! < 0 ? g.linkTo[-outs[0]! - 1]! : -1;
      if (w >= 0 && isOcpd(g.nodes[w]!)) {
        const t = terminationOf(g, w);
        t.label = `${t.label} in ${label}`;
        return t;
      }
      return termination('disconnect', node.id, label, false, node.ratingA ?? null);
    }
    case 'transformer':
    case 'load':
    case 'splice':
      return termination(node.kind, node.id, label, false, null);
    default:
      return termination('none', node.id, label, false, null);
  }
}

function termination(kind: Termination['kind'], nodeId: Termination['nodeId'], label: string, single: boolean, ratingA: number | null): Termination {
  return { kind, nodeId, label, single, ratingA, atDisconnectingMeans: false, disconnectLocation: null, busType: null, groupedOcpdSumA: null, groupedOcpdCount: 0, onlyOcpdsBelow: false };
}

export function transformerFacts(
  g: Graph,
  v: number,
  primaryOcpd: { ratingA: number | null; id: string | null },
  secondaryEnds: Termination[] = [],
): NonNullable<RunFacts['transformer']> {
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
    secondaryEnds,
  };
}

/** A generator's nameplate current (445.13): kVA·1000 / (√3·V) three-phase, kVA·1000 / V single-phase. */
export function generatorFacts(g: Graph, v: number): RunFacts['generator'] {
  const n = g.nodes[v]!;
  if (n.kind !== 'generator') return null;
  return { id: n.id, kva: n.kva, nameplateA: transformerFullLoadA(n.kva, n.voltsLL, n.phases), overloadPreventedByDesign: n.overloadPreventedByDesign };
}
