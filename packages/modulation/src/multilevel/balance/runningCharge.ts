import { TAU } from '../../math.js';
import type { LegCurrentModel, PieceCoefficients } from './legCurrentModel.js';

/** Internal: the running integral of a current over the period, piece by piece. */
export interface RunningCharge {
  /**
   * Adds piece [a, b] (pieces in ascending order, gaps meaning no current) whose current `c`
   * integrates to `integral` over it.
   */
  add(c: PieceCoefficients, a: number, b: number, integral: number): void;
  /**
   * Peak-to-peak of the running integral Q(θ) (ampere-radians) with its linear drift removed,
   * Q(θ) − net·θ/2π, `net` the integral over the whole period: exact, taken at every piece's ends
   * and wherever the current equals net/2π inside a piece (its extremes).
   */
  peakToPeak(net: number): number;
}

/** Internal: starts a {@link RunningCharge} at θ = 0. */
export function runningCharge(model: LegCurrentModel): RunningCharge {
  const pieces: { c: PieceCoefficients; a: number; b: number; start: number }[] = [];
  let charge = 0;
  return {
    add(c, a, b, integral) {
      pieces.push({ c, a, b, start: charge });
      charge += integral;
    },
    peakToPeak(net) {
      const drift = net / TAU;
      let high = 0; // Q(0) − 0 = 0
      let low = 0;
      const mark = (angle: number, q: number) => {
        const ac = q - drift * angle;
        if (ac > high) high = ac;
        if (ac < low) low = ac;
      };
      for (const { c, a, b, start } of pieces) {
        mark(a, start);
        for (const z of model.crossings(c, a, b, drift)) mark(z, start + model.integral(c, a, z));
        mark(b, start + model.integral(c, a, b));
      }
      mark(TAU, charge);
      return high - low;
    },
  };
}
