import { Fragment } from 'react';
import type { Finding, Fix } from '@linewright/core';
import { SEVERITY_LOOK, SEVERITY_TEXT } from '../analysis/verdicts';
import { applyFix } from '../editor/commands';
import { useCommandContext } from '../editor/useEditor';
import { citeText } from './cite';
import { IsolatedText } from './IsolatedText';

/** A severity mark: glyph (shape) + word + colour. */
export function SeverityMark({ severity }: { severity: Finding['severity'] }) {
  const look = SEVERITY_LOOK[severity];
  return (
    <span className={`lw-sev lw-sev-${severity}`} style={{ color: look.colour }}>
      <span aria-hidden="true">{look.glyph}</span> <span className="lw-sev-word">{SEVERITY_TEXT[severity]}</span>
    </span>
  );
}

export function FixButtons({ fixes }: { fixes: readonly Fix[] }) {
  const ctx = useCommandContext();
  if (fixes.length === 0) return null;
  return (
    <div className="lw-fixes">
      {fixes.map((f, i) => (
        <Fragment key={`${f.kind}-${i}`}>
          <button type="button" className="lw-fix" data-testid="fix-button" data-fix-kind={f.kind} onClick={() => applyFix.run(ctx, f)} title="Apply as one edit; Undo takes it back">
            {f.label}
          </button>
          {f.kind === 'shorten' && (
            <span className="lw-fix-note" data-testid="fix-design-note">
              A design decision, not a correction of the drawing: the run must then be built no longer than {f.maxLengthFt} ft in the field.
            </span>
          )}
        </Fragment>
      ))}
    </div>
  );
}

/** One finding as a card: severity, message, citation, fixes. */
export function FindingCard({ finding, showFixes = true }: { finding: Finding; showFixes?: boolean }) {
  return (
    <div className="lw-finding-card" data-testid="finding-card" data-rule={finding.ruleId}>
      <div className="lw-finding-head">
        <SeverityMark severity={finding.severity} />
        {finding.cites && <span className="lw-cite">{citeText(finding.cites)}</span>}
      </div>
      <div className="lw-finding-msg"><IsolatedText text={finding.message} /></div>
      {showFixes && <FixButtons fixes={finding.fixes} />}
    </div>
  );
}
