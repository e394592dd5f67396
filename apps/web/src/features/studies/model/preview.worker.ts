/// <reference lib="webworker" />
import { previewDesign } from './designPreview';
import type { PreviewRequest, PreviewResponse } from './previewMessages';

// The live preview off the main thread: a filtered design at a high frequency ratio takes a few
// hundred milliseconds, which would stall typing. One request at a time; the page sends the latest.
const scope = self as unknown as DedicatedWorkerGlobalScope;
scope.onmessage = (event: MessageEvent<PreviewRequest>) => {
  const { id, design, options } = event.data;
  const start = performance.now();
  const outcome = previewDesign(design, options);
  const response: PreviewResponse = { id, outcome, milliseconds: performance.now() - start };
  scope.postMessage(response);
};
