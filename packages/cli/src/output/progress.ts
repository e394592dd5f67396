import type { CliIo } from './CliIo.js';

/** A progress indicator for long work: `update` with the fraction done, `stop` at the end. */
export interface Progress {
  // Properties, not methods: callers pass `update` on as a callback.
  update: (fraction: number) => void;
  stop: () => void;
}

/** Work that ends sooner than this never shows a bar (milliseconds). */
const SHOW_AFTER = 250;

const NO_PROGRESS: Progress = { update() {}, stop() {} };

/**
 * A cli-progress bar on standard error, for long work, shown only when standard error is a
 * terminal (and `enabled`, i.e. not `--no-progress`), and only once the work has run for a
 * quarter of a second, so short runs and every pipe, file or test stay free of it. Standard
 * output, which holds the result, is never touched.
 */
export async function createProgress(
  label: string,
  io: CliIo,
  enabled: boolean,
): Promise<Progress> {
  if (!enabled || io.stderr.isTTY !== true) return NO_PROGRESS;
  const { default: cliProgress } = await import('cli-progress');
  const started = Date.now();
  let bar: InstanceType<typeof cliProgress.SingleBar> | null = null;
  return {
    update(fraction) {
      const value = Math.round(Math.min(1, Math.max(0, fraction)) * 1000);
      if (bar === null) {
        if (Date.now() - started < SHOW_AFTER) return;
        bar = new cliProgress.SingleBar(
          {
            stream: io.stderr as NodeJS.WritableStream,
            format: `${label} [{bar}] {percentage}% | {duration}s elapsed, about {eta}s to go`,
            hideCursor: true,
            clearOnComplete: true,
          },
          cliProgress.Presets.shades_classic,
        );
        bar.start(1000, value);
      }
      bar.update(value);
    },
    stop() {
      bar?.stop();
    },
  };
}
