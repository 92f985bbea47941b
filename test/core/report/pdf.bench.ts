/**
 * `npx tsx test/core/report/pdf.bench.ts`: time to render the permit-set PDF for synthetic risers
 * of about 100, 500 and 2 000 elements (nodes + conductors, no positions, so the layout runs too).
 * Prints the median of 5 runs per size and the page count; the last line is one JSON object.
 * Not a test: the suite never asserts on time.
 */
import { renderPermitPdf } from '../../../core/src/report/pdf';
import { syntheticRiser } from './fixture';

// [feeders, branch circuits per panel]: 3 + f·(2 + 2b) nodes and 1 + f·(1 + b) conductors.
const sizes: [number, number][] = [
  [3, 10],
  [10, 16],
  [20, 33],
];
const results: { elements: number; medianMs: number; pages: number; bytes: number }[] = [];
for (const [feeders, branches] of sizes) {
  const { project, report } = syntheticRiser(feeders, branches);
  const elements = project.nodes.length + project.conductors.length;
  renderPermitPdf(project, report, { generatedAt: '2026-01-01T00:00:00Z' }); // warm-up
  const times: number[] = [];
  let bytes: Uint8Array = new Uint8Array();
  for (let i = 0; i < 5; i++) {
    const t = performance.now();
    bytes = renderPermitPdf(project, report, { generatedAt: '2026-01-01T00:00:00Z' });
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  const pages = (Buffer.from(bytes).toString('latin1').match(/\/Type\s*\/Page(?![a-z])/g) ?? []).length;
  const medianMs = Math.round(times[2]!);
  results.push({ elements, medianMs, pages, bytes: bytes.length });
  console.log(`${String(elements).padStart(5)} elements: median ${medianMs} ms, ${pages} pages, ${Math.round(bytes.length / 1024)} KB`);
}
console.log(JSON.stringify({ bench: 'permit-pdf', results }));
