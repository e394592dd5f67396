import { execFile } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/** The package's bin, as `npx pulsewright` runs it (it runs the built dist/). */
export const BIN = fileURLToPath(new URL('../../bin/pulsewright.js', import.meta.url));

/** An example design shipped with the package (packages/cli/examples/). */
export const example = (name: string): string =>
  fileURLToPath(new URL(`../../examples/${name}`, import.meta.url));

export interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs `pulsewright` as a child process (no terminal: standard output and error are pipes). */
export function runCli(
  args: readonly string[],
  options: { cwd?: string; input?: string } = {},
): Promise<CliRun> {
  return new Promise((resolve, reject) => {
    const child = execFile(
      process.execPath,
      [BIN, ...args],
      { cwd: options.cwd, maxBuffer: 64 << 20, encoding: 'utf8' },
      (error, stdout, stderr) => {
        const code = error === null ? 0 : typeof error.code === 'number' ? error.code : NaN;
        // No exit code: the child did not run (or was killed); say so with the cause attached.
        if (error !== null && Number.isNaN(code))
          reject(new Error(`pulsewright ${args.join(' ')} did not run`, { cause: error }));
        else resolve({ code, stdout, stderr });
      },
    );
    child.stdin?.end(options.input ?? '');
  });
}

/** A value as JSON would carry it (NaN and ±∞ become null, undefined fields go), to compare with CLI output. */
export const viaJson = (value: unknown): unknown => JSON.parse(JSON.stringify(value)) as unknown;
