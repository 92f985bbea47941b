import { takeoffTables, type TakeoffTable } from '../takeoff/tables';
import type { Takeoff } from '../takeoff/types';
import { spreadsheetCell } from './safeText';

/** Sheet names (at most 31 characters, none of []:*?/\ as XLSX requires). */
const SHEET_NAMES: Readonly<Record<TakeoffTable['id'], string>> = {
  wire: 'Wire',
  raceway: 'Raceway',
  devices: 'Devices',
  buses: 'Buses',
  transformers: 'Transformers',
  disconnects: 'Disconnects',
  terminations: 'Terminations',
  runs: 'Runs',
  notes: 'Notes',
};

/**
 * The takeoff as an XLSX workbook (exceljs, loaded only when a workbook is
 * asked for): one sheet per table, the header row frozen, numbers as numeric
 * cells, text that a spreadsheet program could take for a formula
 * neutralised, and a bold totals row.
 */
export async function takeoffWorkbook(t: Takeoff): Promise<Uint8Array> {
  const mod = await import('exceljs');
  // The package is CommonJS for Node and a UMD bundle for browsers: the namespace sits on `default` in both.
  const ExcelJS = ((mod as unknown as { default?: typeof mod }).default ?? mod) as typeof mod;
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Linewright';
  wb.title = `Takeoff: ${t.projectName}`;
  for (const table of takeoffTables(t)) {
    const ws = wb.addWorksheet(SHEET_NAMES[table.id], { views: [{ state: 'frozen', ySplit: 1 }] });
    ws.columns = table.columns.map((c) => ({
      header: c.header,
      key: c.key,
      width: Math.min(60, Math.max(c.header.length + 2, c.type === 'number' ? 10 : 14)),
      ...(c.type === 'number' ? { style: { numFmt: '#,##0.##' } } : {}),
    }));
    ws.getRow(1).font = { bold: true };
    for (const row of table.rows) ws.addRow(row.map(spreadsheetCell));
    if (table.totals) ws.addRow(table.totals.map(spreadsheetCell)).font = { bold: true };
  }
  const buffer = await wb.xlsx.writeBuffer();
  return new Uint8Array(buffer as ArrayBuffer);
}
