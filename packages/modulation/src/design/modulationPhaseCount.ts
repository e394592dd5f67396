import type { DesignModulation } from './InverterDesign.js';
import { THREE_PHASE_METHODS, type Modulation } from './Modulation.js';

/**
 * How many phases the bridge a modulation drives has: 3 for the three-phase methods
 * (`THREE_PHASE_METHODS`), a multilevel carrier modulation's own `phaseCount`, else 1 (a
 * single-phase bridge). The one place that answers it, so no caller lists methods.
 */
export function modulationPhaseCount(modulation: Modulation | DesignModulation): 1 | 3 {
  if (modulation.method === 'multilevel-carrier') return modulation.phaseCount === 3 ? 3 : 1;
  return THREE_PHASE_METHODS.includes(modulation.method) ? 3 : 1;
}
