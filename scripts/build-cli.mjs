/**
 * Builds the `linewright` command ahead of time: core/src/cli/main.ts and everything it imports
 * (subcommands in core/src/cli/*.ts come along through main.ts) are bundled by esbuild into
 * core/dist/cli/, the file package.json's `bin` points at. No TypeScript loader runs when the
 * command does. The lazy imports of main.ts stay lazy: each renderer and the PDF code is a chunk of
 * its own, loaded only when asked for. Node packages (zod, jspdf) are bundled too, so start-up reads
 * a few files instead of resolving hundreds of modules.
 *
 * Run by `npm install` (the root `prepare` script) and before the tests (test/globalSetup.ts), so
 * the command under test is always built from the current source. `node scripts/build-cli.mjs`
 * rebuilds it by hand; it takes well under a second.
 */
import { chmodSync, rmSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { build } from 'esbuild';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
export const CLI_OUT_DIR = resolve(ROOT, 'core/dist/cli');
/** What package.json's `bin` names; main.ts runs itself when it is the process's entry file. */
export const CLI_ENTRY = resolve(CLI_OUT_DIR, 'linewright.mjs');

export async function buildCli() {
  rmSync(CLI_OUT_DIR, { recursive: true, force: true });
  await build({
    entryPoints: { linewright: resolve(ROOT, 'core/src/cli/main.ts') },
    outdir: CLI_OUT_DIR,
    outExtension: { '.js': '.mjs' },
    chunkNames: 'chunks/[name]-[hash]',
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'node',
    target: 'node20.19',
    // jspdf's browser-only extras (HTML rendering, canvas) are optional imports it guards itself.
    external: ['html2canvas', 'dompurify', 'canvg'],
    // Bundled CommonJS code may call require(); give ESM output one.
    banner: { js: "#!/usr/bin/env node\nimport { createRequire as __lwCreateRequire } from 'node:module';\nconst require = __lwCreateRequire(import.meta.url);" },
    legalComments: 'none',
    minifyWhitespace: true,
    minifySyntax: true,
    logLevel: 'warning',
    absWorkingDir: ROOT,
  });
  // Executable, as a `bin` must be for npx and npm's links to run it.
  chmodSync(CLI_ENTRY, 0o755);
  return CLI_ENTRY;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const t0 = performance.now();
  await buildCli();
  console.log(`linewright CLI built into ${CLI_ENTRY.slice(ROOT.length + 1)} in ${Math.round(performance.now() - t0)} ms`);
}
