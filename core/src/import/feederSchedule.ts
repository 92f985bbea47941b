import type { z } from 'zod';
import {
  INSULATIONS, breakerNode, conductor, loadNode, project as projectSchema,
  type BusLink, type Conductor, type EquipmentNode, type Project,
} from '../model/schema';
import { checkConsistency } from '../model/load';
import { FIELD_SPECS, REQUIRED_FIELDS, mapHeaders, type ColumnMap, type ScheduleField } from './columns';

/**
 * A feeder schedule (one row per feeder: from, to, size, sets, material, length, insulation, device
 * rating…) turned into drawing elements. Every row is checked by the same zod schema a project file is
 * checked by; each bad cell is named by its row, its column, what it must hold and how to fix it, and
 * nothing changes until the caller applies the plan. Pure: the caller reads the file and lays out.
 */

export interface CellProblem {
  /** Row number as the sheet shows it (1 is the first line of the file). */
  row: number;
  /** The column's header as written in the file (or the field's name for a block without headers). */
  column: string;
  field: ScheduleField | null;
  /** Index of the column in the sheet (0 is the first), or -1 when the file has no such column. */
  col: number;
  /** The cell as it was. */
  value: string;
  expected: string;
  fix: string;
}

export interface PlannedRow {
  row: number;
  /** Cell text by field. */
  cells: Partial<Record<ScheduleField, string>>;
  /** 'add' a new conductor, 'update' the conductor with this id, 'bad' when a cell is wrong. */
  action: 'add' | 'update' | 'bad';
  conductorId: string | null;
  problems: CellProblem[];
}

export interface FeederImportPlan {
  columns: ColumnMap['columns'];
  /** Whether the first row was read as headers. */
  headerRow: boolean;
  /** Problems with the file as a whole (a required column missing, no rows); no row can be read. */
  fileProblems: string[];
  rows: PlannedRow[];
  problems: CellProblem[];
  /** The drawing with every good row applied (bad rows left out), or null when the file cannot be read. */
  project: Project | null;
  added: { conductors: number; equipment: number; devices: number; busLinks: number };
  updated: number;
  /** What the import did that the user should know (defaults taken, a device's rating kept). */
  notes: string[];
}

export interface FeederImportOptions {
  /** Column order to read a block without a header row by (a paste into the schedule). */
  headerless?: readonly ScheduleField[];
}

/** Most notes listed; past that a count. */
const MAX_NOTES = 20;

const SIZE_ALIASES: Record<string, string> = { '0': '1/0', '00': '2/0', '000': '3/0', '0000': '4/0', '1/0': '1/0', '2/0': '2/0', '3/0': '3/0', '4/0': '4/0' };

/** "#4/0 AWG", "500 kcmil", "500MCM", "00" → the size as the schema writes it; anything else as given. */
export function normaliseSize(raw: string): string {
  const t = raw.trim().toLowerCase().replace(/^#\s*/, '').replace(/\s*(awg|kcmil|mcm|cu|al)\.?$/g, '').replace(/\s+/g, '');
  return SIZE_ALIASES[t] ?? t;
}

/** "Copper", "AL", "Cu-clad" → cu, al, cu-clad-al; anything else as given (the schema then names it). */
export function normaliseMaterial(raw: string): string {
  const t = raw.trim().toLowerCase().replace(/[^a-z]/g, '');
  if (['cu', 'copper'].includes(t)) return 'cu';
  if (['al', 'alu', 'aluminum', 'aluminium'].includes(t)) return 'al';
  if (['cual', 'cuclad', 'cucladal', 'ccal', 'copperclad', 'coppercladaluminum', 'coppercladaluminium'].includes(t)) return 'cu-clad-al';
  return raw.trim();
}

/** "thwn2", "XHHW 2" → THWN-2, XHHW-2; anything else as given. */
export function normaliseInsulation(raw: string): string {
  const t = raw.trim().toUpperCase().replace(/\s+/g, '').replace(/-?2$/, '-2');
  const found = INSULATIONS.find((i) => i === t || i.replace('-', '') === t.replace('-', ''));
  return found ?? raw.trim();
}

function normaliseWiring(raw: string): string | null {
  const t = raw.trim().toLowerCase();
  if (/tray/.test(t)) return 'cable-tray';
  if (/pvc|rnc|non-?metallic conduit/.test(t)) return 'pvc-conduit';
  if (/alum/.test(t)) return 'aluminum-conduit';
  if (/emt|imc|rmc|rigid|steel|conduit|grc/.test(t)) return 'steel-conduit';
  if (/cable|\bmc\b|\bac\b|\bnm\b|\buf\b/.test(t)) return 'cable';
  if (/open|free air|air/.test(t)) return 'open';
  return null;
}

function normaliseRaceway(raw: string): string | null {
  const t = raw.trim().toUpperCase().replace(/\s+/g, ' ');
  if (/^(EMT|IMC|RMC)$/.test(t)) return t;
  if (/^GRC$|^RIGID/.test(t)) return 'RMC';
  if (/PVC|RNC/.test(t)) return /80/.test(t) ? 'PVC-80' : 'PVC-40';
  return null;
}

/** A number in a cell ("1,200", "120 ft", "225A", "225 AT"), or NaN; `units` are the suffixes allowed. */
function numberIn(raw: string, units: RegExp): number {
  const t = raw.trim().replace(/(\d),(\d{3})\b/g, '$1$2');
  const m = /^([+-]?\d+(?:\.\d+)?|[+-]?\.\d+)\s*(.*)$/.exec(t);
  if (!m) return Number.NaN;
  if (m[2] !== '' && !units.test(m[2]!)) return Number.NaN;
  return Number(m[1]);
}

const FEET = /^(ft|feet|foot|')\.?$/i;
/** After a device rating: "A", "AT", then frame or poles ("/400AF", ", 3P", " 3 pole"). */
const AMPS = /^(a|amps?|amperes?|at)?\.?(\s*[/,]?\s*\d+\s*(af|at|a|p|poles?)\.?)*$/i;
const KVA = /^kva$/i;
const CELSIUS = /^(°?\s*c|deg\s*c)$/i;
const SETS = /^(sets?|x|runs?|par(allel)?)$/i;

interface RowFacts {
  id?: string;
  from: string;
  to: string;
  conductor: Record<string, unknown>;
  deviceRating?: number;
  loadA?: number;
  loadKva?: number;
}

/** Reads one row's cells into conductor fields; cells that cannot be read are problems. */
function readRow(cells: Partial<Record<ScheduleField, string>>, problem: (f: ScheduleField, expected?: string, fix?: string) => void): RowFacts | null {
  const c: Record<string, unknown> = {};
  const txt = (f: ScheduleField) => (cells[f] ?? '').trim();
  const num = (f: ScheduleField, units: RegExp): number | undefined => {
    if (txt(f) === '') return undefined;
    const n = numberIn(txt(f), units);
    if (Number.isNaN(n)) {
      problem(f);
      return undefined;
    }
    return n;
  };
  if (txt('from') === '') problem('from', 'the name or id of the equipment on the supply side; the cell is empty');
  if (txt('to') === '') problem('to', 'the name or id of the equipment on the load side; the cell is empty');
  if (txt('size') === '') problem('size', `${FIELD_SPECS.size.expected}; the cell is empty`);
  else c.size = normaliseSize(txt('size'));
  if (txt('sets') !== '') c.parallelSets = num('sets', SETS);
  if (txt('material') !== '') c.material = normaliseMaterial(txt('material'));
  if (txt('insulation') !== '') c.insulation = normaliseInsulation(txt('insulation'));
  const length = num('length', FEET);
  if (length !== undefined) c.lengthFt = length;
  const ambient = num('ambient', CELSIUS);
  if (ambient !== undefined) c.ambientC = ambient;
  if (txt('raceway') !== '') {
    const r = normaliseRaceway(txt('raceway'));
    if (r === null) problem('raceway');
    else {
      c.raceway = r;
      c.wiring = r.startsWith('PVC') ? 'pvc-conduit' : 'steel-conduit';
    }
  }
  if (txt('wiring') !== '') {
    const w = normaliseWiring(txt('wiring'));
    if (w === null) problem('wiring');
    else c.wiring = w;
  }
  if (txt('label') !== '') c.label = txt('label');
  if (txt('notes') !== '') c.notes = txt('notes');
  const id = txt('id') || undefined;
  return {
    ...(id !== undefined ? { id } : {}),
    from: txt('from'),
    to: txt('to'),
    conductor: c,
    deviceRating: num('deviceRating', AMPS),
    loadA: num('loadA', /^(a|amps?)$/i),
    loadKva: num('loadKva', KVA),
  };
}

/** Which field of a row a conductor schema path belongs to. */
const PATH_FIELD: Record<string, ScheduleField> = {
  id: 'id', size: 'size', parallelSets: 'sets', material: 'material', insulation: 'insulation', lengthFt: 'length',
  ambientC: 'ambient', wiring: 'wiring', raceway: 'raceway', label: 'label', notes: 'notes',
};

/** A schema message worth keeping over the field's own (the schema's custom words), or null. */
function ownMessage(issue: z.core.$ZodIssue): string | null {
  return issue.code === 'custom' || (issue.message && !/^(Too (small|big)|Invalid)/.test(issue.message)) ? issue.message : null;
}

export function planFeederImport(current: Project, table: readonly (readonly string[])[], options: FeederImportOptions = {}): FeederImportPlan {
  const empty = { conductors: 0, equipment: 0, devices: 0, busLinks: 0 };
  const rowsIn = table.filter((r) => r.some((c) => c.trim() !== ''));
  const fileFail = (msg: string, columns: ColumnMap['columns'] = [], headerRow = true): FeederImportPlan => ({
    columns, headerRow, fileProblems: [msg], rows: [], problems: [], project: null, added: empty, updated: 0, notes: [],
  });
  if (rowsIn.length === 0) return fileFail('The file holds no rows. Export the sheet with its header row (From, To, Size…) and at least one feeder.');

  // A header row when the first row names at least two fields (a paste may come without one).
  const first = mapHeaders(rowsIn[0]!);
  const named = first.columns.filter((c) => c.field !== null).length;
  let map: ColumnMap;
  let headerRow: boolean;
  if (named >= 2 || !options.headerless) {
    map = first;
    headerRow = true;
  } else {
    const order = options.headerless;
    const width = Math.max(...rowsIn.map((r) => r.length));
    const columns = Array.from({ length: width }, (_, i) => ({ header: order[i] ? FIELD_SPECS[order[i]].name : `column ${i + 1}`, field: order[i] ?? null }));
    map = { columns, index: Object.fromEntries(columns.flatMap((c, i) => (c.field ? [[c.field, i]] : []))) as ColumnMap['index'] };
    headerRow = false;
  }
  const missing = REQUIRED_FIELDS.filter((f) => map.index[f] === undefined);
  if (missing.length > 0) {
    const words = missing.map((f) => `${FIELD_SPECS[f].name} (e.g. "${FIELD_SPECS[f].words.slice(0, 3).join('", "')}")`).join('; ');
    const found = map.columns.map((c) => c.header.trim()).filter(Boolean).join(', ');
    return fileFail(`No column for ${words}. Headers found: ${found || 'none'}. Name the columns in the first row, or rename a header to one of the words shown.`, map.columns, headerRow);
  }
  const dataRows = headerRow ? rowsIn.slice(1) : rowsIn;
  if (dataRows.length === 0) return fileFail('The file has a header row but no feeders below it.', map.columns, headerRow);
  // Sheet row numbers: blank lines were dropped, so count them back from the original table.
  const sheetRow = new Map<readonly string[], number>();
  table.forEach((r, i) => sheetRow.set(r, i + 1));

  const doc: Project = structuredClone(current);
  const byId = new Map<string, EquipmentNode>(doc.nodes.map((n) => [n.id, n]));
  const byLabel = new Map<string, EquipmentNode>();
  for (const n of doc.nodes) if (n.label && !byLabel.has(n.label.trim().toLowerCase())) byLabel.set(n.label.trim().toLowerCase(), n);
  // Only the drawing's own conductors can be updated; one added by an earlier row is not a target.
  const conductorsById = new Map<string, Conductor>(doc.conductors.map((c) => [c.id, c]));
  const usedIds = new Set<string>([...doc.nodes.map((n) => n.id), ...doc.conductors.map((c) => c.id), ...doc.busLinks.map((b) => b.id)]);
  const freshId = (base: string): string => {
    const stem = base.trim().slice(0, 58) || 'X';
    let id = stem;
    for (let k = 2; usedIds.has(id); k++) id = `${stem}-${k}`;
    usedIds.add(id);
    return id;
  };
  const findNode = (name: string) => byId.get(name) ?? byLabel.get(name.trim().toLowerCase());
  // Names that feed something in this file become distribution equipment, never a load; names that are
  // fed as well as feeding are panelboards, the others (the top of the file) switchboards.
  const cellOf = (r: readonly string[], f: ScheduleField) => (map.index[f] !== undefined ? (r[map.index[f]!] ?? '').trim().toLowerCase() : '');
  const feeds = new Set(dataRows.map((r) => cellOf(r, 'from')));
  const fedNames = new Set(dataRows.map((r) => cellOf(r, 'to')));

  const rows: PlannedRow[] = [];
  const problems: CellProblem[] = [];
  const notes: string[] = [];
  const added = { ...empty };
  let updated = 0;
  const idsInFile = new Map<string, number>();

  for (const r of dataRows) {
    const rowNo = sheetRow.get(r) ?? 0;
    const cells: Partial<Record<ScheduleField, string>> = {};
    for (const [f, i] of Object.entries(map.index) as [ScheduleField, number][]) cells[f] = r[i] ?? '';
    const mine: CellProblem[] = [];
    const problem = (f: ScheduleField, expected = FIELD_SPECS[f].expected, fix = FIELD_SPECS[f].fix) => {
      if (mine.some((p) => p.field === f)) return;
      const col = map.index[f];
      mine.push({ row: rowNo, column: col !== undefined ? map.columns[col]!.header.trim() || FIELD_SPECS[f].name : FIELD_SPECS[f].name, field: f, col: col ?? -1, value: cells[f] ?? '', expected, fix });
    };
    const facts = readRow(cells, problem);
    // The conductor's own fields, checked by the project schema (ends filled in below).
    const candidate = { ...facts!.conductor, id: facts!.id ?? 'pending', from: 'pending', to: 'pending' };
    const parsed = conductor.safeParse(candidate);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const f = PATH_FIELD[String(issue.path[0])];
        if (!f) continue;
        const own = ownMessage(issue);
        problem(f, own ? `${FIELD_SPECS[f].expected} (${own})` : FIELD_SPECS[f].expected);
      }
    }
    if (facts!.deviceRating !== undefined && !breakerNode.shape.ratingA.safeParse(facts!.deviceRating).success) problem('deviceRating');
    if (facts!.loadA !== undefined && !loadNode.shape.currentA.safeParse(facts!.loadA).success) problem('loadA');
    if (facts!.loadKva !== undefined && !loadNode.shape.kva.safeParse(facts!.loadKva).success) problem('loadKva');
    if (facts!.loadA !== undefined && facts!.loadKva !== undefined) problem('loadKva', 'either the load current or the load kVA, not both', 'leave one of the two cells empty');

    const from = facts!.from;
    const to = facts!.to;
    const fromNode = from ? findNode(from) : undefined;
    const toNode = to ? findNode(to) : undefined;
    if (from && to && from.toLowerCase() === to.toLowerCase()) problem('to', 'equipment other than the supply side (From and To name the same equipment)', 'write the equipment this feeder supplies');
    if (fromNode?.kind === 'load') problem('from', `equipment that supplies others; "${from}" is a load on the drawing`, 'write the panel or device that feeds this conductor');
    if (toNode && (toNode.kind === 'utility' || toNode.kind === 'generator')) problem('to', `equipment on the load side; "${to}" is a source on the drawing`, 'write the equipment this feeder supplies');
    const toIsLoad = facts!.loadA !== undefined || facts!.loadKva !== undefined;
    if (toIsLoad && (feeds.has(to.toLowerCase()) || (toNode && toNode.kind !== 'load'))) {
      problem(facts!.loadA !== undefined ? 'loadA' : 'loadKva', `no load figure: "${to}" feeds other equipment, so it is distribution equipment, not a load`, 'leave the load cell empty');
    }

    // An id already in the file, or used by equipment or a bus link on the drawing.
    const id = facts!.id;
    const existing = id !== undefined ? conductorsById.get(id) : undefined;
    if (id !== undefined) {
      const before = idsInFile.get(id);
      if (before !== undefined) problem('id', `an id used once; row ${before} has "${id}" too`, FIELD_SPECS.id.fix);
      else idsInFile.set(id, rowNo);
      if (!existing && usedIds.has(id)) problem('id', `an id not used by other equipment; "${id}" is taken on the drawing`, FIELD_SPECS.id.fix);
    }
    if (existing) {
      const endOk = (name: string, nodeId: string) => {
        const n = findNode(name);
        return n !== undefined && n.id === nodeId;
      };
      const label = (nodeId: string) => byId.get(nodeId)?.label || nodeId;
      if (from && !endOk(from, existing.from)) problem('from', `"${label(existing.from)}": conductor ${existing.id} runs from it on the drawing, and an import does not reconnect`, `write ${label(existing.from)}, or leave the Id empty to add a new conductor`);
      if (to && !endOk(to, existing.to)) problem('to', `"${label(existing.to)}": conductor ${existing.id} runs to it on the drawing, and an import does not reconnect`, `write ${label(existing.to)}, or leave the Id empty to add a new conductor`);
    }

    problems.push(...mine);
    if (mine.length > 0) {
      rows.push({ row: rowNo, cells, action: 'bad', conductorId: id ?? null, problems: mine });
      continue;
    }
    const fields = parsed.success ? facts!.conductor : {};
    if (existing) {
      // Update: the cells given replace the drawing's values; the ends stay.
      const next = conductor.parse({ ...existing, ...fields });
      Object.assign(existing, next);
      const dev = byId.get(existing.from);
      if (facts!.deviceRating !== undefined && dev && (dev.kind === 'breaker' || dev.kind === 'fuse') && dev.ratingA !== facts!.deviceRating) {
        dev.ratingA = facts!.deviceRating;
      }
      updated++;
      rows.push({ row: rowNo, cells, action: 'update', conductorId: existing.id, problems: [] });
      continue;
    }
    // Add: the ends found on the drawing by id or name, or new equipment named by the cell.
    const node = (name: string, make: (id: string) => EquipmentNode): EquipmentNode => {
      const found = findNode(name);
      if (found) return found;
      const n = make(freshId(name));
      doc.nodes.push(n);
      byId.set(n.id, n);
      byLabel.set(name.trim().toLowerCase(), n);
      added.equipment++;
      return n;
    };
    const supply = node(from, (nid) => ({ id: nid as EquipmentNode['id'], kind: 'bus', label: from.slice(0, 200), busType: fedNames.has(from.toLowerCase()) ? 'panelboard' : 'switchboard' }));
    const fed = node(to, (nid) =>
      toIsLoad
        ? ({ id: nid, kind: 'load', label: to.slice(0, 200), ...(facts!.loadA !== undefined ? { currentA: facts!.loadA } : { kva: facts!.loadKva }), powerFactor: 0.9, continuous: false } as EquipmentNode)
        : ({ id: nid, kind: 'bus', label: to.slice(0, 200), busType: 'panelboard' } as EquipmentNode),
    );
    let start: EquipmentNode = supply;
    const rating = facts!.deviceRating;
    if (supply.kind === 'bus' && rating !== undefined) {
      // The feeder's protective device: a breaker on the supply bus, joined to it by a bus link.
      const cb = { id: freshId(`CB-${to}`), kind: 'breaker', label: `Feeder breaker to ${to}`.slice(0, 200), ratingA: rating, arrangement: 'single', atDisconnectingMeans: false } as EquipmentNode;
      doc.nodes.push(cb);
      byId.set(cb.id, cb);
      const link: BusLink = { id: freshId(`BL-${cb.id}`) as BusLink['id'], from: supply.id, to: cb.id };
      doc.busLinks.push(link);
      added.devices++;
      added.busLinks++;
      start = cb;
    } else if (rating !== undefined && (supply.kind === 'breaker' || supply.kind === 'fuse') && supply.ratingA !== rating) {
      if (notes.length < MAX_NOTES) notes.push(`Row ${rowNo}: ${supply.label || supply.id} keeps its ${supply.ratingA ?? '(no)'} A rating from the drawing; the schedule says ${rating} A. Change it in the details panel if the schedule is right.`);
    }
    const cid = id ?? freshId(`F-${to}`);
    if (id !== undefined) usedIds.add(id);
    const made = conductor.parse({ ...fields, id: cid, from: start.id, to: fed.id });
    doc.conductors.push(made);
    added.conductors++;
    rows.push({ row: rowNo, cells, action: 'add', conductorId: cid, problems: [] });
  }

  const defaults = [
    map.index.material === undefined ? 'material (copper taken)' : null,
    map.index.insulation === undefined ? 'insulation (THHN taken)' : null,
    map.index.sets === undefined ? 'sets (one set taken)' : null,
    map.index.length === undefined ? 'length (left unknown: tap rules then ask for it)' : null,
  ].filter((x): x is string => x !== null);
  if (defaults.length > 0) notes.unshift(`Not in the file, so the schema's default is used: ${defaults.join('; ')}.`);
  const ignored = map.columns.filter((c) => c.field === null && c.header.trim() !== '').map((c) => `"${c.header.trim()}"`);
  if (ignored.length > 0) notes.unshift(`Columns not read: ${ignored.join(', ')}.`);

  // The whole drawing, as a file would be checked: the schema, then ids and ends.
  const whole = projectSchema.safeParse(doc);
  const fileProblems: string[] = [];
  if (!whole.success) fileProblems.push(`The imported drawing would not be a valid project: ${whole.error.issues[0]?.message ?? 'unknown'} (at ${whole.error.issues[0]?.path.join('.')}). Please report this with the file.`);
  else for (const e of checkConsistency(whole.data).slice(0, 5)) fileProblems.push(`The imported drawing would not be consistent at ${e.path}: ${e.message}`);
  return {
    columns: map.columns,
    headerRow,
    fileProblems,
    rows,
    problems,
    project: fileProblems.length === 0 && whole.success ? whole.data : null,
    added,
    updated,
    notes,
  };
}

/** One line per bad cell: "Row 4, column "Size" ("5 AWG"): expected …; fix: …". */
export function cellProblemText(p: CellProblem): string {
  return `Row ${p.row}, column "${p.column}"${p.value.trim() ? ` ("${p.value.trim()}")` : ' (empty)'}: expected ${p.expected}. Fix: ${p.fix}.`;
}

