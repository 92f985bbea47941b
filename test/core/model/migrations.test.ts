import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyze, loadProject, migrateToCurrent, PROJECT_FORMAT, PROJECT_VERSION } from '@linewright/core';

const SAMPLES = new URL('../../../samples/', import.meta.url);
const sampleFiles = readdirSync(SAMPLES).filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json');

describe('schema versions and migrations', () => {
  it('a current file passes through untouched', () => {
    const raw = { format: PROJECT_FORMAT, version: PROJECT_VERSION, nodes: [] };
    const r = migrateToCurrent(raw);
    expect(r).toEqual({ ok: true, value: raw, migratedFrom: null });
  });

  it('applies each step in order and stamps the new version', () => {
    // A made-up history: version 1 called the length "len", version 2 used metres.
    const steps = {
      1: (old: Record<string, unknown>) => ({ ...old, conductors: (old.conductors as { len: number }[]).map(({ len }) => ({ lengthM: len })) }),
      2: (old: Record<string, unknown>) => ({ ...old, conductors: (old.conductors as { lengthM: number }[]).map(({ lengthM }) => ({ lengthFt: lengthM / 0.3048 })) }),
    };
    const r = migrateToCurrent({ format: PROJECT_FORMAT, version: 1, conductors: [{ len: 3.048 }] }, steps, 3);
    expect(r.ok && r.value).toEqual({ format: PROJECT_FORMAT, version: 3, conductors: [{ lengthFt: 10 }] });
    expect(r.ok && r.migratedFrom).toBe(1);
  });

  it('a file from a newer Linewright is refused with advice, not misread', () => {
    const r = migrateToCurrent({ format: PROJECT_FORMAT, version: PROJECT_VERSION + 1 });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.errors[0]).toMatchObject({ path: 'version' });
    expect(!r.ok && r.errors[0]!.message).toMatch(/newer Linewright/);
  });

  it('a missing step is an error naming the version', () => {
    const r = migrateToCurrent({ format: PROJECT_FORMAT, version: 1 }, {}, 2);
    expect(!r.ok && r.errors[0]!.message).toMatch(/version 1 to 2/);
  });

  it.each([
    [{ version: 1 }, 'format'],
    [{ format: 'some-other-format', version: 1 }, 'format'],
    [{ format: PROJECT_FORMAT }, 'version'],
    [{ format: PROJECT_FORMAT, version: '1' }, 'version'],
    [{ format: PROJECT_FORMAT, version: 0 }, 'version'],
  ])('%j is refused at "%s"', (raw, path) => {
    const r = migrateToCurrent(raw as Record<string, unknown>);
    expect(!r.ok && r.errors[0]!.path).toBe(path);
  });
});

describe('old files still open', () => {
  it.each(sampleFiles)('%s written as file version 1 opens through the migration, says so, and is analyzed', (file) => {
    const current = JSON.parse(readFileSync(new URL(file, SAMPLES), 'utf8')) as Record<string, unknown>;
    expect(current.version).toBe(PROJECT_VERSION);
    const text = JSON.stringify({ ...current, version: 1 });
    const r = loadProject(text);
    expect(r.ok ? [] : r.errors.slice(0, 3)).toEqual([]);
    if (!r.ok) return;
    expect(r.project.version).toBe(PROJECT_VERSION);
    expect(r.notices).toContain('Upgraded from file version 1.');
    expect(analyze(r.project).conductors.length).toBe(JSON.parse(text).conductors.length);
  });

  it('a version 2 file written before the optional fields of this version (every size stated, no egcBare, no sizingMaterials) opens unchanged', () => {
    const v2 = JSON.parse(readFileSync(new URL('demo-clinic.json', SAMPLES), 'utf8')) as { conductors: Record<string, unknown>[] };
    for (const c of v2.conductors) {
      expect(c.size).toBeDefined();
      expect(c.egcBare).toBeUndefined();
    }
    const r = loadProject({ ...v2, version: 2 });
    expect(r.ok ? [] : r.errors.slice(0, 3)).toEqual([]);
    if (!r.ok) return;
    expect(r.notices).toEqual([]);
    expect(r.project.conductors.map((c) => c.size)).toEqual(v2.conductors.map((c) => c.size));
  });
});
