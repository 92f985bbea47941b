#!/usr/bin/env node
// `npx linewright ...` from the repository root: core has no build step, so load its TypeScript
// through tsx's ESM loader and run the CLI. The exit status is the CLI's own.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
