import { readFileSync } from 'node:fs';
import type { Comparison, ComparisonSide } from '../review/diff';

/** `linewright diff OLD NEW`: the review comparison without the browser. */

export const DIFF_FORMATS = ['text', 'json'] as const;
export type DiffFormat = (typeof DIFF_FORMATS)[number];

export interface DiffCommand {
  command: 'diff';
  /** A project file, or FILE#N for round N frozen in it. */
  old: string;
  new: string;
  format: DiffFormat;
}

export const DIFF_USAGE = `  linewright diff OLD NEW [--format text|json]
      compares two project files (or FILE#N: round N frozen in FILE): elements
      added, removed and changed field by field, verdicts and findings new,
      resolved and still open, comments carried forward.
      Exit 0 nothing that matters changed, 1 verdicts or findings changed, 2 bad input.
`;

/** Pure: the diff command from its arguments, or the message naming what is wrong. */
export function toDiffCommand(args: readonly string[], values: ReadonlyMap<string, string>): DiffCommand | { command: 'error'; message: string } {
  const [oldFile, newFile, ...rest] = args;
  if (oldFile === undefined || newFile === undefined) return { command: 'error', message: 'diff needs two project files: linewright diff OLD NEW' };
  if (rest.length > 0) return { command: 'error', message: `unexpected argument "${rest[0]}"; diff takes two files` };
  for (const flag of values.keys()) {
    if (flag !== '--format') return { command: 'error', message: `option ${flag} does not apply to diff (only --format text|json)` };
  }
  const format = values.get('--format') ?? 'text';
  if (!(DIFF_FORMATS as readonly string[]).includes(format)) return { command: 'error', message: `option --format of diff must be text or json (got "${format}")` };
  return { command: 'diff', old: oldFile, new: newFile, format: format as DiffFormat };
}

export class DiffInputError extends Error {}

/** Splits 'plan.json#2' into the file and the round; a plain path has no round. */
export function sideSpec(spec: string): { file: string; round: number | null } {
  const m = /^(.*)#(\d+)$/.exec(spec);
  return m ? { file: m[1]!, round: Number(m[2]) } : { file: spec, round: null };
}

async function loadSide(spec: string): Promise<ComparisonSide> {
  const { loadProject } = await import('../model/load');
  const { analyze } = await import('../analyze/analyze');
  const review = await import('../review/index');
  const { file, round } = sideSpec(spec);
  let text: string;
  try {
    text = readFileSync(file === '-' ? 0 : file, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new DiffInputError(`cannot read ${file}: ${code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a directory, not a file' : (e as Error).message}`);
  }
  const loaded = loadProject(text);
  if (!loaded.ok) throw new DiffInputError(`${file} is not a usable Linewright project:\n${loaded.errors.map((e) => `${e.path || '(file)'}: ${e.message}`).join('\n')}`);
  const p = loaded.project;
  const r = review.reviewOf(p);
  if (round === null) {
    return { label: file, drawing: review.snapshotOf(p), summary: review.summarize(analyze(p)), comments: r.comments };
  }
  const frozen = r.rounds.find((x) => x.number === round);
  if (!frozen) {
    const have = r.rounds.map((x) => `${x.number} (${x.name})`).join(', ');
    throw new DiffInputError(`${file} has no round ${round}; ${have ? `it has ${have}` : 'it has no rounds yet'}.`);
  }
  let drawing;
  try {
    drawing = review.roundDrawing(r.rounds, round);
  } catch (e) {
    throw new DiffInputError(`${file}: ${(e as Error).message}`);
  }
  return { label: `${file} round ${round} "${frozen.name}" (${frozen.date})`, drawing, summary: frozen.summary, comments: r.comments.filter((c) => c.round <= round) };
}

/** Runs the comparison; returns what to print and whether anything that matters changed. */
export async function runDiff(cmd: DiffCommand): Promise<{ output: string; comparison: Comparison }> {
  const { compareSides, comparisonText } = await import('../review/diff');
  const { CAUTION } = await import('../caution');
  const { TOOL_NAME, TOOL_VERSION } = await import('../report/version');
  const a = await loadSide(cmd.old);
  const b = await loadSide(cmd.new);
  const comparison = compareSides(a, b);
  const output =
    cmd.format === 'json'
      ? `${JSON.stringify({ tool: TOOL_NAME, version: TOOL_VERSION, caution: CAUTION, ...comparison }, null, 2)}\n`
      : `${comparisonText(comparison)}\nCaution: ${CAUTION}\n`;
  return { output, comparison };
}
