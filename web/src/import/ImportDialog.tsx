import './import.css';
import { useMemo, useState } from 'react';
import { FIELD_SPECS, cellProblemText, planFeederImport, type FeederImportPlan, type ScheduleField } from '@linewright/core';
import { layoutTopToBottom } from '../canvas/layout';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import type { CommandContext } from '../editor/commands';
import { count as plural } from '../words';
import { openImport, useImportSource, type ImportSource } from './importState';
import { useModalDialog } from '../panels/useModalDialog';

/** Rows shown in the preview table; the rest are counted. */
const PREVIEW_ROWS = 200;
const PREVIEW_FIELDS: ScheduleField[] = ['id', 'from', 'to', 'size', 'sets', 'material', 'length', 'insulation', 'deviceRating'];

/**
 * The import preview: which columns were read, every bad cell named (row, column, what it must hold,
 * the fix) with a box to correct it here, the rows as they will be read, and what the import adds.
 * Importing is one undoable edit, and the drawing is arranged top to bottom afterwards.
 */
export function ImportDialog() {
  const src = useImportSource();
  const ref = useModalDialog(src !== null);
  return (
    <dialog ref={ref} className="lw-dialog lw-import" onClose={() => openImport(null)} onCancel={() => openImport(null)} data-testid="import-dialog" aria-labelledby="import-title">
      {src && <ImportBody key={src.name + src.rows.length} src={src} />}
    </dialog>
  );
}

function ImportBody({ src }: { src: ImportSource }) {
  const ctx = useCommandContext();
  const doc = useEditorState((s) => s.doc);
  const [rows, setRows] = useState(src.rows);
  const [busy, setBusy] = useState(false);
  const plan = useMemo(() => planFeederImport(doc, rows, src.headerless ? { headerless: src.headerless } : {}), [doc, rows, src.headerless]);
  const good = plan.rows.filter((r) => r.action !== 'bad').length;
  const bad = plan.rows.length - good;
  const setCell = (row: number, col: number, value: string) =>
    setRows((rs) => rs.map((r, i) => (i === row - 1 ? Object.assign([...r], { [col]: value }) : r)));

  const apply = async () => {
    setBusy(true);
    try {
      await applyImport(ctx, plan, src.name);
    } finally {
      setBusy(false);
    }
  };

  return (
    <>
      <h2 id="import-title">Import feeder schedule: {src.name}</h2>
      {plan.fileProblems.length > 0 ? (
        <ul className="lw-import-file-problems" data-testid="import-file-problems">
          {plan.fileProblems.map((p, i) => <li key={i}>{p}</li>)}
        </ul>
      ) : (
        <>
          <p className="lw-import-columns" data-testid="import-columns">
            {plan.headerRow ? 'Columns read: ' : 'No header row: columns read in the schedule’s order: '}
            {plan.columns.map((c, i) => (
              <span key={i} className={`lw-chip${c.field ? '' : ' is-off'}`}>
                {c.header.trim() || `column ${i + 1}`}
                {c.field ? ` → ${FIELD_SPECS[c.field].name}` : ' (not read)'}
              </span>
            ))}
          </p>
          <p data-testid="import-summary">
            {plural(plan.rows.length, 'row')}: {plan.rows.filter((r) => r.action === 'add').length} to add, {plan.updated} to update, {bad} with problems.
            {' '}Adds {plural(plan.added.conductors, 'conductor')}, {plural(plan.added.equipment, 'piece of equipment', 'pieces of equipment')} and {plural(plan.added.devices, 'feeder breaker')}.
          </p>
          {plan.problems.length > 0 && (
            <section className="lw-import-problems" aria-label="Cells to fix">
              <h3>{plural(plan.problems.length, 'cell')} to fix before importing</h3>
              <ol>
                {plan.problems.map((p, i) => (
                  <li key={`${p.row}:${p.col}:${p.field}`} data-testid={`import-problem-${i}`}>
                    <span>{cellProblemText(p)}</span>
                    {p.col >= 0 && (
                      <label className="lw-import-fix">
                        Correct it here:{' '}
                        <input
                          defaultValue={p.value}
                          aria-label={`Row ${p.row}, ${p.column}`}
                          data-testid={`import-fix-${p.row}-${p.col}`}
                          onKeyDown={(e) => {
                            if (e.key === 'Enter') {
                              e.preventDefault();
                              setCell(p.row, p.col, e.currentTarget.value);
                            }
                          }}
                          onBlur={(e) => e.currentTarget.value !== p.value && setCell(p.row, p.col, e.currentTarget.value)}
                        />
                      </label>
                    )}
                  </li>
                ))}
              </ol>
            </section>
          )}
          <PreviewTable plan={plan} />
          {plan.notes.length > 0 && (
            <ul className="lw-import-notes" data-testid="import-notes">
              {plan.notes.map((n, i) => <li key={i}>{n}</li>)}
            </ul>
          )}
          <p className="lw-muted">One step: Undo takes the whole import back. The drawing is arranged top to bottom afterwards; the current drawing is kept and joined where names match.</p>
        </>
      )}
      <div className="lw-import-actions">
        <button type="button" data-testid="import-apply" disabled={busy || !plan.project || bad > 0 || good === 0} onClick={() => void apply()}>
          {busy ? 'Importing…' : `Import ${plural(good, 'row')}`}
        </button>
        {bad > 0 && good > 0 && (
          <button type="button" data-testid="import-apply-good" disabled={busy || !plan.project} onClick={() => void apply()}>
            Import the {plural(good, 'good row')}, skip {bad}
          </button>
        )}
        <button type="button" data-testid="import-cancel" onClick={() => openImport(null)}>Cancel</button>
      </div>
    </>
  );
}

function PreviewTable({ plan }: { plan: FeederImportPlan }) {
  const shown = plan.rows.slice(0, PREVIEW_ROWS);
  return (
    <div className="lw-import-preview">
      <table data-testid="import-preview">
        <thead>
          <tr>
            <th scope="col">Row</th>
            {PREVIEW_FIELDS.map((f) => <th key={f} scope="col">{FIELD_SPECS[f].name}</th>)}
            <th scope="col">Action</th>
          </tr>
        </thead>
        <tbody>
          {shown.map((r) => (
            <tr key={r.row} className={r.action === 'bad' ? 'is-bad' : undefined}>
              <td>{r.row}</td>
              {PREVIEW_FIELDS.map((f) => {
                const p = r.problems.find((q) => q.field === f);
                return (
                  <td key={f} className={p ? 'is-bad-cell' : undefined} title={p ? cellProblemText(p) : undefined}>
                    {r.cells[f] ?? ''}
                  </td>
                );
              })}
              <td>{r.action === 'bad' ? 'fix first' : r.action === 'update' ? `update ${r.conductorId}` : `add ${r.conductorId}`}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {plan.rows.length > shown.length && <p className="lw-muted">and {plan.rows.length - shown.length} more rows</p>}
    </div>
  );
}

/** Applies a plan as one undoable edit, laid out top to bottom; the current drawing is never lost. */
export async function applyImport(ctx: CommandContext, plan: FeederImportPlan, name: string): Promise<void> {
  if (!plan.project) return;
  const version = ctx.store.getState().docVersion;
  let next = plan.project;
  try {
    const pos = await layoutTopToBottom(next);
    next = { ...next, nodes: next.nodes.map((n) => (pos.has(n.id) ? { ...n, position: pos.get(n.id)! } : n)) };
  } catch (e) {
    ctx.store.notify(`The imported drawing could not be arranged (${e instanceof Error ? e.message : String(e)}); use Arrange.`, 'error');
  }
  if (ctx.store.getState().docVersion !== version) {
    ctx.store.notify('The drawing changed while the import was being prepared; nothing was imported. Import again.', 'error');
    return;
  }
  const rows = plan.rows.filter((r) => r.action !== 'bad').length;
  ctx.store.replaceDocument(`Import ${plural(rows, 'row')} from ${name}`, next);
  openImport(null);
  ctx.canvas?.fitAll();
  ctx.store.notify(`Imported ${plural(rows, 'row')} from ${name}: ${plan.added.conductors} conductors added, ${plan.updated} updated. Undo takes it back.`);
}
