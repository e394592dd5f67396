import { besselj } from 'bessel';

/**
 * One term of the double Fourier series of naturally sampled sine-triangle PWM (H. S. Black,
 * *Modulation Theory*, 1953; D. G. Holmes and T. A. Lipo, *Pulse Width Modulation for Power
 * Converters*, 2003, ch. 3, eq. for a two-level leg): a leg switching ±Vdc/2 with reference
 * M·cos ω₀t has, at m·ω_c + n·ω₀ (m ≥ 1), amplitude (4·(Vdc/2)/(mπ))·|J_n(mπM/2)·sin((m+n)π/2)|.
 *
 * Returns the bridge amplitude of each scheme, derived from that leg term:
 * - bipolar full bridge (±vdc): twice the leg term, (4·vdc/(mπ))·|J_n(mπM/2)·sin((m+n)π/2)|.
 * - unipolar full bridge: leg b's reference is −M cos ω₀t, which multiplies each term by (−1)^n;
 *   a − b keeps odd n only, doubled: (4·vdc/(mπ))·|J_n(mπM/2)| when m is even and n odd, else 0.
 * - three-phase line-to-line (legs ±vdc/2, references 2π/3 apart): each leg's term is rotated
 *   by n·2π/3, so a − b scales it by 2|sin(nπ/3)|: (4·vdc/(mπ))·|J_n·sin((m+n)π/2)·sin(nπ/3)|.
 */
export function doubleFourierAmplitude(
  kind: 'bipolar' | 'unipolar' | 'line-to-line',
  vdc: number,
  ma: number,
  m: number,
  n: number,
): number {
  const bessel = besselj((m * Math.PI * ma) / 2, n);
  const base = (4 * vdc) / (m * Math.PI);
  if (kind === 'unipolar')
    return m % 2 === 0 && Math.abs(n) % 2 === 1 ? base * Math.abs(bessel) : 0;
  const carrierSideband = Math.abs(Math.sin(((m + n) * Math.PI) / 2));
  const threePhaseFactor = kind === 'line-to-line' ? Math.abs(Math.sin((n * Math.PI) / 3)) : 1;
  return base * Math.abs(bessel) * carrierSideband * threePhaseFactor;
}
