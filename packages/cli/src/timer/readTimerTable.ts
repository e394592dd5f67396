import { Option, type Command } from 'commander';
import { timerTable, type TimerTable, type TimerTableOptions } from '@pulsewright/modulation';
import { readCheckedDesign } from '../commands/analyseDesignInput.js';
import { numberOption } from '../commands/commonOptions.js';
import { InputError } from '../errors.js';
import { callLibrary } from '../input/callLibrary.js';
import { addDesignOptions, DESIGN_FLAGS } from '../input/designInput.js';
import { readDataFile } from '../input/readDataFile.js';
import { timerOptionsFromDesign } from './timerOptionsFromDesign.js';

/** The timer's own options: the flag and the field of TimerTableOptions it sets. */
const TIMER_FLAGS = [
  { flag: '--timer-clock', key: 'timerClock' },
  { flag: '--counting-mode', key: 'countingMode' },
  { flag: '--counter-bits', key: 'counterBits' },
  { flag: '--dead-time', key: 'deadTime' },
  { flag: '--dead-time-method', key: 'deadTimeMethod' },
  { flag: '--table-length', key: 'tableLength' },
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

/** The flags the timer commands read (design flags, timer flags, prefix). */
export type TimerInputFlags = Record<string, unknown> & { prefix?: string };

/** Adds the design argument and flags and the timer's own options to a command. */
export function addTimerOptions(command: Command): Command {
  addDesignOptions(command);
  command.addOption(
    numberOption(
      '--timer-clock <hertz>',
      'timer input clock after the prescaler, Hz (required unless the input file is a timer-table request)',
    ).helpGroup('Timer:'),
  );
  command.addOption(
    new Option(
      '--counting-mode <mode>',
      'edge-aligned or centre-aligned (default centre-aligned)',
    ).helpGroup('Timer:'),
  );
  command.addOption(
    numberOption('--counter-bits <bits>', 'counter width, 8..32 (default 16)').helpGroup('Timer:'),
  );
  command.addOption(
    numberOption(
      '--dead-time <seconds>',
      'dead time between complementary outputs, s (default 0)',
    ).helpGroup('Timer:'),
  );
  command.addOption(
    new Option(
      '--dead-time-method <method>',
      'compare-offset or dead-time-register (default by counting mode)',
    ).helpGroup('Timer:'),
  );
  command.addOption(
    numberOption(
      '--table-length <entries>',
      'entries per fundamental period, a divisor of the compare updates per period',
    ).helpGroup('Timer:'),
  );
  return command;
}

/** A timer table read from the command line, with what the command should say about it. */
export interface TimerInput {
  table: TimerTable;
  /** The C prefix given by --prefix or the request file. */
  prefix?: string;
  /** Notes for standard error (how the design became a table). */
  messages: string[];
}

/**
 * The library's timer table for the input file and flags, with errors named as the user gave
 * the fields (`design.modulation.ma`, or the request's own `modulation.ma`, and the flag).
 */
export function readTimerTable(file: string | undefined, flags: TimerInputFlags): TimerInput {
  const { options, prefix, fromDesign, notes, messages } = timerInput(file, flags);
  const table = callLibrary(
    () => timerTable(options),
    fromDesign ? { rename: DESIGN_FIELD_PATHS, notes } : { notes },
  );
  return { table, ...(prefix === undefined ? {} : { prefix }), messages };
}

/**
 * The timer-table options from the input file and flags: either a design (file or flags) and
 * the timer flags, or a file holding the API's timer-table request (recognised by its
 * `timerClock`), which the timer flags may override.
 */
function timerInput(
  file: string | undefined,
  flags: TimerInputFlags,
): {
  options: TimerTableOptions;
  prefix?: string;
  fromDesign: boolean;
  notes: Map<string, string>;
  messages: string[];
} {
  const notes = new Map<string, string>();
  const messages: string[] = [];
  let options: Record<string, unknown>;
  let prefix: unknown = flags.prefix;
  const request = file === undefined ? undefined : readDataFile(file, 'design file');
  const isRequest =
    typeof request === 'object' &&
    request !== null &&
    !Array.isArray(request) &&
    'timerClock' in request;
  if (isRequest) {
    const given = DESIGN_FLAGS.filter(({ key }) => flags[key] !== undefined).map(
      ({ flag }) => flag.split(' ')[0],
    );
    if (given.length > 0 || flags.set !== undefined) {
      throw new InputError(
        given[0] ?? '--set',
        `${given[0] ?? '--set'} sets a design field, but ${file} is a timer-table request (it holds timerClock); change the request or give a design instead`,
      );
    }
    const { prefix: requestPrefix, ...rest } = request as Record<string, unknown>;
    options = rest;
    prefix ??= requestPrefix;
  } else {
    const { design } = readCheckedDesign(
      file,
      flags,
      file === undefined ? undefined : { document: request },
    );
    const { fields, notes: designNotes } = timerOptionsFromDesign(design);
    options = { ...fields };
    messages.push(...designNotes);
    for (const path of Object.values(DESIGN_FIELD_PATHS)) {
      const flag = DESIGN_FLAGS.find((d) => `design.${d.path}` === path);
      if (flag === undefined) continue;
      const name = flag.flag.split(' ')[0] as string;
      notes.set(
        path,
        flags[flag.key] !== undefined
          ? `from ${name}`
          : `set it in the design file or with ${name}`,
      );
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
  if (prefix !== undefined && typeof prefix !== 'string')
    throw new InputError('prefix', `prefix must be a C identifier; got ${JSON.stringify(prefix)}`);
  return {
    options: options as unknown as TimerTableOptions,
    ...(prefix === undefined ? {} : { prefix }),
    fromDesign: !isRequest,
    notes,
    messages,
  };
}
