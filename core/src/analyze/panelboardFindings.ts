import { atLeast, runRule } from '../rules/define';
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
  const walk = walkUp(g, v);
  // Most panelboards: an OCPD ahead with no transformer between, rated within the panelboard's rating, or
  // either rating not given (the rule cannot fail then): no facts are built for those.
  if (walk !== null && walk.device >= 0 && walk.transformer < 0 && atLeast(n.busRatingA ?? null, effectiveRatingA(g.nodes[walk.device]!)) !== false) return null;
  const facts = walk === null ? null : panelboardFacts(g, v, walk, edition);
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

/** What the walk up from a panelboard met: the OCPD (-1 for none: a source, or nothing, supplies it), whether it is the panelboard's main, the first transformer passed (-1 for none). */
interface Walk {
  device: number;
  main: boolean;
  transformer: number;
}

/** Walks up from panelboard bus `v` to the first OCPD (a main when bus-linked straight into it), noting a transformer passed; null where it cannot tell (several supplies, a loose end, a loop). */
function walkUp(g: Graph, v: number): Walk | null {
  let transformer = -1;
  let u = v;
  for (let step = 0; step < MAX_WALK; step++) {
    const ins = g.inEdges[u]!;
    if (ins.length !== 1) return ins.length === 0 ? { device: -1, main: false, transformer } : null;
    const e = ins[0]!;
    const w = edgeFrom(g, e);
    if (w < 0) return null;
    const up = g.nodes[w]!;
    if (isOcpd(up)) return { device: w, main: u === v && e < 0 && transformer < 0, transformer };
    if (up.kind === 'transformer' && transformer < 0) transformer = w;
    if (up.kind === 'utility' || up.kind === 'generator') return { device: -1, main: false, transformer };
    u = w;
  }
  return null;
}

/** The facts 408.36 reads of panelboard `v`, from what the walk up met. */
function panelboardFacts(g: Graph, v: number, walk: Walk, edition: PanelboardFacts['edition']): PanelboardFacts | null {
  const n = g.nodes[v]!;
  if (n.kind !== 'bus') return null;
  const transformer = walk.transformer < 0 ? null : transformerFacts(g, walk.transformer, { ratingA: null, id: null });
  const up = walk.device < 0 ? null : g.nodes[walk.device]!;
  const device = up === null ? null : { id: up.id, label: nodeLabel(up), ratingA: effectiveRatingA(up), where: walk.main ? ('main' as const) : ('supply-side' as const) };
  return { edition, id: n.id, label: nodeLabel(n), ratingA: n.busRatingA ?? null, device, transformer };
}
