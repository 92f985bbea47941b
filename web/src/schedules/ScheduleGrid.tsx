import { useEffect, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { parseDelimited } from '@linewright/core';
import { parseElement, replaceElement } from '../editor/commands';
import { useCommandContext } from '../editor/useEditor';
import { PASTE_COLUMNS, openImport } from '../import/importState';
import type { Column } from './scheduleColumns';

/** Row height in px; fixed so only the rows in view are drawn (10 000 rows scroll as smoothly as 10). */
export const ROW_H = 24;
/** Rows drawn above and below the view. */
const OVERSCAN = 8;

type Sort = { key: string; dir: 1 | -1 } | null;

interface Props<R extends { id: string; alarm: boolean }> {
  name: 'conductors' | 'equipment';
  rows: R[];
  columns: Column<R>[];
  filter: string;
  /** Ids selected on the drawing, shown as selected rows. */
  selected: ReadonlySet<string>;
  onSelect(row: R): void;
}

function compare(a: string | number | null, b: string | number | null): number {
  if (a === null || a === '') return b === null || b === '' ? 0 : 1;
  if (b === null || b === '') return -1;
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return String(a).localeCompare(String(b), undefined, { numeric: true });
}

/**
 * A schedule as a spreadsheet-like table: sort by a header, filter by any text, arrows / Tab / Enter /
 * Escape as in a spreadsheet, typing over a cell edits it. Each edit goes through the same command
 * as the details panel (validated by the core schema, one undo step); a bad value stays in the cell
 * with the reason. Selecting a row selects its element on the drawing and brings it into view.
 */
export function ScheduleGrid<R extends { id: string; alarm: boolean }>({ name, rows, columns, filter, selected, onSelect }: Props<R>) {
  const ctx = useCommandContext();
  const [sort, setSort] = useState<Sort>(null);
  const [active, setActive] = useState<{ row: number; col: number }>({ row: 0, col: 0 });
  const [editing, setEditing] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [scrollTop, setScrollTop] = useState(0);
  const [height, setHeight] = useState(240);
  const body = useRef<HTMLDivElement>(null);
  const grid = useRef<HTMLDivElement>(null);

  const shown = useMemo(() => {
    const f = filter.trim().toLowerCase();
    const list = f ? rows.filter((r) => columns.some((c) => c.text(r).toLowerCase().includes(f))) : rows;
    if (!sort) return list;
    const col = columns.find((c) => c.key === sort.key)!;
    const key = (r: R) => (col.sort ? col.sort(r) : col.text(r));
    return [...list].sort((a, b) => sort.dir * compare(key(a), key(b)));
  }, [rows, columns, filter, sort]);

  useLayoutEffect(() => {
    const el = body.current;
    if (!el) return;
    const ro = new ResizeObserver(() => setHeight(el.clientHeight));
    ro.observe(el);
    setHeight(el.clientHeight);
    return () => ro.disconnect();
  }, []);

  const rowIndex = Math.min(active.row, Math.max(0, shown.length - 1));
  const current = shown[rowIndex];
  const col = columns[active.col]!;

  // The active row stays in view as it moves.
  useEffect(() => {
    const el = body.current;
    if (!el) return;
    const top = rowIndex * ROW_H;
    if (top < el.scrollTop) el.scrollTop = top;
    else if (top + ROW_H > el.scrollTop + el.clientHeight) el.scrollTop = top + ROW_H - el.clientHeight;
  }, [rowIndex]);

  const move = (row: number, c: number) => {
    const r = Math.max(0, Math.min(shown.length - 1, row));
    const cc = Math.max(0, Math.min(columns.length - 1, c));
    setActive({ row: r, col: cc });
    setError(null);
    const target = shown[r];
    // The row's element becomes the selection (and comes into view) unless it already is.
    if (target && !(selected.size === 1 && selected.has(target.id))) onSelect(target);
  };

  const commit = (raw: string): boolean => {
    if (!current || !col.edit) return true;
    const e = col.edit(current, raw);
    if (e === null) return true;
    if ('error' in e) {
      setError(e.error);
      return false;
    }
    const parsed = parseElement(e.target, e.value);
    if (!parsed.ok) {
      setError(parsed.issues.map((i) => `${i.path ? `${i.path}: ` : ''}${i.message}`).join(' '));
      return false;
    }
    replaceElement.run(ctx, { target: e.target, value: e.value, label: e.label });
    setError(null);
    return true;
  };

  const startEdit = (initial: string) => {
    if (!col.edit || !current) {
      setError(col.edit ? null : `${col.head} is not edited here${col.key === 'from' || col.key === 'to' ? ': reconnect on the drawing' : ''}.`);
      return;
    }
    setEditing(initial);
  };

  const focusGrid = () => grid.current?.focus();

  const onGridKey = (e: KeyboardEvent<HTMLDivElement>) => {
    if (editing !== null) return;
    const k = e.key;
    const page = Math.max(1, Math.floor(height / ROW_H) - 1);
    if (k === 'ArrowDown') move(rowIndex + 1, active.col);
    else if (k === 'ArrowUp') move(rowIndex - 1, active.col);
    else if (k === 'ArrowRight' || (k === 'Tab' && !e.shiftKey)) move(rowIndex, active.col + 1);
    else if (k === 'ArrowLeft' || (k === 'Tab' && e.shiftKey)) move(rowIndex, active.col - 1);
    else if (k === 'PageDown') move(rowIndex + page, active.col);
    else if (k === 'PageUp') move(rowIndex - page, active.col);
    else if (k === 'Home') move(e.ctrlKey ? 0 : rowIndex, 0);
    else if (k === 'End') move(e.ctrlKey ? shown.length - 1 : rowIndex, columns.length - 1);
    else if (k === 'Enter' || k === 'F2') startEdit(current ? col.text(current) : '');
    else if (k === 'Escape') setError(null);
    else if (k.length === 1 && !e.ctrlKey && !e.metaKey && !e.altKey) startEdit(k);
    else return;
    e.preventDefault();
    e.stopPropagation();
  };

  const onEditKey = (e: KeyboardEvent<HTMLInputElement>) => {
    e.stopPropagation();
    if (e.key === 'Enter' || e.key === 'Tab') {
      e.preventDefault();
      if (!commit(e.currentTarget.value)) return;
      setEditing(null);
      if (e.key === 'Enter') move(rowIndex + (e.shiftKey ? -1 : 1), active.col);
      else move(rowIndex, active.col + (e.shiftKey ? -1 : 1));
      focusGrid();
    } else if (e.key === 'Escape') {
      e.preventDefault();
      setEditing(null);
      setError(null);
      focusGrid();
    }
  };

  const onPaste = (e: React.ClipboardEvent<HTMLDivElement>) => {
    if (editing !== null) return;
    const text = e.clipboardData.getData('text/plain');
    if (!/[\t\n]/.test(text.trim())) return;
    // A block of cells from a spreadsheet: previewed as an import, nothing changes until it is confirmed.
    e.preventDefault();
    openImport({ name: 'rows pasted from a spreadsheet', rows: parseDelimited(text, '\t'), headerless: PASTE_COLUMNS });
  };

  const onHead = (key: string) => setSort((s) => (s && s.key === key ? (s.dir === 1 ? { key, dir: -1 } : null) : { key, dir: 1 }));
  const widths = columns.map((c) => (c.grow ? `minmax(${c.width}px, ${c.grow}fr)` : `${c.width}px`)).join(' ');
  const first = Math.max(0, Math.floor(scrollTop / ROW_H) - OVERSCAN);
  const last = Math.min(shown.length, Math.ceil((scrollTop + height) / ROW_H) + OVERSCAN);
  const activeId = `${name}-cell-${rowIndex}-${active.col}`;

  return (
    <div
      ref={grid}
      className="lw-grid"
      role="grid"
      aria-label={name === 'conductors' ? 'Conductor schedule' : 'Equipment schedule'}
      aria-rowcount={shown.length + 1}
      aria-colcount={columns.length}
      aria-activedescendant={current ? activeId : undefined}
      tabIndex={0}
      data-schedule={name}
      data-testid={`schedule-${name}`}
      onKeyDown={onGridKey}
      onPaste={onPaste}
    >
      <div className="lw-grid-head" role="row" aria-rowindex={1} style={{ gridTemplateColumns: widths }}>
        {columns.map((c) => (
          <div key={c.key} role="columnheader" aria-sort={sort?.key === c.key ? (sort.dir === 1 ? 'ascending' : 'descending') : 'none'} className={c.numeric ? 'lw-num' : undefined}>
            <button type="button" tabIndex={-1} onClick={() => onHead(c.key)} data-testid={`sort-${name}-${c.key}`}>
              {c.head}
              <span aria-hidden="true">{sort?.key === c.key ? (sort.dir === 1 ? ' ▲' : ' ▼') : ''}</span>
            </button>
          </div>
        ))}
      </div>
      <div ref={body} className="lw-grid-body" onScroll={(e) => setScrollTop(e.currentTarget.scrollTop)}>
        <div style={{ height: shown.length * ROW_H, position: 'relative' }}>
          {shown.slice(first, last).map((r, k) => {
            const i = first + k;
            const isActiveRow = i === rowIndex;
            return (
              <div
                key={r.id}
                role="row"
                aria-rowindex={i + 2}
                aria-selected={selected.has(r.id)}
                className={`lw-grid-row${selected.has(r.id) ? ' is-selected' : ''}${r.alarm ? ' is-alarm' : ''}`}
                style={{ top: i * ROW_H, gridTemplateColumns: widths }}
                data-testid={`row-${name}-${r.id}`}
              >
                {columns.map((c, j) => {
                  const on = isActiveRow && j === active.col;
                  return (
                    <div
                      key={c.key}
                      id={`${name}-cell-${i}-${j}`}
                      role="gridcell"
                      className={`${c.numeric ? 'lw-num' : ''}${on ? ' is-active' : ''}${on && error ? ' is-error' : ''}${c.edit ? '' : ' is-readonly'}`}
                      title={on && error ? error : c.text(r)}
                      data-col={c.key}
                      onMouseDown={() => move(i, j)}
                      onDoubleClick={() => startEdit(c.text(r))}
                    >
                      {on && editing !== null ? (
                        <input
                          autoFocus
                          defaultValue={editing}
                          aria-label={`${c.head} of ${r.id}`}
                          aria-invalid={error ? true : undefined}
                          data-testid="schedule-editor"
                          onKeyDown={onEditKey}
                          onBlur={(e) => {
                            if (editing !== null && commit(e.currentTarget.value)) setEditing(null);
                          }}
                        />
                      ) : (
                        c.text(r)
                      )}
                    </div>
                  );
                })}
              </div>
            );
          })}
        </div>
      </div>
      {error && (
        <p className="lw-grid-error" role="alert" data-testid="schedule-error">
          {current ? `${current.id}, ${col.head}: ` : ''}
          {error}
        </p>
      )}
    </div>
  );
}
