import { runRule } from '../rules/define';
import { transformerProtection } from '../rules/transformer-protection';
import type { VerdictContext } from './context';
import { deviceRefs } from './conductorFindings';
import { finding } from './finding';
import { failedTexts } from './summary';
import type { RunVerdict } from './classify';
import type { Citation, ElementRef, Finding } from './types';

/**
 * Stage: equipment findings: each transformer judged under Table 450.3(B)
 * from its primary run; a transformer with no primary device at all (fed
 * straight from service or generator conductors) is a finding of its own.
 */
export function equipmentFindings(ctx: VerdictContext): Finding[] {
  const out: Finding[] = [];
  const seen = new Set<RunVerdict>();
  for (const v of ctx.verdicts) {
    if (v.facts.termination.kind !== 'transformer' || !v.facts.transformer) continue;
    // Runs judged as one share their verdict: judge their transformer once.
    if (seen.has(v)) continue;
    seen.add(v);
    transformerFindingOf(ctx, v, out);
  }
  return out;
}

/** The finding of the transformer run `v` ends at (Table 450.3(B)), appended to `out`; nothing when `v` ends elsewhere or the transformer passes. */
export function transformerFindingOf(ctx: Pick<VerdictContext, 'graph' | 'edition'>, v: RunVerdict, out: Finding[]): void {
  const { graph: g, edition } = ctx;
  const cites = (section: string): Citation => ({ code: 'NEC', edition, section });
  const push = (f: Parameters<typeof finding>[0]) => out.push(finding(f));
  const f = v.facts;
  if (f.termination.kind !== 'transformer' || !f.transformer) return;
  if (v.family === 'service' || v.family === 'generator') {
    const byGenerator = v.family === 'generator';
    push({
      ruleId: transformerProtection.id,
      messageId: 'no-primary-device',
      // A generator's transformer is premises wiring; one on service conductors may be the utility's (90.2), which the drawing does not say.
      severity: byGenerator ? 'violation' : 'warning',
      cites: cites(transformerProtection.section),
      subject: { kind: 'node', id: f.termination.nodeId! },
      related: f.conductorIds.map((id): ElementRef => ({ kind: 'conductor', id })),
      message: byGenerator
        ? `Transformer ${f.transformer.label} is fed straight from generator conductors with no primary OCPD; Table 450.3(B) requires a primary device (at most ${Math.round(f.transformer.primaryFlaA * 1.25 * 100) / 100} A, 125 % of its ${Math.round(f.transformer.primaryFlaA * 100) / 100} A primary current, or 250 % with a secondary device).`
        : `Transformer ${f.transformer.label} is fed by service conductors with no primary OCPD. If it is premises wiring, Table 450.3(B) requires a primary device; a utility-owned transformer is outside the NEC (90.2). Confirm which it is.`,
    });
    return;
  }
  if (f.transformer.primaryOcpdA === null) return;
  const t = runRule(transformerProtection, f);
  if (t.outcome !== 'fails') return;
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
