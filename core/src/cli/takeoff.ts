import { writeFileSync } from 'node:fs';
import type { Takeoff } from '../takeoff/types';
import type { TakeoffCommand } from './args';
import { EXIT_BAD_INPUT, EXIT_CLEAN, ioMessage, loadForCli, overwritesProject, say } from './io';

/** `linewright takeoff FILE`: the estimator's quantities of a checked project, as text, CSV, XLSX or JSON. */
export async function takeoff(cmd: TakeoffCommand): Promise<number> {
  if (overwritesProject(cmd.file, cmd.out)) {
    say(`linewright: --out ${cmd.out} is the project file itself; choose another name so the drawing is not overwritten`);
    return EXIT_BAD_INPUT;
  }
  if (cmd.format === 'xlsx' && cmd.out === null && process.stdout.isTTY) {
    say('linewright: an XLSX workbook is binary; write it to a file with --out FILE.xlsx (or pipe it)');
    return EXIT_BAD_INPUT;
  }
  const loaded = await loadForCli(cmd.file, cmd.edition);
  if (typeof loaded === 'number') return loaded;
  const { analyze } = await import('../analyze/analyze');
  const { buildTakeoff } = await import('../takeoff/takeoff');
  const t = buildTakeoff(loaded.project, analyze(loaded.project));
  const output = await render(cmd, t);
  if (cmd.out !== null) {
    try {
      writeFileSync(cmd.out, output);
    } catch (e) {
      say(`linewright: cannot write ${cmd.out}: ${ioMessage(e)}`);
      return EXIT_BAD_INPUT;
    }
    say(`linewright: wrote takeoff (${cmd.format}) to ${cmd.out}`);
  } else process.stdout.write(output);
  // The text takeoff ends with the caution and the others carry it inside; a file written elsewhere gets it here.
  if (cmd.format !== 'text' || cmd.out !== null) say(`Caution: ${t.caution}`);
  // The takeoff counts; it does not judge, so a drawing with violations still exits 0 (the check command judges).
  return EXIT_CLEAN;
}

async function render(cmd: TakeoffCommand, t: Takeoff): Promise<string | Uint8Array> {
  switch (cmd.format) {
    case 'text':
      return (await import('../report/takeoffText')).renderTakeoffText(t);
    case 'csv':
      return (await import('../report/takeoffCsv')).toTakeoffCsv(t);
    case 'json':
      return `${JSON.stringify((await import('../report/takeoffJson')).toTakeoffJson(t), null, 2)}\n`;
    case 'xlsx':
      return (await import('../report/takeoffXlsx')).takeoffWorkbook(t);
  }
}
