import { describe, expect, it } from 'vitest';
import {
  CARRIER_SAMPLINGS,
  compareWithCarrier,
  harmonics,
  sineReference,
  sineTriangle,
  waveformIntegral,
  type CarrierSampling,
  type ReferenceSignal,
} from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

// A held sample exactly on the carrier's peak (+1) or valley (−1), or beyond it: the comparator
// must give a half period that is high (or low) throughout, with no spurious edge and no lost
// period. Before the fix a sample of exactly +1 taken at a peak gave a low half period.

const vdc = 400;
const REGULAR: readonly CarrierSampling[] = ['regular-symmetric', 'regular-asymmetric'];

const constant = (value: number): ReferenceSignal => ({ value: () => value, slopeBound: 0 });

describe('a reference on or beyond a carrier extreme', () => {
  // Definition of the comparator (Holmes and Lipo 2003, ch. 3): high while the reference is
  // above the carrier. A constant at +1 (or above) is above the carrier everywhere but at its
  // peaks, which have no width: the output is high throughout; at −1 (or below) low throughout.
  for (const sampling of CARRIER_SAMPLINGS) {
    it(`${sampling}: ±1 and beyond give a constant output, no edges`, () => {
      for (const mf of [1, 2, 3, 7, 8, 12, 96]) {
        for (const carrierPhase of [0, Math.PI, 0.3]) {
          for (const [value, level] of [
            [1, vdc],
            [1.5, vdc],
            [-1, -vdc],
            [-3, -vdc],
          ] as const) {
            const waveform = compareWithCarrier(constant(value), {
              mf,
              carrierPhase,
              sampling,
              high: vdc,
              low: -vdc,
            });
            expect(
              waveform,
              `${sampling} mf=${mf} carrierPhase=${carrierPhase} value=${value}`,
            ).toEqual({
              edges: [0],
              levels: [level],
            });
          }
        }
      }
    });
  }
});

describe('a sampled sine reaching ±1 (ma ≥ 1), half period by half period', () => {
  // Regular sampling by definition (Bowes 1975; Holmes and Lipo 2003, ch. 3): the sample is held
  // for the (half) period and the leg is high for the fraction f = (1 + s)/2 of each half
  // period, s clipped to [−1, 1], on the valley's side. carrierPhase π puts a carrier peak at
  // θ = π/2, where ma·sin θ = ma exactly: with ma = 1 the sample there is exactly +1 (and −1
  // at 3π/2 for the negated reference of a unipolar bridge's second leg). The integrals are
  // exact sums of segments; 1e-9·vdc·h leaves room only for rounding.
  function expectDefinition(
    ma: number,
    mf: number,
    carrierPhase: number,
    sampling: CarrierSampling,
  ): void {
    const h = Math.PI / mf;
    for (const amplitude of [ma, -ma]) {
      const reference = sineReference(amplitude);
      const leg = compareWithCarrier(reference, {
        mf,
        carrierPhase,
        sampling,
        high: vdc,
        low: -vdc,
      });
      for (let j = 0; j < 2 * mf; j++) {
        // Valleys at π/2 + (2πk + carrierPhase)/mf: even j start at a valley (carrier rising).
        const start = Math.PI / 2 + (j * Math.PI + carrierPhase) / mf;
        const rising = j % 2 === 0;
        const sampleAngle = sampling === 'regular-symmetric' && rising ? start - h : start;
        const f = (1 + Math.max(-1, Math.min(1, reference.value(sampleAngle)))) / 2;
        const highFrom = rising ? start : start + (1 - f) * h;
        const highTo = rising ? start + f * h : start + h;
        const lowFrom = rising ? highTo : start;
        const lowTo = rising ? start + h : highFrom;
        const label = `${sampling} ma=${amplitude} mf=${mf} carrierPhase=${carrierPhase} half ${j}`;
        assertInDelta(
          waveformIntegral(leg, highFrom, highTo),
          vdc * (highTo - highFrom),
          1e-9 * vdc * h,
          `${label} high`,
        );
        assertInDelta(
          waveformIntegral(leg, lowFrom, lowTo),
          -vdc * (lowTo - lowFrom),
          1e-9 * vdc * h,
          `${label} low`,
        );
      }
    }
  }

  for (const sampling of REGULAR) {
    it(`${sampling}: ma = 1, 1.5, 4 at several carrier phases`, () => {
      for (const ma of [1, 1.5, 4]) {
        for (const mf of [3, 7, 8, 12, 21]) {
          for (const carrierPhase of [0, Math.PI, 0.7])
            expectDefinition(ma, mf, carrierPhase, sampling);
        }
      }
    });
  }
});

describe('symmetric regular sampling of ma·sin θ, closed-form fundamental', () => {
  /** J₁(x) by its power series Σ (−1)^k (x/2)^(2k+1)/(k!(k+1)!) (Abramowitz and Stegun 9.1.10). */
  function besselJ1(x: number): number {
    let term = x / 2;
    let sum = term;
    for (let k = 1; k < 30; k++) {
      term *= -((x / 2) ** 2) / (k * (k + 1));
      sum += term;
    }
    return sum;
  }

  it('equals (4·mf·vdc/π)·J₁(π·ma/(2mf))·cos(π/(2mf)) up to ma = 1, whatever the carrier phase', () => {
    // Derived for this test by the method of Holmes and Lipo (2003, ch. 3): each carrier period
    // holds one pulse centred on its valley v_k, of half-width (1 + s_k)·π/(2mf), so the
    // fundamental is (vdc/π)·Σ 4·sin((1 + s_k)·π/(2mf))·e^{−j·v_k}; the Jacobi–Anger expansion of
    // sin(a + a·ma·sin φ) has fundamental 2·J₁(a·ma)·cos(a)·sin φ, a = π/(2mf), and the mf
    // equally spaced samples sum it to mf/2. Its other terms J_n·e^{±jnφ} alias onto the
    // fundamental only for n = mf ± 1, J_{mf−1}(π/24) < 1e-20 from mf = 12 on (at mf = 3 the
    // closed form is off by 4 %). The amplitude does not depend on where the samples fall, so a
    // sample of exactly +1 (carrierPhase π, ma = 1) must give the same value as any other phase;
    // before the fix it gave 17 % less at mf = 12.
    for (const mf of [12, 21, 60, 96]) {
      for (const ma of [0.5, 1]) {
        const expected =
          ((4 * mf * vdc) / Math.PI) *
          besselJ1((Math.PI * ma) / (2 * mf)) *
          Math.cos(Math.PI / (2 * mf));
        for (const carrierPhase of [0, Math.PI, 0.7]) {
          const waveform = sineTriangle({
            scheme: 'bipolar',
            ma,
            mf,
            vdc,
            sampling: 'regular-symmetric',
            carrierPhase,
          });
          const [, fundamental] = harmonics(waveform, 1);
          // Exact waveform and exact harmonics: only rounding (≈ 1e-13 of vdc) is left.
          assertInDelta(
            fundamental?.amplitude ?? NaN,
            expected,
            1e-11 * vdc,
            `mf=${mf} ma=${ma} carrierPhase=${carrierPhase}`,
          );
        }
      }
    }
  });
});
