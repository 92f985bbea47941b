/**
 * The long fuzz run: `npm run fuzz -- --minutes N [--seed S] [--max COUNT] [--pdf-every K]`.
 * Mutated samples go through the loader, the analysis and every report (the PDF for one input in K) in a
 * worker thread; a watchdog ends a worker stuck on one input for 60 s and counts it. Prints inputs tried,
 * accepted, rejected with a named path, internal errors and every input over 10 s, then one JSON line.
 * Failing inputs are written to test-results/fuzz/ with their seed and index, to replay and keep.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { fuzzBases } from './checkOne';
import { inputAt } from './mutate';
import type { WorkerResult } from './worker';

const ROOT = join(import.meta.dirname, '../..');
const args = process.argv.slice(2);
const opt = (name: string, fallback: number) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] !== undefined ? Number(args[i + 1]) : fallback;
};
const minutes = opt('minutes', 1);
const seed = opt('seed', 1);
const max = opt('max', Number.POSITIVE_INFINITY);
const pdfEvery = opt('pdf-every', 5);
const SLOW_MS = 10_000;
const HUNG_MS = 60_000;
const outDir = join(ROOT, 'test-results', 'fuzz');

const bases = fuzzBases(ROOT);
const deadline = Date.now() + minutes * 60_000;
const tally = { tried: 0, accepted: 0, rejectedNamed: 0, rejectedUnnamed: 0, internal: 0, slow: 0 };
const slow: { index: number; ms: number }[] = [];
const internal: { index: number; stage: string; error: string }[] = [];

function keep(kind: string, index: number, note: string): void {
  mkdirSync(outDir, { recursive: true });
  const { text, ops } = inputAt(bases, seed, index);
  writeFileSync(join(outDir, `${kind}-seed${seed}-${index}.json`), text);
  writeFileSync(join(outDir, `${kind}-seed${seed}-${index}.txt`), `${ops.join('+')}\n${note}\n`);
}

function runFrom(start: number): Promise<number> {
  return new Promise((done) => {
    // worker.mjs registers tsx in the thread, then loads worker.ts.
    const worker = new Worker(new URL('./worker.mjs', import.meta.url), { workerData: { root: ROOT, seed, start, pdfEvery } });
    let current = start;
    let watchdog = setTimeout(hang, HUNG_MS);
    function hang() {
      tally.tried++;
      tally.slow++;
      slow.push({ index: current, ms: HUNG_MS });
      keep('hung', current, `no answer within ${HUNG_MS} ms`);
      console.log(`  input ${current}: no answer within ${HUNG_MS / 1000} s (counted over 10 s; worker restarted)`);
      void worker.terminate().then(() => done(current + 1));
    }
    worker.on('message', (r: WorkerResult) => {
      clearTimeout(watchdog);
      tally.tried++;
      const o = r.outcome;
      if (o.kind === 'accepted') tally.accepted++;
      else if (o.kind === 'rejected') {
        if (o.named) tally.rejectedNamed++;
        else tally.rejectedUnnamed++;
      }
      else {
        tally.internal++;
        internal.push({ index: r.index, stage: o.stage, error: o.error });
        keep('internal', r.index, `${o.stage}: ${o.error}`);
      }
      if (o.ms > SLOW_MS) {
        tally.slow++;
        slow.push({ index: r.index, ms: Math.round(o.ms) });
        keep('slow', r.index, `${Math.round(o.ms)} ms`);
      }
      if (tally.tried % 1000 === 0) console.log(`  ${tally.tried} inputs: ${JSON.stringify(tally)}`);
      current = r.index + 1;
      if (Date.now() >= deadline || tally.tried >= max) {
        void worker.terminate().then(() => done(-1));
        return;
      }
      worker.postMessage('next');
      watchdog = setTimeout(hang, HUNG_MS);
    });
    worker.on('error', (e) => {
      clearTimeout(watchdog);
      tally.tried++;
      tally.internal++;
      internal.push({ index: current, stage: 'worker', error: e.message });
      keep('internal', current, `worker: ${e.message}`);
      done(current + 1);
    });
  });
}

const t0 = Date.now();
console.log(`fuzz: seed ${seed}, ${minutes} min${Number.isFinite(max) ? `, at most ${max} inputs` : ''}, PDF for one input in ${pdfEvery}, ${bases.length} samples`);
let next = 0;
while (next >= 0 && Date.now() < deadline && tally.tried < max) next = await runFrom(next);
const elapsed = (Date.now() - t0) / 60_000;
console.log(`fuzz: ${tally.tried} inputs tried in ${elapsed.toFixed(1)} min (seed ${seed})`);
console.log(`  accepted:                    ${tally.accepted}`);
console.log(`  rejected with a named path:  ${tally.rejectedNamed}`);
console.log(`  rejected without a path:     ${tally.rejectedUnnamed}`);
console.log(`  internal errors:             ${tally.internal}`);
console.log(`  inputs over 10 s:            ${tally.slow}`);
for (const i of internal.slice(0, 20)) console.log(`    internal #${i.index} at ${i.stage}: ${i.error}`);
for (const s of slow.slice(0, 20)) console.log(`    slow #${s.index}: ${s.ms} ms`);
console.log(JSON.stringify({ seed, minutes: Number(elapsed.toFixed(2)), ...tally }));
process.exitCode = tally.internal > 0 || tally.slow > 0 || tally.rejectedUnnamed > 0 ? 1 : 0;
