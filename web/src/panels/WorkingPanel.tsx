import type { ConductorReport, Project } from '@linewright/core';
import { indexReport } from '../analysis/reportIndex';
import { VERDICT_TEXT, conductorFamily } from '../analysis/verdicts';
import { conductorLine, formatNum } from '../editor/equipment';
import { useEditorState } from '../editor/useEditor';
import { InlineBadge } from '../edges/VerdictBadge';
import { citeText } from './cite';
import { FindingCard, FixButtons } from './FindingItem';

const ROLE_TEXT: Record<ConductorReport['role'], string> = {
  service: 'service conductor',
  feeder: 'feeder',
  branch: 'branch circuit',
  'transformer-primary': 'transformer primary',
  'transformer-secondary': 'transformer secondary',
  generator: 'generator conductor',
  unknown: 'role not determined',
};

const STATUS_MARK = { pass: '✓', fail: '✗', unknown: '?' } as const;
const STATUS_WORD = { pass: 'met', fail: 'not met', unknown: 'unknown' } as const;
const OUTCOME_WORD = { holds: 'applies', fails: 'does not apply', unknown: 'cannot decide' } as const;

function useConductorReport(conductorId: string) {
  const report = useEditorState((s) => s.report);
  const stale = useEditorState((s) => s.reportVersion !== s.docVersion);
  return { report, stale, r: indexReport(report).conductor.get(conductorId) };
}

/** Verdict, one-line reason and one-click fixes: shown above the conductor's data. */
export function VerdictSummary({ conductorId }: { conductorId: string }) {
  const { report, stale, r } = useConductorReport(conductorId);
  if (!report || !r) return <p className="lw-muted" data-testid="working-verdict" data-verdict="pending">{report ? 'Not in the last check.' : 'Checking…'}</p>;
  const family = conductorFamily(report, r);
  return (
    <section className={`lw-verdict-summary${stale ? ' is-stale' : ''}`} aria-live="polite">
      <div className={`lw-verdict lw-verdict-${family}`} data-testid="working-verdict" data-verdict={r.verdict}>
        <InlineBadge family={family} />
        <strong>{VERDICT_TEXT[r.verdict]}</strong>
        {r.cites && <span className="lw-cite">{citeText(r.cites)}</span>}
      </div>
      <p className="lw-summary" data-testid="working-summary">{r.summary}</p>
      {r.fixes.length > 0 && <FixButtons fixes={r.fixes} />}
    </section>
  );
}

/** The selected conductor's working: how its verdict was reached, step by step. */
export function WorkingPanel({ conductorId }: { conductorId: string }) {
  const { report, stale, r } = useConductorReport(conductorId);
  const doc = useEditorState((s) => s.doc);
  if (!report || !r) return null;
  const findings = report.findings.filter((f) => r.findingIds.includes(f.id));
  const nameOf = (id: string) => nodeName(doc, id);
  const a = r.ampacity;
  return (
    <section className={`lw-working${stale ? ' is-stale' : ''}`} data-testid="working">
      <h3>How the check decided</h3>
      <dl className="lw-facts">
        <dt>Run</dt>
        <dd>{conductorLine({ parallelSets: r.parallelSets, size: r.size ?? undefined, material: r.material, lengthFt: r.lengthFt ?? undefined })}</dd>
        <dt>Role</dt>
        <dd>{ROLE_TEXT[r.role]}</dd>
        <dt>Supplied by</dt>
        <dd>
          {r.upstreamDevice
            ? `${r.upstreamDevice.label || r.upstreamDevice.id} (${r.upstreamDevice.ratingA === null ? 'rating not given' : `${r.upstreamDevice.ratingA} A`})`
            : r.supply.kind === 'none'
              ? 'no supply found upstream'
              : `${r.supply.kind}${r.supply.id ? `: ${nameOf(r.supply.id)}` : ''}`}
        </dd>
        {r.load && (
          <>
            <dt>Load</dt>
            <dd>{formatNum(r.load.flowingA)} A flowing · {formatNum(r.load.calculatedA)} A calculated</dd>
          </>
        )}
        {r.tapLengthFt !== null && (
          <>
            <dt>Tap length</dt>
            <dd data-testid="working-tap-length">{formatNum(r.tapLengthFt)} ft</dd>
          </>
        )}
        {r.chain.length > 1 && (
          <>
            <dt>Tap chain</dt>
            <dd>{r.chain.map((id) => conductorName(doc, id)).join(' → ')}</dd>
          </>
        )}
      </dl>

      <h4>Ampacity</h4>
      {a ? (
        <>
          <ol className="lw-steps" data-testid="ampacity-steps">
            {a.steps.map((s, i) => (
              <li key={`${s.id}-${i}`}>
                {s.text}
                {s.cites && <span className="lw-cite"> {citeText(s.cites)}</span>}
              </li>
            ))}
          </ol>
          <p className="lw-result">
            Ampacity <strong>{formatNum(a.ampacityA)} A</strong>, set by the {a.governedBy.replace(/-/g, ' ')}
            {a.smallConductorMaxOcpdA !== null && `; 240.4(D) limits its device to ${a.smallConductorMaxOcpdA} A`}.
          </p>
        </>
      ) : (
        <p className="lw-muted">Not worked out: data missing (see findings).</p>
      )}

      <h4>Rules tried</h4>
      <ul className="lw-trials" data-testid="rule-trials">
        {r.tried.map((t) => (
          <li key={t.ruleId} className={`lw-trial lw-trial-${t.outcome}`} data-rule={t.ruleId} data-outcome={t.outcome}>
            <div className="lw-trial-head">
              <span className="lw-trial-outcome">{OUTCOME_WORD[t.outcome]}</span> <strong>{t.title}</strong> <span className="lw-cite">{citeText(t.cites)}</span>
            </div>
            <ul className="lw-conditions">
              {t.conditions.map((c) => (
                <li key={c.id} className={`lw-cond lw-cond-${c.status}`}>
                  <span className="lw-cond-mark" aria-label={STATUS_WORD[c.status]}>{STATUS_MARK[c.status]}</span> {c.text}
                </li>
              ))}
            </ul>
          </li>
        ))}
      </ul>

      {findings.length > 0 && (
        <>
          <h4>Findings</h4>
          {findings.map((f) => <FindingCard key={f.id} finding={f} showFixes={false} />)}
        </>
      )}
    </section>
  );
}

function nodeName(doc: Project, id: string): string {
  const n = doc.nodes.find((x) => x.id === id);
  return n?.label || id;
}

function conductorName(doc: Project, id: string): string {
  const c = doc.conductors.find((x) => x.id === id);
  if (!c) return id;
  return c.label || `${nodeName(doc, c.from)}–${nodeName(doc, c.to)}`;
}
