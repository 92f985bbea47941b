import type { CodeEdition } from '../model/schema';
import { EXIT_BAD_INPUT, EXIT_CLEAN, EXIT_VIOLATIONS, loadForCli, say } from './io';

/** `linewright size FILE --conductor ID`: the sizing assistant without the browser. */

export const SIZE_FORMATS = ['text', 'json'] as const;
export type SizeFormat = (typeof SIZE_FORMATS)[number];

export interface SizeCommand {
  command: 'size';
  file: string;
  conductor: string;
  format: SizeFormat;
  edition: CodeEdition | null;
}

export const SIZE_USAGE = `  linewright size FILE --conductor ID [--format text|json] [--edition 2020|2023]
      the cheapest sizes, materials, parallel sets and (for a branch circuit) device
      ratings that the analyzer accepts for conductor ID's run, why each passes and
      why cheaper ones fail. Costs are a stated relative proxy, not prices.
      Exit 0 a choice was found, 1 none passes, 2 bad input.
`;

/** Pure: the size command from its arguments, or the message naming what is wrong. */
export function toSizeCommand(args: readonly string[], values: ReadonlyMap<string, string>): SizeCommand | { command: 'error'; message: string } {
  const [file, ...rest] = args;
  if (file === undefined) return { command: 'error', message: 'size needs a project file: linewright size FILE --conductor ID' };
  if (rest.length > 0) return { command: 'error', message: `unexpected argument "${rest[0]}"; size takes one file` };
  for (const flag of values.keys()) {
    if (flag !== '--format' && flag !== '--conductor' && flag !== '--edition') return { command: 'error', message: `option ${flag} does not apply to size (only --conductor, --format, --edition)` };
  }
  const conductor = values.get('--conductor');
  if (conductor === undefined) return { command: 'error', message: 'size needs the conductor to size: --conductor ID (an id from the check report)' };
  const format = values.get('--format') ?? 'text';
  if (!(SIZE_FORMATS as readonly string[]).includes(format)) return { command: 'error', message: `option --format of size must be text or json (got "${format}")` };
  const e = values.get('--edition');
  if (e !== undefined && e !== '2020' && e !== '2023') return { command: 'error', message: `option --edition must be 2020 or 2023 (got "${e}")` };
  return { command: 'size', file, conductor, format: format as SizeFormat, edition: e === undefined ? null : (Number(e) as CodeEdition) };
}

export async function runSize(cmd: SizeCommand): Promise<number> {
  const loaded = await loadForCli(cmd.file, cmd.edition);
  if (typeof loaded === 'number') return loaded;
  const { sizeConductor } = await import('../sizing/sizeConductor');
  const { renderSizingText } = await import('../sizing/text');
  const { CAUTION } = await import('../caution');
  if (!loaded.project.conductors.some((c) => c.id === cmd.conductor)) {
    const ids = loaded.project.conductors.slice(0, 12).map((c) => c.id);
    say(`linewright: --conductor: there is no conductor "${cmd.conductor}" in ${cmd.file}; its conductors include ${ids.join(', ') || '(none)'}`);
    return EXIT_BAD_INPUT;
  }
  const r = sizeConductor(loaded.project, cmd.conductor);
  process.stdout.write(cmd.format === 'json' ? `${JSON.stringify({ format: 'linewright-sizing', version: 1, caution: CAUTION, ...r }, null, 2)}\n` : renderSizingText(r));
  if (cmd.format === 'json') say(`Caution: ${CAUTION}`);
  return r.candidates.length > 0 ? EXIT_CLEAN : EXIT_VIOLATIONS;
}
