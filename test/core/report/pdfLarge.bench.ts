/**
 * `npm run bench:pdf`: time to render the permit-set PDF of the two largest hostile-but-valid files of
 * the fuzz corpus (test/fixtures/repro): 4 000 parallel conductors between the same two pieces, and
 * 4 000 pieces stacked at one point. Prints, per file, the fastest of 3 runs in wall-clock and in CPU
 * time of this process (the machine is shared: CPU time is the steadier figure), the page count and
 * the size; the last line is one JSON object. Target: 10 s or less each. Not a test: the suite never
 * asserts on time.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { analyze } from '../../../core/src/analyze/analyze';
import { loadProject } from '../../../core/src/model/load';
import { renderPermitPdf } from '../../../core/src/report/pdf';

const dir = join(import.meta.dirname, '../../fixtures/repro');
const RUNS = 3;
const results: { file: string; nodes: number; conductors: number; wallMs: number; cpuMs: number; pages: number; bytes: number }[] = [];
for (const file of ['parallel-4000.json', 'stacked-4000.json']) {
  const loaded = loadProject(readFileSync(join(dir, file), 'utf8'));
  if (!loaded.ok) throw new Error(`${file} does not load: ${loaded.errors[0]?.message}`);
  const report = analyze(loaded.project);
  let wallMs = Infinity;
  let cpuMs = Infinity;
  let bytes: Uint8Array = new Uint8Array();
  for (let i = 0; i < RUNS; i++) {
    const cpu = process.cpuUsage();
    const t = performance.now();
    bytes = renderPermitPdf(loaded.project, report, { generatedAt: '2026-01-01T00:00:00Z' });
    wallMs = Math.min(wallMs, performance.now() - t);
    const used = process.cpuUsage(cpu);
    cpuMs = Math.min(cpuMs, (used.user + used.system) / 1000);
  }
  const pages = (Buffer.from(bytes).toString('latin1').match(/\/Type\s*\/Page(?![a-z])/g) ?? []).length;
  const row = { file, nodes: loaded.project.nodes.length, conductors: loaded.project.conductors.length, wallMs: Math.round(wallMs), cpuMs: Math.round(cpuMs), pages, bytes: bytes.length };
  results.push(row);
  console.log(`${file.padEnd(20)} ${row.nodes} nodes, ${row.conductors} conductors: best of ${RUNS} ${row.wallMs} ms wall, ${row.cpuMs} ms CPU; ${pages} pages, ${Math.round(bytes.length / 1024)} KB`);
}
console.log(JSON.stringify({ bench: 'permit-pdf-large', targetMs: 10_000, results }));
