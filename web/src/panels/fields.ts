import {
  BUS_TYPES, CODE_EDITIONS, CONDUCTOR_SIZES, DAMAGE_PROTECTION, INSULATIONS, LOAD_CONNECTIONS, MATERIALS, MOTOR_TYPES, TRANSFORMER_CONNECTIONS, WIRING_METHODS,
  type EquipmentKind,
} from '@linewright/core';
import { plain } from '../words';

/** One editable field of the details panel. `key` is a dotted path into the element. */
export type Field =
  | { type: 'text' | 'textarea'; key: string; label: string; optional?: boolean; help?: string }
  | { type: 'number'; key: string; label: string; unit?: string; optional?: boolean; integer?: boolean; help?: string }
  | { type: 'select'; key: string; label: string; options: readonly (string | number | boolean)[]; optionLabels?: Record<string, string>; optional?: boolean; help?: string;
      /** Text of the empty choice of an optional select (default '— not given —'). */
      emptyLabel?: string;
      /** Asked for while empty: the field is marked as needed, with this text (the check cannot judge without it). */
      needed?: string }
  | { type: 'checkbox'; key: string; label: string; help?: string }
  /** Adds or removes an optional sub-object; its fields follow, shown only when present. */
  | { type: 'group'; key: string; label: string; make: () => Record<string, unknown>; fields: Field[]; help?: string };


const codeLabels = (codes: readonly string[]): Record<string, string> => Object.fromEntries(codes.map((c) => [c, plain(c)]));
const label: Field = { type: 'text', key: 'label', label: 'Name on drawing', optional: true };
const notes: Field = { type: 'textarea', key: 'notes', label: 'Notes', optional: true };
const id: Field = { type: 'text', key: 'id', label: 'Id', help: 'Unique in the project; conductors follow a change.' };
const phases: Field = { type: 'select', key: 'phases', label: 'Phases', options: [1, 3] };

const ocpdCommon: Field[] = [
  { type: 'number', key: 'ratingA', label: 'Rating', unit: 'A', optional: true, help: '240.6: for adjustable trip, the rating that counts' },
  { type: 'number', key: 'interruptingKA', label: 'Interrupting rating', unit: 'kA', optional: true },
  { type: 'number', key: 'clearingTimeS', label: 'Clearing time', unit: 's', optional: true },
  { type: 'select', key: 'arrangement', label: 'Arrangement', options: ['single', 'group'], optionLabels: { single: 'one device / one set of fuses', group: 'several devices counted together' } },
  { type: 'checkbox', key: 'atDisconnectingMeans', label: 'Part of or next to the disconnecting means' },
  { type: 'select', key: 'disconnectLocation', label: 'Disconnecting means is', options: ['outside', 'inside-nearest-entrance', 'elsewhere'], optional: true, optionLabels: { outside: 'outside the building', 'inside-nearest-entrance': 'inside, nearest the point of entrance', elsewhere: 'elsewhere' } },
];

export const NODE_FIELDS: Record<EquipmentKind, Field[]> = {
  utility: [
    label, { type: 'number', key: 'voltsLL', label: 'Voltage line to line', unit: 'V' }, phases,
    { type: 'number', key: 'availableFaultKA', label: 'Available fault current', unit: 'kA', optional: true },
    { type: 'number', key: 'xOverR', label: 'X/R ratio', optional: true }, notes, id,
  ],
  generator: [
    label, { type: 'number', key: 'voltsLL', label: 'Voltage line to line', unit: 'V' }, phases,
    { type: 'number', key: 'kva', label: 'Rating', unit: 'kVA' },
    { type: 'checkbox', key: 'overloadPreventedByDesign', label: 'Design prevents overload (445.13: 100 % instead of 115 %)' }, notes, id,
  ],
  bus: [
    label, { type: 'select', key: 'busType', label: 'Equipment', options: BUS_TYPES, optionLabels: codeLabels(BUS_TYPES) },
    { type: 'number', key: 'busRatingA', label: 'Bus rating', unit: 'A', optional: true }, notes, id,
  ],
  breaker: [
    label, ...ocpdCommon,
    {
      type: 'group', key: 'adjustableTrip', label: 'Adjustable trip (240.6(B), (C))',
      make: () => ({ maxSettingA: 100, longTimeSettingA: 100, restrictedAccess: false }),
      fields: [
        { type: 'number', key: 'adjustableTrip.maxSettingA', label: 'Maximum setting', unit: 'A' },
        { type: 'number', key: 'adjustableTrip.longTimeSettingA', label: 'Long-time setting', unit: 'A' },
        { type: 'checkbox', key: 'adjustableTrip.restrictedAccess', label: 'Access to the setting is restricted' },
      ],
    },
    { type: 'select', key: 'tripType', label: 'Trip (Table 430.52)', options: ['inverse-time', 'instantaneous'], optional: true, emptyLabel: '— not stated (inverse-time) —', optionLabels: { 'inverse-time': 'inverse-time', instantaneous: 'instantaneous-trip (motor circuit protector)' } },
    notes, id,
  ],
  fuse: [
    label, ...ocpdCommon, { type: 'checkbox', key: 'currentLimiting', label: 'Current-limiting fuses' },
    { type: 'select', key: 'timeDelay', label: 'Fuse type (Table 430.52)', options: [true, false], optional: true, emptyLabel: '— not stated —', optionLabels: { true: 'time-delay (dual-element)', false: 'non-time-delay' } },
    notes, id,
  ],
  disconnect: [label, { type: 'number', key: 'ratingA', label: 'Switch rating', unit: 'A', optional: true }, notes, id],
  splice: [label, notes, id],
  transformer: [
    label, { type: 'number', key: 'kva', label: 'Rating', unit: 'kVA' },
    { type: 'number', key: 'primaryVoltsLL', label: 'Primary voltage', unit: 'V' },
    { type: 'number', key: 'secondaryVoltsLL', label: 'Secondary voltage', unit: 'V' }, phases,
    { type: 'number', key: 'impedancePct', label: 'Impedance', unit: '%Z', optional: true },
    { type: 'select', key: 'connection', label: 'Connection', options: TRANSFORMER_CONNECTIONS, optionLabels: codeLabels(TRANSFORMER_CONNECTIONS) }, notes, id,
  ],
  load: [
    label,
    { type: 'number', key: 'currentA', label: 'Current', unit: 'A', optional: true, help: 'Give the current or the kVA, not both.' },
    { type: 'number', key: 'kva', label: 'Apparent power', unit: 'kVA', optional: true },
    { type: 'number', key: 'powerFactor', label: 'Power factor' },
    { type: 'checkbox', key: 'continuous', label: 'Continuous (3 h or more)' },
    { type: 'select', key: 'phases', label: 'Phases of the load', options: [1, 3], optional: true, emptyLabel: '— the system\'s —' },
    {
      type: 'select', key: 'connection', label: 'Single-phase connection', options: LOAD_CONNECTIONS, optional: true, emptyLabel: '— not stated (the larger current) —',
      optionLabels: { 'line-to-neutral': 'line to neutral (277 V, 120 V)', 'line-to-line': 'line to line (480 V, 208 V, 240 V)' },
    },
    {
      type: 'group', key: 'motor', label: 'Motor (Article 430)', make: () => ({ hp: 10 }),
      help: 'Full-load current from Table 430.248/430.250 by horsepower, or the nameplate',
      fields: [
        { type: 'number', key: 'motor.hp', label: 'Horsepower', unit: 'hp', optional: true },
        { type: 'number', key: 'motor.fullLoadA', label: 'Nameplate full-load current', unit: 'A', optional: true },
        { type: 'select', key: 'motor.motorType', label: 'Motor type (Table 430.52)', options: MOTOR_TYPES, optional: true, emptyLabel: '— induction (squirrel-cage) —' },
      ],
    },
    {
      type: 'group', key: 'hvac', label: 'HVAC equipment nameplate (Article 440)', make: () => ({ mcaA: 20, mopA: 30 }),
      fields: [
        { type: 'number', key: 'hvac.mcaA', label: 'Minimum circuit ampacity (MCA)', unit: 'A' },
        { type: 'number', key: 'hvac.mopA', label: 'Maximum overcurrent device (MOP)', unit: 'A' },
      ],
    },
    notes, id,
  ],
};

const MAT_LABELS = { cu: 'copper', al: 'aluminum', 'cu-clad-al': 'copper-clad aluminum' };
const WIRING_LABELS = {
  'steel-conduit': 'steel conduit', 'aluminum-conduit': 'aluminum conduit', 'pvc-conduit': 'PVC conduit',
  cable: 'cable', 'cable-tray': 'cable tray', open: 'open (free air)',
};

export const CONDUCTOR_FIELDS: Field[] = [
  { type: 'text', key: 'label', label: 'Name on drawing', optional: true },
  { type: 'number', key: 'parallelSets', label: 'Parallel sets', integer: true, help: '310.10(G): 1/0 and larger only' },
  {
    type: 'select', key: 'size', label: 'Size (AWG / kcmil)', options: CONDUCTOR_SIZES, optional: true, emptyLabel: '— choose a size —',
    needed: 'Needed: choose the size. Until then this conductor has no verdict (incomplete).',
  },
  { type: 'select', key: 'material', label: 'Material', options: MATERIALS, optionLabels: MAT_LABELS },
  { type: 'number', key: 'lengthFt', label: 'Length', unit: 'ft', optional: true, help: 'Conductor length, supply point to termination' },
  { type: 'select', key: 'insulation', label: 'Insulation', options: INSULATIONS },
  { type: 'select', key: 'terminalTempC', label: 'Termination rating (110.14(C))', options: [60, 75, 90], optional: true, emptyLabel: '— project default —', optionLabels: { 60: '60 °C', 75: '75 °C', 90: '90 °C' } },
  { type: 'number', key: 'ambientC', label: 'Ambient', unit: '°C' },
  { type: 'number', key: 'currentCarrying', label: 'Current-carrying conductors in raceway', integer: true },
  { type: 'select', key: 'wiring', label: 'Wiring method', options: WIRING_METHODS, optionLabels: WIRING_LABELS },
  { type: 'select', key: 'damageProtection', label: 'Protection from physical damage', options: DAMAGE_PROTECTION, optionLabels: { raceway: 'raceway', 'other-approved-means': 'other means (AHJ to accept)', none: 'none' } },
  {
    type: 'select', key: 'leavesEnclosure', label: 'Field installation leaves the enclosure where tapped', options: [true, false], optional: true,
    optionLabels: { true: 'yes', false: 'no, stays inside it' }, emptyLabel: '— not stated (taken as leaving) —',
    help: '240.21(B)(1), (C)(2): not stated counts as leaving, the conservative case',
  },
  { type: 'checkbox', key: 'extendsBeyondEquipment', label: 'Runs past the equipment it supplies' },
  { type: 'checkbox', key: 'outdoors', label: 'Outdoors except at its termination' },
  { type: 'checkbox', key: 'multioutletCordAndPlug', label: 'Multioutlet branch circuit for cord-and-plug loads' },
  {
    type: 'group', key: 'highBay', label: 'High-bay manufacturing facts (240.21(B)(4))',
    make: () => ({ horizontalFt: 20, tapHeightAboveFloorFt: 30, penetratesWallFloorCeiling: false }),
    fields: [
      { type: 'number', key: 'highBay.horizontalFt', label: 'Horizontal run', unit: 'ft' },
      { type: 'number', key: 'highBay.tapHeightAboveFloorFt', label: 'Tap made above floor', unit: 'ft' },
      { type: 'checkbox', key: 'highBay.penetratesWallFloorCeiling', label: 'Penetrates a wall, floor or ceiling' },
    ],
  },
  { type: 'textarea', key: 'notes', label: 'Notes', optional: true },
  { type: 'text', key: 'id', label: 'Id' },
];

export const BUS_LINK_FIELDS: Field[] = [
  { type: 'text', key: 'label', label: 'Name on drawing', optional: true },
  { type: 'text', key: 'id', label: 'Id' },
];

export const PROJECT_FIELDS: Field[] = [
  { type: 'text', key: 'name', label: 'Project name' },
  { type: 'select', key: 'codeEdition', label: 'NEC edition', options: CODE_EDITIONS, help: 'Use the edition your AHJ enforces' },
  { type: 'text', key: 'preparedBy', label: 'Prepared by', optional: true },
  { type: 'number', key: 'manufacturingWallHeightFt', label: 'Manufacturing building wall height', unit: 'ft', optional: true, help: '240.21(B)(4) high-bay taps' },
  { type: 'checkbox', key: 'qualifiedMaintenance', label: 'Only qualified persons maintain and supervise the system' },
  { type: 'checkbox', key: 'industrialInstallation', label: 'Industrial installation (240.21(C)(3))' },
  {
    type: 'select', key: 'terminationDefault', label: 'Termination rating where a conductor states none (110.14(C)(1))', options: ['listed-75', 'per-110.14(C)(1)'],
    optionLabels: { 'listed-75': '75 °C: equipment listed for it', 'per-110.14(C)(1)': 'per 110.14(C)(1): 60 °C for 14–1 AWG, 75 °C above' },
  },
  { type: 'textarea', key: 'notes', label: 'Notes', optional: true },
];

export function getPath(obj: unknown, key: string): unknown {
  let cur: unknown = obj;
  for (const k of key.split('.')) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<string, unknown>)[k];
  }
  return cur;
}

/** A copy of obj with the value at the dotted path set; undefined removes the key. */
export function setPath<T>(obj: T, key: string, value: unknown): T {
  const [head, ...rest] = key.split('.');
  const copy = { ...(obj as Record<string, unknown>) };
  if (rest.length === 0) {
    if (value === undefined) delete copy[head!];
    else copy[head!] = value;
  } else copy[head!] = setPath(copy[head!] ?? {}, rest.join('.'), value);
  return copy as T;
}
