import type { z } from 'zod';

/**
 * A validator compiled from our own zod schema, for the common case of a
 * valid file. zod remains the single source of truth: this walks the schema's
 * definition once and builds plain closures for the few constructs the
 * project schema uses, so a 10 000-conductor file validates several times
 * faster. Any failure returns FAIL and the caller asks zod again, which
 * produces the error messages; an unsupported construct throws at compile
 * time, so a schema change cannot slip past unvalidated.
 * test/core/model/fastParse.test.ts checks it agrees with zod on valid and broken inputs.
 */
export const FAIL: unique symbol = Symbol('invalid');
export type Validator = (value: unknown) => unknown;

interface Def {
  type: string;
  checks?: { _zod: { def: CheckDef } }[];
  shape?: Record<string, { _zod: { def: Def } }>;
  catchall?: { _zod: { def: Def } };
  innerType?: { _zod: { def: Def } };
  element?: { _zod: { def: Def } };
  options?: { _zod: { def: Def } }[];
  discriminator?: string;
  entries?: Record<string, string | number>;
  values?: unknown[];
  defaultValue?: unknown;
}

interface CheckDef {
  check: string;
  value?: number;
  inclusive?: boolean;
  minimum?: number;
  maximum?: number;
  format?: string;
}

/**
 * The validator of `schema`. Its object checks are written out as code where the runtime allows it
 * (see generateObject); `generate: false` keeps the closures, the editor's path, so tests can hold
 * both to zod.
 */
export function compileSchema(schema: z.ZodType, options: { generate?: boolean } = {}): Validator {
  const before = generating;
  generating = options.generate ?? canGenerate();
  try {
    return compile((schema as unknown as { _zod: { def: Def } })._zod.def);
  } finally {
    generating = before;
  }
}

/** Whether the compileSchema call under way writes object checks out as code. */
let generating = false;

/**
 * How deep a value the compiled validator accepts can nest (the root object is level 0, its values
 * level 1, and so on): it accepts nothing but the schema's own objects and arrays, so a value it
 * accepts is never deeper than the schema. The load step relies on this to skip its depth check
 * on a valid file.
 */
export function schemaDepth(schema: z.ZodType): number {
  return depthOf((schema as unknown as { _zod: { def: Def } })._zod.def);
}

function depthOf(def: Def): number {
  switch (def.type) {
    case 'optional':
    case 'default':
      return depthOf(def.innerType!._zod.def);
    case 'array':
      return 1 + depthOf(def.element!._zod.def);
    case 'object':
      return 1 + Math.max(0, ...Object.values(def.shape!).map((f) => depthOf(f._zod.def)));
    case 'union':
      return Math.max(0, ...def.options!.map((o) => depthOf(o._zod.def)));
    default:
      return 0;
  }
}

function compile(def: Def): Validator {
  switch (def.type) {
    case 'string': {
      const lengthOk = lengthChecks(def);
      return (v) => (typeof v === 'string' && lengthOk(v.length) ? v : FAIL);
    }
    case 'number': {
      const ok = numberChecks(def);
      return (v) => (typeof v === 'number' && Number.isFinite(v) && ok(v) ? v : FAIL);
    }
    case 'boolean':
      return (v) => (typeof v === 'boolean' ? v : FAIL);
    case 'enum': {
      const allowed = new Set(Object.values(def.entries ?? {}));
      return (v) => (allowed.has(v as string) ? v : FAIL);
    }
    case 'literal': {
      const allowed = new Set(def.values ?? []);
      return (v) => (allowed.has(v) ? v : FAIL);
    }
    case 'optional': {
      const inner = compile(def.innerType!._zod.def);
      return (v) => (v === undefined ? undefined : inner(v));
    }
    case 'default': {
      const inner = compile(def.innerType!._zod.def);
      // zod's defaultValue is a getter that clones; a primitive default is read once.
      const once = def.defaultValue;
      if (once === null || (typeof once !== 'object' && typeof once !== 'function')) return (v) => (v === undefined ? once : inner(v));
      return (v) => (v === undefined ? fresh(def.defaultValue) : inner(v));
    }
    case 'array': {
      const element = compile(def.element!._zod.def);
      const lengthOk = lengthChecks(def);
      return (v) => {
        if (!Array.isArray(v) || !lengthOk(v.length)) return FAIL;
        const out = new Array(v.length);
        for (let i = 0; i < v.length; i++) {
          const r = element(v[i]);
          if (r === FAIL) return FAIL;
          out[i] = r;
        }
        return out;
      };
    }
    case 'object':
      return compileObject(def);
    case 'union':
      return def.discriminator ? compileDiscriminated(def) : compileUnion(def);
    default:
      throw new Error(`fastParse: zod type "${def.type}" is not supported; extend compile() or drop the fast path`);
  }
}

function compileObject(def: Def): Validator {
  const keys = Object.keys(def.shape!);
  const fields = keys.map((k) => compile(def.shape![k]!._zod.def));
  const known = new Set(keys);
  const strict = def.catchall?._zod.def.type === 'never';
  if (def.catchall && !strict) throw new Error('fastParse: only strict or plain objects are supported');
  return (generating ? generateObject(keys, fields, known, strict) : null) ?? objectValidator(keys, fields, known, strict);
}

/** The object validator as a closure over the schema's keys. */
function objectValidator(keys: readonly string[], fields: readonly Validator[], known: ReadonlySet<string>, strict: boolean): Validator {
  return (v) => {
    if (typeof v !== 'object' || v === null || Array.isArray(v)) return FAIL;
    const input = v as Record<string, unknown>;
    if (strict) for (const k in input) if (!known.has(k)) return FAIL;
    const out: Record<string, unknown> = {};
    for (let i = 0; i < keys.length; i++) {
      const k = keys[i]!;
      const r = fields[i]!(input[k]);
      if (r === FAIL) return FAIL;
      // Like zod: an absent optional key stays absent.
      if (r !== undefined || k in input) out[k] = r;
    }
    return out;
  };
}

/**
 * The same validator as objectValidator, written out as code with each key by name where the
 * runtime allows it (not under a Content Security Policy without 'unsafe-eval', as in the editor:
 * null there, and the closure serves). One closure shared by every object of the schema reads and
 * writes its keys by a variable name, which the engine cannot specialise; each generated function
 * reads one object's keys, which it can, so a large file validates several times faster. Only the
 * schema's own key names go into the code, each as a JSON string literal.
 */
function generateObject(keys: readonly string[], fields: readonly Validator[], known: ReadonlySet<string>, strict: boolean): Validator | null {
  const lines: string[] = [];
  keys.forEach((k, i) => {
    const key = JSON.stringify(k);
    lines.push(`x = v[${key}]; r = f[${i}](x); if (r === FAIL) return FAIL; if (r !== undefined || ${key} in v) out[${key}] = r;`);
  });
  const strictCheck = strict ? 'for (const k in v) if (!known.has(k)) return FAIL;' : '';
  const body = `return function (v) {
  if (typeof v !== 'object' || v === null || Array.isArray(v)) return FAIL;
  ${strictCheck}
  const out = {};
  let x, r;
  ${lines.join('\n  ')}
  return out;
};`;
  try {
    return new Function('f', 'FAIL', 'known', body)(fields, FAIL, known) as Validator;
  } catch {
    return null;
  }
}

let generates: boolean | undefined;
function canGenerate(): boolean {
  if (generates === undefined) {
    // A page (the editor) ships a policy without 'unsafe-eval': it is not asked, so no violation is reported.
    if ((globalThis as { document?: unknown }).document !== undefined) return (generates = false);
    try {
      generates = typeof new Function('return 1') === 'function';
    } catch {
      generates = false;
    }
  }
  return generates;
}

function compileDiscriminated(def: Def): Validator {
  const key = def.discriminator!;
  const byTag = new Map<unknown, Validator>();
  for (const option of def.options!) {
    const tag = option._zod.def.shape![key]!._zod.def;
    if (tag.type !== 'literal') throw new Error('fastParse: a discriminator must be a literal');
    const validate = compile(option._zod.def);
    for (const value of tag.values ?? []) byTag.set(value, validate);
  }
  return (v) => {
    if (typeof v !== 'object' || v === null) return FAIL;
    const validate = byTag.get((v as Record<string, unknown>)[key]);
    return validate ? validate(v) : FAIL;
  };
}

function compileUnion(def: Def): Validator {
  const options = def.options!.map((o) => compile(o._zod.def));
  return (v) => {
    for (const option of options) {
      const r = option(v);
      if (r !== FAIL) return r;
    }
    return FAIL;
  };
}

function lengthChecks(def: Def): (n: number) => boolean {
  let min = 0;
  let max = Number.POSITIVE_INFINITY;
  for (const c of def.checks ?? []) {
    const d = c._zod.def;
    if (d.check === 'min_length') min = Math.max(min, d.minimum!);
    else if (d.check === 'max_length') max = Math.min(max, d.maximum!);
    else throw new Error(`fastParse: length check "${d.check}" is not supported`);
  }
  return (n) => n >= min && n <= max;
}

function numberChecks(def: Def): (x: number) => boolean {
  const tests: ((x: number) => boolean)[] = [];
  for (const c of def.checks ?? []) {
    const d = c._zod.def;
    const bound = d.value!;
    if (d.check === 'greater_than') tests.push(d.inclusive ? (x) => x >= bound : (x) => x > bound);
    else if (d.check === 'less_than') tests.push(d.inclusive ? (x) => x <= bound : (x) => x < bound);
    else if (d.check === 'number_format' && (d.format === 'safeint' || d.format === 'int32')) tests.push(Number.isSafeInteger);
    else throw new Error(`fastParse: number check "${d.check}" is not supported`);
  }
  return (x) => {
    for (const t of tests) if (!t(x)) return false;
    return true;
  };
}

function fresh(value: unknown): unknown {
  return Array.isArray(value) ? [...value] : value !== null && typeof value === 'object' ? { ...value } : value;
}
