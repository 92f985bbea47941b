import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkOne, fuzzBases } from './checkOne';
import { inputAt } from './mutate';

/**
 * The short, seeded fuzz run of `npm test`: a few hundred mutated samples through the loader, the
 * analysis and every report. Nothing is timed here (the long run, `npm run fuzz -- --minutes N`, reports
 * slow inputs). Common practice for a file loader: bad input is refused with a message naming where,
 * good input never throws.
 */
const ROOT = join(import.meta.dirname, '../..');
const bases = fuzzBases(ROOT);
const SEED = 20_260_101;
const COUNT = 250;

describe('seeded fuzz run over the samples', () => {
  it(`${COUNT} inputs: no internal error, every rejection has a message and names where`, { timeout: 300_000 }, () => {
    const tally = { accepted: 0, rejected: 0, unnamed: 0 };
    const internal: string[] = [];
    for (let i = 0; i < COUNT; i++) {
      const input = inputAt(bases, SEED, i, 0.1);
      // The PDF is the slowest report: every tenth input renders it too.
      const out = checkOne(input.text, { pdf: i % 10 === 0 });
      if (out.kind === 'internal') internal.push(`#${i} (${input.ops.join('+')}) at ${out.stage}: ${out.error}`);
      else if (out.kind === 'accepted') tally.accepted++;
      else {
        tally.rejected++;
        if (!out.named) tally.unnamed++;
      }
    }
    expect(internal, internal.join('\n')).toEqual([]);
    expect(tally.unnamed).toBe(0);
    // Both sides are exercised, or the run proves nothing.
    expect(tally.accepted).toBeGreaterThan(COUNT / 10);
    expect(tally.rejected).toBeGreaterThan(COUNT / 10);
  });
});
