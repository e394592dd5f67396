import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';

/** Options of {@link rippleInductance}. */
export interface RippleInductanceOptions {
  /** DC bus voltage, V. */
  vdc: number;
  /** Carrier frequency, Hz. */
  switchingFrequency: number;
  /** Largest allowed peak-to-peak ripple of the inductor current, A. */
  ripple: number;
  /**
   * `'bipolar'` H-bridge (±vdc), `'unipolar'` H-bridge (0/±vdc, ripple at 2·fsw) or
   * `'half-bridge'` (one leg, ±vdc/2 about the DC midpoint).
   * @default 'bipolar'
   */
  bridge?: 'bipolar' | 'unipolar' | 'half-bridge';
}

/**
 * The smallest inductance that keeps the peak-to-peak current ripple within `ripple` at any
 * duty cycle, from v_L = L·di/dt with R neglected (common practice):
 * - bipolar H-bridge: ΔI = 2·vdc·d·(1 − d)·T/L ≤ vdc·T/(2L) (at d = ½), so L = vdc/(2·fsw·ΔI)
 *   (the bound listed in docs/references.md);
 * - unipolar H-bridge: the output steps by vdc at twice the carrier frequency,
 *   ΔI ≤ vdc·T/(8L), L = vdc/(8·fsw·ΔI);
 * - half-bridge leg into an inductor returning to the DC midpoint: ΔI ≤ vdc·T/(4L),
 *   L = vdc/(4·fsw·ΔI). (For a three-phase star load with isolated neutral the phase ripple
 *   differs; check it with the exact load model.)
 * @returns henries
 */
export function rippleInductance(options: RippleInductanceOptions): number {
  const { vdc, switchingFrequency, ripple, bridge = 'bipolar' } = options;
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertNumberInRange('switchingFrequency', switchingFrequency, { min: 0, minExclusive: true });
  assertNumberInRange('ripple', ripple, { min: 0, minExclusive: true });
  assertOneOf('bridge', bridge, ['bipolar', 'unipolar', 'half-bridge'] as const);
  const divisor = bridge === 'bipolar' ? 2 : bridge === 'unipolar' ? 8 : 4;
  return vdc / (divisor * switchingFrequency * ripple);
}
