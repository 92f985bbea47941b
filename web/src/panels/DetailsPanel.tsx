import { DropWorkingPanel, FaultWorkingPanel } from '../studies/StudyWorking';
import { SizingAssistant } from '../sizing/SizingAssistant';
import { indexReport } from '../analysis/reportIndex';
import { connect, deleteSelection } from '../editor/commands';
import { kindSpec } from '../editor/equipment';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { BusLinkTools, ConductorTools } from './ConnectionTools';
import { ElementForm } from './ElementForm';
import { MultiForm, sharedFields } from './MultiForm';
import { count as plural } from '../words';
import { BUS_LINK_FIELDS, CONDUCTOR_FIELDS, NODE_FIELDS, PROJECT_FIELDS } from './fields';
import { FindingCard } from './FindingItem';
import { VerdictSummary, WorkingPanel } from './WorkingPanel';

/** The right-hand panel: edits whatever is selected, or the project when nothing is. */
export function DetailsPanel() {
  const ctx = useCommandContext();
  const sel = useEditorState((s) => s.view.selection);
  const doc = useEditorState((s) => s.doc);
  const report = useEditorState((s) => s.report);
  const count = sel.nodes.length + sel.conductors.length + sel.busLinks.length;

  if (count === 0) {
    return (
      <div className="lw-details" data-testid="details">
        <h2>Project</h2>
        <ElementForm key="project" target={{ kind: 'project' }} value={doc.project} fields={PROJECT_FIELDS} />
        <p className="lw-muted">
          {plural(doc.nodes.length, 'piece of equipment', 'pieces of equipment')} · {plural(doc.conductors.length, 'conductor')} · {plural(doc.busLinks.length, 'bus link')}. Select something on the drawing to edit it.
        </p>
        {report && report.assumptions.length > 0 && (
          <>
            <h4>Assumptions of the check</h4>
            <ul className="lw-assumptions">{report.assumptions.map((a, i) => <li key={i}>{a}</li>)}</ul>
          </>
        )}
      </div>
    );
  }
  if (count > 1) {
    // Two pieces of equipment: offer to connect them, supply side being the one drawn higher.
    const pair = sel.nodes.length === 2 && count === 2 ? sel.nodes.map((id) => doc.nodes.find((n) => n.id === id)!).filter(Boolean) : [];
    const [upper, lower] = pair.length === 2 ? [...pair].sort((a, b) => (a.position?.y ?? 0) - (b.position?.y ?? 0)) : [];
    const arg = upper && lower ? { from: upper.id, to: lower.id } : null;
    return (
      <div className="lw-details" data-testid="details">
        <h2>{count} elements selected</h2>
        <p className="lw-muted">
          {plural(sel.nodes.length, 'piece of equipment', 'pieces of equipment')}, {plural(sel.conductors.length, 'conductor')}, {plural(sel.busLinks.length, 'bus link')}. Drag to move them together; Ctrl+C copies them.
        </p>
        {arg && upper && lower && (
          <div className="lw-connect-pair">
            <p>
              Connect {upper.label || upper.id} (supply side) to {lower.label || lower.id}:
            </p>
            <button type="button" data-testid="connect-pair-conductor" disabled={!connect.canRun(ctx, { ...arg, as: 'conductor' })} onClick={() => connect.run(ctx, { ...arg, as: 'conductor' })}>
              with a conductor
            </button>{' '}
            <button type="button" data-testid="connect-pair-buslink" disabled={!connect.canRun(ctx, { ...arg, as: 'busLink' })} onClick={() => connect.run(ctx, { ...arg, as: 'busLink' })}>
              with a bus link
            </button>
          </div>
        )}
        {sel.conductors.length === count && (
          <>
            <h4>Fields the {count} conductors share</h4>
            <MultiForm
              what="conductors"
              items={sel.conductors.flatMap((id) => doc.conductors.filter((c) => c.id === id)).map((c) => ({ target: { kind: 'conductor' as const, id: c.id }, value: c }))}
              fields={sharedFields([CONDUCTOR_FIELDS])}
            />
          </>
        )}
        {sel.nodes.length === count && (() => {
          const nodes = sel.nodes.flatMap((id) => doc.nodes.filter((n) => n.id === id));
          return (
            <>
              <h4>Fields the {count} pieces of equipment share</h4>
              <MultiForm
                what="pieces of equipment"
                items={nodes.map((n) => ({ target: { kind: 'node' as const, id: n.id }, value: n }))}
                fields={sharedFields(nodes.map((n) => NODE_FIELDS[n.kind]))}
              />
            </>
          );
        })()}
        <p>
          <button type="button" onClick={() => deleteSelection.run(ctx)}>Delete selected</button>
        </p>
      </div>
    );
  }
  const idx = indexReport(report);
  if (sel.nodes.length === 1) {
    const n = doc.nodes.find((x) => x.id === sel.nodes[0]);
    if (!n) return null;
    const findings = (idx.findingsByElement.get(n.id) ?? []).filter((f) => f.subject.kind === 'node' && f.subject.id === n.id);
    return (
      <div className="lw-details" data-testid="details">
        <h2>{kindSpec(n.kind).title}</h2>
        <ElementForm key={`n:${n.id}`} target={{ kind: 'node', id: n.id }} value={n} fields={NODE_FIELDS[n.kind]} />
        <FaultWorkingPanel nodeId={n.id} />
        {findings.length > 0 && (
          <>
            <h4>Findings</h4>
            {findings.map((f) => <FindingCard key={f.id} finding={f} />)}
          </>
        )}
      </div>
    );
  }
  if (sel.conductors.length === 1) {
    const c = doc.conductors.find((x) => x.id === sel.conductors[0]);
    if (!c) return null;
    const from = doc.nodes.find((x) => x.id === c.from);
    const to = doc.nodes.find((x) => x.id === c.to);
    return (
      <div className="lw-details" data-testid="details">
        <h2>Conductor</h2>
        <p className="lw-muted">
          Runs from the {from ? kindSpec(from.kind).ports.out : 'load'} side of {from?.label || c.from} to the {to ? kindSpec(to.kind).ports.in : 'line'} side of{' '}
          {to?.label || c.to}.
        </p>
        <VerdictSummary conductorId={c.id} />
        <ElementForm key={`c:${c.id}`} target={{ kind: 'conductor', id: c.id }} value={c} fields={CONDUCTOR_FIELDS} />
        <ConductorTools key={`t:${c.id}:${c.lengthFt ?? ''}`} c={c} />
        <SizingAssistant conductorId={c.id} />
        <WorkingPanel conductorId={c.id} />
        <DropWorkingPanel conductorId={c.id} />
      </div>
    );
  }
  const b = doc.busLinks.find((x) => x.id === sel.busLinks[0]);
  if (!b) return null;
  return (
    <div className="lw-details" data-testid="details">
      <h2>Bus link</h2>
      <p className="lw-muted">
        Inside equipment, no length: {doc.nodes.find((x) => x.id === b.from)?.label || b.from} → {doc.nodes.find((x) => x.id === b.to)?.label || b.to}
      </p>
      <ElementForm key={`b:${b.id}`} target={{ kind: 'busLink', id: b.id }} value={b} fields={BUS_LINK_FIELDS} />
      <BusLinkTools id={b.id} />
    </div>
  );
}
