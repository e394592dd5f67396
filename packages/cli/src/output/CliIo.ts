/** A stream the command line writes to; `isTTY` is true for a terminal. */
export interface OutputStream {
  write(text: string): unknown;
  isTTY?: boolean;
}

/** Where a run writes: its result to `stdout`, messages and the progress bar to `stderr`. */
export interface CliIo {
  stdout: OutputStream;
  stderr: OutputStream;
}
