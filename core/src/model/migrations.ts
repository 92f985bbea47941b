import { PROJECT_FORMAT, PROJECT_VERSION } from './schema';
import type { LoadError } from '../analyze/types';
import { foundText } from './found';

/**
 * Schema versions and the steps between them. Step `n` turns a version-`n`
 * file into a version-`n + 1` file; each is a pure function on plain JSON
 * and has a test. `migrateToCurrent` handles every other case (missing,
 * older, newer, not a number) so a file is never silently misread.
 */
export type Migration = (old: Record<string, unknown>) => Record<string, unknown>;

/**
 * Version 1 → 2: version 2 adds the plan-review block (comments, dispositions,
 * rounds) and changes the meaning of nothing else, so every version-1 field is
 * carried over as it is. Version 1 had no review block; a top-level "review" in
 * a version-1 file was never ours, so it is moved to "reviewFromVersion1",
 * where the loader sets it aside with a notice instead of reading it as review
 * data it never was.
 */
export function migrateV1toV2(old: Record<string, unknown>): Record<string, unknown> {
  const { review, ...rest } = old;
  return review === undefined ? { ...rest, version: 2 } : { ...rest, version: 2, reviewFromVersion1: review };
}

export const MIGRATIONS: Readonly<Record<number, Migration>> = { 1: migrateV1toV2 };

export type MigrationResult =
  | { ok: true; value: Record<string, unknown>; migratedFrom: number | null }
  | { ok: false; errors: LoadError[] };

export function migrateToCurrent(
  raw: Record<string, unknown>,
  migrations: Readonly<Record<number, Migration>> = MIGRATIONS,
  currentVersion: number = PROJECT_VERSION,
): MigrationResult {
  if (raw.format !== PROJECT_FORMAT) {
    const found = raw.format === undefined ? 'no "format" field' : `"format" is ${JSON.stringify(raw.format)}`;
    return fail('format', `This is not a Linewright project file: ${found}; expected "format": "${PROJECT_FORMAT}".`);
  }
  const version = raw.version;
  if (version === undefined) {
    return fail('version', `"version" is missing; add "version": ${currentVersion} (the file format version) next to "format".`);
  }
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    return fail('version', `"version" must be a whole number from 1 to ${currentVersion}; found ${foundText(version)}.`);
  }
  if (version > currentVersion) {
    return fail(
      'version',
      `The file is version ${version}, newer than this Linewright reads (${currentVersion}); open it with a newer Linewright.`,
    );
  }
  let value = raw;
  for (let v = version; v < currentVersion; v++) {
    const step = migrations[v];
    if (!step) return fail('version', `No migration from version ${v} to ${v + 1}; the file cannot be upgraded.`);
    value = { ...step(value), version: v + 1 };
  }
  return { ok: true, value, migratedFrom: version === currentVersion ? null : version };
}

function fail(path: string, message: string): MigrationResult {
  return { ok: false, errors: [{ path, message }] };
}
