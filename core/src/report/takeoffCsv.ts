import { takeoffTables, type TakeoffTable } from '../takeoff/tables';
import type { Takeoff } from '../takeoff/types';
import { csvField } from './csv';

/** One takeoff table as RFC 4180 CSV: a header row, the rows, the totals row; numbers stay bare numbers. */
export function takeoffTableCsv(t: TakeoffTable): string {
  const rows = [t.columns.map((c) => c.header), ...t.rows, ...(t.totals ? [t.totals] : [])];
  return rows.map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}

/** Every takeoff table in one CSV file: each starts with its title on a row of its own and ends with a blank line. */
export function toTakeoffCsv(takeoff: Takeoff): string {
  return takeoffTables(takeoff).map((t) => `${csvField(t.title)}\r\n${takeoffTableCsv(t)}`).join('\r\n');
}
