/** What a file holds where a message points, in a few words: `string "100"`, `number 5`, `boolean true`, `null`, `an array`. */
export function foundText(v: unknown): string {
  if (v === null || v === undefined) return String(v);
  if (typeof v === 'string') return `string ${JSON.stringify(v.length > 40 ? `${v.slice(0, 39)}…` : v)}`;
  if (typeof v === 'number' || typeof v === 'boolean') return `${typeof v} ${String(v)}`;
  if (Array.isArray(v)) return 'an array';
  return typeof v === 'object' ? 'an object' : typeof v;
}
