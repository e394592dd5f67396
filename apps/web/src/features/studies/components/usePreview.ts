import type { AnalyseDesignOptions, InverterDesign } from '@pulsewright/modulation';
import { useEffect, useMemo, useRef, useState } from 'react';
import { timed } from '../../../lib/measure';
import { previewDesign, type PreviewOutcome } from '../model/designPreview';
import type { PreviewRequest, PreviewResponse } from '../model/previewMessages';

/** The live preview of a design: the library's report, the refused fields, and what it cost. */
export interface LivePreview extends PreviewOutcome {
  /** Time the analysis took, ms. */
  milliseconds: number;
  /** True while a newer design is being analysed (the figures shown are of the previous one). */
  stale: boolean;
  /** The design the figures are of. */
  design: InverterDesign;
}

interface WorkerHolder {
  busy: boolean;
  next: PreviewRequest | null;
  post(request: PreviewRequest): void;
}

/**
 * The library's {@link previewDesign} of `design`, recomputed on every change. In a browser it
 * runs in a web worker, one analysis at a time with only the newest design queued, so typing
 * stays smooth while a filtered design at a high frequency ratio takes a few hundred ms; where
 * there is no Worker (tests) it runs in place. Pass memoised `design` and `options`.
 * Null until the first answer arrives.
 */
export function usePreview(
  design: InverterDesign,
  options: AnalyseDesignOptions,
): LivePreview | null {
  const [workerFailed, setWorkerFailed] = useState(typeof Worker === 'undefined');
  const holder = useRef<WorkerHolder | null>(null);
  const sequence = useRef(0);
  const [answer, setAnswer] = useState<{
    request: PreviewRequest;
    response: PreviewResponse;
  } | null>(null);
  const inPlace = useMemo(() => {
    if (!workerFailed) return null;
    const { value, milliseconds } = timed(() => previewDesign(design, options));
    return { ...value, milliseconds, stale: false, design };
  }, [workerFailed, design, options]);

  useEffect(() => {
    if (workerFailed) return;
    const worker = new Worker(new URL('../model/preview.worker.ts', import.meta.url), {
      type: 'module',
    });
    const sent = new Map<number, PreviewRequest>();
    const current: WorkerHolder = {
      busy: false,
      next: null,
      post(request) {
        current.busy = true;
        sent.set(request.id, request);
        worker.postMessage(request);
      },
    };
    worker.onmessage = (event: MessageEvent<PreviewResponse>) => {
      const request = sent.get(event.data.id);
      sent.delete(event.data.id);
      current.busy = false;
      if (request) setAnswer({ request, response: event.data });
      if (current.next) {
        const next = current.next;
        current.next = null;
        current.post(next);
      }
    };
    worker.onerror = () => setWorkerFailed(true);
    holder.current = current;
    return () => {
      worker.terminate();
      holder.current = null;
    };
  }, [workerFailed]);

  useEffect(() => {
    const current = holder.current;
    if (workerFailed || !current) return;
    sequence.current += 1;
    const request: PreviewRequest = { id: sequence.current, design, options };
    // One analysis at a time: a design typed while one runs waits, and only the newest waits.
    if (current.busy) current.next = request;
    else current.post(request);
  }, [workerFailed, design, options]);

  if (inPlace) return inPlace;
  if (!answer) return null;
  const { request, response } = answer;
  return {
    ...response.outcome,
    milliseconds: response.milliseconds,
    stale: request.design !== design || request.options !== options,
    design: request.design,
  };
}
