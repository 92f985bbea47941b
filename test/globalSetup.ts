import { buildCli } from '../scripts/build-cli.mjs';

/**
 * Rebuilds the `linewright` command from the current source before any test runs, so the tests
 * that spawn core/dist/cli/linewright.mjs (the file `bin` points at) never test a stale build.
 */
export default async function setup(): Promise<void> {
  await buildCli();
}
