/**
 * The short-circuit and voltage-drop studies alone, next to the tap analysis
 * (base facts + classification) on the same synthetic one-lines of 10 000 and
 * 100 000 conductors: medians of timed runs after warm-up, in ms. Figures
 * only; nothing passes or fails on time.
 */
import { baseRunFacts } from '../src/analyze/runFacts';
import { classifyRuns } from '../src/analyze/classify';
import { prepareContext } from '../src/analyze/context';
import { loadProject } from '../src/index';
import { runStudies } from '../src/studies/index';
import { generateProject } from './generateProject';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;
const time = (f: () => unknown) => {
  const t0 = process.hrtime.bigint();
  f();
  return Number(process.hrtime.bigint() - t0) / 1e6;
};

export function printStudiesBench(sizes: readonly number[] = [10_000, 100_000]): void {
  console.log('fault current + voltage drop study (runStudies) vs the tap analysis (baseRunFacts + classifyRuns), medians in ms');
  const rows: { conductors: number; studyMs: number; tapMs: number }[] = [];
  for (const conductors of sizes) {
    const loaded = loadProject(generateProject({ conductors, seed: 1 }));
    if (!loaded.ok) throw new Error('synthetic project refused');
    const ctx = prepareContext(loaded.project);
    const verdicts = classifyRuns({ ...ctx, facts: baseRunFacts(ctx) });
    const judged = { ...ctx, verdicts };
    const study: number[] = [];
    const tap: number[] = [];
    const runs = conductors >= 100_000 ? 5 : 11;
    for (let i = 0; i < runs + 2; i++) {
      const s = time(() => runStudies(judged));
      const t = time(() => classifyRuns({ ...ctx, facts: baseRunFacts(ctx) }));
      if (i >= 2) {
        study.push(s);
        tap.push(t);
      }
    }
    const r = { conductors, studyMs: Math.round(median(study) * 100) / 100, tapMs: Math.round(median(tap) * 100) / 100 };
    rows.push(r);
    console.log(`  ${String(conductors).padStart(7)} conductors: studies ${r.studyMs} ms, tap analysis ${r.tapMs} ms, ratio ${Math.round((r.studyMs / r.tapMs) * 100) / 100}`);
  }
  if (rows.length === 2) console.log(`  studies growth ${rows[0]!.conductors} -> ${rows[1]!.conductors}: x${Math.round((rows[1]!.studyMs / rows[0]!.studyMs) * 10) / 10} (x10 is linear)`);
}
