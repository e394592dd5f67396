import { Command, Option } from 'commander';
import {
  angleTable,
  angleTableMidpointErrors,
  angleTableRowsForTarget,
  angleTableToCHeader,
  angleTableToCsv,
  angleTableToJson,
  type AngleTableErrorMetric,
  type AngleTablePattern,
} from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { callLibrary } from '../input/callLibrary.js';
import { parseNumberList } from '../input/parseValue.js';
import { readDataFile } from '../input/readDataFile.js';
import type { CliIo } from '../output/CliIo.js';
import { writeOutput } from '../output/writeOutput.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';

type AngleTableFlags = Record<string, unknown> &
  OutputFlags & { format?: 'c-header' | 'csv' | 'json'; design?: string };

/** The option that sets each library field, for the notes errors end with. */
const ANGLE_TABLE_FLAGS: Readonly<Record<string, string>> = {
  'pattern.method': '--method (or the design)',
  'pattern.kind': '--kind (or the design)',
  'pattern.vdc': '--vdc (or the design)',
  'pattern.eliminate': '--eliminate (or the design)',
  'pattern.count': '--count',
  'pattern.objective': '--objective',
  'pattern.maxOrder': '--max-order',
  'ma.from': '--ma-from',
  'ma.to': '--ma-to',
  rows: '--rows',
  'target.metric': '--target-metric',
  'target.value': '--target',
  maxRows: '--max-rows',
  angles: '--angles',
  fractionBits: '--fraction-bits',
  timerClock: '--timer-clock',
  fundamentalFrequency: '--fundamental-frequency (or the design)',
  prefix: '--prefix',
};

/**
 * `pulsewright angle-table`: a table of switching angles over a range of ma for a controller
 * (the library's angleTable, or angleTableRowsForTarget for an error target), with the exact
 * error of interpolating it at each interval's midpoint, as a C header, CSV or JSON: the same
 * bytes the API's `POST /api/v1/angle-tables?format=…` downloads.
 */
export function angleTableCommand(io: CliIo): Command {
  const command = new Command('angle-table').description(
    'switching angles over a range of ma for a controller, with the error of interpolating them (C header, CSV or JSON)',
  );
  const group = (option: Option, title: string) => command.addOption(option.helpGroup(title));
  group(
    new Option(
      '--design <file>',
      'a design (JSON or YAML, - for standard input) with a stored SHE or optimal pattern: its method, kind, DC bus, eliminated orders, angles and fundamental frequency',
    ),
    'Pattern:',
  );
  group(
    new Option('--method <method>', 'she (eliminate orders) or optimal (least WTHD or THD)'),
    'Pattern:',
  );
  group(
    new Option(
      '--kind <kind>',
      'bipolar (two-level ±vdc, the default) or staircase (equal DC cells)',
    ),
    'Pattern:',
  );
  group(
    numberOption('--vdc <volts>', 'DC voltage: the bipolar level or each staircase cell'),
    'Pattern:',
  );
  group(
    new Option('--eliminate <orders>', 'she: odd orders to eliminate, comma-separated').argParser(
      parseNumberList,
    ),
    'Pattern:',
  );
  group(numberOption('--count <angles>', 'optimal: number of first-quarter angles'), 'Pattern:');
  group(new Option('--objective <objective>', 'optimal: wthd (default) or thd'), 'Pattern:');
  group(
    numberOption('--max-order <order>', 'optimal: highest order of the objective (default 99)'),
    'Pattern:',
  );
  group(
    new Option(
      '--angles <radians>',
      'angles at --ma-from to start from (a point picked on a branch)',
    ).argParser(parseNumberList),
    'Pattern:',
  );
  group(numberOption('--ma-from <ma>', 'first row: ma = V1/(L·vdc), in (0, 4/π)'), 'Rows:');
  group(numberOption('--ma-to <ma>', 'last row, above --ma-from'), 'Rows:');
  group(numberOption('--rows <count>', 'number of rows, 2..1024 (default 32)'), 'Rows:');
  group(
    numberOption('--target <error>', 'choose the fewest rows whose midpoint error is at most this'),
    'Rows:',
  );
  group(
    new Option(
      '--target-metric <metric>',
      'eliminated-residual (default for she), fundamental-error, or wthd-change (default for optimal)',
    ),
    'Rows:',
  );
  group(numberOption('--max-rows <count>', 'most rows tried for a target (default 256)'), 'Rows:');
  group(
    numberOption(
      '--fraction-bits <n>',
      'unsigned Q0.n fractions of the period, 8..32 (default 16)',
    ),
    'Firmware:',
  );
  group(numberOption('--timer-clock <hertz>', 'timer clock after the prescaler'), 'Firmware:');
  group(
    numberOption('--fundamental-frequency <hertz>', 'output frequency (default: the design’s)'),
    'Firmware:',
  );
  group(
    new Option('--prefix <name>', 'prefix of the C names and macros (default angle_table)'),
    'Firmware:',
  );
  group(
    new Option('--format <format>', 'c-header (default), csv or json').choices([
      'c-header',
      'csv',
      'json',
    ]),
    'Output:',
  );
  addOutputOptions(command);
  command.addHelpText(
    'after',
    '\nThe default format is c-header; --json is --format json. Rows where the branch has no solution are marked and never interpolated across.',
  );
  command.action((flags: AngleTableFlags) => {
    const { pattern, angles, fundamentalFrequency } = patternOf(flags);
    const notes = new Map(Object.entries(ANGLE_TABLE_FLAGS).map(([f, o]) => [f, `option ${o}`]));
    const ma = { from: flags.maFrom, to: flags.maTo } as { from: number; to: number };
    const start = angles === undefined ? {} : { angles };
    const fixedPoint = {
      timerClock: flags.timerClock as number,
      fundamentalFrequency: fundamentalFrequency as number,
      ...(flags.fractionBits === undefined ? {} : { fractionBits: flags.fractionBits as number }),
    };
    const format = flags.json === true ? 'json' : (flags.format ?? 'c-header');
    const text = callLibrary(
      () => {
        let table;
        let midpointErrors;
        if (flags.target !== undefined) {
          const metric =
            flags.targetMetric ??
            (pattern.method === 'optimal-pattern' ? 'wthd-change' : 'eliminated-residual');
          const chosen = angleTableRowsForTarget({
            pattern,
            ma,
            ...start,
            target: { metric: metric as AngleTableErrorMetric, value: flags.target as number },
            ...(flags.maxRows === undefined ? {} : { maxRows: flags.maxRows as number }),
          });
          ({ table, midpointErrors } = chosen);
        } else {
          table = angleTable({ pattern, ma, rows: (flags.rows ?? 32) as number, ...start });
          midpointErrors = angleTableMidpointErrors(table);
        }
        if (format === 'csv') return angleTableToCsv(table, { midpointErrors, fixedPoint });
        if (format === 'json') return angleTableToJson(table, { midpointErrors, fixedPoint });
        const prefix = (flags.prefix ?? 'angle_table') as string;
        return angleTableToCHeader(table, { ...fixedPoint, prefix, midpointErrors });
      },
      { notes },
    );
    // The API's bytes; a newline after JSON only on a terminal, so the prompt starts on its own line.
    const onTerminal =
      io.stdout.isTTY === true && (flags.output === undefined || flags.output === '-');
    writeOutput(format === 'json' && onTerminal ? `${text}\n` : text, flags.output, io);
  });
  return command;
}

/** The pattern from --design and the flags (a flag wins over the design). */
function patternOf(flags: AngleTableFlags): {
  pattern: AngleTablePattern;
  angles: number[] | undefined;
  fundamentalFrequency: unknown;
} {
  const design =
    flags.design === undefined ? {} : designFields(readDataFile(flags.design, '--design'));
  const method = flags.method ?? design.method;
  if (method !== 'she' && method !== 'optimal') {
    throw new InputError(
      '--method',
      `--method must be she or optimal (or give a --design with a stored pattern); got ${JSON.stringify(method)}`,
    );
  }
  const kind = flags.kind ?? design.kind ?? 'bipolar';
  const vdc = flags.vdc ?? design.vdc;
  const angles = (flags.angles ?? design.angles) as number[] | undefined;
  const pattern =
    method === 'she'
      ? {
          method: 'selective-harmonic-elimination',
          kind,
          vdc,
          eliminate: flags.eliminate ?? design.eliminate,
        }
      : {
          method: 'optimal-pattern',
          kind,
          vdc,
          count: flags.count ?? angles?.length,
          ...(flags.objective === undefined ? {} : { objective: flags.objective }),
          ...(flags.maxOrder === undefined ? {} : { maxOrder: flags.maxOrder }),
        };
  return {
    pattern: pattern as AngleTablePattern,
    angles,
    fundamentalFrequency: flags.fundamentalFrequency ?? design.fundamentalFrequency,
  };
}

/** The fields of a design that a pattern table uses (a design is checked by the library where used). */
function designFields(value: unknown): Record<string, unknown> {
  const design = (typeof value === 'object' && value !== null ? value : {}) as Record<
    string,
    unknown
  >;
  const modulation = (design.modulation ?? {}) as Record<string, unknown>;
  const method =
    modulation.method === 'selective-harmonic-elimination'
      ? 'she'
      : modulation.method === 'optimal-pattern'
        ? 'optimal'
        : undefined;
  if (method === undefined) {
    throw new InputError(
      '--design',
      `--design must hold a stored pattern (modulation.method selective-harmonic-elimination or optimal-pattern); got ${JSON.stringify(modulation.method)}`,
    );
  }
  return {
    method,
    kind: modulation.kind,
    vdc: design.vdc,
    eliminate: modulation.eliminate,
    angles: modulation.angles,
    fundamentalFrequency: design.fundamentalFrequency,
  };
}
