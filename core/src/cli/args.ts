import { CAUTION } from '../caution';
import type { CodeEdition } from '../model/schema';
import { JSON_DETAILS, type JsonDetail } from '../report/json';
import { wrap } from '../report/text';
import { DIFF_USAGE, toDiffCommand, type DiffCommand } from './diff';
import { SIZE_USAGE, toSizeCommand, type SizeCommand } from './size';

/** Pure argument parsing for the `linewright` command: no I/O here, so every case is a unit test. */

export const FORMATS = ['text', 'json', 'sarif', 'csv'] as const;
export type OutputFormat = (typeof FORMATS)[number];
export const EDITIONS = ['2020', '2023'] as const;
/** PDF sheet sizes (report/pdf/sheet.ts SHEET_SIZES). */
export const SHEETS = ['ansi-b', 'ansi-d', 'arch-d'] as const;

export interface CheckCommand {
  command: 'check';
  file: string;
  format: OutputFormat;
  /** Also write the permit-set PDF here. */
  pdf: string | null;
  /** Sheet size of that PDF. */
  sheet: (typeof SHEETS)[number];
  /** Write the report here instead of stdout. */
  out: string | null;
  /** Analyze under this edition instead of the project's own setting. */
  edition: CodeEdition | null;
  color: boolean;
  /** How much working the JSON report carries (default summary). */
  detail: JsonDetail;
  /** Exit 1 also while a needs-AHJ finding has no standing AHJ acceptance in the file's review. */
  failOnAhj: boolean;
}

/** `linewright takeoff FILE`: quantities for an estimator (core/src/cli/takeoff.ts). */
export const TAKEOFF_FORMATS = ['text', 'csv', 'xlsx', 'json'] as const;
export type TakeoffFormat = (typeof TAKEOFF_FORMATS)[number];

export interface TakeoffCommand {
  command: 'takeoff';
  file: string;
  format: TakeoffFormat;
  out: string | null;
  edition: CodeEdition | null;
}

export type ParsedArgs =
  | CheckCommand
  | TakeoffCommand
  | DiffCommand
  | SizeCommand
  | { command: 'help' }
  | { command: 'version' }
  | { command: 'error'; message: string };

export const USAGE_SHORT = `Usage: linewright check FILE [--format text|json|sarif|csv] [--out FILE] [--pdf FILE] [--sheet ansi-b|ansi-d|arch-d] [--edition 2020|2023] [--detail summary|full] [--color] [--fail-on-ahj]
       linewright takeoff FILE [--format text|csv|xlsx|json] [--out FILE] [--edition 2020|2023]
       linewright diff OLD NEW [--format text|json]
       linewright size FILE --conductor ID [--format text|json]
       linewright --help | --version
`;

/** The full help; ends with the caution, as every output of Linewright does. */
export const USAGE = `${USAGE_SHORT}
Checks every conductor of a one-line project file against the conductor
overcurrent-protection and feeder-tap rules (NEC 240.4, 240.21(B), 240.21(C))
and prints a report. FILE may be - to read the project from stdin.

Options for check:
  --format text|json|sarif|csv   report format on stdout (default: text)
  --out FILE                     write the report to FILE instead of stdout
  --pdf FILE                     also write the annotated permit-set PDF to FILE
  --sheet ansi-b|ansi-d|arch-d   PDF sheet: ANSI B 17 x 11 in (default), ANSI D 34 x 22 in, ARCH D 36 x 24 in
  --edition 2020|2023            analyze under this NEC edition instead of the project's
  --detail summary|full          JSON report: summary (default) or full, which adds
                                 every rule tried with each condition
  --color                        colour the text report (off by default)
  --fail-on-ahj                  exit 1 also while a needs-AHJ finding is open (a standing
                                 AHJ acceptance recorded in the file's review closes it)

Options for takeoff (wire, raceway, devices and equipment counted from the
checked drawing: EGC by Table 250.122, raceway by Chapter 9):
  --format text|csv|xlsx|json    takeoff format (default: text); xlsx needs --out
                                 unless stdout is a file or a pipe
  --out FILE                     write the takeoff to FILE instead of stdout
  --edition 2020|2023            take off under this NEC edition

  -h, --help                     show this help
  -V, --version                  show the version

Other commands:
${DIFF_USAGE}${SIZE_USAGE}
Exit status of check:
  0  no violations found
  1  violations found (see the report)
  2  the file could not be read as a project, or the arguments are wrong
  3  Linewright itself failed (please report it with the file)

${wrap(`Caution: ${CAUTION}`, 78).join('\n')}
`;

function error(message: string): ParsedArgs {
  return { command: 'error', message };
}

const VALUE_FLAGS = new Set(['--format', '--out', '--pdf', '--sheet', '--edition', '--detail', '--conductor']);

/** Parses `argv` (without node and the script). Flags may be written `--flag value` or `--flag=value`. */
export function parseArgs(argv: readonly string[]): ParsedArgs {
  if (argv.length === 0) return error('no command given; expected "check FILE"');
  const positional: string[] = [];
  const values = new Map<string, string>();
  let color = false;
  let failOnAhj = false;
  let help = false;
  let version = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '--') {
      positional.push(...argv.slice(i + 1));
      break;
    }
    if (arg === '-h' || arg === '--help') help = true;
    else if (arg === '-V' || arg === '--version') version = true;
    else if (arg === '--color' || arg === '--colour') color = true;
    else if (arg === '--fail-on-ahj') failOnAhj = true;
    else if (arg.startsWith('--')) {
      const eq = arg.indexOf('=');
      const name = eq === -1 ? arg : arg.slice(0, eq);
      if (!VALUE_FLAGS.has(name)) return error(`unknown option ${name}`);
      let value: string | undefined;
      if (eq !== -1) value = arg.slice(eq + 1);
      else {
        value = argv[i + 1];
        if (value === undefined || (value.startsWith('-') && value !== '-')) return error(`option ${name} needs a value`);
        i++;
      }
      if (value === '') return error(`option ${name} needs a value`);
      if (values.has(name)) return error(`option ${name} given twice`);
      values.set(name, value);
    } else if (arg.startsWith('-') && arg !== '-') return error(`unknown option ${arg}`);
    else positional.push(arg);
  }
  if (help) return { command: 'help' };
  if (version) return { command: 'version' };

  const [command, file, ...rest] = positional;
  if (command === undefined) return error('no command given; expected "check FILE"');
  if (command === 'takeoff') return parseTakeoff(file, rest, values, color);
  if (command === 'diff') return failOnAhj || color ? error('options --color and --fail-on-ahj apply to check, not diff') : toDiffCommand(positional.slice(1), values);
  if (command === 'size') return failOnAhj || color ? error('options --color and --fail-on-ahj apply to check, not size') : toSizeCommand(positional.slice(1), values);
  if (values.has('--conductor')) return error('option --conductor belongs to size: linewright size FILE --conductor ID');
  if (command !== 'check') return error(`unknown command "${command}"; expected "check FILE", "takeoff FILE", "diff OLD NEW" or "size FILE --conductor ID"`);
  if (file === undefined) return error('check needs a project file: linewright check FILE');
  if (rest.length > 0) return error(`unexpected argument "${rest[0]}"; check takes one file`);

  const format = values.get('--format') ?? 'text';
  if (!(FORMATS as readonly string[]).includes(format)) return error(`option --format must be one of ${FORMATS.join(', ')} (got "${format}")`);
  const edition = parseEdition(values.get('--edition'));
  if (typeof edition === 'object' && edition !== null) return edition;
  const detail = values.get('--detail') ?? 'summary';
  if (!(JSON_DETAILS as readonly string[]).includes(detail)) return error(`option --detail must be ${JSON_DETAILS.join(' or ')} (got "${detail}")`);
  const sheet = values.get('--sheet') ?? 'ansi-b';
  if (!(SHEETS as readonly string[]).includes(sheet)) return error(`option --sheet must be one of ${SHEETS.join(', ')} (got "${sheet}")`);
  return {
    command: 'check',
    file,
    format: format as OutputFormat,
    pdf: values.get('--pdf') ?? null,
    sheet: sheet as CheckCommand['sheet'],
    out: values.get('--out') ?? null,
    edition,
    color,
    detail: detail as JsonDetail,
    failOnAhj,
  };
}

function parseEdition(text: string | undefined): CodeEdition | null | ParsedArgs {
  if (text === undefined) return null;
  if (!(EDITIONS as readonly string[]).includes(text)) return error(`option --edition must be ${EDITIONS.join(' or ')} (got "${text}")`);
  return Number(text) as CodeEdition;
}

function parseTakeoff(file: string | undefined, rest: readonly string[], values: ReadonlyMap<string, string>, color: boolean): ParsedArgs {
  if (file === undefined) return error('takeoff needs a project file: linewright takeoff FILE');
  if (rest.length > 0) return error(`unexpected argument "${rest[0]}"; takeoff takes one file`);
  if (values.has('--pdf')) return error('option --pdf belongs to check; the takeoff has no PDF of its own (the permit-set PDF carries the schedule)');
  if (color) return error('option --color belongs to check');
  if (values.has('--detail')) return error('option --detail belongs to check; the takeoff JSON always carries every run');
  const format = values.get('--format') ?? 'text';
  if (!(TAKEOFF_FORMATS as readonly string[]).includes(format)) return error(`option --format for takeoff must be one of ${TAKEOFF_FORMATS.join(', ')} (got "${format}")`);
  const edition = parseEdition(values.get('--edition'));
  if (typeof edition === 'object' && edition !== null) return edition;
  return { command: 'takeoff', file, format: format as TakeoffFormat, out: values.get('--out') ?? null, edition };
}
