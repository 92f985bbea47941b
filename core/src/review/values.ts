/** Structural equality of plain JSON values; key order does not matter. */
export function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a)) {
    const bb = b as unknown[];
    return a.length === bb.length && a.every((x, i) => sameValue(x, bb[i]));
  }
  const ao = a as Record<string, unknown>;
  const bo = b as Record<string, unknown>;
  const keys = new Set([...Object.keys(ao), ...Object.keys(bo)]);
  for (const k of keys) {
    if (ao[k] === undefined && bo[k] === undefined) continue;
    if (!sameValue(ao[k], bo[k])) return false;
  }
  return true;
}

/** Leaves of a plain object by dotted path: { highBay: { horizontalFt: 3 } } → [['highBay.horizontalFt', 3]]. */
export function leaves(value: unknown, prefix = '', out = new Map<string, unknown>()): Map<string, unknown> {
  if (typeof value === 'object' && value !== null && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value)) if (v !== undefined) leaves(v, prefix ? `${prefix}.${k}` : k, out);
  } else if (prefix) out.set(prefix, value);
  return out;
}
