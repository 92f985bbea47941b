import './schedules.css';
import { memo, useMemo, useRef, useState } from 'react';
import { useCommandContext, useEditorState } from '../editor/useEditor';
import { openImport, readScheduleFile } from '../import/importState';
import { count as plural, thousands } from '../words';
import { CONDUCTOR_COLUMNS, EQUIPMENT_COLUMNS, conductorRows, equipmentRows, type ConductorRow, type EquipmentRow } from './scheduleColumns';
import { ScheduleGrid } from './ScheduleGrid';

type Tab = 'conductors' | 'equipment' | null;

/**
 * The schedules under the drawing: a bar that is always there (conductor schedule, equipment schedule,
 * import of a feeder schedule) and, when a schedule is open, its table. The tables edit the drawing
 * through the same commands as the details panel.
 */
export const Schedules = memo(function Schedules() {
  const ctx = useCommandContext();
  const doc = useEditorState((s) => s.doc);
  const report = useEditorState((s) => s.report);
  const sel = useEditorState((s) => s.view.selection);
  const [tab, setTab] = useState<Tab>(null);
  const [filter, setFilter] = useState('');
  const file = useRef<HTMLInputElement>(null);
  const cRows = useMemo(() => (tab === 'conductors' ? conductorRows(doc, report) : []), [tab, doc, report]);
  const eRows = useMemo(() => (tab === 'equipment' ? equipmentRows(doc, report) : []), [tab, doc, report]);
  const selected = useMemo(() => new Set<string>(tab === 'conductors' ? sel.conductors : sel.nodes), [tab, sel]);

  const pick = async (f: File) => {
    try {
      openImport({ name: f.name, rows: await readScheduleFile(f) });
    } catch (e) {
      ctx.store.notify(`${f.name} could not be read: ${e instanceof Error ? e.message : String(e)}`, 'error');
    }
  };
  const selectConductor = (r: ConductorRow) => {
    ctx.store.setSelection({ nodes: [], conductors: [r.id], busLinks: [] });
    ctx.store.requestFrame([r.c.from, r.c.to]);
  };
  const selectNode = (r: EquipmentRow) => {
    ctx.store.setSelection({ nodes: [r.id], conductors: [], busLinks: [] });
    ctx.store.requestFrame([r.id]);
  };
  const toggle = (t: Exclude<Tab, null>) => setTab((cur) => (cur === t ? null : t));

  return (
    <section className={`lw-schedules${tab ? ' is-open' : ''}`} aria-label="Schedules" data-testid="schedules">
      <div className="lw-schedules-bar" role="toolbar" aria-label="Schedules">
        <button type="button" aria-pressed={tab === 'conductors'} onClick={() => toggle('conductors')} data-testid="schedule-tab-conductors">
          Conductor schedule ({thousands(doc.conductors.length)})
        </button>
        <button type="button" aria-pressed={tab === 'equipment'} onClick={() => toggle('equipment')} data-testid="schedule-tab-equipment">
          Equipment schedule ({thousands(doc.nodes.length)})
        </button>
        <button type="button" onClick={() => file.current?.click()} data-testid="cmd-import-schedule" title="Import a feeder schedule from a CSV or XLSX file: from, to, size, sets, material, length, insulation, device rating. You see every row before anything changes.">
          Import schedule…
        </button>
        <input
          ref={file}
          type="file"
          hidden
          accept=".csv,.tsv,.txt,.xlsx,text/csv,text/tab-separated-values,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
          data-testid="import-file-input"
          onChange={(e) => {
            const f = e.target.files?.[0];
            e.target.value = '';
            if (f) void pick(f);
          }}
        />
        {tab && (
          <>
            <input type="search" className="lw-schedules-filter" placeholder="Filter rows" aria-label="Filter rows" value={filter} onChange={(e) => setFilter(e.target.value)} data-testid="schedule-filter" />
            <span className="lw-muted lw-schedules-hint">
              Arrows move · Enter or typing edits · Tab next cell · Esc cancels · paste rows from a spreadsheet to import them ·{' '}
              {plural(tab === 'conductors' ? cRows.length : eRows.length, 'row')}
            </span>
          </>
        )}
      </div>
      {tab === 'conductors' && <ScheduleGrid name="conductors" rows={cRows} columns={CONDUCTOR_COLUMNS} filter={filter} selected={selected} onSelect={selectConductor} />}
      {tab === 'equipment' && <ScheduleGrid name="equipment" rows={eRows} columns={EQUIPMENT_COLUMNS} filter={filter} selected={selected} onSelect={selectNode} />}
    </section>
  );
});
