import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { analyze } from '../../core/src/analyze/analyze';
import { loadProject } from '../../core/src/model/load';
import { toConductorScheduleCsv } from '../../core/src/report/csv';
import { toJsonReport } from '../../core/src/report/json';
import { renderPermitPdf } from '../../core/src/report/pdf';
import { looksLikeFormula } from '../../core/src/report/safeText';
import { toSarif } from '../../core/src/report/sarif';
import { renderText } from '../../core/src/report/text';
import { sarifSchemaErrors } from '../helpers/sarifSchema';
import type { Json } from './mutate';

export type Outcome =
  | { kind: 'accepted'; ms: number }
  | { kind: 'rejected'; ms: number; paths: string[]; named: boolean }
  | { kind: 'internal'; ms: number; error: string; stage: string };

// eslint-disable-next-line no-control-regex -- the check looks for control characters
const RAW_CONTROL = /[\x00-\x09\x0b-\x1f\x7f-\x9f]/;

/**
 * One input through everything a user can run on it: load; then, when it loads, the analysis and every
 * report (text, JSON, SARIF, CSV and, when asked, the PDF). Any exception, or a report that breaks its
 * promise (raw control characters in the text report, a SARIF log the official 2.1.0 schema refuses,
 * a live formula in the CSV, a rejection without a
 * message), is an internal error: a bug of ours, never the input's fault.
 */
export function checkOne(text: string, options: { pdf: boolean }): Outcome {
  const t0 = performance.now();
  let stage = 'load';
  try {
    const loaded = loadProject(text);
    if (!loaded.ok) {
      const paths = loaded.errors.map((e) => e.path);
      if (loaded.errors.length === 0 || loaded.errors.some((e) => typeof e.message !== 'string' || e.message.trim() === '')) {
        return { kind: 'internal', ms: performance.now() - t0, error: 'a rejection without a message', stage };
      }
      // "Named": the first error points at a field, or at the whole file when the file itself is not JSON or not an object.
      const named = paths[0] !== '' || /not valid JSON|is empty|is a JSON object/.test(loaded.errors[0]!.message);
      return { kind: 'rejected', ms: performance.now() - t0, paths, named };
    }
    stage = 'analyze';
    const report = analyze(loaded.project);
    stage = 'text';
    const txt = renderText(report);
    if (RAW_CONTROL.test(txt)) throw new Error('the text report passes a raw control character');
    stage = 'json';
    JSON.stringify(toJsonReport(report));
    stage = 'sarif';
    const sarif = toSarif(report, { artifactUri: 'fuzz.json', sourceText: text });
    JSON.stringify(sarif);
    const invalid = sarifSchemaErrors(sarif);
    if (invalid) throw new Error(`the SARIF log breaks the SARIF 2.1.0 schema: ${invalid.split('\n')[0]}`);
    stage = 'csv';
    const csv = toConductorScheduleCsv(report);
    for (const c of report.conductors) {
      if (c.label && looksLikeFormula(c.label) && csv.includes(`,${c.label},`)) throw new Error(`a live formula in the CSV: ${JSON.stringify(c.label)}`);
    }
    if (options.pdf) {
      stage = 'pdf';
      renderPermitPdf(loaded.project, report, { generatedAt: '2026-01-01T00:00:00Z' });
    }
    return { kind: 'accepted', ms: performance.now() - t0 };
  } catch (e) {
    return { kind: 'internal', ms: performance.now() - t0, error: e instanceof Error ? e.message : String(e), stage };
  }
}

/** The samples and the accepted corpus files: the starting points of every mutation. */
export function fuzzBases(root: string): Json[] {
  const samples = readdirSync(join(root, 'samples'))
    .filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json')
    .map((f) => join(root, 'samples', f));
  return samples.map((f) => JSON.parse(readFileSync(f, 'utf8')) as Json);
}
