import { Command } from 'commander';
import {
  multilevelTimerTable,
  multilevelTimerTableToCHeader,
  multilevelTimerTableToCsv,
  multilevelTimerTableToJson,
  type MultilevelTimerTable,
  type MultilevelTimerTableOptions,
} from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { callLibrary } from '../input/callLibrary.js';
import { readDataFile } from '../input/readDataFile.js';
import type { CliIo } from '../output/CliIo.js';
import {
  addTimerOutputOptions,
  timerFormatOf,
  writeTimerOutput,
  type TimerFormat,
  type TimerOutputFlags,
} from './timerOutput.js';

/**
 * The table rendered as the API's `POST /api/v1/multilevel-timer-tables?format=…` renders it
 * (the same library calls, the same default prefix), so a file from either is the same byte for
 * byte.
 */
export function renderMultilevelTimerTable(
  table: MultilevelTimerTable,
  format: TimerFormat,
  prefix = 'pwm_multilevel',
): string {
  if (format === 'csv') return multilevelTimerTableToCsv(table);
  if (format === 'c-header') return multilevelTimerTableToCHeader(table, { prefix });
  return multilevelTimerTableToJson(table);
}

/**
 * `pulsewright multilevel-timer-table <request>`: compare values for every switch of a multilevel
 * leg, from a JSON or YAML file holding the body of `POST /api/v1/multilevel-timer-tables`.
 */
export function multilevelTimerTableCommand(io: CliIo): Command {
  const command = new Command('multilevel-timer-table')
    .description(
      'compare values for every switch of a multilevel leg (C header, CSV or JSON), byte for byte as the API downloads them',
    )
    .argument(
      '<request>',
      'JSON or YAML file (- for standard input) holding the body of POST /api/v1/multilevel-timer-tables',
    );
  addTimerOutputOptions(command, 'pwm_multilevel');
  command.addHelpText(
    'after',
    '\nThe request holds modulation (topology, levels, carriers, phaseCount, ma, vdc, zeroSequence, sampling,\n' +
      'carrierPhase), fundamentalFrequency, carrierFrequency, timerClock, and optionally counterBits, deadTime,\n' +
      'deadTimeMethod, tableLength and prefix. The default format is c-header; --json is --format json.',
  );
  command.action((file: string, flags: TimerOutputFlags) => {
    const format = timerFormatOf(flags);
    const request = readDataFile(file, 'request file');
    if (typeof request !== 'object' || request === null || Array.isArray(request)) {
      throw new InputError(
        'request file',
        `request file ${file} must hold an object (the body of POST /api/v1/multilevel-timer-tables)`,
      );
    }
    const { prefix: requestPrefix, ...options } = request as Record<string, unknown>;
    const prefix = flags.prefix ?? requestPrefix ?? 'pwm_multilevel';
    if (typeof prefix !== 'string')
      throw new InputError(
        'prefix',
        `prefix must be a C identifier; got ${JSON.stringify(prefix)}`,
      );
    const table = callLibrary(() =>
      multilevelTimerTable(options as unknown as MultilevelTimerTableOptions),
    );
    const notes = new Map(flags.prefix === undefined ? [] : [['prefix', 'from --prefix']]);
    const text = callLibrary(() => renderMultilevelTimerTable(table, format, prefix), { notes });
    writeTimerOutput(text, format, flags, io, { messages: [], warnings: table.warnings });
  });
  return command;
}
