import type { z } from 'zod';
import { CONDUCTOR_SIZES, project, type Project } from './schema';
import { migrateToCurrent } from './migrations';
import { compileSchema, FAIL } from './fastParse';

const fastProject = compileSchema(project);
import type { LoadError } from '../analyze/types';

export type LoadResult =
  | { ok: true; project: Project; notices: string[] }
  | { ok: false; errors: LoadError[] };

/** Most errors worth listing at once; past that the file is wrong wholesale. */
const MAX_ERRORS = 50;

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
  const migrated = migrateToCurrent(raw as Record<string, unknown>);
  if (!migrated.ok) return fail(migrated.errors);

  const notices = migrated.migratedFrom === null ? [] : [`Upgraded from file version ${migrated.migratedFrom}.`];
  // The compiled validator answers for valid files; zod is asked only to explain a failure.
  let data = fastProject(migrated.value) as Project | typeof FAIL;
  if (data === FAIL) {
    let parsed = project.safeParse(migrated.value);
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
    if (!parsed.success) return fail(parsed.error.issues.slice(0, MAX_ERRORS).map(issueToError));
    data = parsed.data;
  }

  const errors = checkConsistency(data);
  if (errors.length > 0) return fail(errors.slice(0, MAX_ERRORS));
  return { ok: true, project: data, notices };
}

function fail(errors: LoadError[]): LoadResult {
  return { ok: false, errors };
}

function describe(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  return `a ${typeof v}`;
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

function issueToError(issue: z.core.$ZodIssue): LoadError {
  const path = formatPath(issue.path);
  const field = String(issue.path[issue.path.length - 1] ?? 'value');
  switch (issue.code) {
    case 'invalid_type':
      return {
        path,
        message:
          issue.input === undefined
            ? `"${field}" is required (${issue.expected}).`
            : `"${field}" must be a ${issue.expected}; found ${describe(issue.input)}.`,
      };
    case 'invalid_value': {
      const values = field === 'size' ? CONDUCTOR_SIZES : issue.values;
      return { path, message: `"${field}" must be one of ${values.map((v) => JSON.stringify(v)).join(', ')}.` };
    }
    case 'invalid_union': {
      if ('options' in issue && Array.isArray(issue.options)) {
        return { path, message: `"${field}" must be one of ${issue.options.map((v) => JSON.stringify(v)).join(', ')}.` };
      }
      const literals = issue.errors.flat().flatMap((e) => (e.code === 'invalid_value' ? e.values : []));
      if (literals.length > 0) {
        return { path, message: `"${field}" must be ${literals.map((v) => JSON.stringify(v)).join(' or ')}.` };
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
  const kindById = new Map<string, string>();
  // Where each id was first seen, as (list, index); a path string is built only for an error.
  const seen = new Map<string, number>();
  const lists = ['nodes', 'conductors', 'busLinks'] as const;
  const pathOf = (list: number, i: number) => `${lists[list]}[${i}]`;
  const claim = (id: string, list: number, i: number) => {
    const first = seen.get(id);
    if (first === undefined) seen.set(id, list * 1e7 + i);
    else {
      const at = pathOf(Math.floor(first / 1e7), first % 1e7);
      errors.push({ path: `${pathOf(list, i)}.id`, message: `Id "${id}" is already used at ${at}; every id must be unique.` });
    }
  };
  for (let i = 0; i < p.nodes.length; i++) {
    const n = p.nodes[i]!;
    claim(n.id, 0, i);
    kindById.set(n.id, n.kind);
    if (n.kind === 'load') {
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
  const checkEnds = (e: { id: string; from: string; to: string }, list: number, i: number) => {
    claim(e.id, list, i);
    const fromKind = kindById.get(e.from);
    const toKind = kindById.get(e.to);
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
  for (let i = 0; i < p.conductors.length; i++) checkEnds(p.conductors[i]!, 1, i);
  for (let i = 0; i < p.busLinks.length; i++) checkEnds(p.busLinks[i]!, 2, i);
  return errors;
}
