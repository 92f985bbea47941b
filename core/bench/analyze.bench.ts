/**
 * `npm run bench`: analysis speed and heap on synthetic one-lines of 1 000, 10 000 and 100 000
 * conductors (core/bench/generateProject.ts), beside the true floor of that work, and the
 * whole-process time of the `linewright` command on a sample. Prints figures only: nothing here
 * passes or fails on time.
 *
 * Compiled as shipped: `npm run bench` (scripts/bench.mjs) bundles this file and the core it
 * imports with esbuild and no keepNames, as the CLI and the web build bundle core, then runs the
 * bundle. Run directly under tsx (`npx tsx core/bench/analyze.bench.ts`) it times core as tsx
 * compiles it (keepNames: every function made at run time is also named by a call), slower; the
 * first printed line and the JSON's `compiledBy` say which.
 *
 * Per size: warm-up runs, then timed runs; medians are reported. Nothing of an earlier run is held
 * while one runs but the first run's project, which the floor reads.
 *   parse     = JSON.parse of the file text
 *   load      = loadProject (schema, defaults, references) of the parsed file
 *   analyze   = analyze(project)
 *   pipeline  = parse + load + analyze, one after the other (what a check of the file costs)
 *   floor     = over typed adjacency built beforehand (untimed: node and conductor indices, each
 *               node's supply-side neighbour, supply-to-load order), one pass that reads every field
 *               of every node and every conductor once and carries each node's nearest OCPD,
 *               transformer or source down the network so every conductor learns what supplies it:
 *               the least work any analysis that looks at all the data must do.
 *   ratio     = analyze ÷ floor
 *   JSON      = bytes per conductor of the compact JSON report (`--format json`, default detail)
 * Heap: with gc exposed (turned on below through v8 flags, no command-line switch needed), the
 * heap is collected before each size, then one extra untimed run holds text, parsed JSON, project
 * and report alive and samples heapUsed after each stage; the largest sample minus the baseline is
 * reported as "peak heap". It is a lower bound of the true peak (garbage made between samples is
 * not seen); the process's peak RSS (resourceUsage().maxRSS, whole run, all sizes) is printed too.
 * Re-check: a session (createAnalysis) on the 10 000-conductor network, then edits of one kind at a
 * time (the length of a branch circuit, a feeder, a tap or a transformer secondary changed by a foot;
 * a load's amperes by one; a breaker's rating 5 A up, then back), each a new project sharing every
 * other object, as an editor's immer edit does, each
 * timed through session.update();
 * per kind the median and 95th percentile, and how many ran the whole analysis.
 * CLI: the command is built from the current source first (scripts/build-cli.mjs), then
 * `node core/bin/linewright.mjs check samples/demo-clinic.json --format json` runs as a child
 * process; the median wall time of the runs is reported.
 */
import { spawnSync } from 'node:child_process';
import { cpus, loadavg } from 'node:os';
import { resolve } from 'node:path';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { analyze, conductor as conductorSchema, createAnalysis, equipmentNode, loadProject, toJsonReport, type Project } from '../src/index';
import { buildCli } from '../../scripts/build-cli.mjs';
import { generateProject } from './generateProject';
import { printStudiesBench } from './studies';

setFlagsFromString('--expose-gc');
const gc = runInNewContext('gc') as (() => void) | undefined;

/**
 * `npm run bench -- --sizes=10000` times only the sizes named (growth is then printed only when both
 * 10 000 and 100 000 ran); `--analyze-only` also leaves out the re-check, the CLI and the studies.
 * The default runs everything.
 */
const sizesArg = process.argv.find((a) => a.startsWith('--sizes='))?.slice('--sizes='.length);
const ANALYZE_ONLY = process.argv.includes('--analyze-only');
const ALL_SIZES = [
  { conductors: 1_000, warmup: 5, runs: 25 },
  { conductors: 10_000, warmup: 3, runs: 15 },
  { conductors: 100_000, warmup: 1, runs: 5 },
];
const SIZES = sizesArg ? ALL_SIZES.filter((x) => sizesArg.split(',').map(Number).includes(x.conductors)) : ALL_SIZES;
const CLI_RUNS = 9;
/** Set by scripts/bench.mjs when it bundles the bench; absent when a TypeScript loader runs it. */
const COMPILED_BY = process.env.LINEWRIGHT_BENCH_BUNDLED === 'esbuild' ? 'esbuild bundle, no keepNames (as shipped)' : 'TypeScript loader (tsx, keepNames)';

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};
const ms = (t0: bigint, t1: bigint) => Number(t1 - t0) / 1e6;
const round = (x: number, digits = 2) => Math.round(x * 10 ** digits) / 10 ** digits;
const mb = (bytes: number) => round(bytes / 2 ** 20, 1);

/** Kinds that end the upstream walk: what a conductor is judged against. */
const SUPPLY_KINDS = new Set(['breaker', 'fuse', 'transformer', 'utility', 'generator']);

/** Typed adjacency for the floor, built before the clock starts. */
interface Adjacency {
  nodes: readonly object[];
  conductors: readonly object[];
  /** Node indices in supply-to-load order. */
  order: Int32Array;
  /** Each node's supply-side neighbour (conductor or bus link), -1 for none. */
  feeder: Int32Array;
  isSupply: Uint8Array;
  conductorFrom: Int32Array;
}

function buildAdjacency(project: Project): Adjacency {
  const n = project.nodes.length;
  const index = new Map<string, number>();
  project.nodes.forEach((node, i) => index.set(node.id, i));
  const isSupply = new Uint8Array(n);
  project.nodes.forEach((node, i) => (isSupply[i] = SUPPLY_KINDS.has(node.kind) ? 1 : 0));
  const feeder = new Int32Array(n).fill(-1);
  const conductorFrom = new Int32Array(project.conductors.length);
  project.conductors.forEach((c, k) => {
    conductorFrom[k] = index.get(c.from)!;
    feeder[index.get(c.to)!] = index.get(c.from)!;
  });
  for (const l of project.busLinks) feeder[index.get(l.to)!] = index.get(l.from)!;
  // Supply-to-load order: depth of each node along its feeders, then a counting sort.
  const depth = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    const path: number[] = [];
    let at = i;
    while (at >= 0 && depth[at] === -1 && path.length <= n) {
      path.push(at);
      at = feeder[at]!;
    }
    let d = at >= 0 ? depth[at]! : -1;
    for (let k = path.length - 1; k >= 0; k--) depth[path[k]!] = ++d;
  }
  const order = Int32Array.from({ length: n }, (_, i) => i).sort((a, b) => depth[a]! - depth[b]!);
  return { nodes: project.nodes, conductors: project.conductors, order, feeder, isSupply, conductorFrom };
}

/** Sums what a field holds, so reading it cannot be optimized away. */
function weigh(value: unknown): number {
  switch (typeof value) {
    case 'number':
      return value;
    case 'string':
      return value.length;
    case 'boolean':
      return value ? 1 : 0;
    case 'object':
      return value === null ? 0 : 1;
    default:
      return 0;
  }
}

/** The floor: one pass over the prebuilt adjacency reading every field once. Returns a checksum. */
function floorPass(a: Adjacency): number {
  let checksum = 0;
  const n = a.nodes.length;
  const supplyOf = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    const i = a.order[k]!;
    const node = a.nodes[i] as Record<string, unknown>;
    for (const key in node) checksum += weigh(node[key]);
    const up = a.feeder[i]!;
    supplyOf[i] = a.isSupply[i] || up < 0 ? i : supplyOf[up]!;
  }
  for (let k = 0; k < a.conductors.length; k++) {
    const c = a.conductors[k] as Record<string, unknown>;
    for (const key in c) checksum += weigh(c[key]);
    checksum += supplyOf[a.conductorFrom[k]!]!;
  }
  return checksum;
}

interface SizeResult {
  conductors: number;
  nodes: number;
  fileMB: number;
  runs: number;
  parseMs: number;
  loadMs: number;
  analyzeMs: number;
  pipelineMs: number;
  floorMs: number;
  analyzeToFloor: number;
  jsonBytesPerConductor: number;
  peakHeapMB: number;
  verdicts: Record<string, number>;
}

function measure({ conductors, warmup, runs }: (typeof SIZES)[number]): SizeResult {
  const input = generateProject({ conductors, seed: 1 });
  const text = JSON.stringify(input);
  const once = () => {
    const t0 = process.hrtime.bigint();
    const parsed: unknown = JSON.parse(text);
    const t1 = process.hrtime.bigint();
    const loaded = loadProject(parsed);
    const t2 = process.hrtime.bigint();
    if (!loaded.ok) throw new Error(`synthetic project refused: ${JSON.stringify(loaded.errors.slice(0, 3))}`);
    const report = analyze(loaded.project);
    const t3 = process.hrtime.bigint();
    return { parse: ms(t0, t1), load: ms(t1, t2), analyze: ms(t2, t3), pipeline: ms(t0, t3), project: loaded.project, report };
  };
  // What is needed of the first run is read here, in a call of its own, so its report is not held through the timed runs.
  const { adjacency, jsonBytes, verdicts } = (() => {
    const first = once();
    return {
      adjacency: buildAdjacency(first.project),
      jsonBytes: JSON.stringify(toJsonReport(first.report)).length + 1,
      verdicts: Object.fromEntries(Object.entries(first.report.counts.byVerdict).filter(([, v]) => v > 0)),
    };
  })();
  let sink = 0;
  const floorOnce = () => {
    const t0 = process.hrtime.bigint();
    sink += floorPass(adjacency);
    return ms(t0, process.hrtime.bigint());
  };

  for (let i = 0; i < warmup; i++) {
    once();
    floorOnce();
  }
  const parse: number[] = [];
  const load: number[] = [];
  const analyzeT: number[] = [];
  const pipeline: number[] = [];
  const floor: number[] = [];
  for (let i = 0; i < runs; i++) {
    // Alternate so drift in machine load hits both the same way. No gc() between runs: a full collection
    // shrinks the young generation, so the run after it scavenges far more often (10k: 87 -> 198 ms).
    floor.push(floorOnce());
    const run = once();
    parse.push(run.parse);
    load.push(run.load);
    analyzeT.push(run.analyze);
    pipeline.push(run.pipeline);
  }
  if (sink === 0) console.log('(floor checksum 0)');

  // Heap: collect, then hold every stage's result alive and sample after each.
  gc?.();
  const base = process.memoryUsage().heapUsed;
  const held: unknown[] = [];
  let peak = 0;
  const sample = () => (peak = Math.max(peak, process.memoryUsage().heapUsed - base));
  const parsed: unknown = JSON.parse(text);
  held.push(parsed);
  sample();
  const loaded = loadProject(parsed);
  held.push(loaded);
  sample();
  if (loaded.ok) held.push(analyze(loaded.project));
  sample();
  held.length = 0;

  const medAnalyze = median(analyzeT);
  const medFloor = median(floor);
  return {
    conductors,
    nodes: input.nodes.length,
    fileMB: mb(text.length),
    runs,
    parseMs: round(median(parse)),
    loadMs: round(median(load)),
    analyzeMs: round(medAnalyze),
    pipelineMs: round(median(pipeline)),
    floorMs: round(medFloor, 3),
    analyzeToFloor: round(medAnalyze / medFloor, 0),
    jsonBytesPerConductor: Math.round(jsonBytes / conductors),
    peakHeapMB: mb(peak),
    verdicts,
  };
}

/** One edit of `project`: the `k`th of its kind, a new project sharing every object it does not touch (an immer edit). */
type BenchEdit = (project: Project, session: ReturnType<typeof createAnalysis>, k: number) => Project;

/** The `k`th of the conductors whose report line `pick` chooses (spread over the drawing), its length a foot longer or shorter. */
const lengthEdit =
  (pick: (c: ReturnType<typeof createAnalysis>['report']['conductors'][number]) => boolean): BenchEdit =>
  (project, session, k) => {
    const chosen = session.report.conductors.flatMap((c, i) => (pick(c) && c.lengthFt !== null ? [i] : []));
    const i = chosen[(k * 7919) % chosen.length]!;
    const c = project.conductors[i]!;
    return { ...project, conductors: project.conductors.map((x, j) => (j === i ? { ...c, lengthFt: (c.lengthFt ?? 0) + (k % 2 ? -1 : 1) } : x)) };
  };

/** The `k`th (spread over the drawing) of the nodes `pick` chooses. */
const spread = (project: Project, k: number, pick: (n: Project['nodes'][number], i: number) => boolean): Project['nodes'][number] => {
  const chosen = project.nodes.filter(pick);
  return chosen[(k * 7919) % chosen.length]!;
};

/** The editor's "add equipment" below `from`: the new node with its kind's defaults and a conductor (sized or, as the editor draws it, not) or a bus link. */
const addBelow = (project: Project, from: Project['nodes'][number], node: Record<string, unknown> & { kind: string }, how: 'link' | 'sized' | 'unsized', k: number): Project => {
  const id = `bench-${node.kind}-${k}`;
  const added = equipmentNode.parse({ ...node, id });
  if (how === 'link') return { ...project, nodes: [...project.nodes, added], busLinks: [...project.busLinks, { id: `bench-bl-${k}` as Project['busLinks'][number]['id'], from: from.id, to: added.id }] };
  const c = conductorSchema.parse({ id: `bench-c-${k}`, from: from.id, to: id, ...(how === 'sized' ? { size: '12', lengthFt: 60 } : {}) });
  return { ...project, nodes: [...project.nodes, added], conductors: [...project.conductors, c] };
};

/** A branch-circuit breaker: bus-linked from a panelboard, one conductor out. */
const branchBreaker = (project: Project) => {
  const linked = new Set(project.busLinks.map((l) => l.to as string));
  return (n: Project['nodes'][number]) => n.kind === 'breaker' && linked.has(n.id) && n.ratingA === 20;
};

const RECHECK_EDITS: { kind: string; edit: BenchEdit }[] = [
  { kind: 'branch-circuit length', edit: lengthEdit((c) => c.role === 'branch') },
  // Feeders to panelboards, transformers and distribution boards: the fault current and drops below them move.
  { kind: 'feeder length', edit: lengthEdit((c) => c.role === 'feeder' && !c.verdict.startsWith('tap-')) },
  { kind: 'tap length', edit: lengthEdit((c) => c.verdict.startsWith('tap-')) },
  { kind: 'transformer secondary length', edit: lengthEdit((c) => c.role === 'transformer-secondary') },
  {
    kind: 'load amperes',
    edit: (project, _session, k) => {
      const loads = project.nodes.flatMap((n, i) => (n.kind === 'load' && n.currentA !== undefined ? [i] : []));
      const i = loads[(k * 7919) % loads.length]!;
      const n = project.nodes[i]!;
      return { ...project, nodes: project.nodes.map((x, j) => (j === i && n.kind === 'load' ? { ...n, currentA: n.currentA! + (k % 2 ? -1 : 1) } : x)) };
    },
  },
  {
    kind: 'breaker rating',
    edit: (project, _session, k) => {
      // 5 A up, then back down: a branch or feeder device resized (20 A to 25 A, a standard rating, on most).
      const breakers = project.nodes.flatMap((n, i) => (n.kind === 'breaker' ? [i] : []));
      const i = breakers[(Math.floor(k / 2) * 7919) % breakers.length]!;
      const n = project.nodes[i]!;
      if (n.kind !== 'breaker') return project;
      const ratingA = k % 2 ? n.ratingA! - 5 : n.ratingA! + 5;
      return { ...project, nodes: project.nodes.map((x, j) => (j === i ? { ...n, ratingA } : x)) };
    },
  },
  // The editor's structural edits (web/src/editor/commands/): equipment added below a panelboard or breaker, a connection, a deletion.
  {
    kind: 'add breaker in a panelboard (bus link)',
    edit: (project, _session, k) => addBelow(project, spread(project, k, (n) => n.kind === 'bus' && n.busType === 'panelboard'), { kind: 'breaker', ratingA: 20 }, 'link', k),
  },
  {
    kind: 'add load below a breaker (sized conductor)',
    edit: (project, _session, k) => addBelow(project, spread(project, k, branchBreaker(project)), { kind: 'load', kva: 1, powerFactor: 0.9, continuous: false, phases: 1 }, 'sized', k),
  },
  {
    kind: 'add load below a breaker (conductor without size, as drawn)',
    edit: (project, _session, k) => addBelow(project, spread(project, k, branchBreaker(project)), { kind: 'load', kva: 1, powerFactor: 0.9, continuous: false, phases: 1 }, 'unsized', k),
  },
  {
    kind: 'paste a breaker and its load in a panelboard',
    edit: (project, _session, k) => {
      const panel = spread(project, k, (n) => n.kind === 'bus' && n.busType === 'panelboard');
      const withBreaker = addBelow(project, panel, { kind: 'breaker', ratingA: 20 }, 'link', k);
      return addBelow(withBreaker, withBreaker.nodes[withBreaker.nodes.length - 1]!, { kind: 'load', kva: 1, powerFactor: 0.9, continuous: false, phases: 1 }, 'sized', k);
    },
  },
  {
    kind: 'rename a breaker',
    edit: (project, _session, k) => {
      const b = spread(project, k, (n) => n.kind === 'breaker');
      return { ...project, nodes: project.nodes.map((n) => (n === b ? { ...b, label: `CB ${k}` } : n)) };
    },
  },
  {
    kind: 'connect a conductor between equipment drawn',
    edit: (project, _session, k) => {
      const from = spread(project, k, branchBreaker(project));
      const to = spread(project, k + 1, (n) => n.kind === 'load');
      return { ...project, conductors: [...project.conductors, conductorSchema.parse({ id: `bench-connect-${k}`, from: from.id, to: to.id, size: '12', lengthFt: 40 })] };
    },
  },
  {
    kind: 'delete a branch circuit (load and its conductor)',
    edit: (project, _session, k) => {
      const gone = spread(project, k, (n) => n.kind === 'load').id;
      return { ...project, nodes: project.nodes.filter((n) => n.id !== gone), conductors: project.conductors.filter((c) => c.to !== gone) };
    },
  },
];

/** Edits of each kind through an incremental session at 10 000 conductors (see the header): median, p95, how many ran the whole analysis. */
function measureRecheck(conductors = 10_000, edits = 60): { conductors: number; edits: number; kinds: { kind: string; medianMs: number; p95Ms: number; full: number }[] } {
  const loaded = loadProject(generateProject({ conductors, seed: 1 }));
  if (!loaded.ok) throw new Error('synthetic project refused');
  const kinds = RECHECK_EDITS.map(({ kind, edit }) => {
    let project = loaded.project;
    const session = createAnalysis(project);
    const times: number[] = [];
    let full = 0;
    for (let k = 0; k < edits + 5; k++) {
      const next = edit(project, session, k);
      const t0 = process.hrtime.bigint();
      session.update(next);
      const t = ms(t0, process.hrtime.bigint());
      project = next;
      if (k < 5) continue;
      times.push(t);
      if (session.last.mode === 'full') full++;
    }
    const sorted = [...times].sort((a, b) => a - b);
    return { kind, medianMs: round(median(times), 3), p95Ms: round(sorted[Math.ceil(sorted.length * 0.95) - 1]!, 3), full };
  });
  return { conductors, edits, kinds };
}

/** Whole-process time of the command on a sample, as a user runs it (median wall time, ms). */
async function measureCli(): Promise<{ sample: string; runs: number; medianMs: number; exitCode: number | null }> {
  await buildCli();
  const root = resolve(import.meta.dirname, '../..');
  const sample = 'samples/demo-clinic.json';
  const args = ['core/bin/linewright.mjs', 'check', sample, '--format', 'json'];
  const times: number[] = [];
  let exitCode: number | null = null;
  for (let i = 0; i < CLI_RUNS + 1; i++) {
    const t0 = process.hrtime.bigint();
    const r = spawnSync(process.execPath, args, { cwd: root, stdio: ['ignore', 'ignore', 'ignore'] });
    if (i > 0) times.push(ms(t0, process.hrtime.bigint()));
    exitCode = r.status;
  }
  return { sample, runs: CLI_RUNS, medianMs: round(median(times), 0), exitCode };
}

const pad = (s: string | number, w: number) => String(s).padStart(w);
const load = () => loadavg().map((x) => round(x, 1));
const COLUMNS = ['conductors', 'nodes', 'file MB', 'runs', 'parse', 'load', 'analyze', 'pipeline', 'floor', 'analyze/floor', 'JSON B/cond', 'peak heap MB'];
const WIDTHS = [10, 8, 8, 5, 8, 8, 9, 9, 8, 14, 12, 13];
const row = (cells: (string | number)[]) => cells.map((v, i) => pad(v, WIDTHS[i]!)).join(' ');
console.log(`Linewright core benchmark, node ${process.version}, ${cpus().length} CPUs, load average ${load().join(' ')} at start, ${gc ? 'gc exposed' : 'gc NOT exposed: heap figures are rough'}; core compiled by ${COMPILED_BY}`);
console.log('a load average above the CPU count means other work shares the machine: figures are then upper bounds; read ratios');
console.log('medians of timed runs after warm-up; times in ms; pipeline = parse + load + analyze; floor = one field-reading pass over prebuilt typed adjacency');
console.log(row(COLUMNS));
const results: SizeResult[] = [];
for (const size of SIZES) {
  const r = measure(size);
  results.push(r);
  console.log(row([r.conductors, r.nodes, r.fileMB, r.runs, r.parseMs, r.loadMs, r.analyzeMs, r.pipelineMs, r.floorMs, r.analyzeToFloor, r.jsonBytesPerConductor, r.peakHeapMB]));
}
const at = (n: number) => results.find((r) => r.conductors === n);
const growth = (pick: (r: SizeResult) => number) => {
  const small = at(10_000);
  const large = at(100_000);
  return small && large ? round(pick(large) / pick(small), 1) : null;
};
const analyzeGrowth10kTo100k = growth((r) => r.analyzeMs);
const pipelineGrowth10kTo100k = growth((r) => r.pipelineMs);
const maxRssMB = round(process.resourceUsage().maxRSS / 1024, 0);
console.log(`growth 10k -> 100k conductors: analyze x${analyzeGrowth10kTo100k ?? '? (not both run)'}, pipeline x${pipelineGrowth10kTo100k ?? '?'} (x10 is linear); process peak RSS ${maxRssMB} MB`);
for (const r of results) console.log(`verdicts at ${r.conductors}: ${JSON.stringify(r.verdicts)}`);
const recheck = ANALYZE_ONLY ? null : measureRecheck();
if (recheck) for (const k of recheck.kinds) console.log(`re-check after one ${k.kind} edit @${recheck.conductors / 1000}k: median ${k.medianMs} ms, p95 ${k.p95Ms} ms over ${recheck.edits} edits (${k.full} ran the whole analysis)`);
const cli = ANALYZE_ONLY ? null : await measureCli();
if (cli) console.log(`linewright check ${cli.sample} --format json, whole process: ${cli.medianMs} ms median of ${cli.runs} (exit ${cli.exitCode})`);
// The studies' own figures come before the JSON, which stays the last line.
if (!ANALYZE_ONLY) printStudiesBench();
console.log(
  JSON.stringify({
    node: process.version,
    cpus: cpus().length,
    loadAverageAtEnd: load(),
    gcExposed: Boolean(gc),
    compiledBy: COMPILED_BY,
    sizes: results,
    analyzeGrowth10kTo100k,
    pipelineGrowth10kTo100k,
    maxRssMB,
    recheck,
    cli,
  }),
);
