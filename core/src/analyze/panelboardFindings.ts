import { runRule } from '../rules/define';
import { panelboardProtection, type PanelboardFacts } from '../rules/panelboard-protection';
import { largestStandardRatingAtMost } from '../tables/standardRatings';
import { edgeFrom, KIND, type Graph } from '../topology/graph';
import type { AnalysisContext } from './context';
import { effectiveRatingA, isOcpd, nodeLabel, transformerFacts } from './equipment';
import { finding } from './finding';
import { failedTexts } from './summary';
import type { ElementRef, Finding, Fix } from './types';

/** Most nodes the walk up from a panelboard passes before it gives up (a loop is reported elsewhere). */
const MAX_WALK = 10_000;

/** Stage: 408.36 on every panelboard: the OCPD in it or on its supply side, not above its rating. */
export function panelboardFindings(ctx: AnalysisContext): Finding[] {
  const out: Finding[] = [];
  const kinds = ctx.graph.nodeKind;
  for (let v = 0; v < kinds.length; v++) {
    // Only a bus can be a panelboard: the kind codes spare reaching every other node.
    if (kinds[v] !== KIND.bus) continue;
    const f = panelboardFindingOf(ctx, v);
    if (f) out.push(f);
  }
  return out;
}

/** The 408.36 finding of node `v`, or null when it is not a panelboard fed once or its protection passes. */
export function panelboardFindingOf(ctx: Pick<AnalysisContext, 'graph' | 'edition' | 'onCycle'>, v: number): Finding | null {
  const { graph: g, edition } = ctx;
  const n = g.nodes[v]!;
  if (n.kind !== 'bus' || n.busType !== 'panelboard' || g.inEdges[v]!.length !== 1 || ctx.onCycle[v]) return null;
  const facts = panelboardFacts(g, v, edition);
  if (!facts) return null;
  const t = runRule(panelboardProtection, facts);
  if (t.outcome !== 'fails') return null;
  const mainA = facts.ratingA === null ? null : largestStandardRatingAtMost(facts.ratingA, edition, 'breaker');
  const fixes: Fix[] =
    mainA === null ? [] : [{ kind: 'add-main', busId: n.id, ratingA: mainA, label: `Add a ${mainA} A main breaker in ${facts.label}: it then protects the panelboard at no more than its ${facts.ratingA} A rating (408.36).` }];
  const related: ElementRef[] = facts.device ? [{ kind: 'node', id: facts.device.id }] : [];
  if (facts.transformer) related.push({ kind: 'node', id: facts.transformer.id });
  return finding({
    ruleId: panelboardProtection.id,
    messageId: t.conditions.some((c) => c.id === 'device' && c.status === 'fail') ? 'no-device' : 'over-rating',
    severity: 'violation',
    cites: t.cites,
    subject: { kind: 'node', id: n.id },
    related,
    fixes,
    message: `Panelboard ${facts.label}: ${failedTexts(t).join(' ')} Fails ${t.cites.section}.`,
  });
}

/** Walks up from a panelboard bus to the first OCPD (a main when bus-linked straight into it), noting a transformer passed. */
function panelboardFacts(g: Graph, v: number, edition: PanelboardFacts['edition']): PanelboardFacts | null {
  const n = g.nodes[v]!;
  if (n.kind !== 'bus') return null;
  let transformer: PanelboardFacts['transformer'] = null;
  let u = v;
  for (let step = 0; step < MAX_WALK; step++) {
    const ins = g.inEdges[u]!;
    if (ins.length !== 1) return ins.length === 0 ? { edition, id: n.id, label: nodeLabel(n), ratingA: n.busRatingA ?? null, device: null, transformer } : null;
    const e = ins[0]!;
    const w = edgeFrom(g, e);
    if (w < 0) return null;
    const up = g.nodes[w]!;
    if (isOcpd(up)) {
      const where = u === v && e < 0 && transformer === null ? 'main' : 'supply-side';
      return { edition, id: n.id, label: nodeLabel(n), ratingA: n.busRatingA ?? null, device: { id: up.id, label: nodeLabel(up), ratingA: effectiveRatingA(up), where }, transformer };
    }
    if (up.kind === 'transformer' && transformer === null) transformer = transformerFacts(g, w, { ratingA: null, id: null });
    if (up.kind === 'utility' || up.kind === 'generator') return { edition, id: n.id, label: nodeLabel(n), ratingA: n.busRatingA ?? null, device: null, transformer };
    u = w;
  }
  return null;
}
