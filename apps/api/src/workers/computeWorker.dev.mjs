// The compute worker when the service runs from its TypeScript source (vitest, tsx): registers
// tsx's loader in this worker thread, then hands every task to src/workers/computeWorker.ts.
// The built service (apps/api/dist) loads dist/workers/computeWorker.js directly.
import { register } from 'tsx/esm/api';

register();
const worker = import('./computeWorker.ts');

export async function runComputeTask(task) {
  return (await worker).runComputeTask(task);
}
