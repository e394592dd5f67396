import { Command } from 'commander';
import {
  timerTableToCHeader,
  timerTableToCsv,
  timerTableToJson,
  type TimerTable,
} from '@pulsewright/modulation';
import { callLibrary } from '../input/callLibrary.js';
import type { CliIo } from '../output/CliIo.js';
import { addTimerOptions, readTimerTable, type TimerInputFlags } from '../timer/readTimerTable.js';
import {
  addTimerOutputOptions,
  timerFormatOf,
  writeTimerOutput,
  type TimerFormat,
  type TimerOutputFlags,
} from './timerOutput.js';

export { TIMER_FORMATS, type TimerFormat } from './timerOutput.js';

type TimerFlags = TimerInputFlags & TimerOutputFlags;

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
  addTimerOutputOptions(command, 'pwm_table');
  command.addHelpText(
    'after',
    '\nThe input is a design (file or flags) with the timer options, or a JSON/YAML file holding the body of\n' +
      'POST /api/v1/timer-tables (modulation, fundamentalFrequency, carrierFrequency, timerClock, …, prefix).\n' +
      'The default format is c-header; --json is --format json.',
  );
  command.action((file: string | undefined, flags: TimerFlags) => {
    const format = timerFormatOf(flags);
    const { table, prefix, messages } = readTimerTable(file, flags);
    const notes = new Map(flags.prefix === undefined ? [] : [['prefix', 'from --prefix']]);
    const text = callLibrary(() => renderTimerTable(table, format, prefix), { notes });
    writeTimerOutput(text, format, flags, io, { messages, warnings: table.warnings });
  });
  return command;
}
