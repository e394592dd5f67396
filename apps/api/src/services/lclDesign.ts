import { designLclFilter, type LclDesign, type LclDesignOptions } from '@pulsewright/modulation';
import type { CostEstimate } from './cost.js';
import { callLibrary } from './library.js';

/** POST /filters/lcl-design: a handful of closed-form steps, no spectra. */
export function lclDesignCost(): CostEstimate {
  return {
    work: 1000,
    basis: 'one LCL filter from closed forms',
    fields: [],
    responseBytes: 2000,
    responseFields: [],
  };
}

/**
 * An LCL filter for a grid-connected bridge by the library's designLclFilter (Liserre,
 * Blaabjerg, Hansen 2005, targets from memory); its refusals become 400s naming the field.
 */
export function computeLclDesign(options: LclDesignOptions): LclDesign {
  return callLibrary('', () => designLclFilter(options));
}
