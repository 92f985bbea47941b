/**
 * A seeded mutator of project files for the fuzz harness: the same (seed, index) always gives the same
 * input, so a failure found by a long run is replayed by its numbers. The mutations follow what broke
 * the loader and the reports before: wrong types, missing keys, huge and far coordinates, duplicated and
 * dangling ids, deep nesting, pieces stacked at one point, hostile text (formulas, terminal escapes, bidi
 * overrides, CJK and emoji, very long names) and plain damage to the JSON text.
 */

/** The seeded generator of the benchmark's networks (mulberry32), so one seed means one input everywhere. */
import { prng as rng } from '../../core/bench/generateProject';

export { rng };

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type Rand = () => number;

const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;

export const HOSTILE_TEXT: readonly string[] = [
  '=HYPERLINK("http://example.invalid/x","click")',
  '+cmd|\' /C calc\'!A0',
  '-2+3',
  '@SUM(A1:A9)',
  '\t=1+1',
  '\r=1+1',
  'ok\x1b[8m hidden\x1b[0m',
  'two\nlines\r\nC9  forged',
  'LP-3 \u202Eevil\u202C tail',
  '\u2067isolate',
  '配電盤 第一',
  '⚡🔌 panel 🏭',
  'x'.repeat(200),
  'Ä'.repeat(150) + ' end',
  '',
  ' ',
  '\u0000nul',
  '"quoted", with comma',
];

const NUMBERS: readonly number[] = [0, -1, 1, 0.5, 1e9, -1e9, 1e308, -1e308, 5e-324, 2 ** 53, 13800, 600, 99999];

function hostileValue(r: Rand, old: Json): Json {
  switch (Math.floor(r() * 9)) {
    case 0:
      return typeof old === 'number' ? String(old) : typeof old === 'string' ? Number(old) || 7 : '100';
    case 1:
      return null;
    case 2:
      return pick(r, [true, false]);
    case 3:
      return [];
    case 4:
      return {};
    case 5:
      return pick(r, NUMBERS);
    case 6:
      return pick(r, HOSTILE_TEXT);
    case 7: {
      // Nesting around the limit: 60 levels pass the depth check, 70 do not.
      let v: Json = 1;
      for (let i = 0, n = pick(r, [10, 60, 70, 3000]); i < n; i++) v = [v];
      return v;
    }
    default:
      return typeof old === 'number' ? old * pick(r, [-1, 10, 1e6, 0.001]) : pick(r, NUMBERS);
  }
}

/** Every container in the tree with a way to reach it, for picking one at random. */
function containers(root: Json): (Json[] | { [k: string]: Json })[] {
  const out: (Json[] | { [k: string]: Json })[] = [];
  const stack: Json[] = [root];
  while (stack.length > 0) {
    const v = stack.pop()!;
    if (v && typeof v === 'object') {
      out.push(v);
      for (const x of Array.isArray(v) ? v : Object.values(v)) if (x && typeof x === 'object') stack.push(x);
    }
  }
  return out;
}

function list(p: Json, key: string): { [k: string]: Json }[] {
  const v = p && typeof p === 'object' && !Array.isArray(p) ? p[key] : undefined;
  return Array.isArray(v) ? (v.filter((x) => x && typeof x === 'object' && !Array.isArray(x)) as { [k: string]: Json }[]) : [];
}

const OPS = ['set', 'set', 'set', 'delete', 'label', 'label', 'far', 'stack', 'parallel', 'dup', 'rename', 'swap', 'text'] as const;
export type MutationOp = (typeof OPS)[number];

/** Applies one to three mutations to a copy of `base`; returns the file text and what was done. */
export function mutate(base: Json, r: Rand, scale = 1): { text: string; ops: MutationOp[] } {
  const p = structuredClone(base);
  const ops: MutationOp[] = [];
  let textDamage = false;
  for (let k = 0, n = 1 + Math.floor(r() * 3); k < n; k++) {
    const op = pick(r, OPS);
    ops.push(op);
    const nodes = list(p, 'nodes');
    const conductors = list(p, 'conductors');
    switch (op) {
      case 'set': {
        const c = pick(r, containers(p));
        if (Array.isArray(c)) {
          if (c.length > 0) {
            const i = Math.floor(r() * c.length);
            c[i] = hostileValue(r, c[i]!);
          }
        } else {
          const keys = Object.keys(c);
          const key = keys.length > 0 && r() < 0.85 ? pick(r, keys) : pick(r, ['notes', 'lenghtFt', '$schema', 'extra']);
          c[key] = hostileValue(r, c[key] ?? null);
        }
        break;
      }
      case 'delete': {
        const c = pick(r, containers(p));
        if (Array.isArray(c)) c.splice(Math.floor(r() * c.length), 1);
        else {
          const keys = Object.keys(c);
          if (keys.length > 0) delete c[pick(r, keys)];
        }
        break;
      }
      case 'label': {
        const target = pick(r, [...nodes, ...conductors, ...(p && typeof p === 'object' && !Array.isArray(p) && p.project && typeof p.project === 'object' && !Array.isArray(p.project) ? [p.project] : [])]);
        if (target) target[target === (p as { project?: Json }).project ? pick(r, ['name', 'preparedBy']) : pick(r, ['label', 'label', 'id'])] = pick(r, HOSTILE_TEXT);
        break;
      }
      case 'far': {
        const n = pick(r, nodes);
        if (n) n.position = { x: pick(r, [1e9, -1e9, 1e308, 0, 5e5]), y: pick(r, [-1e308, 1e308, -1e9, 0, 5e5]) };
        break;
      }
      case 'stack': {
        // Many pieces at one point, each fed from a piece of the original (a breaker under a random node).
        const count = Math.round(pick(r, [20, 200, 600]) * scale);
        const parent = pick(r, nodes.filter((n) => n.kind !== 'load'));
        if (!parent || !Array.isArray((p as { conductors?: Json }).conductors)) break;
        for (let i = 0; i < count; i++) {
          nodes.push({ id: `FZ-N${i}`, kind: 'breaker', ratingA: 100, position: { x: 10, y: 10 } });
          (p as { nodes: Json[] }).nodes.push(nodes[nodes.length - 1]!);
          (p as { conductors: Json[] }).conductors.push({ id: `FZ-C${i}`, from: parent.id as Json, to: `FZ-N${i}`, size: '3', lengthFt: 10 });
        }
        break;
      }
      case 'parallel': {
        const c = pick(r, conductors);
        if (!c || !Array.isArray((p as { conductors?: Json }).conductors)) break;
        const count = Math.round(pick(r, [20, 200, 600]) * scale);
        for (let i = 0; i < count; i++) (p as { conductors: Json[] }).conductors.push({ ...c, id: `FZ-P${i}` });
        break;
      }
      case 'dup': {
        const arr = pick(r, [list(p, 'nodes'), list(p, 'conductors')]);
        const x = pick(r, arr);
        if (x) (p as { [k: string]: Json[] })[arr === nodes ? 'nodes' : 'conductors']?.push(structuredClone(x));
        break;
      }
      case 'rename': {
        const n = pick(r, nodes);
        if (n) n.id = pick(r, ['', 'X', `${String(n.id)}-renamed`, pick(r, HOSTILE_TEXT)]);
        break;
      }
      case 'swap': {
        const c = pick(r, conductors);
        if (c) [c.from, c.to] = [c.to!, c.from!];
        break;
      }
      case 'text':
        textDamage = true;
        break;
    }
  }
  let text = JSON.stringify(p, null, r() < 0.5 ? 2 : undefined);
  if (textDamage) {
    const at = Math.floor(r() * text.length);
    text = pick(r, [
      () => text.slice(0, at),
      () => text.slice(0, at) + pick(r, ['"', ',', '}', ']', '\\', '\u0000', 'ÿ']) + text.slice(at),
      () => text.slice(0, at) + text.slice(at + 1),
    ])();
  }
  return { text, ops };
}

/** The input number `index` of the run seeded `seed`, over the given bases. */
export function inputAt(bases: readonly Json[], seed: number, index: number, scale = 1): { text: string; ops: MutationOp[]; base: number } {
  const r = rng((seed * 0x9e3779b1 + index * 0x85ebca6b) >>> 0);
  const base = Math.floor(r() * bases.length);
  return { ...mutate(bases[base]!, r, scale), base };
}

export type { Json };
