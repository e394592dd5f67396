import { Option, type Command } from 'commander';
import { InputError } from '../errors.js';
import type { CliIo } from '../output/CliIo.js';
import { writeOutput } from '../output/writeOutput.js';
import { addOutputOptions, type OutputFlags } from './commonOptions.js';

export const TIMER_FORMATS = ['c-header', 'csv', 'json'] as const;
export type TimerFormat = (typeof TIMER_FORMATS)[number];

/** The output flags of the timer-table commands. */
export type TimerOutputFlags = OutputFlags & {
  format?: TimerFormat;
  quiet?: boolean;
  prefix?: string;
};

/** Adds `--prefix`, `--format`, `-q/--quiet` and the common output options. */
export function addTimerOutputOptions(command: Command, defaultPrefix: string): Command {
  command.addOption(
    new Option(
      '--prefix <name>',
      `prefix of the C names and macros (default ${defaultPrefix})`,
    ).helpGroup('Timer:'),
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
  return addOutputOptions(command);
}

/** The format asked for: `--json` is `--format json`; c-header by default. */
export function timerFormatOf(flags: TimerOutputFlags): TimerFormat {
  if (flags.json === true && flags.format !== undefined && flags.format !== 'json') {
    throw new InputError(
      '--format',
      `--format must be json or left out with --json; got ${JSON.stringify(flags.format)}`,
    );
  }
  return flags.json === true ? 'json' : (flags.format ?? 'c-header');
}

/**
 * Writes a rendered table (a newline after JSON on a terminal) and, unless quiet, the notes and
 * the table's warnings on standard error.
 */
export function writeTimerOutput(
  text: string,
  format: TimerFormat,
  flags: TimerOutputFlags,
  io: CliIo,
  report: { messages: readonly string[]; warnings: readonly { field: string; message: string }[] },
): void {
  const toTerminal =
    io.stdout.isTTY === true && (flags.output === undefined || flags.output === '-');
  writeOutput(format === 'json' && toTerminal ? `${text}\n` : text, flags.output, io);
  if (flags.quiet === true) return;
  for (const message of report.messages) io.stderr.write(`pulsewright: note: ${message}\n`);
  for (const warning of report.warnings)
    io.stderr.write(`pulsewright: warning: ${warning.field}: ${warning.message}\n`);
}
