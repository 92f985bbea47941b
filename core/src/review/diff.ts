import type { Verdict } from '../analyze/types';
import { VERDICT_LABELS } from '../analyze/types';
import type { DrawingSnapshot, ReviewComment, RoundSummary } from '../model/schema';
import { leaves, sameValue } from './values';

export type ElementList = 'nodes' | 'conductors' | 'busLinks';
const ELEMENT_WORDS: Readonly<Record<ElementList, string>> = { nodes: 'equipment', conductors: 'conductor', busLinks: 'bus link' };

export interface FieldChange {
  /** Dotted path inside the element: 'size', 'highBay.horizontalFt'. */
  field: string;
  before: unknown;
  after: unknown;
  /** 'size 2/0 → 3/0', 'length 24 ft → 18 ft'. */
  text: string;
}

export interface ElementChange {
  change: 'added' | 'removed' | 'changed';
  list: ElementList | 'project';
  id: string;
  fields: FieldChange[];
  /** Only the position moved: the drawing looks different, the design is the same. */
  layoutOnly: boolean;
  /** 'TAP-L3 size 2/0 → 3/0' */
  text: string;
}

const UNITS: readonly [suffix: string, unit: string][] = [
  ['VoltsLL', 'V'], ['Ft', 'ft'], ['KA', 'kA'], ['A', 'A'], ['C', '°C'], ['Pct', '%'], ['S', 's'],
];

/** 'lengthFt' → ['length', 'ft']; 'highBay.tapHeightAboveFloorFt' → ['high bay tap height above floor', 'ft']. */
export function fieldWords(path: string): { words: string; unit: string } {
  const last = path.split('.');
  const name = last[last.length - 1]!;
  let unit = '';
  let stem = name;
  if (name === 'kva') return { words: [...last.slice(0, -1).map(split), 'rating'].join(' '), unit: 'kVA' };
  for (const [suffix, u] of UNITS) {
    if (name.length > suffix.length && name.endsWith(suffix) && /[a-z]/.test(name.charAt(name.length - suffix.length - 1))) {
      stem = name.slice(0, -suffix.length);
      unit = u;
      break;
    }
  }
  const words = [...last.slice(0, -1).map(split), split(stem)].join(' ');
  return { words: words === 'primary' ? 'primary voltage' : words === 'secondary' ? 'secondary voltage' : words, unit };
}

function split(camel: string): string {
  return camel.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
}

function valueText(v: unknown, unit: string): string {
  if (v === undefined || v === null) return 'not given';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'number') return unit ? `${Number.isInteger(v) ? v : Math.round(v * 100) / 100} ${unit}` : String(v);
  return typeof v === 'string' && /\s/.test(v) ? JSON.stringify(v) : String(v);
}

function fieldChanges(a: object, b: object): FieldChange[] {
  const la = leaves(a);
  const lb = leaves(b);
  const out: FieldChange[] = [];
  const paths = [...new Set([...la.keys(), ...lb.keys()])];
  for (const path of paths) {
    if (path === 'id') continue;
    const before = la.get(path);
    const after = lb.get(path);
    if (sameValue(before, after)) continue;
    const { words, unit } = fieldWords(path);
    out.push({ field: path, before, after, text: `${words} ${valueText(before, unit)} → ${valueText(after, unit)}` });
  }
  return out;
}

function describeElement(list: ElementList, e: Record<string, unknown>): string {
  if (list === 'conductors') {
    const sets = typeof e.parallelSets === 'number' && e.parallelSets > 1 ? `${e.parallelSets} sets ` : '';
    return `${ELEMENT_WORDS[list]}, ${sets}${typeof e.size === 'string' ? e.size : 'size unknown'} ${String(e.material ?? 'cu')}, ${String(e.from)} → ${String(e.to)}`;
  }
  if (list === 'busLinks') return `${ELEMENT_WORDS[list]}, ${String(e.from)} → ${String(e.to)}`;
  return `${String(e.kind)}${e.label ? ` "${String(e.label)}"` : ''}`;
}

/** Every element added, removed or changed between two drawings, field by field in plain words. */
export function diffDrawings(a: DrawingSnapshot, b: DrawingSnapshot): ElementChange[] {
  const out: ElementChange[] = [];
  const settings = fieldChanges(a.project, b.project);
  if (settings.length > 0) {
    out.push({ change: 'changed', list: 'project', id: 'project', fields: settings, layoutOnly: false, text: `project ${settings.map((f) => f.text).join('; ')}` });
  }
  const series = (d: DrawingSnapshot) => (d.seriesRatings ?? []).map((r) => `${r.lineSideId} ahead of ${r.loadSideId} at ${r.combinationKA} kA`).sort();
  const sa = series(a);
  const sb = series(b);
  if (!sameValue(sa, sb)) {
    const gone = sa.filter((x) => !sb.includes(x));
    const added = sb.filter((x) => !sa.includes(x));
    const fields = [...gone.map((x) => ({ field: 'seriesRatings', before: x, after: undefined, text: `series rating ${x} removed` })), ...added.map((x) => ({ field: 'seriesRatings', before: undefined, after: x, text: `series rating ${x} added` }))];
    out.push({ change: 'changed', list: 'project', id: 'project', fields, layoutOnly: false, text: `project ${fields.map((f) => f.text).join('; ')}` });
  }
  for (const list of ['nodes', 'conductors', 'busLinks'] as const) {
    const before = new Map<string, Record<string, unknown>>((a[list] as unknown as Record<string, unknown>[]).map((e) => [e.id as string, e]));
    const seen = new Set<string>();
    for (const e of b[list] as unknown as Record<string, unknown>[]) {
      const id = e.id as string;
      seen.add(id);
      const old = before.get(id);
      if (!old) {
        out.push({ change: 'added', list, id, fields: [], layoutOnly: false, text: `${id} added (${describeElement(list, e)})` });
        continue;
      }
      const fields = fieldChanges(old, e);
      if (fields.length === 0) continue;
      const layoutOnly = fields.every((f) => f.field.startsWith('position.'));
      const text = layoutOnly ? `${id} moved on the drawing` : `${id} ${fields.filter((f) => !f.field.startsWith('position.')).map((f) => f.text).join('; ')}`;
      out.push({ change: 'changed', list, id, fields, layoutOnly, text });
    }
    for (const [id, e] of before) {
      if (!seen.has(id)) out.push({ change: 'removed', list, id, fields: [], layoutOnly: false, text: `${id} removed (${describeElement(list, e)})` });
    }
  }
  return out;
}

export type FindingEntry = RoundSummary['findings'][number];

export interface VerdictChange {
  id: string;
  before: Verdict | null;
  after: Verdict | null;
  text: string;
}

export interface FindingsDiff {
  added: FindingEntry[];
  resolved: FindingEntry[];
  /** In both; `changed` when its values differ (the fingerprint moved). */
  stillOpen: (FindingEntry & { changed: boolean })[];
}

export function diffVerdicts(a: RoundSummary, b: RoundSummary): VerdictChange[] {
  const before = new Map(a.verdicts.map((v) => [v.id as string, v.verdict]));
  const out: VerdictChange[] = [];
  const seen = new Set<string>();
  const word = (v: Verdict | null) => (v === null ? 'not drawn' : VERDICT_LABELS[v]);
  for (const v of b.verdicts) {
    seen.add(v.id);
    const old = before.get(v.id) ?? null;
    if (old !== v.verdict) out.push({ id: v.id, before: old, after: v.verdict, text: `${v.id} ${word(old)} → ${word(v.verdict)}` });
  }
  for (const [id, old] of before) if (!seen.has(id)) out.push({ id, before: old, after: null, text: `${id} ${word(old)} → ${word(null)}` });
  return out;
}

export function diffFindings(a: RoundSummary, b: RoundSummary): FindingsDiff {
  const before = new Map(a.findings.map((f) => [f.id, f]));
  const after = new Set(b.findings.map((f) => f.id));
  const added: FindingEntry[] = [];
  const stillOpen: FindingsDiff['stillOpen'] = [];
  for (const f of b.findings) {
    const old = before.get(f.id);
    if (!old) added.push(f);
    else stillOpen.push({ ...f, changed: old.fingerprint !== f.fingerprint });
  }
  return { added, resolved: a.findings.filter((f) => !after.has(f.id)), stillOpen };
}

export interface Comparison {
  from: string;
  to: string;
  elements: ElementChange[];
  verdicts: VerdictChange[];
  findings: FindingsDiff;
  /** Comments from the older side still open or answered: they carry forward. */
  carriedForward: Pick<ReviewComment, 'number' | 'state' | 'text' | 'pin' | 'author'>[];
  /** Verdicts or findings changed (new, resolved, or other values): what `linewright diff` exits 1 on. */
  matters: boolean;
}

export interface ComparisonSide {
  label: string;
  drawing: DrawingSnapshot;
  summary: RoundSummary;
  comments: readonly ReviewComment[];
}

/** The whole comparison of two sides (two rounds, or a round and the present drawing, or two files). */
export function compareSides(a: ComparisonSide, b: ComparisonSide): Comparison {
  const elements = diffDrawings(a.drawing, b.drawing);
  const verdicts = diffVerdicts(a.summary, b.summary);
  const findings = diffFindings(a.summary, b.summary);
  const carriedForward = a.comments
    .filter((c) => c.state === 'open' || c.state === 'answered')
    .sort((x, y) => x.number - y.number)
    .map(({ number, state, text, pin, author }) => ({ number, state, text, pin, author }));
  const matters = verdicts.length > 0 || findings.added.length > 0 || findings.resolved.length > 0 || findings.stillOpen.some((f) => f.changed);
  return { from: a.label, to: b.label, elements, verdicts, findings, carriedForward, matters };
}

/** The comparison as plain text, for the terminal and the letter. */
export function comparisonText(c: Comparison): string {
  const lines: string[] = [`Changes from ${c.from} to ${c.to}`, ''];
  const design = c.elements.filter((e) => !e.layoutOnly);
  const moved = c.elements.length - design.length;
  lines.push(`Drawing: ${design.length === 0 ? 'no design changes' : `${design.length} element${design.length === 1 ? '' : 's'} changed`}${moved > 0 ? ` (${moved} only moved)` : ''}`);
  for (const e of design) lines.push(`  ${e.change === 'added' ? '+' : e.change === 'removed' ? '-' : '~'} ${e.text}`);
  lines.push('', `Verdicts: ${c.verdicts.length === 0 ? 'none changed' : `${c.verdicts.length} changed`}`);
  for (const v of c.verdicts) lines.push(`  ${v.text}`);
  const f = c.findings;
  lines.push('', `Findings: ${f.added.length} new, ${f.resolved.length} resolved, ${f.stillOpen.length} still open`);
  for (const x of f.added) lines.push(`  new       [${x.severity}] ${x.id}: ${x.message}`);
  for (const x of f.resolved) lines.push(`  resolved  [${x.severity}] ${x.id}`);
  for (const x of f.stillOpen) lines.push(`  ${x.changed ? 'changed  ' : 'still    '} [${x.severity}] ${x.id}${x.changed ? `: ${x.message}` : ''}`);
  if (c.carriedForward.length > 0) {
    lines.push('', `Comments carried forward: ${c.carriedForward.length}`);
    for (const m of c.carriedForward) lines.push(`  #${m.number} (${m.state}) ${m.text.split('\n')[0]!.slice(0, 100)}`);
  }
  return `${lines.join('\n')}\n`;
}
