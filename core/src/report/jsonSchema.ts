import { z } from 'zod';
import { PROJECT_FORMAT, PROJECT_VERSION, project } from '../model/schema';

/**
 * The JSON Schema (draft 2020-12) of the project file, generated from the zod schema so the two
 * cannot drift. `io: 'input'` describes what a file may hold (defaults optional), not the parsed
 * value. Branded ids are plain strings in JSON.
 */
export function projectJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(project, { io: 'input', target: 'draft-2020-12' }) as Record<string, unknown>;
  const { $schema, ...rest } = generated;
  return {
    $schema,
    title: 'Linewright project',
    description: `A one-line diagram project (format "${PROJECT_FORMAT}", version ${PROJECT_VERSION}). Generated from core/src/model/schema.ts by "npm run schema"; do not edit by hand.`,
    ...rest,
  };
}

/** The committed file's text: stable two-space JSON with a final newline. */
export function projectJsonSchemaText(): string {
  return `${JSON.stringify(projectJsonSchema(), null, 2)}\n`;
}
