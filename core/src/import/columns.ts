import { INSULATIONS, RACEWAY_KINDS } from '../model/schema';

/** What a column of a feeder schedule can hold. */
export type ScheduleField =
  | 'id' | 'from' | 'to' | 'size' | 'sets' | 'material' | 'length' | 'insulation' | 'deviceRating'
  | 'loadA' | 'loadKva' | 'wiring' | 'raceway' | 'ambient' | 'label' | 'notes';

export interface FieldSpec {
  /** Name of the field in messages and the preview. */
  name: string;
  /** Header words that mean this field, after normalising (lower case, punctuation and units as spaces). */
  words: readonly string[];
  /** Words that mean it only when no other column already does (a bare "Load" is the equipment fed, unless a "To" column exists). */
  weak?: readonly string[];
  /** What a cell must hold, in plain words. */
  expected: string;
  /** How to put it right. */
  fix: string;
}

/**
 * The header words of a feeder schedule as engineers write them (common practice; no standard fixes
 * them). A header is matched after normalising, so "Length (ft)", "LENGTH, FT" and "length_ft" agree.
 */
export const FIELD_SPECS: Record<ScheduleField, FieldSpec> = {
  id: {
    name: 'Id',
    words: ['id', 'tag', 'feeder', 'feeder id', 'feeder tag', 'feeder no', 'feeder number', 'conductor id', 'conductor tag', 'cable id', 'cable tag', 'cable no', 'circuit', 'circuit id', 'ref', 'reference', 'no', 'number'],
    expected: 'an id of 1 to 64 characters, used by no other element',
    fix: 'give each conductor its own id, or leave the cell empty and one is made',
  },
  from: {
    name: 'From',
    words: ['from', 'from equipment', 'source', 'fed from', 'feed from', 'supply', 'supplied from', 'origin', 'line side', 'upstream', 'from panel', 'from board'],
    expected: 'the name or id of the equipment on the supply side',
    fix: 'write the equipment name as it is on the drawing, or a new name to add it',
  },
  to: {
    name: 'To',
    words: ['to', 'to equipment', 'destination', 'feeds', 'serves', 'load side', 'downstream', 'to panel', 'to board', 'fed to', 'feeder to'],
    weak: ['load', 'equipment', 'panel'],
    expected: 'the name or id of the equipment on the load side, not the same as From',
    fix: 'write the equipment name as it is on the drawing, or a new name to add it',
  },
  size: {
    name: 'Size',
    words: ['size', 'conductor size', 'wire size', 'phase size', 'phase conductor', 'phase conductor size', 'cable size', 'awg', 'awg kcmil', 'size awg kcmil', 'awg mcm', 'wire', 'conductor', 'conductors'],
    expected: 'a conductor size of NEC Table 310.16: 18 to 4/0 AWG or 250 to 2000 kcmil',
    fix: 'write the phase conductor size alone, e.g. 3/0 or 500 (sets and material go in their own columns)',
  },
  sets: {
    name: 'Sets',
    words: ['sets', 'set', 'parallel', 'parallel sets', 'sets per phase', 'sets in parallel', 'no of sets', 'no sets', 'number of sets', 'runs', 'parallel runs', 'qty', 'quantity'],
    expected: 'a whole number of parallel sets, 1 to 20',
    fix: 'write e.g. 2 for two sets per phase, or leave it empty for one',
  },
  material: {
    name: 'Material',
    words: ['material', 'conductor material', 'metal', 'cu al', 'cu or al'],
    expected: 'copper, aluminum or copper-clad aluminum',
    fix: 'write Cu, Al or CuAl, or leave it empty for copper',
  },
  length: {
    name: 'Length',
    words: ['length', 'len', 'distance', 'run length', 'conductor length', 'feeder length', 'ft', 'feet', 'length ft', 'length feet'],
    expected: 'a length in feet, more than 0 and at most 20 000',
    fix: 'write the number of feet from the supply point to the termination, e.g. 120',
  },
  insulation: {
    name: 'Insulation',
    words: ['insulation', 'insul', 'insulation type', 'wire type', 'conductor type', 'type'],
    expected: `an insulation type: ${INSULATIONS.join(', ')}`,
    fix: 'write the insulation type, e.g. THHN or XHHW-2, or leave it empty for THHN',
  },
  deviceRating: {
    name: 'Device rating',
    words: ['device rating', 'device', 'ocpd', 'ocpd rating', 'ocpd size', 'breaker', 'breaker rating', 'breaker size', 'fuse', 'fuse size', 'fuse rating', 'trip', 'trip rating', 'protection', 'protective device', 'overcurrent device', 'rating', 'amps', 'amp', 'at'],
    expected: 'the rating of the protective device at the supply end in amperes, more than 0',
    fix: 'write the rating alone, e.g. 225, or leave it empty when there is no device to add',
  },
  loadA: {
    name: 'Load current',
    words: ['load a', 'load amps', 'load current', 'current', 'demand a', 'demand amps', 'demand load', 'calculated load', 'calc load', 'design current', 'load amperes'],
    expected: 'the load current in amperes, more than 0',
    fix: 'write the current, e.g. 80, or leave it empty (the equipment fed is then a panelboard)',
  },
  loadKva: {
    name: 'Load kVA',
    words: ['load kva', 'kva', 'demand kva', 'connected kva'],
    expected: 'the load in kVA, more than 0',
    fix: 'write the kVA, e.g. 45, or leave it empty',
  },
  wiring: {
    name: 'Wiring method',
    words: ['wiring', 'wiring method', 'method', 'installation'],
    expected: 'steel conduit, aluminum conduit, PVC conduit, cable, cable tray or open',
    fix: 'write one of those words, or leave it empty for steel conduit',
  },
  raceway: {
    name: 'Raceway',
    words: ['raceway', 'conduit', 'conduit type', 'raceway type'],
    expected: `a raceway kind: ${RACEWAY_KINDS.join(', ')}`,
    fix: 'write e.g. EMT or PVC-40, or leave it empty',
  },
  ambient: {
    name: 'Ambient',
    words: ['ambient', 'ambient c', 'ambient temp', 'ambient temperature', 'ambient temp c'],
    expected: 'an ambient temperature in °C, -40 to 90',
    fix: 'write the degrees Celsius, e.g. 40, or leave it empty for 30',
  },
  label: {
    name: 'Description',
    words: ['description', 'desc', 'label', 'name on drawing', 'title'],
    expected: 'a text of at most 200 characters',
    fix: 'shorten the text',
  },
  notes: {
    name: 'Notes',
    words: ['notes', 'note', 'remarks', 'remark', 'comments', 'comment'],
    expected: 'a text of at most 4000 characters',
    fix: 'shorten the text',
  },
};

export const SCHEDULE_FIELDS = Object.keys(FIELD_SPECS) as ScheduleField[];
/** Without these three a row says nothing to draw. */
export const REQUIRED_FIELDS: readonly ScheduleField[] = ['from', 'to', 'size'];

/** Lower case, units in brackets and punctuation turned to spaces: "Length (ft)" → "length ft". */
export function normaliseHeader(h: string): string {
  return h
    .toLowerCase()
    .replace(/[#№]/g, ' no ')
    .replace(/[^a-z0-9]+/g, ' ')
    .trim()
    .replace(/\s+/g, ' ');
}

/** Unit words a header may end with, tried off when the whole header matches nothing. */
const UNIT_TAIL = /\s(ft|feet|a|amps|amperes|awg|kcmil|mcm|c|deg c|degc|no|qty)$/;

export interface ColumnMap {
  /** One entry per column of the sheet, in order. */
  columns: { header: string; field: ScheduleField | null }[];
  /** Column index of each field found. */
  index: Partial<Record<ScheduleField, number>>;
}

/** Which field each header means; the first column to claim a field keeps it, a later one is ignored. */
export function mapHeaders(headers: readonly string[]): ColumnMap {
  const index: Partial<Record<ScheduleField, number>> = {};
  const columns: ColumnMap['columns'] = headers.map((h) => ({ header: h, field: null }));
  const find = (h: string, weak: boolean): ScheduleField | null => {
    const tries = [h];
    let t = h;
    while (UNIT_TAIL.test(t)) {
      t = t.replace(UNIT_TAIL, '');
      tries.push(t);
    }
    for (const x of tries) for (const f of SCHEDULE_FIELDS) if ((weak ? FIELD_SPECS[f].weak ?? [] : FIELD_SPECS[f].words).includes(x) && index[f] === undefined) return f;
    return null;
  };
  for (const weak of [false, true]) {
    headers.forEach((h, i) => {
      if (columns[i]!.field) return;
      const f = find(normaliseHeader(h), weak);
      if (f) {
        index[f] = i;
        columns[i]!.field = f;
      }
    });
  }
  return { columns, index };
}
