import type { ConductorId, NodeId } from '../model/schema';
import { KIND, type Graph } from '../topology/graph';
import type { AnalysisContext } from './context';
import { nodeLabel } from './equipment';
import { finding, type NewFinding } from './finding';
import type { ElementRef, Finding } from './types';

/** Most elements a single topology finding lists. */
const MAX_RELATED = 50;

/** Equipment that passes power on, by kind code (Graph.nodeKind): with nothing below it, a conductor or load is probably missing. */
const PASSES_POWER_ON: ReadonlySet<number> = new Set([KIND.splice, KIND.bus, KIND.disconnect, KIND.breaker, KIND.fuse]);

/** Stage: findings about the shape of the network: loose equipment, several supplies, no source, dangling ends, loops. */
export function topologyFindings(ctx: AnalysisContext): Finding[] {
  const { graph: g, onCycle } = ctx;
  const out: Finding[] = [];
  const push = (f: NewFinding) => out.push(finding(f));
  const cycleNodes: ElementRef[] = [];
  for (let v = 0; v < g.nodes.length; v++) {
    if (onCycle[v]) cycleNodes.push({ kind: 'node', id: g.nodes[v]!.id });
    nodeTopologyFindings(g, v, out);
  }
  if (cycleNodes.length > 0) {
    const first = cycleNodes[0]!;
    push({
      ruleId: 'topology',
      messageId: 'cycle',
      severity: 'warning',
      cites: null,
      subject: first,
      related: cycleNodes.slice(1, MAX_RELATED),
      message: `${cycleNodes.length} items lie on or below a loop (starting at ${(first as { id: NodeId }).id}); a one-line runs from source to load without loops, so the conductors there are not judged.`,
    });
  }
  return out;
}

/**
 * The findings about node `v`'s place in the network (loose, several supplies, no source, dangling
 * end), appended to `out`. Also how incremental.ts makes again those of the nodes an edit connected.
 */
export function nodeTopologyFindings(g: Graph, v: number, out: Finding[]): void {
  const ins = g.inEdges[v]!.length;
  const outs = g.outEdges[v]!.length;
  // Nearly every node has one supply and either something below it or no need of it (a load): no finding
  // here, so its name and subject are made only for a node that may have one.
  if (ins === 1 && (outs > 0 || !PASSES_POWER_ON.has(g.nodeKind[v]!))) return;
  const push = (f: NewFinding) => out.push(finding(f));
  const n = g.nodes[v]!;
  const subject: ElementRef = { kind: 'node', id: n.id };
  const name = `${nodeLabel(n)}${n.label ? ` (${n.id})` : ''}`;
  if (ins === 0 && outs === 0) {
    push({ ruleId: 'topology', messageId: 'isolated', severity: 'info', cites: null, subject, message: `${name} is not connected to anything.` });
    return;
  }
  if (ins > 1) {
    push({
      ruleId: 'topology',
      messageId: 'several-supplies',
      severity: 'warning',
      cites: null,
      subject,
      related: g.inEdges[v]!.map((e) => edgeRef(g, e)),
      data: { supplies: ins },
      message: `${name} is fed from ${ins === 2 ? 'two' : ins} sources: ${supplyNames(g, v)}. Linewright judges radial systems, so the loads below it count against every supply and its voltage is known only where the supplies agree; show the transfer equipment, or remove all but one supply.`,
    });
  }
  if (ins === 0 && n.kind !== 'utility' && n.kind !== 'generator') {
    push({ ruleId: 'topology', messageId: 'no-source', severity: 'warning', cites: null, subject, message: `Nothing supplies ${name}; the conductors below it cannot be judged. Connect it to a source.` });
  }
  if (outs === 0 && ins > 0 && PASSES_POWER_ON.has(g.nodeKind[v]!)) {
    push({ ruleId: 'topology', messageId: 'dangling-end', severity: 'info', cites: null, subject, message: `${name} supplies nothing; is a conductor or load missing below it?` });
  }
}

/** 'A and B', 'A, B and C': the equipment on the supply end of each edge into node v. */
function supplyNames(g: Graph, v: number): string {
  const names = g.inEdges[v]!.slice(0, MAX_RELATED).map((e) => {
    const u = e >= 0 ? g.conductorFrom[e]! : g.linkFrom[-e - 1]!;
    return u >= 0 ? nodeLabel(g.nodes[u]!) : '?';
  });
  return names.length <= 1 ? names.join('') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

function edgeRef(g: Graph, e: number): ElementRef {
  return e >= 0 ? { kind: 'conductor', id: g.conductors[e]!.id as ConductorId } : { kind: 'busLink', id: g.links[-e - 1]!.id };
}

