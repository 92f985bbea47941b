import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { CodeEdition, Project } from '../model/schema';
import { inertText } from '../report/safeText';

/** File and process helpers every subcommand shares; with main.ts the only Node-touching code of core. */

export const EXIT_CLEAN = 0;
export const EXIT_VIOLATIONS = 1;
export const EXIT_BAD_INPUT = 2;
export const EXIT_INTERNAL = 3;

export function say(s: string): void {
  process.stderr.write(s.endsWith('\n') ? s : `${s}\n`);
}

export function readInput(file: string): string {
  return file === '-' ? readFileSync(0, 'utf8') : readFileSync(file, 'utf8');
}

export function ioMessage(e: unknown): string {
  const err = e as NodeJS.ErrnoException;
  switch (err?.code) {
    case 'ENOENT':
      return 'no such file';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied';
    case 'EISDIR':
      return 'it is a directory, not a file';
    default:
      return err instanceof Error ? err.message : String(e);
  }
}

/** True when writing `target` would overwrite the project file itself. */
export function overwritesProject(file: string, target: string | null): boolean {
  return target !== null && file !== '-' && resolve(target) === resolve(file);
}

/**
 * Reads and loads a project for a subcommand, printing each problem as
 * `path: message`; the project (under the edition asked for) and its source
 * text, or an exit status.
 */
export async function loadForCli(file: string, edition: CodeEdition | null): Promise<{ project: Project; text: string } | number> {
  const { loadProject } = await import('../model/load');
  let text: string;
  try {
    text = readInput(file);
  } catch (e) {
    say(`linewright: cannot read ${file}: ${ioMessage(e)}`);
    return EXIT_BAD_INPUT;
  }
  const loaded = loadProject(text);
  if (!loaded.ok) {
    say(`linewright: ${file} is not a usable Linewright project (${loaded.errors.length} problem${loaded.errors.length === 1 ? '' : 's'}):`);
    // Paths and messages quote the file's own text (ids, unknown keys): shown inert, never acted on by the terminal.
    for (const e of loaded.errors) say(inertText(`${e.path || '(file)'}: ${e.message}`));
    return EXIT_BAD_INPUT;
  }
  for (const notice of loaded.notices ?? []) say(`linewright: ${inertText(notice)}`);
  const project: Project = edition === null ? loaded.project : { ...loaded.project, project: { ...loaded.project.project, codeEdition: edition } };
  return { project, text };
}
