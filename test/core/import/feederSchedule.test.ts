import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  CONDUCTOR_SIZES, analyze, cellProblemText, detectDelimiter, loadProject, mapHeaders, normaliseSize, parseDelimited, planFeederImport,
  type Project,
} from '@linewright/core';

/*
 * The feeder-schedule import. Sizes are those of NEC Table 310.16 (AWG 18–4/0, kcmil 250–2000); "0"
 * for 1/0 … "0000" for 4/0 and "MCM" for kcmil are the trade's shorthand (common practice). Header
 * words are common practice (no standard fixes them). CSV quoting follows RFC 4180.
 */

const empty = (): Project => {
  const r = loadProject({ format: 'linewright-project', version: 2, project: { name: 'Import test', edition: 2023 }, nodes: [], conductors: [], busLinks: [] });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.project;
};
const demo = (): Project => {
  const r = loadProject(readFileSync(new URL('../../../samples/demo-clinic.json', import.meta.url), 'utf8'));
  if (!r.ok) throw new Error('demo does not load');
  return r.project;
};

describe('text tables (RFC 4180 CSV, tab-separated blocks)', () => {
  it('reads quoted cells with commas, doubled quotes and line breaks, CRLF rows, and drops a BOM and blank lines', () => {
    const text = '\ufeffFrom,To,Notes\r\nMSB,"LP-1, level 1","say ""hi""\nsecond line"\r\n\r\n,,\r\nMSB,LP-2,x';
    expect(parseDelimited(text)).toEqual([
      ['From', 'To', 'Notes'],
      ['MSB', 'LP-1, level 1', 'say "hi"\nsecond line'],
      ['MSB', 'LP-2', 'x'],
    ]);
  });
  it('takes a tab when the first line has one, else the more frequent of comma and semicolon', () => {
    expect(detectDelimiter('a\tb,c\n')).toBe('\t');
    expect(detectDelimiter('a;b;c,5\n')).toBe(';');
    expect(detectDelimiter('"a;b";c,d,e\n')).toBe(',');
    expect(parseDelimited('a;b\n1;2', ';')).toEqual([['a', 'b'], ['1', '2']]);
  });
});

describe('header words', () => {
  it('maps the common words and units of a feeder schedule', () => {
    const m = mapHeaders(['Feeder Tag', 'Fed From', 'Load', 'Wire Size (AWG/kcmil)', '# Sets', 'Cu/Al', 'Length (ft)', 'Insulation Type', 'Breaker (A)', 'Remarks', 'Colour']);
    expect(m.columns.map((c) => c.field)).toEqual(['id', 'from', 'to', 'size', 'sets', 'material', 'length', 'insulation', 'deviceRating', 'notes', null]);
  });
  it('reads "Load" as the equipment fed only when no To column exists', () => {
    expect(mapHeaders(['From', 'To', 'Load', 'Size']).columns.map((c) => c.field)).toEqual(['from', 'to', null, 'size']);
  });
});

describe('sizes as written on schedules', () => {
  it.each([
    ['#4/0 AWG', '4/0'], ['0000', '4/0'], ['00', '2/0'], ['500 kcmil', '500'], ['500MCM', '500'], ['12', '12'], ['3/0', '3/0'],
  ])('%s → %s', (raw, size) => {
    expect(normaliseSize(raw)).toBe(size);
    expect(CONDUCTOR_SIZES).toContain(size);
  });
});

const CSV = [
  'Tag,From,To,Size,Sets,Material,Length (ft),Insulation,Device rating,Load A',
  'F-1,MSB,LP-1,#4/0 AWG,1,Copper,120 ft,THWN2,225A,',
  'F-2,MSB,DP-2,500 kcmil,2,Al,85,XHHW-2,"400 AT/600 AF",',
  'F-3,DP-2,AHU-1,3,,cu,40,THHN,100,72',
].join('\n');

describe('planning an import into an empty drawing', () => {
  const plan = planFeederImport(empty(), parseDelimited(CSV));
  it('reads every row, with no problem', () => {
    expect(plan.fileProblems).toEqual([]);
    expect(plan.problems).toEqual([]);
    expect(plan.rows.map((r) => r.action)).toEqual(['add', 'add', 'add']);
  });
  it('makes each feeder a breaker on the supply bus (bus link) and a conductor to the equipment fed', () => {
    const p = plan.project!;
    const byLabel = (l: string) => p.nodes.find((n) => n.label === l)!;
    expect(byLabel('MSB')).toMatchObject({ kind: 'bus', busType: 'switchboard' });
    expect(byLabel('DP-2')).toMatchObject({ kind: 'bus', busType: 'panelboard' });
    expect(byLabel('LP-1')).toMatchObject({ kind: 'bus', busType: 'panelboard' });
    expect(byLabel('AHU-1')).toMatchObject({ kind: 'load', currentA: 72 });
    const f1 = p.conductors.find((c) => c.id === 'F-1')!;
    expect(f1).toMatchObject({ size: '4/0', parallelSets: 1, material: 'cu', lengthFt: 120, insulation: 'THWN-2' });
    const cb = p.nodes.find((n) => n.id === f1.from)!;
    expect(cb).toMatchObject({ kind: 'breaker', ratingA: 225 });
    expect(p.busLinks).toContainEqual(expect.objectContaining({ from: byLabel('MSB').id, to: cb.id }));
    expect(p.conductors.find((c) => c.id === 'F-2')).toMatchObject({ size: '500', parallelSets: 2, material: 'al', lengthFt: 85, insulation: 'XHHW-2' });
    expect(p.nodes.find((n) => n.id === p.conductors.find((c) => c.id === 'F-2')!.from)).toMatchObject({ ratingA: 400 });
    expect(plan.added).toEqual({ conductors: 3, equipment: 4, devices: 3, busLinks: 3 });
  });
  it('gives a drawing that loads as a project file and can be checked', () => {
    const again = loadProject(JSON.parse(JSON.stringify(plan.project)));
    expect(again.ok).toBe(true);
    const report = analyze(plan.project!);
    expect(report.conductors.map((c) => c.id).sort()).toEqual(['F-1', 'F-2', 'F-3']);
  });
});

describe('bad cells are named before anything changes', () => {
  const bad = [
    'From,To,Size,Length (ft),Breaker',
    'MSB,LP-1,4/0,120,225',
    'MSB,LP-2,5,90,200',
    'MSB,LP-3,2/0,about ninety,150',
    'MSB,LP-4,1/0,60,125',
  ].join('\n');
  const before = empty();
  const snapshot = JSON.stringify(before);
  const plan = planFeederImport(before, parseDelimited(bad));
  it('names each bad cell by sheet row and column as written, with what is expected and the fix', () => {
    expect(plan.problems.map((p) => [p.row, p.column, p.value])).toEqual([[3, 'Size', '5'], [4, 'Length (ft)', 'about ninety']]);
    // Table 310.16 has no 5 AWG.
    expect(plan.problems[0]!.expected).toMatch(/Table 310\.16/);
    expect(cellProblemText(plan.problems[1]!)).toBe('Row 4, column "Length (ft)" ("about ninety"): expected a length in feet, more than 0 and at most 20 000. Fix: write the number of feet from the supply point to the termination, e.g. 120.');
    expect(plan.rows.map((r) => r.action)).toEqual(['add', 'bad', 'bad', 'add']);
  });
  it('keeps the schema\'s own words where it has them (the 20 000 ft limit)', () => {
    const p = planFeederImport(empty(), parseDelimited('From,To,Size,Length\nA,B,12,25000'));
    expect(p.problems[0]).toMatchObject({ row: 2, column: 'Length', field: 'length' });
    expect(p.problems[0]!.expected).toMatch(/check the units/);
  });
  it('leaves the current drawing untouched; the planned drawing holds only the good rows', () => {
    expect(JSON.stringify(before)).toBe(snapshot);
    expect(plan.project!.conductors).toHaveLength(2);
  });
  it('says which required column is missing, and the words that name it', () => {
    const p = planFeederImport(empty(), parseDelimited('From,To,Length\nA,B,10'));
    expect(p.project).toBeNull();
    expect(p.fileProblems[0]).toMatch(/No column for Size \(e\.g\. "size", "conductor size", "wire size"\)/);
  });
  it('refuses a load figure for equipment that feeds others, and From equal to To', () => {
    const p = planFeederImport(empty(), parseDelimited('From,To,Size,Load A\nMSB,LP-1,4/0,80\nLP-1,LP-1A,2,\nX,x,12,'));
    expect(p.problems.map((q) => [q.row, q.field])).toEqual([[2, 'loadA'], [4, 'to']]);
  });
});

describe('importing into an existing drawing', () => {
  it('joins rows to equipment found by id or name, and updates a conductor named by its id (ends unchanged)', () => {
    const doc = demo();
    const plan = planFeederImport(doc, parseDelimited('Id,From,To,Size,Sets\nF-R2,Level 1 riser tap box,TB-2,500,1\nF-NEW,MSB-1,New panel,3/0,1'));
    expect(plan.problems).toEqual([]);
    const p = plan.project!;
    expect(p.conductors.find((c) => c.id === 'F-R2')).toMatchObject({ size: '500', from: 'TB-1', to: 'TB-2', lengthFt: 14 });
    expect(p.conductors.find((c) => c.id === 'F-NEW')).toMatchObject({ from: 'MSB-1', size: '3/0' });
    expect(plan.updated).toBe(1);
    expect(p.nodes).toHaveLength(doc.nodes.length + 1);
    // Nothing else of the drawing is lost.
    expect(p.conductors).toHaveLength(doc.conductors.length + 1);
  });
  it('will not reconnect a conductor: a different end is a problem with the drawing\'s end in the fix', () => {
    const plan = planFeederImport(demo(), parseDelimited('Id,From,To,Size\nF-R2,TB-1,TB-3,500'));
    expect(plan.problems).toHaveLength(1);
    expect(plan.problems[0]).toMatchObject({ row: 2, field: 'to' });
    expect(plan.problems[0]!.fix).toMatch(/Level 2 riser tap box/);
  });
  it('refuses an id another element uses, and an id used twice in the file', () => {
    const plan = planFeederImport(demo(), parseDelimited('Id,From,To,Size\nMSB-1,TB-1,X1,12\nQ,TB-1,X2,12\nQ,TB-1,X3,12'));
    expect(plan.problems.map((q) => [q.row, q.field])).toEqual([[2, 'id'], [4, 'id']]);
  });
});

describe('a block pasted without a header row', () => {
  it('reads columns in the schedule\'s order', () => {
    const rows = Array.from({ length: 10 }, (_, i) => `MSB\tP-${i + 1}\t${i % 2 ? '1/0' : '2'}\t1\tcu\t${50 + i}\tTHHN\t${i % 2 ? 150 : 100}`).join('\n');
    const plan = planFeederImport(empty(), parseDelimited(rows), { headerless: ['from', 'to', 'size', 'sets', 'material', 'length', 'insulation', 'deviceRating'] });
    expect(plan.headerRow).toBe(false);
    expect(plan.problems).toEqual([]);
    expect(plan.project!.conductors).toHaveLength(10);
    expect(plan.rows[0]!.row).toBe(1);
    expect(plan.project!.conductors[9]).toMatchObject({ size: '1/0', lengthFt: 59 });
  });
});

describe('a workbook (XLSX, ECMA-376) read back with exceljs', () => {
  it('reads the first sheet with text, numbers as shown and a formula\'s result', async () => {
    const mod = await import('exceljs');
    const ExcelJS = ((mod as unknown as { default?: typeof mod }).default ?? mod) as typeof mod;
    const wb = new ExcelJS.Workbook();
    wb.addWorksheet('Empty');
    const ws = wb.addWorksheet('Feeders');
    ws.addRow(['From', 'To', 'Size', 'Sets', 'Length (ft)', 'Breaker']);
    ws.addRow(['MSB', 'LP-1', '4/0', 1, 120, 225]);
    ws.addRow(['MSB', 'LP-2', '3/0', 1, { formula: '40*2', result: 80 }, 200]);
    const bytes = new Uint8Array(await wb.xlsx.writeBuffer());
    const { readXlsxRows } = await import('@linewright/core/import-xlsx');
    const sheet = await readXlsxRows(bytes);
    expect(sheet.sheetName).toBe('Feeders');
    expect(sheet.rows).toEqual([
      ['From', 'To', 'Size', 'Sets', 'Length (ft)', 'Breaker'],
      ['MSB', 'LP-1', '4/0', '1', '120', '225'],
      ['MSB', 'LP-2', '3/0', '1', '80', '200'],
    ]);
    const plan = planFeederImport(empty(), sheet.rows);
    expect(plan.problems).toEqual([]);
    expect(plan.project!.conductors.map((c) => c.lengthFt)).toEqual([120, 80]);
  });
});
