import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyze, loadProject, migrateToCurrent, migrateV1toV2, PROJECT_VERSION, toJsonReport } from '@linewright/core';

// File version 2 is our own format: these cases pin that a version-1 file keeps its meaning.
const samplesDir = fileURLToPath(new URL('../../../samples/', import.meta.url));
const samples = readdirSync(samplesDir).filter((f) => f.endsWith('.json') && !f.endsWith('.expected.json') && f !== 'package.json');
const asV1 = (f: string) => {
  const raw = JSON.parse(readFileSync(samplesDir + f, 'utf8')) as Record<string, unknown>;
  return { ...raw, version: 1 };
};

describe('file version 1 → 2', () => {
  it('the current version is 2', () => expect(PROJECT_VERSION).toBe(2));

  it.each(samples)('%s: the step is pure and changes nothing but the version', (f) => {
    const v1 = asV1(f);
    const frozen = structuredClone(v1);
    const v2 = migrateV1toV2(v1);
    expect(v1).toEqual(frozen);
    expect(v2).toEqual({ ...frozen, version: 2 });
  });

  it.each(samples)('%s: opens as version 2 with the same analysis as the version-1 text', (f) => {
    const v1 = asV1(f);
    const fromV1 = loadProject(JSON.stringify(v1));
    const fromV2 = loadProject(JSON.stringify({ ...v1, version: 2 }));
    expect(fromV1.ok && fromV2.ok).toBe(true);
    if (!fromV1.ok || !fromV2.ok) return;
    expect(fromV1.project.version).toBe(2);
    expect(fromV1.notices).toContain('Upgraded from file version 1.');
    expect(fromV1.project).toEqual(fromV2.project);
    expect(fromV1.project.review).toBeUndefined();
    expect(toJsonReport(analyze(fromV1.project))).toEqual(toJsonReport(analyze(fromV2.project)));
  });

  it('a top-level "review" in a version-1 file was never review data: it is set aside with a notice, not read', () => {
    const v1 = { ...asV1(samples[0]!), review: { comments: [{ number: 1 }] } };
    expect(migrateToCurrent(v1).ok && (migrateToCurrent(v1) as { value: Record<string, unknown> }).value.review).toBeUndefined();
    const r = loadProject(JSON.stringify(v1));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.project.review).toBeUndefined();
    expect(r.notices.join(' ')).toMatch(/reviewFromVersion1/);
  });

  it('a version-2 file with review data round-trips unchanged through load and save', () => {
    const text = readFileSync(`${samplesDir}review/round-2.json`, 'utf8');
    const r = loadProject(text);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.notices).toEqual([]);
    expect(r.project.review?.comments.map((c) => c.number)).toEqual([1, 2]);
    // Loading fills defaults; a second load of the saved text gives the same document.
    const again = loadProject(JSON.stringify(r.project));
    expect(again.ok && again.project).toEqual(r.project);
  });
});
