import { Command, Option } from 'commander';
import {
  timerTable,
  timerTableToCHeader,
  timerTableToCsv,
  timerTableToJson,
  type TimerTable,
  type TimerTableOptions,
} from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { callLibrary } from '../input/callLibrary.js';
import { addDesignOptions, DESIGN_FLAGS } from '../input/designInput.js';
import { readDataFile } from '../input/readDataFile.js';
import type { CliIo } from '../output/CliIo.js';
import { writeOutput } from '../output/writeOutput.js';
import { timerOptionsFromDesign } from '../timer/timerOptionsFromDesign.js';
import { readCheckedDesign } from './analyseDesignInput.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';

export const TIMER_FORMATS = ['c-header', 'csv', 'json'] as const;
export type TimerFormat = (typeof TIMER_FORMATS)[number];

/** The timer's own options: the flag, the field of TimerTableOptions, numeric or not. */
const TIMER_FLAGS = [
  { flag: '--timer-clock', key: 'timerClock', numeric: true },
  { flag: '--counting-mode', key: 'countingMode', numeric: false },
  { flag: '--counter-bits', key: 'counterBits', numeric: true },
  { flag: '--dead-time', key: 'deadTime', numeric: true },
  { flag: '--dead-time-method', key: 'deadTimeMethod', numeric: false },
  { flag: '--table-length', key: 'tableLength', numeric: true },
] as const;

/** The design's fields as timerTable names them, and their paths in the design. */
const DESIGN_FIELD_PATHS: Record<string, string> = {
  'modulation.method': 'design.modulation.method',
  'modulation.scheme': 'design.modulation.scheme',
  'modulation.zeroSequence': 'design.modulation.zeroSequence',
  'modulation.ma': 'design.modulation.ma',
  fundamentalFrequency: 'design.fundamentalFrequency',
  carrierFrequency: 'design.carrierFrequency',
  vdc: 'design.vdc',
  sampling: 'design.modulation.sampling',
};

type TimerFlags = Record<string, unknown> & OutputFlags & { format?: TimerFormat; prefix?: string; quiet?: boolean };

/**
 * The table rendered as the API's `POST /api/v1/timer-tables?format=…` renders it (the same
 * library calls, the same default prefix), so a file from either is the same byte for byte.
 */
export function renderTimerTable(table: TimerTable, format: TimerFormat, prefix = 'pwm_table'): string {
  if (format === 'csv') return timerTableToCsv(table);
  if (format === 'c-header') return timerTableToCHeader(table, { prefix });
  return timerTableToJson(table);
}

/**
 * The timer-table options from the input file and flags: either a design (file or flags) and
 * the timer flags, or a file holding the API's timer-table request (recognised by its
 * `timerClock`), which the timer flags may override.
 */
function timerInput(
  file: string | undefined,
  flags: TimerFlags,
): { options: TimerTableOptions; prefix?: string; fromDesign: boolean; notes: Map<string, string>; messages: string[] } {
  const notes = new Map<string, string>();
  const messages: string[] = [];
  let options: Record<string, unknown>;
  let prefix: unknown = flags.prefix;
  const request = file === undefined ? undefined : readDataFile(file, 'input file');
  const isRequest = typeof request === 'object' && request !== null && !Array.isArray(request) && 'timerClock' in request;
  if (isRequest) {
    const given = DESIGN_FLAGS.filter(({ key }) => flags[key] !== undefined).map(({ flag }) => flag.split(' ')[0]);
    if (given.length > 0 || flags.set !== undefined) {
      throw new InputError(given[0] ?? '--set', `${given[0] ?? '--set'} sets a design field, but ${file} is a timer-table request (it holds timerClock); change the request or give a design instead`);
    }
    const { prefix: requestPrefix, ...rest } = request as Record<string, unknown>;
    options = rest;
    prefix ??= requestPrefix;
  } else {
    const { design } = readCheckedDesign(file, flags);
    const { fields, notes: designNotes } = timerOptionsFromDesign(design);
    options = { ...fields };
    messages.push(...designNotes);
    for (const path of Object.values(DESIGN_FIELD_PATHS)) {
      const flag = DESIGN_FLAGS.find((d) => `design.${d.path}` === path);
      if (flag === undefined) continue;
      const name = flag.flag.split(' ')[0] as string;
      notes.set(path, flags[flag.key] !== undefined ? `from ${name}` : `set it in the design file or with ${name}`);
    }
  }
  for (const { flag, key } of TIMER_FLAGS) {
    if (flags[key] !== undefined) {
      options[key] = flags[key];
      notes.set(key, `from ${flag}`);
    } else if (options[key] === undefined) {
      notes.set(key, `give ${flag}`);
    }
  }
  if (prefix !== undefined && typeof prefix !== 'string') throw new InputError('prefix', `prefix must be a C identifier; got ${JSON.stringify(prefix)}`);
  return {
    options: options as unknown as TimerTableOptions,
    ...(prefix === undefined ? {} : { prefix }),
    fromDesign: !isRequest,
    notes,
    messages,
  };
}

/** `pulsewright timer-table`: timer compare values as a C header, CSV or JSON. */
export function timerTableCommand(io: CliIo): Command {
  const command = new Command('timer-table').description(
    'timer compare values for a controller (C header, CSV or JSON), byte for byte as the API downloads them',
  );
  addDesignOptions(command);
  command.addOption(numberOption('--timer-clock <hertz>', 'timer input clock after the prescaler, Hz (required unless the input file is a timer-table request)').helpGroup('Timer:'));
  command.addOption(new Option('--counting-mode <mode>', 'edge-aligned or centre-aligned (default centre-aligned)').helpGroup('Timer:'));
  command.addOption(numberOption('--counter-bits <bits>', 'counter width, 8..32 (default 16)').helpGroup('Timer:'));
  command.addOption(numberOption('--dead-time <seconds>', 'dead time between complementary outputs, s (default 0)').helpGroup('Timer:'));
  command.addOption(new Option('--dead-time-method <method>', 'compare-offset or dead-time-register (default by counting mode)').helpGroup('Timer:'));
  command.addOption(numberOption('--table-length <entries>', 'entries per fundamental period, a divisor of the compare updates per period').helpGroup('Timer:'));
  command.addOption(new Option('--prefix <name>', 'prefix of the C names and macros (default pwm_table)').helpGroup('Timer:'));
  command.addOption(new Option('--format <format>', 'c-header, csv or json').choices(TIMER_FORMATS).helpGroup('Output:'));
  command.addOption(new Option('-q, --quiet', 'do not print the table\'s warnings on standard error (they are in the output too)').helpGroup('Output:'));
  addOutputOptions(command);
  command.addHelpText(
    'after',
    '\nThe input is a design (file or flags) with the timer options, or a JSON/YAML file holding the body of\n' +
      'POST /api/v1/timer-tables (modulation, fundamentalFrequency, carrierFrequency, timerClock, …, prefix).\n' +
      'The default format is c-header; --json is --format json.',
  );
  command.action((file: string | undefined, flags: TimerFlags) => {
    if (flags.json === true && flags.format !== undefined && flags.format !== 'json') {
      throw new InputError('--format', `--format must be json or left out with --json; got ${JSON.stringify(flags.format)}`);
    }
    const format: TimerFormat = flags.json === true ? 'json' : (flags.format ?? 'c-header');
    const { options, prefix, fromDesign, notes, messages } = timerInput(file, flags);
    const table = callLibrary(() => timerTable(options), fromDesign ? { rename: DESIGN_FIELD_PATHS, notes } : { notes });
    let text = callLibrary(() => renderTimerTable(table, format, prefix), { notes: new Map([['prefix', 'from --prefix']]) });
    if (format === 'json' && io.stdout.isTTY === true && (flags.output === undefined || flags.output === '-')) text += '\n';
    writeOutput(text, flags.output, io);
    if (flags.quiet !== true) {
      for (const message of messages) io.stderr.write(`pulsewright: note: ${message}\n`);
      for (const warning of table.warnings) io.stderr.write(`pulsewright: warning: ${warning.field}: ${warning.message}\n`);
    }
  });
  return command;
}

