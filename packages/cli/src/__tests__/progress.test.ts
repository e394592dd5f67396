import { describe, expect, it } from 'vitest';
import type { CliIo } from '../output/CliIo.js';
import { createProgress } from '../output/progress.js';

/** An io whose standard error records what is written, a terminal or not. */
function recordingIo(isTTY: boolean): { io: CliIo; written: string[] } {
  const written: string[] = [];
  const stream = { isTTY, columns: 100, write: (text: string) => (written.push(text), true) };
  return { io: { stdout: { write: () => true }, stderr: stream }, written };
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

describe('the progress bar', () => {
  it('shows on a terminal once the work has run a quarter of a second, and clears at the end', async () => {
    const { io, written } = recordingIo(true);
    const progress = await createProgress('ma sweep', io, true);
    progress.update(0.1);
    expect(written).toEqual([]); // short work never shows a bar
    await sleep(300);
    progress.update(0.5);
    expect(written.join('')).toMatch(/ma sweep \[.*\] 50%/);
    progress.stop();
  });

  it('never writes when standard error is not a terminal, or with --no-progress', async () => {
    for (const [isTTY, enabled] of [
      [false, true],
      [true, false],
    ] as const) {
      const { io, written } = recordingIo(isTTY);
      const progress = await createProgress('SHE table', io, enabled);
      await sleep(300);
      progress.update(0.5);
      progress.stop();
      expect(written).toEqual([]);
    }
  });
});
