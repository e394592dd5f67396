import { CommanderError } from 'commander';
import {
  EXIT_BAD_INPUT,
  EXIT_FAILURE,
  EXIT_OK,
  exitCodeOf,
  FailureError,
  InputError,
  isFieldError,
} from './errors.js';
import type { CliIo } from './output/CliIo.js';
import { createProgram } from './program.js';

/** Commander's codes for help and version, which end a run successfully. */
const DONE_CODES = new Set([
  'commander.helpDisplayed',
  'commander.version',
  'commander.executeSubCommandAsync',
]);

/**
 * Runs `pulsewright` with `argv` (the arguments after the program name) and returns the exit
 * status: 0 done, 1 failure, 2 bad input. Errors go to `io.stderr` as one line
 * `pulsewright: <message>`, or with `--json` as a JSON object { error: { status, field, message } }.
 */
export async function main(
  argv: readonly string[],
  io: CliIo = { stdout: process.stdout, stderr: process.stderr },
): Promise<number> {
  const program = createProgram(io);
  try {
    await program.parseAsync([...argv], { from: 'user' });
    return EXIT_OK;
  } catch (error) {
    if (error instanceof CommanderError) {
      // Commander has printed its own message (unknown option, missing argument, bad choice).
      return DONE_CODES.has(error.code) || error.exitCode === 0 ? EXIT_OK : EXIT_BAD_INPUT;
    }
    const status = exitCodeOf(error);
    const message = error instanceof Error ? error.message : String(error);
    const field = error instanceof InputError || isFieldError(error) ? error.field : null;
    if (argv.includes('--json')) {
      io.stderr.write(`${JSON.stringify({ error: { status, field, message } })}\n`);
    } else {
      io.stderr.write(`pulsewright: ${message}\n`);
      // An unexpected error is a defect: its stack helps whoever reports it.
      if (
        status === EXIT_FAILURE &&
        !(error instanceof FailureError) &&
        error instanceof Error &&
        error.stack
      ) {
        io.stderr.write(`${error.stack}\n`);
      }
    }
    return status;
  }
}
