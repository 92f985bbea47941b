import {
  CONDUCTOR_SIZES, normaliseInsulation, normaliseMaterial, normaliseSize, showsViolation,
  type AnalysisReport, type Conductor, type EquipmentNode, type Project,
} from '@linewright/core';
import { indexReport } from '../analysis/reportIndex';
import { kindSpec } from '../editor/equipment';
import { VERDICT_WORDS, plain } from '../words';

/** An element's change as the details panel makes it: the target and the whole element, parsed before it lands. */
const MATERIAL_WORDS = { cu: 'copper', al: 'aluminum', 'cu-clad-al': 'Cu-clad Al' } as const;

export interface CellEdit {
  target: { kind: 'node' | 'conductor'; id: string };
  value: unknown;
  label: string;
}

export interface Column<R> {
  key: string;
  head: string;
  /** Least width in px. */
  width: number;
  /** Share of the width left over (text columns grow, numbers keep their width). */
  grow?: number;
  numeric?: boolean;
  text(r: R): string;
  /** Sort key; the text when absent. */
  sort?(r: R): string | number | null;
  /** The edit a typed text makes, or a message naming what is expected; absent for a read-only column. */
  edit?(r: R, raw: string): CellEdit | { error: string } | null;
}

export interface ConductorRow {
  id: string;
  c: Conductor;
  from: EquipmentNode | undefined;
  to: EquipmentNode | undefined;
  verdict: string;
  alarm: boolean;
}

export interface EquipmentRow {
  id: string;
  n: EquipmentNode;
  verdict: string;
  alarm: boolean;
}

const name = (n: EquipmentNode | undefined, id: string) => n?.label || id;
const numOrEmpty = (v: number | undefined) => (v === undefined ? '' : String(v));

/** A typed number: empty is "not given" where the field may be left out. */
function numberOf(raw: string, what: string, optional: boolean): number | undefined | { error: string } {
  const t = raw.trim();
  if (t === '') return optional ? undefined : { error: `Enter the ${what}.` };
  const n = Number(t);
  return Number.isFinite(n) ? n : { error: `"${raw}" is not a number: enter the ${what}.` };
}

function conductorEdit(r: ConductorRow, key: keyof Conductor, value: unknown, what: string): CellEdit {
  const next: Record<string, unknown> = { ...r.c, [key]: value };
  if (value === undefined) delete next[key];
  return { target: { kind: 'conductor', id: r.id }, value: next, label: `Set ${what} of ${r.id}` };
}

function nodeEdit(n: EquipmentNode, key: string, value: unknown, what: string): CellEdit {
  const next: Record<string, unknown> = { ...n, [key]: value };
  if (value === undefined) delete next[key];
  return { target: { kind: 'node', id: n.id }, value: next, label: `Set ${what} of ${n.label || n.id}` };
}

/** The supply-side device of a conductor whose rating the schedule shows and edits. */
const device = (r: ConductorRow) => (r.from && (r.from.kind === 'breaker' || r.from.kind === 'fuse' || r.from.kind === 'disconnect') ? r.from : undefined);

export const CONDUCTOR_COLUMNS: Column<ConductorRow>[] = [
  { key: 'id', head: 'Id', width: 70, text: (r) => r.id },
  { key: 'from', head: 'From', width: 110, grow: 1, text: (r) => name(r.from, r.c.from) },
  { key: 'to', head: 'To', width: 110, grow: 1, text: (r) => name(r.to, r.c.to) },
  {
    // Not entered yet: 'size?' (the check says incomplete until it is), sorted after every size.
    key: 'size', head: 'Size', width: 56, text: (r) => r.c.size ?? 'size?',
    sort: (r) => (r.c.size === undefined ? CONDUCTOR_SIZES.length : CONDUCTOR_SIZES.indexOf(r.c.size)),
    edit: (r, raw) => conductorEdit(r, 'size', normaliseSize(raw), 'size'),
  },
  {
    key: 'sets', head: 'Sets', width: 42, numeric: true, text: (r) => String(r.c.parallelSets), sort: (r) => r.c.parallelSets,
    edit: (r, raw) => {
      const v = numberOf(raw, 'number of parallel sets', false);
      return typeof v === 'object' ? v : conductorEdit(r, 'parallelSets', v, 'parallel sets');
    },
  },
  { key: 'material', head: 'Material', width: 66, text: (r) => MATERIAL_WORDS[r.c.material], edit: (r, raw) => conductorEdit(r, 'material', normaliseMaterial(raw), 'material') },
  {
    key: 'length', head: 'Length (ft)', width: 72, numeric: true, text: (r) => numOrEmpty(r.c.lengthFt), sort: (r) => r.c.lengthFt ?? null,
    edit: (r, raw) => {
      const v = numberOf(raw, 'length in feet', true);
      return typeof v === 'object' ? v : conductorEdit(r, 'lengthFt', v, 'length');
    },
  },
  { key: 'insulation', head: 'Insulation', width: 72, text: (r) => r.c.insulation, edit: (r, raw) => conductorEdit(r, 'insulation', normaliseInsulation(raw), 'insulation') },
  {
    key: 'device', head: 'Device (A)', width: 72, numeric: true,
    text: (r) => {
      const d = device(r);
      return d ? numOrEmpty(d.ratingA) : '';
    },
    sort: (r) => device(r)?.ratingA ?? null,
    edit: (r, raw) => {
      const d = device(r);
      if (!d) return { error: 'This conductor is not fed from a breaker, fuse or switch; its device rating is edited on the piece that protects it.' };
      const v = numberOf(raw, 'rating in amperes', true);
      return typeof v === 'object' ? v : nodeEdit(d, 'ratingA', v, 'rating');
    },
  },
  { key: 'verdict', head: 'Verdict', width: 150, grow: 1.3, text: (r) => r.verdict },
];

const ratingKey = (n: EquipmentNode): 'ratingA' | 'busRatingA' | null =>
  n.kind === 'breaker' || n.kind === 'fuse' || n.kind === 'disconnect' ? 'ratingA' : n.kind === 'bus' ? 'busRatingA' : null;
const kvaKey = (n: EquipmentNode): boolean => n.kind === 'transformer' || n.kind === 'generator' || n.kind === 'load';

export const EQUIPMENT_COLUMNS: Column<EquipmentRow>[] = [
  { key: 'id', head: 'Id', width: 90, text: (r) => r.id },
  {
    key: 'label', head: 'Name on drawing', width: 180, grow: 2, text: (r) => r.n.label ?? '',
    edit: (r, raw) => nodeEdit(r.n, 'label', raw.trim() === '' ? undefined : raw.trim(), 'name'),
  },
  { key: 'kind', head: 'Kind', width: 120, grow: 1, text: (r) => (r.n.kind === 'bus' ? plain(r.n.busType) : kindSpec(r.n.kind).title) },
  {
    key: 'rating', head: 'Rating (A)', width: 80, numeric: true,
    text: (r) => {
      const k = ratingKey(r.n);
      return k ? numOrEmpty((r.n as Record<string, unknown>)[k] as number | undefined) : '';
    },
    sort: (r) => {
      const k = ratingKey(r.n);
      return k ? (((r.n as Record<string, unknown>)[k] as number | undefined) ?? null) : null;
    },
    edit: (r, raw) => {
      const k = ratingKey(r.n);
      if (!k) return { error: `A ${kindSpec(r.n.kind).title.toLowerCase()} has no ampere rating here.` };
      const v = numberOf(raw, 'rating in amperes', true);
      return typeof v === 'object' ? v : nodeEdit(r.n, k, v, 'rating');
    },
  },
  {
    key: 'kva', head: 'kVA', width: 70, numeric: true,
    text: (r) => (kvaKey(r.n) ? numOrEmpty((r.n as { kva?: number }).kva) : ''),
    sort: (r) => (kvaKey(r.n) ? ((r.n as { kva?: number }).kva ?? null) : null),
    edit: (r, raw) => {
      if (!kvaKey(r.n)) return { error: `A ${kindSpec(r.n.kind).title.toLowerCase()} has no kVA rating.` };
      const v = numberOf(raw, 'kVA', r.n.kind === 'load');
      return typeof v === 'object' ? v : nodeEdit(r.n, 'kva', v, 'kVA');
    },
  },
  {
    key: 'volts', head: 'Volts', width: 90,
    text: (r) => (r.n.kind === 'utility' || r.n.kind === 'generator' ? `${r.n.voltsLL}` : r.n.kind === 'transformer' ? `${r.n.primaryVoltsLL}/${r.n.secondaryVoltsLL}` : ''),
  },
  { key: 'verdict', head: 'Findings', width: 150, grow: 1, text: (r) => r.verdict },
];

const SEVERITY_PLAIN = { violation: 'violation', 'needs-ahj': 'needs AHJ review', warning: 'warning', info: 'note' } as const;

export function conductorRows(doc: Project, report: AnalysisReport | null): ConductorRow[] {
  const nodes = new Map(doc.nodes.map((n) => [n.id as string, n]));
  const idx = indexReport(report);
  return doc.conductors.map((c) => {
    const cr = idx.conductor.get(c.id);
    const alarm = report !== null && cr !== undefined && showsViolation(report, cr);
    const verdict = cr ? `${VERDICT_WORDS[cr.verdict]}${alarm && cr.verdict !== 'unprotected' ? ' · violation' : ''}` : report ? 'not checked' : 'checking…';
    return { id: c.id, c, from: nodes.get(c.from), to: nodes.get(c.to), verdict, alarm };
  });
}

export function equipmentRows(doc: Project, report: AnalysisReport | null): EquipmentRow[] {
  const idx = indexReport(report);
  return doc.nodes.map((n) => {
    const own = (idx.findingsByElement.get(n.id) ?? []).filter((f) => f.subject.kind === 'node' && f.subject.id === n.id);
    const worst = own.find((f) => f.severity === 'violation') ?? own.find((f) => f.severity === 'needs-ahj') ?? own.find((f) => f.severity === 'warning') ?? own[0];
    const verdict = !report ? 'checking…' : worst ? `${SEVERITY_PLAIN[worst.severity]}${own.length > 1 ? ` (+${own.length - 1} more)` : ''}` : 'no findings';
    return { id: n.id, n, verdict, alarm: worst?.severity === 'violation' };
  });
}
