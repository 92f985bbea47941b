import type { Citation, ElementRef, Finding } from './types';
import { conductorName, formatNumber } from '../rules/define';
import type { Graph } from '../topology/graph';
import type { RunVerdict } from './classify';
import type { FixedContext } from './context';
import { finding, type NewFinding } from './finding';
import { failedTexts, incompleteReason, nearestTrial } from './summary';

/** Stage: the findings of each conductor, in file order: its verdict, its ampacity, its load. */
export function conductorFindings(ctx: FixedContext): Finding[] {
  const { graph: g, runs, verdicts, ampacities, edition } = ctx;
  const runFixes = ctx.fixes;
  const out: Finding[] = [];
  const cites = (section: string): Citation => ({ code: 'NEC', edition, section });
  const push = (f: NewFinding) => out.push(finding(f));

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

  return out;
}

export function describeConductor(c: Graph['conductors'][number], sets: number): string {
  const name = conductorName({ size: c.size, material: c.material, parallelSets: sets });
  // A label that already says the size ("500 kcmil Cu") is not followed by it again.
  if (c.label && c.label.includes(name.replace(/ AWG| kcmil/, ''))) return `Conductor ${c.label} (${c.id})`;
  return `Conductor ${c.label ? `${c.label} (${c.id})` : c.id}, ${name}`;
}

export function deviceRefs(g: Graph, v: RunVerdict): ElementRef[] {
  return v.deviceNode >= 0 ? [{ kind: 'node', id: g.nodes[v.deviceNode]!.id }] : [];
}
