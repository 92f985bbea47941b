import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { projectJsonSchema, projectJsonSchemaText } from '../../../core/src/report/jsonSchema';

const committed = fileURLToPath(new URL('../../../core/schema/linewright-project.schema.json', import.meta.url));

describe('project JSON Schema', () => {
  it('the committed core/schema/linewright-project.schema.json is current (run "npm run schema" if this fails)', () => {
    expect(readFileSync(committed, 'utf8')).toBe(projectJsonSchemaText());
  });

  it('is a JSON Schema draft 2020-12 document describing the file as written (JSON Schema 2020-12 core, §8.1.1 $schema)', () => {
    const s = projectJsonSchema() as { $schema: string; type: string; required: string[]; properties: Record<string, { const?: unknown }> };
    expect(s.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(s.type).toBe('object');
    expect(s.required).toEqual(expect.arrayContaining(['format', 'version', 'project', 'nodes', 'conductors']));
    // io: 'input': fields with defaults are optional in the file.
    expect(s.required).not.toContain('busLinks');
    expect(s.properties.format!.const).toBe('linewright-project');
  });
});
