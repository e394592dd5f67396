/**
 * Zero-sequence signal added to all three references of a three-phase carrier modulator
 * (it cancels in every line-to-line voltage):
 * - `none`: plain sine-triangle; linear up to ma = 1.
 * - `third-harmonic`: +ma/6·sin 3θ, linear up to ma = 2/√3 (J. A. Houldsworth and D. A. Grant,
 *   IEEE Trans. Ind. Appl., 1984; Holmes and Lipo, 2003, ch. 5).
 * - `min-max`: −(max + min)/2 of the three sine references; equals centred space-vector PWM
 *   (Holmes and Lipo, 2003, ch. 5), linear up to ma = 2/√3.
 * The discontinuous choices carry the trade's DPWM names (A. M. Hava, R. J. Kerkman, T. A. Lipo,
 * IEEE Trans. Power Electron., 1998; Holmes and Lipo, 2003, ch. 7; the DPWM0/DPWM2 sides from
 * memory), the same names the space-vector five-segment `clamping` uses for the same intervals:
 * - `dpwm1`: each leg clamped to the rail its reference is nearest, for 60° round its
 *   positive and negative peaks (discontinuous, 120° of clamping per period per leg in two 60°
 *   blocks; Holmes and Lipo, 2003, ch. 7).
 * - `dpwm0` / `dpwm2`: the same 60° blocks advanced / delayed by 30°.
 * - `dpwm-max` / `dpwm-min`: each leg clamped to the positive / negative rail for a
 *   single 120° block per period (Holmes and Lipo, 2003, ch. 7).
 */
export type ZeroSequence =
  'none' | 'third-harmonic' | 'min-max' | 'dpwm1' | 'dpwm0' | 'dpwm2' | 'dpwm-max' | 'dpwm-min';

/** The zero-sequence choices, in the order the API and the dashboard list them. */
export const ZERO_SEQUENCES: readonly ZeroSequence[] = [
  'none',
  'third-harmonic',
  'min-max',
  'dpwm1',
  'dpwm0',
  'dpwm2',
  'dpwm-max',
  'dpwm-min',
];
