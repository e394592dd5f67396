import type { FundamentalRange } from '@pulsewright/modulation';
import { FailureError } from '../errors.js';
import { anglesCsv } from '../output/anglesCsv.js';
import type { CliIo } from '../output/CliIo.js';
import { createProgress } from '../output/progress.js';
import { toJson } from '../output/toJson.js';
import { writeOutput } from '../output/writeOutput.js';
import type { OutputFlags } from './commonOptions.js';
import { fundamentalRange } from './patternInput.js';

/** One run of a pattern command: the library's result, its renderings, and why it failed (null: it did not). */
export interface PatternRun {
  result: unknown;
  text: () => string;
  csv: () => string;
  failure: string | null;
}

/** The run of one pattern: its angles as CSV, a failure when it did not converge. */
export function singlePatternRun(
  result: { angles: number[]; converged: boolean; message: string },
  text: () => string,
): PatternRun {
  return {
    result,
    text,
    csv: () => anglesCsv(result.angles),
    failure: result.converged ? null : result.message,
  };
}

/** What a pattern command computes: one pattern, or a table over a range of fundamentals. */
export interface PatternWork {
  /** The progress bar's label for a table. */
  label: string;
  single: () => PatternRun;
  table: (range: FundamentalRange, onProgress: (fraction: number) => void) => PatternRun;
}

/**
 * The action the pattern commands (she, optimal-pattern) share: one pattern when no range is
 * given, else a table with a progress bar; the result as JSON, CSV or text; exit status 1
 * (FailureError) when nothing was solved.
 */
export async function runPatternCommand(
  flags: Record<string, unknown> & OutputFlags,
  io: CliIo,
  work: PatternWork,
): Promise<void> {
  const range = fundamentalRange(flags);
  let run: PatternRun;
  if (range === null) {
    run = work.single();
  } else {
    const progress = await createProgress(work.label, io, flags.progress !== false);
    try {
      run = work.table(range, progress.update);
    } finally {
      progress.stop();
    }
  }
  writeOutput(
    flags.json === true ? toJson(run.result) : flags.csv === true ? run.csv() : run.text(),
    flags.output,
    io,
  );
  if (run.failure !== null) throw new FailureError(run.failure);
}
