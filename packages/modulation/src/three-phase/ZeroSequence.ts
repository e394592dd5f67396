/**
 * Zero-sequence signal added to all three references of a three-phase carrier modulator
 * (it cancels in every line-to-line voltage):
 * - `none`: plain sine-triangle; linear up to ma = 1.
 * - `third-harmonic`: +ma/6·sin 3θ, linear up to ma = 2/√3 (J. A. Houldsworth and D. A. Grant,
 *   IEEE Trans. Ind. Appl., 1984; Holmes and Lipo, 2003, ch. 5).
 * - `min-max`: −(max + min)/2 of the three sine references; equals centred space-vector PWM
 *   (Holmes and Lipo, 2003, ch. 5), linear up to ma = 2/√3.
 * - `clamp-60-peak`: each leg clamped to the rail its reference is nearest, for 60° round its
 *   positive and negative peaks (discontinuous, 120° of clamping per period per leg in two 60°
 *   blocks; Holmes and Lipo, 2003, ch. 7).
 * - `clamp-60-lead` / `clamp-60-lag`: the same 60° blocks advanced / delayed by 30°.
 * - `clamp-120-top` / `clamp-120-bottom`: each leg clamped to the positive / negative rail for a
 *   single 120° block per period (Holmes and Lipo, 2003, ch. 7).
 */
export type ZeroSequence =
  | 'none'
  | 'third-harmonic'
  | 'min-max'
  | 'clamp-60-peak'
  | 'clamp-60-lead'
  | 'clamp-60-lag'
  | 'clamp-120-top'
  | 'clamp-120-bottom';

/** The zero-sequence choices, in the order the API and the dashboard list them. */
export const ZERO_SEQUENCES: readonly ZeroSequence[] = [
  'none',
  'third-harmonic',
  'min-max',
  'clamp-60-peak',
  'clamp-60-lead',
  'clamp-60-lag',
  'clamp-120-top',
  'clamp-120-bottom',
];
