import { parentPort, workerData } from 'node:worker_threads';
import { checkOne, fuzzBases, type Outcome } from './checkOne';
import { inputAt } from './mutate';

/** One fuzz worker: answers one input at a time, so the watchdog in run.ts knows which one hung. */
export interface WorkerResult {
  index: number;
  outcome: Outcome;
}

const { root, seed, start, pdfEvery } = workerData as { root: string; seed: number; start: number; pdfEvery: number };
const bases = fuzzBases(root);
let index = start;

function one(): void {
  const { text } = inputAt(bases, seed, index);
  const outcome = checkOne(text, { pdf: index % pdfEvery === 0 });
  parentPort!.postMessage({ index, outcome } satisfies WorkerResult);
  index++;
}

parentPort!.on('message', one);
one();
