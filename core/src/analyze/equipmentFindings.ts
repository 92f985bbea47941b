import { runRule } from '../rules/define';
import { transformerProtection } from '../rules/transformer-protection';
import type { VerdictContext } from './context';
import { deviceRefs } from './conductorFindings';
import { finding } from './finding';
import { failedTexts } from './summary';
import type { ElementRef, Finding } from './types';

/** Stage: equipment findings: each transformer judged under Table 450.3(B) from its primary run. */
export function equipmentFindings(ctx: VerdictContext): Finding[] {
  const { graph: g, verdicts } = ctx;
  const out: Finding[] = [];
  const push = (f: Parameters<typeof finding>[0]) => out.push(finding(f));
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

  return out;
}
