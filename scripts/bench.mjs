/**
 * `npm run bench`: times the analyzer as it ships. The CLI (scripts/build-cli.mjs) and the web
 * build (Vite) bundle core with esbuild, which keeps no function names; a TypeScript loader such
 * as tsx compiles with keepNames instead, so every function or closure made at run time also
 * costs a call that names it, and a benchmark run under it times that too. So core/bench/analyze.bench.ts
 * and the core it imports are bundled here the same way (esbuild, no keepNames, syntax minified
 * like the CLI) into dist/bench/, then run. Build time is not part of any figure.
 */
import { spawnSync } from 'node:child_process';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
/** Two levels below the root, like core/bench/, so the bench finds the root and the CLI build script the same way. */
const OUT = resolve(ROOT, 'dist/bench/analyze.bench.mjs');

await build({
  entryPoints: [resolve(ROOT, 'core/bench/analyze.bench.ts')],
  outfile: OUT,
  bundle: true,
  format: 'esm',
  platform: 'node',
  target: 'node20.19',
  keepNames: false,
  minifySyntax: true,
  legalComments: 'none',
  logLevel: 'warning',
  absWorkingDir: ROOT,
  // Bundled CommonJS code may call require(); give ESM output one.
  banner: { js: "import { createRequire as __lwCreateRequire } from 'node:module';\nconst require = __lwCreateRequire(import.meta.url);" },
  define: { 'process.env.LINEWRIGHT_BENCH_BUNDLED': '"esbuild"' },
  plugins: [
    {
      name: 'cli-build-script-stays-outside',
      // The bench rebuilds the CLI with the script itself (which finds the root from its own path) and esbuild stays a package.
      setup(b) {
        b.onResolve({ filter: /build-cli\.mjs$/ }, () => ({ path: '../../scripts/build-cli.mjs', external: true }));
        b.onResolve({ filter: /^esbuild$/ }, () => ({ path: 'esbuild', external: true }));
      },
    },
  ],
});
const run = spawnSync(process.execPath, [OUT, ...process.argv.slice(2)], { cwd: ROOT, stdio: 'inherit' });
process.exit(run.status ?? 1);
