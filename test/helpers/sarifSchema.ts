import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import Ajv from 'ajv-draft-04';
import addFormats from 'ajv-formats';

/**
 * The official SARIF 2.1.0 JSON schema (OASIS SARIF 2.1.0, sarif-schema-2.1.0 "rtm.5", the schema
 * published with the standard) as shipped in the @microsoft/jest-sarif package: read from
 * node_modules, never fetched. The schema is draft-04, so the validator is Ajv's draft-04 class, with
 * the "uri", "uri-reference" and "date-time" formats checked (ajv-formats) rather than ignored.
 */
const require = createRequire(import.meta.url);
const SCHEMA_FILE = join(dirname(require.resolve('@microsoft/jest-sarif/package.json')), 'lib/schemas/sarif-2.1.0-rtm.5.json');
export const SARIF_2_1_0_SCHEMA = JSON.parse(readFileSync(SCHEMA_FILE, 'utf8')) as Record<string, unknown>;

// unicodeRegExp off: the schema's pattern for `language` ("^[a-zA-Z]{2}|^[a-zA-Z]{2}-[a-zA-Z]{2}]?$") has a
// stray "]" that is a syntax error under the u flag; without the flag it is read as a literal "]".
const ajv = new Ajv({ allErrors: true, strict: false, unicodeRegExp: false });
addFormats(ajv);
const validate = ajv.compile(SARIF_2_1_0_SCHEMA);

/** The schema's complaints about a log, one per line; "" when the log is valid. */
export function sarifSchemaErrors(log: unknown): string {
  return validate(log) ? '' : ajv.errorsText(validate.errors, { separator: '\n' });
}
