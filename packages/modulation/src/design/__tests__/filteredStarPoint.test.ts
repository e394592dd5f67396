import { describe, expect, it } from 'vitest';
import { TAU } from '../../math.js';
import { analyseDesign } from '../analyseDesign.js';
import type { PeriodSeries } from '../DesignReport.js';
import type { InverterDesign } from '../InverterDesign.js';

/**
 * The fundamental phasor (re = A·cos φ, im = A·sin φ of A·sin(θ + φ)) of a chart series over one
 * period, by the trapezoid rule on its angles (closed round to 2π): a Fourier coefficient read
 * from the samples alone, independent of the report's own phasors.
 */
const seriesFundamental = ({ angles, values }: PeriodSeries): { re: number; im: number } => {
  let re = 0;
  let im = 0;
  for (let k = 0; k < angles.length; k++) {
    const from = angles[k] as number;
    const to = k + 1 < angles.length ? (angles[k + 1] as number) : TAU;
    const next = k + 1 < angles.length ? (values[k + 1] as number) : (values[0] as number);
    const value = values[k] as number;
    // ∫ v·sin θ dθ / π = A·cos φ and ∫ v·cos θ dθ / π = A·sin φ, each interval by the trapezoid.
    re += ((value * Math.sin(from) + next * Math.sin(to)) * (to - from)) / 2 / Math.PI;
    im += ((value * Math.cos(from) + next * Math.cos(to)) * (to - from)) / 2 / Math.PI;
  }
  return { re, im };
};

/** An angle difference wrapped into (−π, π]. */
const wrapped = (angle: number): number => Math.atan2(Math.sin(angle), Math.cos(angle));

describe('a filtered three-phase report at the star point', () => {
  const design: InverterDesign = {
    vdc: 650,
    fundamentalFrequency: 50,
    carrierFrequency: 50 * 41,
    modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'third-harmonic' },
    load: { r: 12, l: 0.02, emf: { amplitude: 150, phase: -0.2 } },
    filter: { l: 0.002, c: 10e-6, rDamping: 3 },
  };
  const report = analyseDesign(design, { maxOrder: 1000 });

  it("has the three phases' currents summing to zero at every sample (Kirchhoff at the star point)", () => {
    for (const part of ['inverter', 'capacitor', 'load'] as const) {
      const [a, b, c] = report.currents.map((phase) => {
        const figures = phase[part];
        if (figures === null) throw new Error(`no ${part} current`);
        return figures;
      });
      if (!a || !b || !c) throw new Error('three phases expected');
      // Balanced star with an isolated star point: i_a + i_b + i_c = 0 (standard circuit
      // analysis); rounding of a sum of about a thousand harmonics, 1e-12 of the peak.
      a.series.values.forEach((value, k) => {
        const sum = value + (b.series.values[k] as number) + (c.series.values[k] as number);
        expect(Math.abs(sum), `${part} at sample ${k}`).toBeLessThan(1e-12 * a.peak);
      });
      // The fundamentals lie 2π/3 apart (balanced set, the EMF lagging k·2π/3).
      expect(wrapped(b.fundamentalPhase - a.fundamentalPhase)).toBeCloseTo(-TAU / 3, 9);
    }
  });

  it("gives phase c's samples its own fundamental, as its phasors give it", () => {
    // The series' fundamental from the samples alone against the report's phasor for each
    // phase: the trapezoid over about 1200 points of a current whose ripple lies near 41 times
    // the fundamental and above errs by well under 1e-3 of the fundamental (the sampled
    // harmonics alias into order 1 only from near 1200 and above).
    for (const phase of report.currents) {
      const load = phase.load;
      if (load === null) throw new Error('no load current');
      const read = seriesFundamental(load.series);
      expect(Math.hypot(read.re, read.im) / load.fundamental).toBeCloseTo(1, 3);
      expect(wrapped(Math.atan2(read.im, read.re) - load.fundamentalPhase)).toBeCloseTo(0, 3);
    }
  });
});

describe("a filtered report's peaks and ripple read over every sample", () => {
  // At odd mf every even order is zero, so the currents are half-wave symmetric and read over the
  // first half period (see currentExtremes). With as many chart points as grid samples the
  // series holds every sample: the peak is the largest |i| among them and the ripple
  // peak-to-peak the range of i − i₁, i₁ = A₁·sin(θ + φ₁) from the current's own fundamental
  // (the harmonics convention), over the whole period.
  const design: InverterDesign = {
    vdc: 650,
    fundamentalFrequency: 50,
    carrierFrequency: 50 * 21,
    modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'min-max' },
    load: { r: 12, l: 0.02 },
    // Resonance 796 Hz, order 16: the sum to 220 is ten times past it, so the switching tail
    // is added to the samples (filteredPhase's switchingTail).
    filter: { l: 0.002, c: 20e-6, rDamping: 3 },
  };
  const grid = analyseDesign(design).dcLink?.samplesPerPeriod ?? 0;
  const report = analyseDesign(design, { points: grid });

  it('every phase and current, the samples half a period apart negated', () => {
    expect(grid).toBeGreaterThanOrEqual(4096);
    for (const phase of report.currents)
      for (const part of ['inverter', 'capacitor', 'load'] as const) {
        const figures = phase[part];
        if (figures === null) throw new Error(`no ${part} current`);
        const { angles, values } = figures.series;
        expect(values.length).toBe(grid);
        const label = `${part}, phase ${phase.phase}`;
        expect(figures.peak, label).toBe(Math.max(...values.map(Math.abs)));
        const ripple = values.map(
          (v, j) =>
            v - figures.fundamental * Math.sin((angles[j] as number) + figures.fundamentalPhase),
        );
        const range = Math.max(...ripple) - Math.min(...ripple);
        expect(Math.abs(figures.ripplePeakToPeak - range), label).toBeLessThan(1e-9 * figures.peak);
        for (let j = 0; j < grid / 2; j++)
          expect(values[j + grid / 2], `${label} at ${j}`).toBe(-(values[j] as number));
      }
  });
});
