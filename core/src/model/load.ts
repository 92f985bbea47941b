import type { z } from 'zod';
import { CONDUCTOR_SIZES, PROJECT_FORMAT, PROJECT_VERSION, project, type Project } from './schema';
import { migrateToCurrent } from './migrations';
import { compileSchema, FAIL, schemaDepth } from './fastParse';
import { foundText } from './found';
import { rememberEdgeEnds, rememberNodeIndex } from './nodeIndex';
import type { LoadError } from '../analyze/types';

const fastProject = compileSchema(project);

export type LoadResult =
  | { ok: true; project: Project; notices: string[] }
  | { ok: false; errors: LoadError[] };

/** Most errors worth listing at once; past that the file is wrong wholesale. */
const MAX_ERRORS = 50;

/**
 * Deepest nesting of arrays and objects a file may have. A project itself is five levels deep
 * (root, list, item, sub-object, value); the limit leaves room for notes another tool adds, and stops a
 * hostile file (thousands of nested arrays) before any recursive step could overflow the stack.
 */
export const MAX_DEPTH = 64;

// A file the compiled validator accepts holds only the schema's own objects and arrays, so it is never
// deeper than the schema: loadProject checks the depth only of a file it does not accept at once.
if (schemaDepth(project) > MAX_DEPTH) throw new Error(`The project schema nests deeper than MAX_DEPTH (${MAX_DEPTH}); raise the limit.`);

/**
 * Read a project from JSON text or an already-parsed value: parse, migrate,
 * validate against the schema, then check what the schema cannot see (ids,
 * ends, loads). Every problem becomes a LoadError naming its JSON path.
 */
export function loadProject(input: unknown): LoadResult {
  let raw: unknown = input;
  if (typeof input === 'string') {
    if (input.trim() === '') return fail([{ path: '', message: 'The file is empty; a Linewright project is a JSON object.' }]);
    try {
      raw = JSON.parse(input);
    } catch (e) {
      const why = e instanceof Error ? e.message : String(e);
      return fail([{ path: '', message: `The file is not valid JSON (${why}). Save it again from Linewright or fix the syntax.` }]);
    }
  }
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    return fail([{ path: '', message: `A project file is a JSON object; this one holds ${describe(raw)}.` }]);
  }
  // The common case first: a valid file of the current version needs no migration, and the compiled
  // validator accepting it proves it shallow (see schemaDepth above), so the depth walk is skipped.
  const current = raw as Record<string, unknown>;
  const accepted = current.format === PROJECT_FORMAT && current.version === PROJECT_VERSION ? fastProject(current) : FAIL;
  if (accepted !== FAIL) return consistent(accepted as Project, []);
  const tooDeep = findTooDeep(raw, MAX_DEPTH);
  if (tooDeep !== null) {
    return fail([
      {
        path: tooDeep,
        message: `Nested more than ${MAX_DEPTH} levels deep here; a Linewright project is only a few levels deep. Remove or flatten this field.`,
      },
    ]);
  }
  const migrated = migrateToCurrent(raw as Record<string, unknown>);
  if (!migrated.ok) return fail(migrated.errors);

  const notices = migrated.migratedFrom === null ? [] : [`Upgraded from file version ${migrated.migratedFrom}.`];
  // The compiled validator answers for valid files; zod is asked only to explain a failure.
  let data = (migrated.value === raw ? FAIL : fastProject(migrated.value)) as Project | typeof FAIL;
  if (data === FAIL) {
    const source = migrated.value;
    let parsed = project.safeParse(source);
    // Fields Linewright does not know (a "$schema" line, another tool's notes) are set aside with a notice
    // rather than refusing the whole drawing; any real error is still an error.
    if (!parsed.success && parsed.error.issues.every((i) => i.code === 'unrecognized_keys')) {
      const cleaned = structuredClone(migrated.value);
      for (const issue of parsed.error.issues) {
        if (issue.code !== 'unrecognized_keys') continue;
        const owner = issue.path.reduce<unknown>((o, k) => (o as Record<PropertyKey, unknown>)[k], cleaned) as Record<string, unknown>;
        for (const key of issue.keys) delete owner[key];
        const where = formatPath(issue.path);
        notices.push(`Ignored unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => `"${k}"`).join(', ')}${where ? ` at ${where}` : ''}; check the spelling if it was meant.`);
      }
      parsed = project.safeParse(cleaned);
    }
    if (!parsed.success) return fail(parsed.error.issues.slice(0, MAX_ERRORS).map((issue) => issueToError(issue, source)));
    data = parsed.data;
  }
  return consistent(data, notices);
}

/** The loaded project, or the first errors of what the schema cannot check. */
function consistent(data: Project, notices: string[]): LoadResult {
  const errors = checkConsistency(data);
  if (errors.length > 0) return fail(errors.slice(0, MAX_ERRORS));
  return { ok: true, project: data, notices };
}

function article(expected: string): string {
  return `${/^[aeiou]/.test(expected) ? 'an' : 'a'} ${expected}`;
}

function fail(errors: LoadError[]): LoadResult {
  return { ok: false, errors };
}

function describe(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  return `a ${typeof v}`;
}

/**
 * The path to the first value nested deeper than `limit`, or null. Iterative, so the check itself cannot
 * overflow the stack however deep the input goes; the path is cut short after a few steps to stay readable.
 */
export function findTooDeep(root: unknown, limit: number): string | null {
  const stack: { value: unknown; depth: number; path: readonly PropertyKey[] }[] = [{ value: root, depth: 0, path: [] }];
  while (stack.length > 0) {
    const { value, depth, path } = stack.pop()!;
    if (typeof value !== 'object' || value === null) continue;
    if (depth >= limit) return formatPath(path.length > 8 ? [...path.slice(0, 6), '…'] : path);
    // Paths are kept only for the first few levels: that is all a message shows.
    const child = (k: PropertyKey) => (path.length > 8 ? path : [...path, k]);
    if (Array.isArray(value)) for (let i = value.length - 1; i >= 0; i--) stack.push({ value: value[i], depth: depth + 1, path: child(i) });
    else for (const k of Object.keys(value)) stack.push({ value: (value as Record<string, unknown>)[k], depth: depth + 1, path: child(k) });
  }
  return null;
}

/** The value at a zod issue path in the input, and whether its last key is present at all. */
function lookup(root: unknown, path: readonly PropertyKey[]): { present: boolean; value: unknown } {
  let owner: unknown = root;
  for (let i = 0; i < path.length; i++) {
    if (typeof owner !== 'object' || owner === null) return { present: false, value: undefined };
    const key = path[i]!;
    if (i === path.length - 1) return { present: Object.prototype.hasOwnProperty.call(owner, key), value: (owner as Record<PropertyKey, unknown>)[key] };
    owner = (owner as Record<PropertyKey, unknown>)[key];
  }
  return { present: true, value: owner };
}

/** `['conductors', 3, 'lengthFt']` → `conductors[3].lengthFt`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out === '' ? String(part) : `.${String(part)}`;
  }
  return out;
}

function issueToError(issue: z.core.$ZodIssue, source: unknown): LoadError {
  const path = formatPath(issue.path);
  const field = String(issue.path[issue.path.length - 1] ?? 'value');
  // zod does not keep the input in its issues; read what the file holds at that path instead.
  const at = lookup(source, issue.path);
  switch (issue.code) {
    case 'invalid_type': {
      if (!at.present || at.value === undefined) return { path, message: `"${field}" is missing; expected ${article(issue.expected)}.` };
      const hint =
        issue.expected === 'number' && typeof at.value === 'string' && at.value.trim() !== '' && Number.isFinite(Number(at.value))
          ? ' Write the number without quotes.'
          : '';
      return { path, message: `"${field}": expected ${issue.expected}, found ${foundText(at.value)}.${hint}` };
    }
    case 'invalid_value': {
      const values = field === 'size' ? CONDUCTOR_SIZES : issue.values;
      const list = values.map((v) => JSON.stringify(v)).join(', ');
      if (!at.present || at.value === undefined) return { path, message: `"${field}" is missing; expected one of ${list}.` };
      return { path, message: `"${field}" must be one of ${list}; found ${foundText(at.value)}.` };
    }
    case 'invalid_union': {
      if ('options' in issue && Array.isArray(issue.options)) {
        return { path, message: `"${field}" must be one of ${issue.options.map((v) => JSON.stringify(v)).join(', ')}.` };
      }
      const literals = issue.errors.flat().flatMap((e) => (e.code === 'invalid_value' ? e.values : []));
      if (literals.length > 0) {
        const found = !at.present || at.value === undefined ? 'it is missing' : `found ${foundText(at.value)}`;
        return { path, message: `"${field}" must be ${literals.map((v) => JSON.stringify(v)).join(' or ')}; ${found}.` };
      }
      return { path, message: `"${field}" is not valid: ${issue.message}.` };
    }
    case 'too_small':
    case 'too_big': {
      // Our own messages (set in the schema) already say what to do.
      if (!issue.message.startsWith('Too ')) return { path, message: `"${field}": ${issue.message}.` };
      const bound = issue.code === 'too_small' ? issue.minimum : issue.maximum;
      const word = issue.code === 'too_small' ? (issue.inclusive ? 'at least' : 'more than') : issue.inclusive ? 'at most' : 'less than';
      const what = issue.origin === 'array' ? 'items' : issue.origin === 'string' ? 'characters' : '';
      return { path, message: `"${field}" must be ${word} ${String(bound)}${what ? ` ${what}` : ''}.` };
    }
    case 'unrecognized_keys':
      return {
        path,
        message: `Unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => `"${k}"`).join(', ')}; check the spelling (names are case-sensitive).`,
      };
    default:
      return { path, message: issue.message };
  }
}

/** What the schema cannot check alone: unique ids, ends that exist and point the right way, load data. */
export function checkConsistency(p: Project): LoadError[] {
  const errors: LoadError[] = [];
  // Each node id's position (the last, should one repeat); the graph reuses it (./nodeIndex.ts).
  const nodeIndex = new Map<string, number>();
  // Where a node id repeated was first seen; empty for a valid file.
  const firstNode = new Map<string, number>();
  // Where each conductor or bus link id was first seen, as list * 1e7 + index; a path string is built only for an error.
  const seen = new Map<string, number>();
  // Each end's node position (-1 for none), kept for the graph with the index (./nodeIndex.ts).
  const ends = { from: new Int32Array(p.conductors.length), to: new Int32Array(p.conductors.length) };
  const linkEnds = { from: new Int32Array(p.busLinks.length), to: new Int32Array(p.busLinks.length) };
  const lists = ['nodes', 'conductors', 'busLinks'] as const;
  const pathOf = (list: number, i: number) => `${lists[list]}[${i}]`;
  const repeated = (id: string, first: string, list: number, i: number) => {
    errors.push({ path: `${pathOf(list, i)}.id`, message: `Id "${id}" is already used at ${first}; every id must be unique.` });
  };
  // Node ids come first, so an id used by a node is first seen at that node's first position.
  const firstNodeOf = (id: string): number | undefined => (firstNode.size === 0 ? nodeIndex.get(id) : (firstNode.get(id) ?? nodeIndex.get(id)));
  const claim = (id: string, list: number, i: number) => {
    const node = firstNodeOf(id);
    if (node !== undefined) {
      repeated(id, pathOf(0, node), list, i);
      return;
    }
    const first = seen.get(id);
    if (first === undefined) seen.set(id, list * 1e7 + i);
    else repeated(id, pathOf(Math.floor(first / 1e7), first % 1e7), list, i);
  };
  for (let i = 0; i < p.nodes.length; i++) {
    const n = p.nodes[i]!;
    const before = nodeIndex.get(n.id);
    if (before !== undefined) {
      const first = firstNode.get(n.id) ?? before;
      firstNode.set(n.id, first);
      repeated(n.id, pathOf(0, first), 0, i);
    }
    nodeIndex.set(n.id, i);
    if (n.kind === 'load' && n.motor && n.motor.hp === undefined && n.motor.fullLoadA === undefined) {
      errors.push({ path: `nodes[${i}].motor.hp`, message: 'A motor needs its horsepower ("hp", for Tables 430.248/430.250) or its nameplate full-load current ("fullLoadA").' });
    } else if (n.kind === 'load' && n.motor && n.hvac) {
      errors.push({ path: `nodes[${i}].hvac`, message: 'A load is either a motor ("motor") or air-conditioning equipment with a nameplate MCA and MOP ("hvac"), not both.' });
    } else if (n.kind === 'load' && n.hvac && n.hvac.mopA < n.hvac.mcaA) {
      errors.push({ path: `nodes[${i}].hvac.mopA`, message: 'The nameplate maximum overcurrent device (MOP) is never below the minimum circuit ampacity (MCA); check the two values.' });
    } else if (n.kind === 'load' && !n.motor && !n.hvac) {
      const given = (n.currentA === undefined ? 0 : 1) + (n.kva === undefined ? 0 : 1);
      if (given !== 1) {
        errors.push({
          path: `nodes[${i}].${n.currentA === undefined ? 'currentA' : 'kva'}`,
          message: given === 0 ? 'A load needs its current ("currentA") or its apparent power ("kva").' : 'Give either "currentA" or "kva" for a load, not both.',
        });
      }
    }
    if (n.kind === 'breaker' && n.adjustableTrip && n.adjustableTrip.longTimeSettingA > n.adjustableTrip.maxSettingA) {
      errors.push({ path: `nodes[${i}].adjustableTrip.longTimeSettingA`, message: 'The long-time setting cannot exceed the maximum setting.' });
    }
  }
  const checkEnds = (e: { id: string; from: string; to: string }, list: number, i: number, at: { from: Int32Array; to: Int32Array }) => {
    claim(e.id, list, i);
    const from = (at.from[i] = nodeIndex.get(e.from) ?? -1);
    const to = (at.to[i] = nodeIndex.get(e.to) ?? -1);
    const fromKind = from < 0 ? undefined : p.nodes[from]!.kind;
    const toKind = to < 0 ? undefined : p.nodes[to]!.kind;
    if (fromKind !== undefined && toKind !== undefined && e.from !== e.to && fromKind !== 'load' && toKind !== 'utility' && toKind !== 'generator') return;
    const path = pathOf(list, i);
    if (fromKind === undefined) errors.push({ path: `${path}.from`, message: `No equipment has the id "${e.from}"; connect the supply end to existing equipment.` });
    if (toKind === undefined) errors.push({ path: `${path}.to`, message: `No equipment has the id "${e.to}"; connect the load end to existing equipment.` });
    if (e.from === e.to) errors.push({ path: `${path}.to`, message: 'Both ends are the same equipment; a connection must join two different items.' });
    if (fromKind === 'load') errors.push({ path: `${path}.from`, message: `"${e.from}" is a load, which supplies nothing; draw the connection from the supply side.` });
    if (toKind === 'utility' || toKind === 'generator') {
      errors.push({ path: `${path}.to`, message: `"${e.to}" is a source and has no line side; draw the connection from it, not to it.` });
    }
  };
  for (let i = 0; i < p.conductors.length; i++) checkEnds(p.conductors[i]!, 1, i, ends);
  for (let i = 0; i < p.busLinks.length; i++) checkEnds(p.busLinks[i]!, 2, i, linkEnds);
  if (errors.length === 0) {
    rememberNodeIndex(p.nodes, nodeIndex);
    rememberEdgeEnds(p.conductors, nodeIndex, ends.from, ends.to);
    rememberEdgeEnds(p.busLinks, nodeIndex, linkEnds.from, linkEnds.to);
  }
  return errors;
}
