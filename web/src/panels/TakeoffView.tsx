import './takeoff.css';
import { useMemo, useState } from 'react';
import { buildTakeoff, takeoffTables, takeoffTotals, toTakeoffCsv, takeoffTableCsv, type TakeoffCell, type TakeoffTable } from '@linewright/core';
import { CAUTION } from '../analysis/coreApi';
import { fileBaseName } from '../editor/commands/saveJson';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { setOpen, useOpen } from './takeoffOpen';
import { useModalDialog } from './useModalDialog';

/*
 * The estimator's takeoff of the checked drawing: totals grouped by what is
 * bought (wire, raceway, devices, equipment, lugs), then the run schedule;
 * every table sorts by any column and shows its totals row; the whole takeoff
 * downloads as an XLSX workbook (exceljs, loaded only on that click) or CSV.
 * Open state is in takeoffOpen.ts (not document state, not in undo history); this
 * module loads on the first opening (App.tsx), so the editor's first paint never waits for it.
 */
type Sort = { col: number; dir: 1 | -1 } | null;

function compareCells(a: TakeoffCell, b: TakeoffCell): number {
  if (a === null) return b === null ? 0 : 1;
  if (b === null) return -1;
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return String(a).localeCompare(String(b), undefined, { numeric: true });
}

function SortableTable({ table }: { table: TakeoffTable }) {
  const [sort, setSort] = useState<Sort>(null);
  const rows = useMemo(() => {
    if (!sort) return table.rows;
    return [...table.rows].sort((a, b) => sort.dir * compareCells(a[sort.col]!, b[sort.col]!));
  }, [table, sort]);
  const onHead = (i: number) => setSort((s) => (s && s.col === i ? (s.dir === 1 ? { col: i, dir: -1 } : null) : { col: i, dir: 1 }));
  return (
    <table className="lw-takeoff-table" data-testid={`takeoff-table-${table.id}`}>
      <caption>{table.title}</caption>
      <thead>
        <tr>
          {table.columns.map((c, i) => (
            <th
              key={c.key}
              scope="col"
              className={c.type === 'number' ? 'lw-num' : undefined}
              aria-sort={sort?.col === i ? (sort.dir === 1 ? 'ascending' : 'descending') : 'none'}
            >
              <button type="button" onClick={() => onHead(i)} data-testid={`takeoff-sort-${table.id}-${c.key}`}>
                {c.header}
                <span aria-hidden="true">{sort?.col === i ? (sort.dir === 1 ? ' ▲' : ' ▼') : ''}</span>
              </button>
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.length === 0 && (
          <tr>
            <td colSpan={table.columns.length}>none</td>
          </tr>
        )}
        {rows.map((r, k) => (
          <tr key={k}>
            {r.map((v, i) => (
              <td key={i} className={table.columns[i]!.type === 'number' ? 'lw-num' : undefined}>
                {v ?? ''}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
      {table.totals && rows.length > 0 && (
        <tfoot>
          <tr>
            {table.totals.map((v, i) => (
              <td key={i} className={table.columns[i]!.type === 'number' ? 'lw-num' : undefined} data-testid={i === 0 ? undefined : `takeoff-total-${table.id}-${table.columns[i]!.key}`}>
                {v ?? ''}
              </td>
            ))}
          </tr>
        </tfoot>
      )}
    </table>
  );
}

const GROUPS: { title: string; ids: TakeoffTable['id'][] }[] = [
  { title: 'Wire', ids: ['wire', 'terminations'] },
  { title: 'Raceway', ids: ['raceway'] },
  { title: 'Devices and equipment', ids: ['devices', 'buses', 'transformers', 'disconnects'] },
  { title: 'Conductor and raceway schedule', ids: ['runs'] },
];

/** The takeoff dialog; mounted once in App. */
export function TakeoffView() {
  const isOpen = useOpen();
  const ctx = useCommandContext();
  const doc = useEditorState((s) => s.doc);
  const report = useEditorState((s) => s.report);
  const stale = useEditorState((s) => s.reportVersion !== s.docVersion);
  const ref = useModalDialog(isOpen);
  const [busy, setBusy] = useState(false);
  const takeoff = useMemo(() => (isOpen && report ? buildTakeoff(doc, report) : null), [isOpen, doc, report]);
  const tables = useMemo(() => (takeoff ? takeoffTables(takeoff, takeoffTotals(takeoff)) : []), [takeoff]);
  const byId = useMemo(() => new Map(tables.map((t) => [t.id, t])), [tables]);

  const base = `${fileBaseName(doc)}.takeoff`;
  const downloadXlsx = async () => {
    if (!takeoff) return;
    setBusy(true);
    try {
      // The workbook code and exceljs load only now, so opening the editor never waits for them.
      const { takeoffWorkbook } = await import('@linewright/core/xlsx');
      ctx.download(`${base}.xlsx`, 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', await takeoffWorkbook(takeoff));
    } catch (e) {
      ctx.store.notify(`The workbook could not be written: ${e instanceof Error ? e.message : String(e)}`, 'error');
    } finally {
      setBusy(false);
    }
  };
  const notes = byId.get('notes');
  const flagged = takeoff?.runs.filter((r) => r.flags.length > 0) ?? [];

  return (
    <dialog ref={ref} className="lw-dialog lw-takeoff" onClose={() => setOpen(false)} onCancel={() => setOpen(false)} data-testid="takeoff-view" aria-labelledby="takeoff-title">
      <header className="lw-takeoff-head">
        <h2 id="takeoff-title">Takeoff: {doc.project.name}</h2>
        <div className="lw-takeoff-actions">
          <button type="button" data-testid="takeoff-xlsx" disabled={!takeoff || busy} onClick={() => void downloadXlsx()}>
            {busy ? 'Writing…' : 'Download XLSX'}
          </button>
          <button type="button" data-testid="takeoff-csv" disabled={!takeoff} onClick={() => takeoff && ctx.download(`${base}.csv`, 'text/csv', toTakeoffCsv(takeoff))}>
            Download CSV
          </button>
          <button type="button" data-testid="takeoff-close" onClick={() => setOpen(false)}>
            Close
          </button>
        </div>
      </header>
      {stale && <p className="lw-takeoff-stale" data-testid="takeoff-stale">The check is updating; the takeoff follows the last finished check.</p>}
      {takeoff && (
        <div className="lw-takeoff-body">
          <p className="lw-takeoff-summary" data-testid="takeoff-summary">
            NEC {takeoff.edition} · {takeoff.runs.length} runs · makeup {takeoff.makeupFtPerTermination} ft per termination · {flagged.length} to resolve
          </p>
          {GROUPS.map((g) => (
            <section key={g.title} className="lw-takeoff-group">
              <h3>{g.title}</h3>
              {g.ids.map((id) => {
                const t = byId.get(id);
                return t ? (
                  <div key={id} className="lw-takeoff-table-wrap">
                    <SortableTable table={t} />
                    <button type="button" className="lw-link" onClick={() => ctx.download(`${base}.${id}.csv`, 'text/csv', takeoffTableCsv(t))}>
                      CSV of this table
                    </button>
                  </div>
                ) : null;
              })}
            </section>
          ))}
          {flagged.length > 0 && (
            <section className="lw-takeoff-group" data-testid="takeoff-flags">
              <h3>To resolve before pricing</h3>
              <ul>
                {flagged.flatMap((r) => r.flags.map((f, i) => <li key={`${r.conductorId}-${i}`}><strong>{r.conductorId}</strong>: {f}</li>))}
              </ul>
            </section>
          )}
          {notes && (
            <section className="lw-takeoff-group">
              <h3>Assumptions and sources</h3>
              <ul>
                {notes.rows.filter((r) => r[0] !== 'caution').map((r, i) => <li key={i}>{r[1]}</li>)}
              </ul>
            </section>
          )}
        </div>
      )}
      <p className="lw-caution-text" data-testid="takeoff-caution">{takeoff?.caution ?? CAUTION}</p>
    </dialog>
  );
}
