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
 *
 * Two reduced common-mode methods are listed with them: each is a zero sequence (its modulation
 * waves) plus a carrier arrangement, the carrier of each phase inverted while that phase is the
 * middle one of the three (within ±30° of its own zero crossings; see {@link invertsCarrier}),
 * so that no carrier period uses the zero vectors 000 and 111 and the common-mode voltage stays
 * at ±vdc/6 (A. M. Hava and E. Ün, IEEE Trans. Power Electronics, 2009; the carrier-based form
 * from memory, checked here against the vector definition in the tests):
 * - `azspwm1`: active zero state PWM, the min-max (space-vector) modulation waves; the zero
 *   vectors are replaced by two opposite active vectors for the same time. Common mode ±vdc/6 at
 *   every ma; linear to ma = 2/√3.
 * - `nspwm`: near state PWM, the DPWM1 modulation waves; only the three active vectors nearest
 *   the reference are used. Common mode ±vdc/6 only for ma ≥ 4/(3√3) ≈ 0.770 (M = π·ma/4 ≥ 0.605,
 *   derived in {@link reducedCommonModeRange}); linear to ma = 2/√3.
 */
export type ZeroSequence =
  | 'none'
  | 'third-harmonic'
  | 'min-max'
  | 'dpwm1'
  | 'dpwm0'
  | 'dpwm2'
  | 'dpwm-max'
  | 'dpwm-min'
  | 'azspwm1'
  | 'nspwm';

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
  'azspwm1',
  'nspwm',
];
