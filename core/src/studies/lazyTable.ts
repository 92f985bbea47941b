/**
 * The studies' report tables (a row per node, a row per conductor) built when a report first reads
 * them. A large drawing's analysis is mostly read for its verdicts and findings; building 100 000
 * row objects up front cost more than the studies themselves. The rows are built from the study
 * arrays (FaultStudy, VoltageDropStudy), which an incremental re-check changes in place
 * (analyze/incremental.ts): every function that does so calls `settleTables` on the study first,
 * so a report keeps the figures of the analysis that made it, whenever it is read.
 */

/** The tables still to build from each study, by the study they read. */
const pending = new WeakMap<object, (() => unknown)[]>();

/**
 * Puts on `owner[key]` (an own, enumerable property, so JSON, spreading and deep equality see it
 * like any other) a table built by `build` when first read; writing it replaces the table.
 * `reads` are the studies `build` reads.
 */
export function lazyTable<O extends object, K extends keyof O & string>(owner: O, key: K, build: () => O[K], reads: readonly object[]): void {
  let rows: O[K] | undefined;
  const get = (): O[K] => (rows ??= build());
  Object.defineProperty(owner, key, {
    enumerable: true,
    configurable: true,
    get,
    set: (value: O[K]) => {
      rows = value;
    },
  });
  for (const study of reads) {
    const list = pending.get(study);
    if (list) list.push(get);
    else pending.set(study, [get]);
  }
}

/** Builds every table not yet read that reads `study`: call before changing the study in place. */
export function settleTables(study: object): void {
  const list = pending.get(study);
  if (!list) return;
  pending.delete(study);
  for (const get of list) get();
}
