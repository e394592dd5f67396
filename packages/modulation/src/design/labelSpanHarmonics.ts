import { carrierGroupLabel } from '../spectrum/carrierGroupLabel.js';
import { fractionLabel } from '../spectrum/fractionLabel.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import type { LabelledHarmonic } from '../spectrum/labelHarmonics.js';

/**
 * What a component of a span's spectrum is against the fundamental f₁: a `harmonic` (a whole
 * multiple of f₁, the mean included), a `sub-harmonic` (below f₁) or an `inter-harmonic`
 * (above f₁, between two harmonics) — the terms of IEC 61000-4-7 (recalled from memory).
 */
export type SpanComponentKind = 'harmonic' | 'sub-harmonic' | 'inter-harmonic';

/** A component of a span's spectrum, labelled by carrier group and sideband and by its kind. */
export type SpanLabelledHarmonic = LabelledHarmonic & { kind: SpanComponentKind };

/**
 * Labels the spectrum of a waveform that spans q fundamental periods with p carrier cycles
 * (mf = p/q, p and q coprime). Span order n lies at n/q of the fundamental, returned as `order`.
 * The components of a carrier waveform sit at m·mf + k for whole m (carrier group) and k
 * (sideband, in fundamentals; Holmes and Lipo, 2003, ch. 3), so n = m·p + k·q: m ≡ n·p⁻¹
 * (mod q) fixes the group up to multiples of q, and the one nearest n/p is taken (m = 0 is the
 * baseband). A sideband that falls below zero frequency folds back to |m·mf + k| (the double
 * Fourier series' negative-frequency terms), so the class m ≡ −n·p⁻¹ is tried too, its least
 * m ≥ 0, and the candidate with the smaller |k| names the component (m·mf + k = −order then).
 * With q = 1 this is `labelHarmonics`' labelling. Labels: the baseband by its order as a
 * fraction (`1/3`, `2`, `47/3`), the others `mf−7`, `2mf+1`, `9mf−973`, … so a sub-harmonic
 * shows which carrier group's sideband reaches below the fundamental.
 * Internal: the design report's spectra of a non-integer ratio.
 * @param spectrum - span orders 0..N of the waveform (the `harmonics` convention)
 * @param ratio - p ≥ 1 carrier cycles and q ≥ 1 fundamental periods in the span, coprime
 */
export function labelSpanHarmonics(
  spectrum: readonly Harmonic[],
  ratio: { p: number; q: number },
): SpanLabelledHarmonic[] {
  const { p, q } = ratio;
  let inverse = 0;
  while (q > 1 && (p * inverse) % q !== 1) inverse++;
  return spectrum.map(({ order: n, amplitude, phase }) => {
    const residue = (n * inverse) % q;
    let carrierGroup = residue + q * Math.round((n / p - residue) / q);
    if (carrierGroup < 0) carrierGroup += q;
    let sideband = Math.round((n - carrierGroup * p) / q);
    // A sideband below zero frequency folds back: m·p + k·q = −n, m ≡ −n·p⁻¹ (mod q), the least
    // m ≥ 0 of that class. It names the component when its |k| is smaller (the nearer sideband).
    const folded = (q - residue) % q;
    const foldedSideband = Math.round((-n - folded * p) / q);
    if (Math.abs(foldedSideband) < Math.abs(sideband)) {
      carrierGroup = folded;
      sideband = foldedSideband;
    }
    const order = n / q;
    return {
      order,
      amplitude,
      phase,
      carrierGroup,
      sideband,
      label:
        carrierGroup === 0 ? fractionLabel(n, q) : carrierGroupLabel(order, carrierGroup, sideband),
      kind: n % q === 0 ? 'harmonic' : n < q ? 'sub-harmonic' : 'inter-harmonic',
    };
  });
}
