import type { AnalyseDesignOptions, InverterDesign } from '@pulsewright/modulation';
import type { PreviewOutcome } from './designPreview';

/** A preview asked of the worker. */
export interface PreviewRequest {
  id: number;
  design: InverterDesign;
  options: AnalyseDesignOptions;
}

/** The worker's answer, with the time the analysis took in the worker (ms). */
export interface PreviewResponse {
  id: number;
  outcome: PreviewOutcome;
  milliseconds: number;
}
