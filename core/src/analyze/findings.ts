import type { ConductorId, NodeId, Project } from '../model/schema';
import { conductorName, formatNumber, runRule } from '../rules/define';
import { transformerProtection } from '../rules/transformer-protection';
import type { Graph } from '../topology/graph';
import type { Runs } from '../topology/runs';
import type { RunVerdict } from './classify';
import { nodeLabel, type ConductorAmpacity } from './facts';
import { failedTexts, incompleteReason, nearestTrial } from './summary';
import type { Citation, ElementRef, Finding, Fix } from './types';

/** Most elements a single topology finding lists. */
const MAX_RELATED = 50;

/**
 * Turns verdicts and topology into findings: one sentence each, with the
 * citation, the elements involved and the fixes. Order is stable: conductors
 * in file order, then equipment.
 */
export function collectFindings(
  project: Project,
  g: Graph,
  runs: Runs,
  verdicts: readonly RunVerdict[],
  runFixes: readonly Fix[][],
  ampacities: readonly ConductorAmpacity[],
  onCycle: Uint8Array,
): Finding[] {
  const edition = project.project.codeEdition;
  const out: Finding[] = [];
  const cites = (section: string): Citation => ({ code: 'NEC', edition, section });
  const push = (f: Omit<Finding, 'id' | 'related' | 'fixes' | 'data'> & Partial<Pick<Finding, 'related' | 'fixes' | 'data'>>) => {
    const subject = f.subject.kind === 'project' ? 'project' : f.subject.id;
    out.push({ id: `${f.ruleId}:${subject}:${f.messageId}`, related: [], fixes: [], data: {}, ...f });
  };

  for (let ci = 0; ci < g.conductors.length; ci++) {
    const c = g.conductors[ci]!;
    const v = verdicts[runs.runOf[ci]!]!;
    const f = v.facts;


    const fixes = runFixes[runs.runOf[ci]!]!;
    const amp = ampacities[ci]!;
    if (amp.problem) {
      push({ ruleId: 'ampacity', messageId: `no-ampacity-${amp.problem.field}`, severity: 'warning', cites: cites('310.16'), subject: { kind: 'conductor', id: c.id }, message: `${describeConductor(c, f.parallelSets)}: ${amp.problem.message}` });
    }
    switch (v.verdict) {
      case 'unprotected': {
        const n = nearestTrial(v.tried);
        const R = f.supplyOcpdA === null ? '' : `, fed by the ${formatNumber(f.supplyOcpdA)} A device ahead`;
        push({
          ruleId: n?.ruleId ?? 'protected',
          messageId: 'no-rule-fits',
          severity: 'violation',
          cites: n?.cites ?? cites('240.4'),
          subject: { kind: 'conductor', id: c.id },
          related: deviceRefs(g, v),
          fixes,
          data: { ampacityA: f.ampacityA ?? '?', deviceA: f.supplyOcpdA ?? '?' },
          message: `${describeConductor(c, f.parallelSets)}, ${f.ampacityA === null ? '?' : formatNumber(f.ampacityA)} A${R}: no rule of NEC ${edition} makes it acceptable.${n ? ` Nearest is ${n.cites.section} (${n.title.toLowerCase()}), which fails: ${failedTexts(n).join(' ')}` : ''}`,
        });
        break;
      }
      case 'tap-from-tap':
        push({
          ruleId: 'tap-from-tap',
          messageId: 'supply',
          severity: 'violation',
          cites: cites('240.21'),
          subject: { kind: 'conductor', id: c.id },
          related: [...(f.suppliedFrom?.conductorIds ?? []).map((id): ElementRef => ({ kind: 'conductor', id })), ...deviceRefs(g, v)],
          fixes,
          message: `${describeConductor(c, f.parallelSets)} is tapped from ${f.suppliedFrom?.conductorIds.join(' → ') ?? '?'}, which is itself a tap or transformer secondary; a conductor supplied under 240.21 may supply another only through an OCPD that meets 240.4.`,
        });
        break;
      case 'incomplete':
        if (v.supply.kind === 'run' || v.supply.kind === 'ocpd' || v.supply.kind === 'transformer') {
          push({ ruleId: 'incomplete', messageId: 'missing-data', severity: 'warning', cites: null, subject: { kind: 'conductor', id: c.id }, related: deviceRefs(g, v), message: `${describeConductor(c, f.parallelSets)}: no verdict yet; ${incompleteReason(v)}.` });
        }
        break;
      case 'protected-next-size':
        push({
          ruleId: 'protected-next-size',
          messageId: 'round-up-used',
          severity: 'info',
          cites: cites('240.4(B)'),
          subject: { kind: 'conductor', id: c.id },
          related: deviceRefs(g, v),
          message: `${describeConductor(c, f.parallelSets)}: the ${formatNumber(f.supplyOcpdA ?? 0)} A device is the next standard rating above its ${formatNumber(f.ampacityA ?? 0)} A ampacity (240.4(B)); confirm the circuit is not a multioutlet branch circuit for cord-and-plug loads.`,
        });
        break;
      default:
        break;
    }
    for (const t of v.tried) {
      if (t.outcome !== 'holds' || t.ruleId !== v.rule?.id) continue;
      if (t.conditions.some((cond) => cond.needsAhj)) {
        push({
          ruleId: t.ruleId,
          messageId: 'other-approved-means',
          severity: 'needs-ahj',
          cites: t.cites,
          subject: { kind: 'conductor', id: c.id },
          message: `${describeConductor(c, f.parallelSets)}: meets ${t.cites.section} only if the AHJ accepts its protection from physical damage by "other approved means".`,
        });
      }
    }
    if ((v.verdict === 'service' || v.verdict === 'generator') && v.tried[0]?.outcome === 'fails') {
      const t = v.tried[0];
      push({ ruleId: t.ruleId, messageId: 'fails', severity: 'violation', cites: t.cites, subject: { kind: 'conductor', id: c.id }, message: `${describeConductor(c, f.parallelSets)}: ${failedTexts(t).join(' ')} Fails ${t.cites.section}.` });
    }
    if (f.ampacityA !== null && f.calculatedLoadA !== null && f.calculatedLoadA > f.ampacityA + 1e-6 && v.role !== 'service') {
      const section = v.role === 'branch' ? '210.19(A)(1)' : '215.2(A)(1)';
      push({
        ruleId: 'calculated-load',
        messageId: 'below-load',
        severity: 'violation',
        cites: cites(section),
        subject: { kind: 'conductor', id: c.id },
        data: { ampacityA: f.ampacityA, calculatedA: f.calculatedLoadA },
        message: `${describeConductor(c, f.parallelSets)}: ampacity ${formatNumber(f.ampacityA)} A is below the calculated load of ${formatNumber(f.calculatedLoadA)} A (continuous × 1.25 plus noncontinuous, ${section}).`,
      });
    }
  }

  for (const v of verdicts) {
    const f = v.facts;
    if (f.termination.kind !== 'transformer' || !f.transformer || f.transformer.primaryOcpdA === null) continue;
    const t = runRule(transformerProtection, f);
    if (t.outcome !== 'fails') continue;
    push({
      ruleId: transformerProtection.id,
      messageId: 'overprotected',
      severity: 'violation',
      cites: t.cites,
      subject: { kind: 'node', id: f.termination.nodeId! },
      related: [...deviceRefs(g, v), ...f.conductorIds.map((id): ElementRef => ({ kind: 'conductor', id }))],
      message: `Transformer ${f.transformer.label}: ${failedTexts(t).join(' ')} Fails ${t.cites.section}.`,
    });
  }

  const cycleNodes: ElementRef[] = [];
  for (let v = 0; v < g.nodes.length; v++) {
    const n = g.nodes[v]!;
    const subject: ElementRef = { kind: 'node', id: n.id };
    const ins = g.inEdges[v]!.length;
    const outs = g.outEdges[v]!.length;
    const name = `${nodeLabel(n)}${n.label ? ` (${n.id})` : ''}`;
    if (onCycle[v]) cycleNodes.push(subject);
    if (ins === 0 && outs === 0) {
      push({ ruleId: 'topology', messageId: 'isolated', severity: 'info', cites: null, subject, message: `${name} is not connected to anything.` });
      continue;
    }
    if (ins > 1) {
      push({
        ruleId: 'topology',
        messageId: 'several-supplies',
        severity: 'warning',
        cites: null,
        subject,
        related: g.inEdges[v]!.map((e) => edgeRef(g, e)),
        message: `${name} is fed from ${ins} supplies at once; Linewright judges radial systems. Show the transfer equipment, or remove all but one supply.`,
      });
    }
    if (ins === 0 && n.kind !== 'utility' && n.kind !== 'generator') {
      push({ ruleId: 'topology', messageId: 'no-source', severity: 'warning', cites: null, subject, message: `Nothing supplies ${name}; the conductors below it cannot be judged. Connect it to a source.` });
    }
    if (outs === 0 && ins > 0 && (n.kind === 'splice' || n.kind === 'bus' || n.kind === 'disconnect' || n.kind === 'breaker' || n.kind === 'fuse')) {
      push({ ruleId: 'topology', messageId: 'dangling-end', severity: 'info', cites: null, subject, message: `${name} supplies nothing; is a conductor or load missing below it?` });
    }
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

function describeConductor(c: Graph['conductors'][number], sets: number): string {
  const name = conductorName({ size: c.size, material: c.material, parallelSets: sets });
  // A label that already says the size ("500 kcmil Cu") is not followed by it again.
  if (c.label && c.label.includes(name.replace(/ AWG| kcmil/, ''))) return `Conductor ${c.label} (${c.id})`;
  return `Conductor ${c.label ? `${c.label} (${c.id})` : c.id}, ${name}`;
}

function deviceRefs(g: Graph, v: RunVerdict): ElementRef[] {
  return v.deviceNode >= 0 ? [{ kind: 'node', id: g.nodes[v.deviceNode]!.id }] : [];
}

function edgeRef(g: Graph, e: number): ElementRef {
  return e >= 0 ? { kind: 'conductor', id: g.conductors[e]!.id as ConductorId } : { kind: 'busLink', id: g.links[-e - 1]!.id };
}

