/**
 * The cells of a workbook's first sheet that holds anything, as text, for the feeder-schedule import.
 * exceljs is loaded only when a workbook is read, so opening the editor never waits for it.
 */

/** Most rows read from a sheet; a schedule is far smaller, a bigger sheet is not a schedule. */
export const MAX_SHEET_ROWS = 100_000;

export interface SheetRows {
  sheetName: string;
  rows: string[][];
}

export async function readXlsxRows(bytes: Uint8Array | ArrayBuffer): Promise<SheetRows> {
  const mod = await import('exceljs');
  // The package is CommonJS for Node and a UMD bundle for browsers: the namespace sits on `default` in both.
  const ExcelJS = ((mod as unknown as { default?: typeof mod }).default ?? mod) as typeof mod;
  const wb = new ExcelJS.Workbook();
  const buf = bytes instanceof Uint8Array ? bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) : bytes;
  await wb.xlsx.load(buf as ArrayBuffer);
  const ws = wb.worksheets.find((w) => w.actualRowCount > 0);
  if (!ws) return { sheetName: '', rows: [] };
  const rows: string[][] = [];
  const last = Math.min(ws.rowCount, MAX_SHEET_ROWS);
  for (let r = 1; r <= last; r++) {
    const row = ws.getRow(r);
    const cells: string[] = [];
    for (let c = 1; c <= row.cellCount; c++) {
      // `text` is what the sheet shows: a formula's result, rich text joined, a number as formatted.
      const cell = row.getCell(c);
      cells.push(cell.value === null || cell.value === undefined ? '' : String(cell.text ?? ''));
    }
    rows.push(cells);
  }
  return { sheetName: ws.name, rows };
}
