/// <reference lib="webworker" />
import { sheSweep, type SheSweepOptions } from '@pulsewright/modulation';

// Runs the library's SHE continuation sweep off the main thread, posting progress.
self.onmessage = (event: MessageEvent<Omit<SheSweepOptions, 'onProgress'>>) => {
  try {
    const result = sheSweep({ ...event.data, onProgress: (fraction) => self.postMessage({ type: 'progress', fraction }) });
    self.postMessage({ type: 'done', result });
  } catch (error) {
    self.postMessage({ type: 'error', message: error instanceof Error ? error.message : String(error), field: (error as { field?: string }).field });
  }
};
