#!/usr/bin/env node
// `linewright` (package.json `bin`). Runs the command built ahead of time by `npm install`
// (scripts/build-cli.mjs → core/dist/cli/linewright.mjs): plain JavaScript, no TypeScript loader.
// When that build is missing or older than a file of core/src (a pull or an edit since the last
// `npm install`), it runs the source through tsx instead, so the result is never a stale one;
// `npm run build:cli` makes it fast again. The exit status is the CLI's own.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const core = fileURLToPath(new URL('..', import.meta.url));
const built = join(core, 'dist/cli/linewright.mjs');

function builtIsCurrent() {
  if (!existsSync(built)) return false;
  const builtAt = statSync(built).mtimeMs;
  const src = join(core, 'src');
  for (const entry of readdirSync(src, { recursive: true, withFileTypes: true })) {
    if (entry.isFile() && statSync(join(entry.parentPath ?? entry.path, entry.name)).mtimeMs > builtAt) return false;
  }
  return true;
}

let main;
if (builtIsCurrent()) ({ main } = await import(built));
else {
  const { register } = await import('tsx/esm/api');
  register();
  ({ main } = await import('../src/cli/main.ts'));
}
process.exitCode = await main(process.argv.slice(2));
