import { spawn } from 'node:child_process';
import { resolve } from 'node:path';
import { CLI_ENTRY } from '../../scripts/build-cli.mjs';

/** The repository root, where the CLI runs. */
export const ROOT = resolve(import.meta.dirname, '../..');

/**
 * Runs a command from the repository root in a child process; async so cases run side by side.
 * Feeds `input` (or nothing) on stdin.
 */
export function run(command: string, prefix: string[], args: string[], input?: string): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((done, fail) => {
    const child = spawn(command, [...prefix, ...args], { cwd: ROOT, stdio: ['pipe', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.setEncoding('utf8').on('data', (d: string) => (stdout += d));
    child.stderr.setEncoding('utf8').on('data', (d: string) => (stderr += d));
    child.on('error', fail);
    child.on('close', (code) => done({ code, stdout, stderr }));
    child.stdin.end(input ?? '');
  });
}

/** The built command (core/dist/cli/linewright.mjs, rebuilt from the source by test/globalSetup.ts) with node directly. */
export const cli = (args: string[], input?: string) => run(process.execPath, [CLI_ENTRY], args, input);
