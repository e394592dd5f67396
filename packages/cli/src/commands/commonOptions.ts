import { Option, type Command } from 'commander';
import { parseNumber } from '../input/parseValue.js';

/** What every command's output options hold once parsed. */
export interface OutputFlags {
  json?: boolean;
  csv?: boolean;
  output?: string;
  progress?: boolean;
}

/** Adds `--json`, `-o/--output` and, where asked, `--csv` and `--no-progress`. */
export function addOutputOptions(
  command: Command,
  extras: { csv?: boolean; progress?: boolean } = {},
): Command {
  command.addOption(
    new Option('--json', "machine-readable JSON output (the library's result as it is)").helpGroup(
      'Output:',
    ),
  );
  if (extras.csv === true) {
    command.addOption(
      new Option('--csv', 'CSV output, units in the header').conflicts('json').helpGroup('Output:'),
    );
  }
  command.addOption(
    new Option(
      '-o, --output <file>',
      'write the result to this file instead of standard output',
    ).helpGroup('Output:'),
  );
  if (extras.progress === true) {
    command.addOption(
      new Option(
        '--no-progress',
        'never show the progress bar (it shows on long work when standard error is a terminal)',
      ).helpGroup('Output:'),
    );
  }
  return command;
}

/** A numeric option; its text is passed on as a number when it reads as one, so the library checks it. */
export function numberOption(flags: string, description: string): Option {
  return new Option(flags, description).argParser((text: string) => parseNumber(text));
}
