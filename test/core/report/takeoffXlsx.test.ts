import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { analyze, buildTakeoff, loadProject, takeoffTables, type Project } from '@linewright/core';
import { takeoffWorkbook } from '../../../core/src/report/takeoffXlsx';
import { toTakeoffCsv } from '../../../core/src/report/takeoffCsv';
import { diagram } from '../../helpers/builder';

const samplesDir = fileURLToPath(new URL('../../../samples/', import.meta.url));
const samples = readdirSync(samplesDir).filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json');

function loadText(text: string): Project {
  const loaded = loadProject(text);
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return loaded.project;
}

async function readBack(bytes: Uint8Array): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
  return wb;
}

// The workbook is read back with the same library in its reading direction (ECMA-376 SpreadsheetML):
// every sheet, its frozen header, and the type of every cell against the table it came from.
describe.each(samples)('takeoff workbook of samples/%s', (file) => {
  it('has one sheet per table, a frozen header row, numbers as numeric cells and text as text', async () => {
    const project = loadText(readFileSync(samplesDir + file, 'utf8'));
    const takeoff = buildTakeoff(project, analyze(project));
    const tables = takeoffTables(takeoff);
    const wb = await readBack(await takeoffWorkbook(takeoff));
    expect(wb.worksheets.length).toBe(tables.length);
    tables.forEach((table, i) => {
      const ws = wb.worksheets[i]!;
      expect(ws.views[0]).toMatchObject({ state: 'frozen', ySplit: 1 });
      expect((ws.getRow(1).values as unknown[]).slice(1)).toEqual(table.columns.map((c) => c.header));
      const rows = table.totals ? [...table.rows, table.totals] : table.rows;
      expect(ws.rowCount).toBe(rows.length + 1);
      rows.forEach((row, r) => {
        row.forEach((v, c) => {
          const cell = ws.getRow(r + 2).getCell(c + 1);
          if (v === null) expect(cell.type, `${table.id} r${r} c${c}`).toBe(ExcelJS.ValueType.Null);
          else if (typeof v === 'number') {
            expect(cell.type, `${table.id} r${r} c${c}`).toBe(ExcelJS.ValueType.Number);
            expect(cell.value).toBe(v);
          } else expect(cell.type, `${table.id} r${r} c${c}`).toBe(ExcelJS.ValueType.String);
        });
      });
    });
  }, 60_000);
});

describe('spreadsheet cells that could run as formulas are neutralised (OWASP CSV injection guidance, common practice)', () => {
  const hostile = diagram({ name: '=HYPERLINK("x")' })
    .utility(480).breaker(100).conductor({ id: 'C1', label: '+SUM(A1)', size: '3', lengthFt: 50 }).load({ currentA: 80, phases: 3, label: '@cmd' }).build();
  const project = loadText(JSON.stringify(hostile));
  const takeoff = buildTakeoff(project, analyze(project));

  it('XLSX: a label starting with + is stored as text with a leading apostrophe, never as a formula', async () => {
    const wb = await readBack(await takeoffWorkbook(takeoff));
    const runs = wb.getWorksheet('Runs')!;
    const labelCol = takeoffTables(takeoff).find((t) => t.id === 'runs')!.columns.findIndex((c) => c.key === 'label') + 1;
    const cell = runs.getRow(2).getCell(labelCol);
    expect(cell.type).toBe(ExcelJS.ValueType.String);
    expect(cell.value).toBe("'+SUM(A1)");
  });

  it('CSV: the same label is written with the apostrophe; numbers stay bare', () => {
    const csv = toTakeoffCsv(takeoff);
    expect(csv).toContain("'+SUM(A1)");
    expect(csv).not.toMatch(/(^|,)\+SUM/m);
  });
});
