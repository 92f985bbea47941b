import { analyze, loadProject, type AnalysisReport, type ProjectInput } from '@linewright/core';

/** Loads a project (throwing with every path-named error if it is refused) and analyzes it. */
export function run(input: ProjectInput): AnalysisReport {
  const r = loadProject(input);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return analyze(r.project);
}

/** The report line of conductor `id`; throws when the report has none. */
export function conductor(report: AnalysisReport, id: string): AnalysisReport['conductors'][number] {
  const c = report.conductors.find((x) => x.id === id);
  if (!c) throw new Error(`no conductor ${id}`);
  return c;
}
