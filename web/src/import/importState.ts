import { uiValue } from '../editor/uiValue';
import { parseDelimited, type ScheduleField } from '@linewright/core';

/**
 * What the import preview shows: the rows of a file or a pasted block. View state of its own (not
 * document state, not in undo history): nothing in the drawing changes until the user imports.
 */
export interface ImportSource {
  /** File name, or what was pasted. */
  name: string;
  /** The table as read, blank lines included, so row numbers match the sheet. */
  rows: string[][];
  /** Column order for a block without a header row (a paste into the schedule). */
  headerless?: readonly ScheduleField[];
}

const source = uiValue<ImportSource | null>(null);
/** Opens the import preview on a table read from a file or a paste; null closes it. */
export const openImport = source.set;
export const useImportSource = source.use;

/** The conductor schedule's columns, in order: how a block pasted without headers is read. */
export const PASTE_COLUMNS: readonly ScheduleField[] = ['from', 'to', 'size', 'sets', 'material', 'length', 'insulation', 'deviceRating'];

/** Reads a CSV, tab-separated text or XLSX file into rows; exceljs loads only for a workbook. */
export async function readScheduleFile(file: File): Promise<string[][]> {
  if (/\.xlsx$/i.test(file.name)) {
    const { readXlsxRows } = await import('@linewright/core/import-xlsx');
    return (await readXlsxRows(await file.arrayBuffer())).rows;
  }
  if (/\.xls$/i.test(file.name)) throw new Error('This is an older .xls workbook; save it as .xlsx or CSV from your spreadsheet program and import that.');
  return parseDelimited(await file.text());
}
