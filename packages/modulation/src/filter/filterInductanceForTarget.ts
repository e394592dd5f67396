import { TAU } from '../math.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';

/** What an LC output filter's inductance is sized for. */
export type FilterInductanceTarget =
  | {
      /** The resonance (the usual cut-off figure of an LC filter) at `frequency` hertz, > 0. */
      kind: 'resonance';
      frequency: number;
      /** Filter capacitance, farads, > 0. */
      c: number;
    }
  | {
      /**
       * A peak-to-peak inductor (switch) current ripple of at most `peakToPeak` amperes, > 0,
       * with the DC bus `vdc` volts switched at `carrierFrequency` hertz.
       */
      kind: 'ripple';
      peakToPeak: number;
      vdc: number;
      carrierFrequency: number;
    };

/**
 * The series inductance of an LC output filter for a target, henries.
 *
 * - `resonance`: L = 1/((2π·f)²·C), from the LC resonance ω₀ = 1/√(LC) (standard circuit
 *   analysis); an LC filter's cut-off is commonly quoted as this resonance (common practice).
 * - `ripple`: L = vdc/(2·f_c·Δi), the inductance at which the worst-case peak-to-peak ripple of
 *   two-level switching, vdc·T_c/(2L) at zero output voltage (from v_L = L·di/dt; common practice,
 *   docs/references.md), equals the target. Three-level and three-phase bridges ripple less, so
 *   the value is on the safe side for them.
 *
 * @throws ParameterRangeError naming the target's field (`target.frequency`, `target.c`,
 *   `target.peakToPeak`, `target.vdc`, `target.carrierFrequency`, `target.kind`)
 */
export function filterInductanceForTarget(target: FilterInductanceTarget): number {
  const positive = { min: 0, minExclusive: true };
  if (target?.kind === 'resonance') {
    assertNumberInRange('target.frequency', target.frequency, positive);
    assertNumberInRange('target.c', target.c, positive);
    return 1 / ((TAU * target.frequency) ** 2 * target.c);
  }
  if (target?.kind === 'ripple') {
    assertNumberInRange('target.peakToPeak', target.peakToPeak, positive);
    assertNumberInRange('target.vdc', target.vdc, positive);
    assertNumberInRange('target.carrierFrequency', target.carrierFrequency, positive);
    return target.vdc / (2 * target.carrierFrequency * target.peakToPeak);
  }
  const kind = (target as { kind?: unknown } | undefined)?.kind;
  throw new ParameterRangeError('target.kind', "'resonance' or 'ripple'", kind);
}
