import { VERDICT_LABELS, type ElementRef, type Finding, type Fix, type RuleTrial } from './types';
import { conductorName, formatNumber } from '../rules/define';
import { cite } from '../tables/citations';
import { calculatedLoadFails, calculatedLoadTrial } from './trials';
import type { Graph } from '../topology/graph';
import type { RunVerdict } from './classify';
import type { RunFacts } from '../rules/facts';
import type { FixedContext } from './context';
import { finding, type NewFinding } from './finding';
import { failedTexts, incompleteReason, nearestTrial } from './summary';

/**
 * Stage: the findings of each conductor, in file order: its ampacity, then
 * its run's verdict and load. A run of several segments gets one finding,
 * on its first conductor, naming the others as related.
 */
export function conductorFindings(ctx: FixedContext, start?: Int32Array): Finding[] {
  const out: Finding[] = [];
  const n = ctx.graph.conductors.length;
  for (let ci = 0; ci < n; ci++) {
    if (start) start[ci] = out.length;
    conductorFindingsOf(ctx, ci, out);
  }
  if (start) start[n] = out.length;
  return out;
}

/** The findings of conductor `ci`, appended to `out`: its ampacity, then (on a run's first conductor) the run's. */
export function conductorFindingsOf(ctx: FixedContext, ci: number, out: Finding[]): void {
  const { graph: g, runs, verdicts, ampacities, edition } = ctx;
  const c = g.conductors[ci]!;
  const v = verdicts[runs.runOf[ci]!]!;
  const f = v.facts;
  const amp = ampacities[ci]!;
  if (amp.problem) {
    // The code says "shall" for parallel sets (310.10(G)) and for the insulation's temperature (310.14(A)(3)): violations; a missing fact is a warning.
    const field = amp.problem.field;
    const shall = field === 'parallelSets' ? '310.10(G)' : field === 'ambientC' ? '310.14(A)(3)' : null;
    out.push(finding({ ruleId: 'ampacity', messageId: `no-ampacity-${field}`, severity: shall ? 'violation' : 'warning', cites: cite(shall ?? '310.16', edition), subject: { kind: 'conductor', id: c.id }, message: `${describeConductor(c, c.parallelSets)}: ${amp.problem.message}` }));
  }
  // The run's own findings once, on its first conductor.
  if (f.conductorIds[0] !== c.id) return;
  runFindings(ctx, c, v, ctx.fixes[runs.runOf[ci]!]!, out);
}

/** A run's finding: on its first conductor, naming the run's other segments first among the related elements. */
function pushRunFinding(out: Finding[], f: RunFacts, x: NewFinding): void {
  const others: ElementRef[] = [];
  for (let i = 1; i < f.conductorIds.length; i++) others.push({ kind: 'conductor', id: f.conductorIds[i]! });
  out.push(finding({ ...x, related: [...others, ...(x.related ?? [])] }));
}

/** The findings of run verdict `v`, on its first conductor `c`. No closure is made per run: this runs once per run of a large drawing. */
function runFindings(ctx: FixedContext, c: Graph['conductors'][number], v: RunVerdict, fixes: Fix[], out: Finding[]): void {
  const { graph: g, edition } = ctx;
  const f = v.facts;
  switch (v.verdict) {
    case 'unprotected': {
      if (f.suppliedFrom) {
        pushRunFinding(out, f, {
          ruleId: 'tap-from-tap',
          messageId: 'fed-from-unprotected',
          severity: 'violation',
          cites: cite('240.21', edition),
          subject: { kind: 'conductor', id: c.id },
          related: [...f.suppliedFrom.conductorIds.map((id): ElementRef => ({ kind: 'conductor', id })), ...deviceRefs(g, v)],
          fixes,
          message: `${describeRun(c, f)} is fed from unprotected conductor ${f.suppliedFrom.conductorIds.join(' → ')} (${VERDICT_LABELS[f.suppliedFrom.verdict]}): no OCPD that meets 240.4 protects it. Correct that conductor, or supply this one through an OCPD that protects it.`,
        });
        break;
      }
      const n = nearestTrial(v.tried);
      const R = f.supplyOcpdA === null ? '' : `, fed by the ${formatNumber(f.supplyOcpdA)} A device ahead`;
      pushRunFinding(out, f, {
        ruleId: n?.ruleId ?? 'protected',
        messageId: 'no-rule-fits',
        severity: 'violation',
        cites: n?.cites ?? cite('240.4', edition),
        subject: { kind: 'conductor', id: c.id },
        related: deviceRefs(g, v),
        fixes,
        data: { ampacityA: f.ampacityA ?? '?', deviceA: f.supplyOcpdA ?? '?' },
        message: `${describeRun(c, f)}, ${f.ampacityA === null ? '?' : formatNumber(f.ampacityA)} A${R}: no rule of NEC ${edition} makes it acceptable.${n ? ` Nearest is ${n.cites.section} (${n.title.toLowerCase()}), which fails: ${failedTexts(n).join(' ')}` : ''}`,
      });
      break;
    }
    case 'tap-from-tap':
      pushRunFinding(out, f, {
        ruleId: 'tap-from-tap',
        messageId: 'supply',
        severity: 'violation',
        cites: cite('240.21', edition),
        subject: { kind: 'conductor', id: c.id },
        related: [...(f.suppliedFrom?.conductorIds ?? []).map((id): ElementRef => ({ kind: 'conductor', id })), ...deviceRefs(g, v)],
        fixes,
        message: `${describeRun(c, f)} is tapped from ${f.suppliedFrom?.conductorIds.join(' → ') ?? '?'}, which is itself a tap or transformer secondary; a conductor supplied under 240.21 may supply another only through an OCPD that meets 240.4.`,
      });
      break;
    case 'incomplete':
      if (v.supply.kind === 'run' || v.supply.kind === 'ocpd' || v.supply.kind === 'transformer' || v.supply.kind === 'utility' || v.supply.kind === 'generator') {
        // Fed through a known device but without a size: what it supplies at equipment is judged on as if it were protected.
        const note = v.family === 'fed-by-ocpd' && f.size === null && v.deviceNode >= 0 ? ' What it supplies through equipment is judged against the device ahead of it, as if it were protected.' : '';
        pushRunFinding(out, f, { ruleId: 'incomplete', messageId: 'missing-data', severity: 'warning', cites: null, subject: { kind: 'conductor', id: c.id }, related: deviceRefs(g, v), message: `${describeRun(c, f)}: no verdict yet; ${incompleteReason(v)}.${note}` });
      }
      break;
    case 'protected-next-size':
      pushRunFinding(out, f, {
        ruleId: 'protected-next-size',
        messageId: 'round-up-used',
        severity: 'info',
        cites: cite('240.4(B)', edition),
        subject: { kind: 'conductor', id: c.id },
        related: deviceRefs(g, v),
        message: `${describeRun(c, f)}: the ${formatNumber(f.supplyOcpdA ?? 0)} A device is the next standard rating above its ${formatNumber(f.ampacityA ?? 0)} A ampacity (240.4(B)); confirm the circuit is not a multioutlet branch circuit for cord-and-plug loads.`,
      });
      break;
    default:
      break;
  }
  for (let i = 0; v.rule && i < v.tried.length; i++) {
    const t = v.tried[i]!;
    // The rule first: the trials after the one that holds are made only when read (analyze/trials.ts).
    if (t.ruleId !== v.rule.id || t.outcome !== 'holds') continue;
    if (hasNeedsAhj(t)) {
      pushRunFinding(out, f, {
        ruleId: t.ruleId,
        messageId: 'other-approved-means',
        severity: 'needs-ahj',
        cites: t.cites,
        subject: { kind: 'conductor', id: c.id },
        message: `${describeRun(c, f)}: meets ${t.cites.section} only if the AHJ accepts its protection from physical damage by "other approved means".`,
      });
    }
  }
  // By family: a service without a size is incomplete, yet a condition that fails whatever the size is still reported.
  if ((v.family === 'service' || v.family === 'generator') && v.tried[0]?.outcome === 'fails') {
    const t = v.tried[0];
    // More than six service disconnects is a finding of its own (230.71), apart from the conductors' protection.
    const tooMany = t.conditions.find((x) => x.id === 'disconnects' && x.status === 'fail');
    if (tooMany) pushRunFinding(out, f, { ruleId: t.ruleId, messageId: 'too-many-disconnects', severity: 'violation', cites: cite('230.71', edition), subject: { kind: 'conductor', id: c.id }, message: `${describeRun(c, f)}: ${tooMany.text} Fails 230.71.` });
    const rest = t.conditions.filter((x) => x.status === 'fail' && x !== tooMany).map((x) => x.text);
    if (rest.length > 0) pushRunFinding(out, f, { ruleId: t.ruleId, messageId: 'fails', severity: 'violation', cites: t.cites, subject: { kind: 'conductor', id: c.id }, message: `${describeRun(c, f)}: ${rest.join(' ')} Fails ${t.cites.section}.` });
  }
  // 210.19(A)(1), 215.2(A)(1), 230.42(A): both halves; a motor or HVAC circuit is sized by its own article (430.22, 440.35).
  if (c.id === f.conductorIds[0] && sizedByCalculatedLoad(v) && calculatedLoadFails(f)) {
    const t = calculatedLoadTrial(f);
    const section = v.role === 'branch' ? '210.19(A)(1)' : v.role === 'service' ? '230.42(A)' : '215.2(A)(1)';
    for (const cond of t.conditions) {
      if (cond.status !== 'fail') continue;
      const part = `${section}(${cond.id === 'continuous' ? 'a' : 'b'})`;
      pushRunFinding(out, f, {
        ruleId: 'calculated-load',
        messageId: cond.id === 'continuous' ? 'below-calculated-load' : 'below-load',
        severity: 'violation',
        cites: cite(part, edition),
        subject: { kind: 'conductor', id: c.id },
        data: cond.data,
        message: `${describeRun(c, f)}: ${cond.text.replace(/\.$/, '')} (${part}).`,
      });
    }
  }
}

function hasNeedsAhj(t: RuleTrial): boolean {
  for (const cond of t.conditions) if (cond.needsAhj) return true;
  return false;
}

/** 210.19(A)(1), 215.2(A)(1), 230.42(A) apply to the run: all but a motor or HVAC branch circuit (sized by 430.22, 440.35). */
export function sizedByCalculatedLoad(v: Pick<RunVerdict, 'family' | 'role' | 'facts'>): boolean {
  return !(v.family === 'fed-by-ocpd' && (v.facts.motor || v.facts.hvac) && v.role === 'branch');
}

/** The run as a finding names it: the conductor, or for a run of several segments all of them and the weakest size. */
function describeRun(c: Graph['conductors'][number], f: RunFacts): string {
  if (f.conductorIds.length === 1) return describeConductor(c, f.parallelSets);
  return `Run ${f.conductorIds.join(' → ')} (${f.conductorIds.length} segments, judged as one on its weakest, ${conductorName(f)})`;
}

export function describeConductor(c: Graph['conductors'][number], sets: number): string {
  const name = conductorName({ size: c.size ?? null, material: c.material, parallelSets: sets });
  // A label that already says the size ("500 kcmil Cu") is not followed by it again.
  if (c.label && c.label.includes(name.replace(/ AWG| kcmil/, ''))) return `Conductor ${c.label} (${c.id})`;
  return `Conductor ${c.label ? `${c.label} (${c.id})` : c.id}, ${name}`;
}

export function deviceRefs(g: Graph, v: RunVerdict): ElementRef[] {
  return v.deviceNode >= 0 ? [{ kind: 'node', id: g.nodes[v.deviceNode]!.id }] : [];
}
