import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { projectJsonSchemaText } from '../report/jsonSchema';

/** `npm run schema`: regenerates core/schema/linewright-project.schema.json from the zod schema. */
export const SCHEMA_PATH = resolve(dirname(fileURLToPath(import.meta.url)), '../../schema/linewright-project.schema.json');

mkdirSync(dirname(SCHEMA_PATH), { recursive: true });
writeFileSync(SCHEMA_PATH, projectJsonSchemaText());
process.stdout.write(`wrote ${SCHEMA_PATH}\n`);
