import { writeFileSync } from 'node:fs';
import { FailureError } from '../errors.js';
import type { CliIo } from './CliIo.js';

/**
 * Writes a command's result, exactly as given, to the `output` file or to standard output.
 * @throws FailureError when the file cannot be written
 */
export function writeOutput(text: string, output: string | undefined, io: CliIo): void {
  if (output === undefined || output === '-') {
    io.stdout.write(text);
    return;
  }
  try {
    writeFileSync(output, text);
  } catch (error) {
    throw new FailureError(`cannot write ${output}: ${(error as Error).message}`);
  }
}
