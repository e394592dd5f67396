import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  assertWaveform,
  fundamentalAngleOfCarrier,
  harmonics,
  sineTriangle,
  threePhase,
  waveformIntegral,
  waveformMeanSquare,
  type SineTriangleOptions,
  type Waveform,
} from '../../index.js';

// Property tests on random valid inputs (fast-check, fixed seed for reproducibility).
const runs = { numRuns: 150, seed: 20261202 };

const sineTriangleOptions = fc.record({
  scheme: fc.constantFrom('bipolar', 'unipolar'),
  ma: fc.double({ min: 0.01, max: 2.5, noNaN: true }),
  mf: fc.integer({ min: 1, max: 60 }),
  vdc: fc.double({ min: 1, max: 1500, noNaN: true }),
  sampling: fc.constantFrom('natural', 'regular-symmetric', 'regular-asymmetric'),
  carrierPhase: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
}) as fc.Arbitrary<Required<SineTriangleOptions>>;

/** Σ|jumps| of a waveform: each harmonic obeys amplitude_n ≤ Σ|Δ|/(πn). */
function totalJump({ levels }: Waveform): number {
  return levels.reduce(
    (sum, level, i) =>
      sum + Math.abs(level - (levels[(i + levels.length - 1) % levels.length] as number)),
    0,
  );
}

describe('sineTriangle properties', () => {
  it('edges are strictly ascending in [0, 2π) and levels come from the scheme', () => {
    fc.assert(
      fc.property(sineTriangleOptions, (options) => {
        const waveform = sineTriangle(options);
        assertWaveform(waveform);
        const allowed =
          options.scheme === 'bipolar'
            ? [options.vdc, -options.vdc]
            : [options.vdc, 0, -options.vdc];
        return waveform.levels.every((level) => allowed.includes(level));
      }),
      runs,
    );
  });

  it('Parseval: the mean square equals DC² + Σ A²/2 within the truncation bound', () => {
    // Parseval's theorem (standard Fourier analysis). Orders above N carry at most
    // Σ_{n>N} (Σ|Δ|/(πn))²/2 ≤ (Σ|Δ|)²/(2π²N) of the mean square, so the sum from the
    // harmonics must lie in [meanSquare − bound, meanSquare] (Bessel's inequality).
    fc.assert(
      fc.property(sineTriangleOptions, (options) => {
        const waveform = sineTriangle(options);
        const maxOrder = 2000;
        const spectrum = harmonics(waveform, maxOrder);
        const fromHarmonics = spectrum.reduce(
          (sum, { order, amplitude }) => sum + (order === 0 ? amplitude ** 2 : amplitude ** 2 / 2),
          0,
        );
        const meanSquare = waveformMeanSquare(waveform);
        const bound = totalJump(waveform) ** 2 / (2 * Math.PI ** 2 * maxOrder);
        const rounding = 1e-9 * options.vdc ** 2;
        return (
          fromHarmonics <= meanSquare + rounding && fromHarmonics >= meanSquare - bound - rounding
        );
      }),
      runs,
    );
  });

  it('regular sampling: each carrier half period carries the volt-seconds of its sample', () => {
    // Bowes (1975): with the sample s held over a half period in which the carrier sweeps
    // linearly through ±1, the output (±vdc, or the unipolar difference) averages s·vdc there,
    // clamped to ±vdc when |s| ≥ 1. Symmetric sampling uses the sample at the carrier period's
    // opening peak for both halves.
    fc.assert(
      fc.property(
        sineTriangleOptions.filter((o) => o.sampling !== 'natural'),
        (options) => {
          const waveform = sineTriangle(options);
          const alignment = { mf: options.mf, carrierPhase: options.carrierPhase };
          for (let j = 0; j < 2 * options.mf; j++) {
            const start = fundamentalAngleOfCarrier(j * Math.PI, alignment);
            const end = fundamentalAngleOfCarrier((j + 1) * Math.PI, alignment);
            const rising = j % 2 === 0;
            const sampleAt =
              options.sampling === 'regular-asymmetric' || !rising
                ? start
                : fundamentalAngleOfCarrier((j - 1) * Math.PI, alignment);
            const sample = Math.max(-1, Math.min(1, options.ma * Math.sin(sampleAt)));
            // waveformIntegral needs from ≥ 0 only through periodicity; shift into range.
            const shift = 2 * Math.PI * Math.ceil(Math.max(0, -start) / (2 * Math.PI));
            const mean = waveformIntegral(waveform, start + shift, end + shift) / (end - start);
            if (Math.abs(mean - sample * options.vdc) > 1e-9 * options.vdc) return false;
          }
          return true;
        },
      ),
      runs,
    );
  });
});

describe('threePhase properties', () => {
  it('line-to-line voltages sum to zero and equal the leg differences everywhere', () => {
    fc.assert(
      fc.property(
        fc.record({
          ma: fc.double({ min: 0.05, max: 1.5, noNaN: true }),
          mf: fc.integer({ min: 1, max: 40 }),
          zeroSequence: fc.constantFrom('none', 'third-harmonic', 'min-max', 'dpwm1', 'dpwm-max'),
          sampling: fc.constantFrom('natural', 'regular-symmetric', 'regular-asymmetric'),
        }),
        fc.array(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true, maxExcluded: true }), {
          minLength: 5,
          maxLength: 5,
        }),
        ({ ma, mf, zeroSequence, sampling }, angles) => {
          const { legs, lineToLine } = threePhase({ ma, mf, vdc: 100, zeroSequence, sampling });
          return angles.every((theta) => {
            const at = (w: Waveform): number => waveformIntegral(w, theta, theta + 1e-9);
            const sum = at(lineToLine.ab) + at(lineToLine.bc) + at(lineToLine.ca);
            const difference = at(lineToLine.ab) - (at(legs.a) - at(legs.b));
            return Math.abs(sum) < 1e-12 && Math.abs(difference) < 1e-12;
          });
        },
      ),
      { numRuns: 60, seed: 7 },
    );
  });
});

describe('waveform consistency', () => {
  it('any valid waveform literal is accepted and analysed', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true, maxExcluded: true }), {
          minLength: 1,
          maxLength: 30,
        }),
        fc.array(fc.double({ min: -500, max: 500, noNaN: true }), { minLength: 30, maxLength: 30 }),
        (rawEdges, rawLevels) => {
          const edges = [...rawEdges].sort((a, b) => a - b);
          const waveform = { edges, levels: rawLevels.slice(0, edges.length) };
          const spectrum = harmonics(waveform, 50);
          expect(spectrum).toHaveLength(51);
          return spectrum.every((h) => Number.isFinite(h.amplitude) && Number.isFinite(h.phase));
        },
      ),
      runs,
    );
  });
});
