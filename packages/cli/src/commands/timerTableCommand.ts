import { Command, Option } from 'commander';
import {
  timerTableToCHeader,
  timerTableToCsv,
  timerTableToJson,
  type TimerTable,
} from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { callLibrary } from '../input/callLibrary.js';
import type { CliIo } from '../output/CliIo.js';
import { writeOutput } from '../output/writeOutput.js';
import { addTimerOptions, readTimerTable, type TimerInputFlags } from '../timer/readTimerTable.js';
import { addOutputOptions, type OutputFlags } from './commonOptions.js';

export const TIMER_FORMATS = ['c-header', 'csv', 'json'] as const;
export type TimerFormat = (typeof TIMER_FORMATS)[number];

type TimerFlags = TimerInputFlags & OutputFlags & { format?: TimerFormat; quiet?: boolean };

/**
 * The table rendered as the API's `POST /api/v1/timer-tables?format=…` renders it (the same
 * library calls, the same default prefix), so a file from either is the same byte for byte.
 */
export function renderTimerTable(
  table: TimerTable,
  format: TimerFormat,
  prefix = 'pwm_table',
): string {
  if (format === 'csv') return timerTableToCsv(table);
  if (format === 'c-header') return timerTableToCHeader(table, { prefix });
  return timerTableToJson(table);
}

/** `pulsewright timer-table`: timer compare values as a C header, CSV or JSON. */
export function timerTableCommand(io: CliIo): Command {
  const command = new Command('timer-table').description(
    'timer compare values for a controller (C header, CSV or JSON), byte for byte as the API downloads them',
  );
  addTimerOptions(command);
  command.addOption(
    new Option('--prefix <name>', 'prefix of the C names and macros (default pwm_table)').helpGroup(
      'Timer:',
    ),
  );
  command.addOption(
    new Option('--format <format>', 'c-header, csv or json')
      .choices(TIMER_FORMATS)
      .helpGroup('Output:'),
  );
  command.addOption(
    new Option(
      '-q, --quiet',
      "do not print the table's warnings on standard error (they are in the output too)",
    ).helpGroup('Output:'),
  );
  addOutputOptions(command);
  command.addHelpText(
    'after',
    '\nThe input is a design (file or flags) with the timer options, or a JSON/YAML file holding the body of\n' +
      'POST /api/v1/timer-tables (modulation, fundamentalFrequency, carrierFrequency, timerClock, …, prefix).\n' +
      'The default format is c-header; --json is --format json.',
  );
  command.action((file: string | undefined, flags: TimerFlags) => {
    if (flags.json === true && flags.format !== undefined && flags.format !== 'json') {
      throw new InputError(
        '--format',
        `--format must be json or left out with --json; got ${JSON.stringify(flags.format)}`,
      );
    }
    const format: TimerFormat = flags.json === true ? 'json' : (flags.format ?? 'c-header');
    const { table, prefix, messages } = readTimerTable(file, flags);
    const notes = new Map(flags.prefix === undefined ? [] : [['prefix', 'from --prefix']]);
    let text = callLibrary(() => renderTimerTable(table, format, prefix), { notes });
    if (
      format === 'json' &&
      io.stdout.isTTY === true &&
      (flags.output === undefined || flags.output === '-')
    )
      text += '\n';
    writeOutput(text, flags.output, io);
    if (flags.quiet !== true) {
      for (const message of messages) io.stderr.write(`pulsewright: note: ${message}\n`);
      for (const warning of table.warnings)
        io.stderr.write(`pulsewright: warning: ${warning.field}: ${warning.message}\n`);
    }
  });
  return command;
}
