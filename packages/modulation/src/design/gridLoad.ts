import type { DesignGrid, DesignLoad } from './InverterDesign.js';

/**
 * The grid of a design as the load of phase a: resistance r, inductance l2 + l and the grid
 * source as the back-EMF, √2·V_ph·sin(θ + phase), V_ph = lineVoltage/√3 for a three-phase bridge
 * (star) or lineVoltage for a single-phase one. The analysis lags b and c by 2π/3 and 4π/3.
 */
export function gridLoad(grid: DesignGrid, phaseCount: 1 | 3): DesignLoad {
  const phaseRms = phaseCount === 3 ? grid.lineVoltage / Math.sqrt(3) : grid.lineVoltage;
  return {
    r: grid.r,
    l: grid.l2 + grid.l,
    emf: { amplitude: Math.SQRT2 * phaseRms, phase: grid.phase ?? 0 },
  };
}
