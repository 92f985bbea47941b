/**
 * `npm run bench`: load + analyze time and heap on synthetic one-lines of
 * 1 000, 10 000 and 100 000 conductors (core/bench/generateProject.ts), next to
 * a bare traversal of the same network as the floor. Prints figures only:
 * nothing here passes or fails on time.
 *
 * Per size: warm-up runs, then timed runs; medians are reported.
 *   load     = JSON.parse of the file text + loadProject (schema, defaults, references)
 *   analyze  = analyze(project)
 *   floor    = JSON.parse + id → index maps + an upstream walk from every conductor
 *              over plain arrays until the first OCPD, transformer or source: the
 *              least work any classifier of this file must do.
 * Heap: with gc exposed (turned on below through v8 flags, no command-line switch
 * needed), the heap is collected before each size, then one extra untimed run holds
 * text, parsed JSON, project and report alive and samples heapUsed after each stage;
 * the largest sample minus the baseline is reported as "peak heap". It is a lower
 * bound of the true peak (garbage made between samples is not seen); the process's
 * peak RSS (resourceUsage().maxRSS, whole run, all sizes) is printed as well.
 */
import { cpus, loadavg } from 'node:os';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { analyze, loadProject } from '../src/index';
import { generateProject } from './generateProject';

setFlagsFromString('--expose-gc');
const gc = runInNewContext('gc') as (() => void) | undefined;

const SIZES = [
  { conductors: 1_000, warmup: 5, runs: 25 },
  { conductors: 10_000, warmup: 5, runs: 15 },
  { conductors: 100_000, warmup: 2, runs: 7 },
];

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};
const ms = (t0: bigint, t1: bigint) => Number(t1 - t0) / 1e6;
const round = (x: number, digits = 2) => Math.round(x * 10 ** digits) / 10 ** digits;
const mb = (bytes: number) => round(bytes / 2 ** 20, 1);

const SUPPLY_KINDS = new Set(['breaker', 'fuse', 'transformer', 'utility', 'generator']);

interface RawFile {
  nodes: { id: string; kind: string }[];
  conductors: { from: string; to: string }[];
  busLinks?: { from: string; to: string }[];
}

/** The floor: parse, index, walk up from every conductor. Returns a checksum so nothing is optimized away. */
function bareTraversal(text: string): number {
  const file = JSON.parse(text) as RawFile;
  const n = file.nodes.length;
  const index = new Map<string, number>();
  const isSupply = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const node = file.nodes[i]!;
    index.set(node.id, i);
    if (SUPPLY_KINDS.has(node.kind)) isSupply[i] = 1;
  }
  // One feeding node per node (radial system): conductors and bus links alike.
  const feeder = new Int32Array(n).fill(-1);
  const fromIndex = new Int32Array(file.conductors.length);
  file.conductors.forEach((c, k) => {
    const from = index.get(c.from)!;
    fromIndex[k] = from;
    feeder[index.get(c.to)!] = from;
  });
  for (const l of file.busLinks ?? []) feeder[index.get(l.to)!] = index.get(l.from)!;
  let checksum = 0;
  for (let k = 0; k < fromIndex.length; k++) {
    let at = fromIndex[k]!;
    for (let guard = 0; !isSupply[at] && feeder[at]! >= 0 && guard < n; guard++) at = feeder[at]!;
    checksum += at;
  }
  return checksum;
}

interface SizeResult {
  conductors: number;
  nodes: number;
  fileMB: number;
  runs: number;
  loadMs: number;
  analyzeMs: number;
  totalMs: number;
  floorMs: number;
  ratioToFloor: number;
  peakHeapMB: number;
  verdicts: Record<string, number>;
}

function measure({ conductors, warmup, runs }: (typeof SIZES)[number]): SizeResult {
  const input = generateProject({ conductors, seed: 1 });
  const text = JSON.stringify(input);
  const once = () => {
    const t0 = process.hrtime.bigint();
    const loaded = loadProject(JSON.parse(text));
    const t1 = process.hrtime.bigint();
    if (!loaded.ok) throw new Error(`synthetic project refused: ${JSON.stringify(loaded.errors.slice(0, 3))}`);
    const report = analyze(loaded.project);
    const t2 = process.hrtime.bigint();
    return { load: ms(t0, t1), analyze: ms(t1, t2), total: ms(t0, t2), report };
  };
  const floorOnce = () => {
    const t0 = process.hrtime.bigint();
    bareTraversal(text);
    return ms(t0, process.hrtime.bigint());
  };

  for (let i = 0; i < warmup; i++) {
    once();
    floorOnce();
  }
  const load: number[] = [];
  const analyzeT: number[] = [];
  const total: number[] = [];
  const floor: number[] = [];
  for (let i = 0; i < runs; i++) {
    // Alternate so drift in machine load hits both the same way.
    floor.push(floorOnce());
    const run = once();
    load.push(run.load);
    analyzeT.push(run.analyze);
    total.push(run.total);
  }

  // Heap: collect, then hold every stage's result alive and sample after each.
  gc?.();
  const base = process.memoryUsage().heapUsed;
  const held: unknown[] = [];
  let peak = 0;
  const sample = () => (peak = Math.max(peak, process.memoryUsage().heapUsed - base));
  const parsed = JSON.parse(text);
  held.push(parsed);
  sample();
  const loaded = loadProject(parsed);
  held.push(loaded);
  sample();
  if (loaded.ok) held.push(analyze(loaded.project));
  sample();
  const report = held[2] as ReturnType<typeof analyze>;
  const verdicts = Object.fromEntries(Object.entries(report.counts.byVerdict).filter(([, v]) => v > 0));
  held.length = 0;

  const medTotal = median(total);
  const medFloor = median(floor);
  return {
    conductors,
    nodes: input.nodes.length,
    fileMB: mb(text.length),
    runs,
    loadMs: round(median(load)),
    analyzeMs: round(median(analyzeT)),
    totalMs: round(medTotal),
    floorMs: round(medFloor),
    ratioToFloor: round(medTotal / medFloor, 1),
    peakHeapMB: mb(peak),
    verdicts,
  };
}

const pad = (s: string | number, w: number) => String(s).padStart(w);
const load = () => loadavg().map((x) => round(x, 1));
console.log(`Linewright core benchmark, node ${process.version}, ${cpus().length} CPUs, load average ${load().join(' ')} at start, ${gc ? 'gc exposed' : 'gc NOT exposed: heap figures are rough'}`);
console.log('a load average above the CPU count means other work shares the machine: figures are then upper bounds');
console.log('medians of timed runs after warm-up; times in ms; load = JSON.parse + loadProject');
console.log(['conductors', 'nodes', 'file MB', 'runs', 'load', 'analyze', 'load+analyze', 'floor', 'ratio', 'peak heap MB'].map((h, i) => pad(h, [10, 8, 8, 5, 9, 9, 13, 8, 6, 13][i]!)).join(' '));
const results: SizeResult[] = [];
for (const size of SIZES) {
  const r = measure(size);
  results.push(r);
  console.log(
    [r.conductors, r.nodes, r.fileMB, r.runs, r.loadMs, r.analyzeMs, r.totalMs, r.floorMs, r.ratioToFloor, r.peakHeapMB]
      .map((v, i) => pad(v, [10, 8, 8, 5, 9, 9, 13, 8, 6, 13][i]!))
      .join(' '),
  );
}
const at = (n: number) => results.find((r) => r.conductors === n)!;
const growth10kTo100k = round(at(100_000).totalMs / at(10_000).totalMs, 1);
const maxRssMB = round(process.resourceUsage().maxRSS / 1024, 0);
console.log(`growth 10k -> 100k conductors: x${growth10kTo100k} (x10 is linear); process peak RSS ${maxRssMB} MB`);
for (const r of results) console.log(`verdicts at ${r.conductors}: ${JSON.stringify(r.verdicts)}`);
console.log(JSON.stringify({ node: process.version, cpus: cpus().length, loadAverageAtEnd: load(), gcExposed: Boolean(gc), sizes: results, growth10kTo100k, maxRssMB }));
