import { realpathSync, writeFileSync } from 'node:fs';
import { isAbsolute, relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { AnalysisReport } from '../analyze/types';
import type { Project } from '../model/schema';
import { CAUTION } from '../caution';
import { TOOL_NAME, TOOL_VERSION } from '../report/version';
import { USAGE, USAGE_SHORT, parseArgs, type CheckCommand } from './args';
import { EXIT_BAD_INPUT, EXIT_CLEAN, EXIT_INTERNAL, EXIT_VIOLATIONS, ioMessage, loadForCli, overwritesProject, say } from './io';
import type { DiffCommand } from './diff';

/** The only file of core that touches the file system and the process. */

export { EXIT_CLEAN, EXIT_VIOLATIONS, EXIT_BAD_INPUT, EXIT_INTERNAL } from './io';

/** SARIF wants a URI reference: relative to the working directory when the file is inside it. */
function artifactUri(file: string): string {
  if (file === '-') return 'stdin';
  const abs = resolve(file);
  const rel = relative(process.cwd(), abs);
  if (rel && !rel.startsWith('..') && !isAbsolute(rel)) return rel.split(sep).join('/');
  return pathToFileURL(abs).href;
}

async function render(cmd: CheckCommand, report: AnalysisReport, sourceText: string, project: Project): Promise<string> {
  const review = project.review ? await import('../review/index') : null;
  switch (cmd.format) {
    case 'text': {
      const text = (await import('../report/text')).renderText(report, { color: cmd.color });
      const lines = review ? review.reviewSummaryLines(project, report) : [];
      return lines.length > 0 ? `${text}\n${lines.join('\n')}\n` : text;
    }
    case 'json': {
      // Compact: one line, no indentation (pipe it through a formatter to read it).
      const json = (await import('../report/json')).toJsonReport(report, { detail: cmd.detail });
      return `${JSON.stringify(review ? { ...json, review: review.toJsonReview(project, report) } : json)}\n`;
    }
    case 'sarif': {
      const suppressions = review ? review.ahjJustifications(project.review, report) : undefined;
      return `${JSON.stringify((await import('../report/sarif')).toSarif(report, { artifactUri: artifactUri(cmd.file), sourceText, suppressions }), null, 2)}\n`;
    }
    case 'csv':
      return (await import('../report/csv')).toConductorScheduleCsv(report);
  }
}

// The analyzer, the renderers and jspdf load only for `check`, so --help and --version stay instant.
async function check(cmd: CheckCommand): Promise<number> {
  // Never write over the drawing itself (a slip like `--pdf plan.json`).
  for (const [flag, target] of [['--out', cmd.out], ['--pdf', cmd.pdf]] as const) {
    if (overwritesProject(cmd.file, target)) {
      say(`linewright: ${flag} ${target} is the project file itself; choose another name so the drawing is not overwritten`);
      return EXIT_BAD_INPUT;
    }
  }
  if (cmd.out !== null && cmd.pdf !== null && resolve(cmd.out) === resolve(cmd.pdf)) {
    say(`linewright: --out and --pdf both name ${cmd.out}; give each its own file`);
    return EXIT_BAD_INPUT;
  }
  const { analyze } = await import('../analyze/analyze');
  const { hasViolations } = await import('../report/format');
  const loaded = await loadForCli(cmd.file, cmd.edition);
  if (typeof loaded === 'number') return loaded;
  const { project, text } = loaded;
  const report = analyze(project);
  const output = await render(cmd, report, text, project);
  // Everything is rendered before anything is written: a renderer that fails is our bug (exit 3, below in
  // main), never reported as a file that cannot be written.
  const pdfModule = cmd.pdf === null ? null : await import('../report/pdf');
  const pdf = pdfModule === null ? null : pdfModule.renderPermitPdf(project, report, { sheet: cmd.sheet });

  const written: string[] = [];
  try {
    if (cmd.out !== null) {
      writeFileSync(cmd.out, output);
      written.push(`report (${cmd.format}) to ${cmd.out}`);
    }
    if (cmd.pdf !== null && pdf !== null) {
      writeFileSync(cmd.pdf, pdf);
      written.push(`permit-set PDF to ${cmd.pdf}`);
    }
  } catch (e) {
    say(`linewright: cannot write ${written.length === 0 && cmd.out !== null ? cmd.out : cmd.pdf}: ${ioMessage(e)}`);
    return EXIT_BAD_INPUT;
  }
  if (cmd.out === null) process.stdout.write(output);
  for (const w of written) say(`linewright: wrote ${w}`);
  const unprintable = pdfModule?.unprintableNote(project) ?? null;
  if (unprintable !== null) say(`linewright: permit-set PDF: ${unprintable}`);
  // The text report ends with the caution; the other formats carry it inside, and CSV cannot, so say it here.
  if (cmd.format !== 'text' || cmd.out !== null) say(`Caution: ${report.caution || CAUTION}`);
  if (hasViolations(report)) return EXIT_VIOLATIONS;
  if (cmd.failOnAhj) {
    const { acceptedFindingIds } = await import('../review/dispositions');
    const accepted = acceptedFindingIds(project.review, report);
    if (report.findings.some((f) => f.severity === 'needs-ahj' && !accepted.has(f.id))) return EXIT_VIOLATIONS;
  }
  return EXIT_CLEAN;
}

async function diff(cmd: DiffCommand): Promise<number> {
  const { runDiff, DiffInputError } = await import('./diff');
  try {
    const { output, comparison } = await runDiff(cmd);
    process.stdout.write(output);
    return comparison.matters ? EXIT_VIOLATIONS : EXIT_CLEAN;
  } catch (e) {
    if (!(e instanceof DiffInputError)) throw e;
    say(`linewright: ${e.message}`);
    return EXIT_BAD_INPUT;
  }
}

let pipeGuard = false;

/** A reader that stops early (`| head`) closes the pipe: that is not an error worth a stack trace. */
function guardPipes(): void {
  if (pipeGuard) return;
  pipeGuard = true;
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE') process.exit(typeof process.exitCode === 'number' ? process.exitCode : 0);
    say(`linewright: cannot write to stdout: ${e.message}`);
    process.exit(EXIT_INTERNAL);
  });
}

/** Runs the command line; returns the exit status instead of exiting, so output is flushed first. */
export async function main(argv: readonly string[]): Promise<number> {
  guardPipes();
  const args = parseArgs(argv);
  switch (args.command) {
    case 'help':
      process.stdout.write(USAGE);
      return EXIT_CLEAN;
    case 'version':
      process.stdout.write(`${TOOL_NAME} ${TOOL_VERSION}\n`);
      return EXIT_CLEAN;
    case 'error':
      say(`linewright: ${args.message}`);
      say(`${USAGE_SHORT}Run "linewright --help" for the options and exit codes.`);
      return EXIT_BAD_INPUT;
    case 'check':
    case 'takeoff':
    case 'diff':
    case 'size':
      try {
        if (args.command === 'takeoff') return await (await import('./takeoff')).takeoff(args);
        if (args.command === 'size') return await (await import('./size')).runSize(args);
        return await (args.command === 'check' ? check(args) : diff(args));
      } catch (e) {
        // A bug of ours, not bad input: name it plainly; the stack only when asked for.
        say(`linewright: internal error: ${e instanceof Error ? e.message : String(e)}`);
        if (process.env.LINEWRIGHT_DEBUG && e instanceof Error && e.stack) say(e.stack);
        say('Please report this with the project file.');
        return EXIT_INTERNAL;
      }
  }
}

function isEntry(): boolean {
  const script = process.argv[1];
  if (!script) return false;
  try {
    return import.meta.url === pathToFileURL(realpathSync(script)).href;
  } catch {
    return false;
  }
}

if (isEntry()) process.exitCode = await main(process.argv.slice(2));
