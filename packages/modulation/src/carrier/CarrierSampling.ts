/**
 * How the reference is compared with the carrier (Holmes and Lipo, 2003, ch. 3; S. R. Bowes,
 * "New sinusoidal pulsewidth-modulated invertor", Proc. IEE, 1975):
 * - `natural`: the continuous reference against the carrier; edges at the exact intersections.
 * - `regular-symmetric`: the reference sampled once per carrier period, at the carrier peak
 *   that starts the period, and held; pulses are symmetric about the carrier valley.
 * - `regular-asymmetric`: sampled at every carrier peak and valley, held for the half period.
 */
export type CarrierSampling = 'natural' | 'regular-symmetric' | 'regular-asymmetric';

/** The sampling methods, in the order the API and the dashboard list them. */
export const CARRIER_SAMPLINGS: readonly CarrierSampling[] = [
  'natural',
  'regular-symmetric',
  'regular-asymmetric',
];
