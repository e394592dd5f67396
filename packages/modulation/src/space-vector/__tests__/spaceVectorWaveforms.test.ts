import { describe, expect, it } from 'vitest';
import { spaceVectorWaveforms, SIX_STEP_M } from '../index.js';
import type { SpaceVectorWaveformOptions } from '../index.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { thd } from '../../spectrum/thd.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const TAU = 2 * Math.PI;
const vdc = 540;

/** ∫ from `from` to `to` (radians, 0 ≤ from < to ≤ 2π) of a waveform, exact (segment sums). */
function integral({ edges, levels }: Waveform, from: number, to: number): number {
  let sum = 0;
  const n = edges.length;
  // The segment before edges[0] holds the last level (wraps round).
  const bounds = [{ start: 0, end: edges[0] as number, level: levels[n - 1] as number }];
  for (let i = 0; i < n; i++) {
    bounds.push({
      start: edges[i] as number,
      end: i + 1 < n ? (edges[i + 1] as number) : TAU,
      level: levels[i] as number,
    });
  }
  for (const { start, end, level } of bounds) {
    const overlap = Math.min(end, to) - Math.max(start, from);
    if (overlap > 0) sum += overlap * level;
  }
  return sum;
}

/** Reference line voltage va* − vb* at fundamental angle θ: (m·vdc/√3)·(sin θ − sin(θ − 2π/3)). */
function lineReference(m: number, theta: number): number {
  return ((m * vdc) / Math.sqrt(3)) * (Math.sin(theta) - Math.sin(theta - TAU / 3));
}

describe('spaceVectorWaveforms: volt-second balance', () => {
  // Every switching period (every half period with asymmetric sampling) the mean of the line
  // voltage equals the sampled reference's line voltage (van der Broeck et al., IEEE Trans. Ind.
  // Appl., 1988: the dwell times realise the reference vector's volt-seconds). Checked on the
  // exact waveform by integrating its segments, not by sampling it.
  const cases: SpaceVectorWaveformOptions[] = [
    { m: 0.9, vdc, frequencyRatio: 9 },
    { m: 0.45, vdc, frequencyRatio: 24, sampling: 'asymmetric' },
    { m: 1, vdc, frequencyRatio: 15, sequence: 'five-segment', clamping: 'dpwm1' },
    {
      m: 0.7,
      vdc,
      frequencyRatio: 7.5,
      sequence: 'five-segment',
      clamping: 'dpwm2',
      sampling: 'asymmetric',
    },
    { m: 0.8, vdc, frequencyRatio: 10.25, zeroSplit: 0.3 },
    { ma: 0.6, vdc, frequencyRatio: 21 },
  ];
  for (const options of cases) {
    it(JSON.stringify(options), () => {
      const result = spaceVectorWaveforms(options);
      const { switchingPeriods: n, fundamentalOrder: q, m } = result;
      expect(n).toBe(q * options.frequencyRatio);
      const parts = options.sampling === 'asymmetric' ? 2 : 1;
      for (let k = 0; k < n * parts; k++) {
        const from = (k * TAU) / (n * parts);
        const to = ((k + 1) * TAU) / (n * parts);
        const mean = integral(result.ab, from, to) / (to - from);
        // The sample is taken at the start of each (half) period, fundamental angle q·(span angle).
        assertInDelta(mean, lineReference(m, q * from), 1e-9 * vdc, `period ${k}`);
      }
    });
  }
});

describe('spaceVectorWaveforms: levels, fundamental, frequency ratio', () => {
  it('switches legs between ±vdc/2 and line voltages among 0, ±vdc', () => {
    // Two-level leg (definition); line-to-line = difference of two legs.
    const { a, b, c, ab, bc, ca, an } = spaceVectorWaveforms({ m: 0.8, vdc, frequencyRatio: 12 });
    for (const leg of [a, b, c])
      for (const level of leg.levels) expect(Math.abs(level)).toBe(vdc / 2);
    for (const line of [ab, bc, ca])
      for (const level of line.levels) expect([0, vdc]).toContain(Math.abs(level));
    for (const level of an.levels) {
      expect([0, vdc / 3, (2 * vdc) / 3].some((x) => Math.abs(Math.abs(level) - x) < 1e-9)).toBe(
        true,
      );
    }
    // Seven-segment: each leg switches twice per switching period (Holmes and Lipo ch. 5).
    expect(a.edges.length).toBe(2 * 12);
  });

  it('gives the commanded fundamental m·vdc/√3 in the linear range at a high frequency ratio', () => {
    // Linear range: phase fundamental = |Vref| = m·vdc/√3 (Holmes and Lipo 2003, ch. 5). Regular
    // sampling leaves an amplitude error that falls as about 1/mf² (measured 0.04 % at mf = 60),
    // and delays the fundamental by half a switching period, −π/mf (the pulse is centred half a
    // period after its sample; Bowes 1975, regular sampling).
    for (const m of [0.3, 0.9]) {
      const result = spaceVectorWaveforms({ m, vdc, frequencyRatio: 600 });
      const fundamental = harmonics(result.an, 1)[1] as { amplitude: number; phase: number };
      assertInDelta(fundamental.amplitude, (m * vdc) / Math.sqrt(3), 1e-4 * vdc, `m ${m}`);
      assertInDelta(fundamental.phase, -Math.PI / 600, 1e-6, `phase ${m}`);
    }
  });

  it('covers q fundamental periods for a ratio p/q, the fundamental at order q', () => {
    // 7.5 = 15/2: the pattern repeats after 2 fundamental periods (15 switching periods), so the
    // fundamental is order 2 of the span (Fourier series of a waveform periodic over the span).
    const result = spaceVectorWaveforms({ m: 0.9, vdc, frequencyRatio: 7.5 });
    expect(result.fundamentalOrder).toBe(2);
    expect(result.switchingPeriods).toBe(15);
    const spectrum = harmonics(result.an, 4);
    const commanded = (0.9 * vdc) / Math.sqrt(3);
    // At so low a ratio regular sampling costs a few per cent (2.7 % measured).
    expect(Math.abs((spectrum[2]?.amplitude ?? 0) - commanded)).toBeLessThan(0.05 * commanded);
    // The sub-harmonic at half the fundamental frequency (order 1 of the span) is not zero:
    // the two fundamental periods of the span differ.
    expect(spectrum[1]?.amplitude ?? 0).toBeGreaterThan(1e-6 * vdc);
    expect(spaceVectorWaveforms({ m: 0.9, vdc, frequencyRatio: 10.25 }).fundamentalOrder).toBe(4);
  });

  it('refuses bad input, naming the field', () => {
    expect(() => spaceVectorWaveforms({ m: 0.5, vdc, frequencyRatio: Math.PI })).toThrow(
      /^frequencyRatio must be/,
    );
    expect(() => spaceVectorWaveforms({ m: 0.5, vdc, frequencyRatio: 0.5 })).toThrow(
      /^frequencyRatio must be/,
    );
    expect(() => spaceVectorWaveforms({ m: 1.2, vdc, frequencyRatio: 12 })).toThrow(/^m must be/);
    expect(() => spaceVectorWaveforms({ m: 0.5, ma: 0.5, vdc, frequencyRatio: 12 })).toThrow(
      /^ma must be/,
    );
    expect(() => spaceVectorWaveforms({ vdc, frequencyRatio: 12 })).toThrow(/^m must be/);
    expect(() => spaceVectorWaveforms({ m: 0.5, vdc: 0, frequencyRatio: 12 })).toThrow(
      /^vdc must be/,
    );
    expect(() =>
      spaceVectorWaveforms({ m: 0.5, vdc, frequencyRatio: 12, sampling: 'natural' as never }),
    ).toThrow(/^sampling must be/);
  });
});

describe('spaceVectorWaveforms: six-step', () => {
  // At m = 2√3/π the two-mode overmodulation holds the vector at the vertices for the whole
  // sector (Holtz, Lotzkat, Khambadkone, IEEE Trans. Power Electron., 1993): six-step.
  for (const options of [
    { frequencyRatio: 12 },
    { frequencyRatio: 18, sequence: 'five-segment' as const },
    { frequencyRatio: 30, sampling: 'asymmetric' as const },
  ]) {
    it(`reaches the six-step waveform, ${JSON.stringify(options)}`, () => {
      const result = spaceVectorWaveforms({ m: SIX_STEP_M, vdc, ...options });
      expect(result.mode).toBe('six-step');
      // Square leg voltage ±vdc/2: fundamental 4·(vdc/2)/π = (2/π)·vdc (Fourier series of a
      // square wave, standard Fourier analysis), in phase with sin θ.
      expect(result.a.edges.length).toBe(2);
      const leg = harmonics(result.a, 1)[1] as { amplitude: number; phase: number };
      assertInDelta(leg.amplitude, (2 / Math.PI) * vdc, 1e-9 * vdc, 'leg fundamental');
      assertInDelta(leg.phase, 0, 1e-9, 'leg phase');
      const phase = harmonics(result.an, 1)[1] as { amplitude: number };
      assertInDelta(phase.amplitude, (2 / Math.PI) * vdc, 1e-9 * vdc, 'phase fundamental');
      // Six-step line voltage THD = √(π²/9 − 1) ≈ 31.08 % (docs/references.md; standard Fourier
      // analysis). Orders 6k ± 1 above N = 20001 hold ≈ 1/(3N) of THD², which lowers the
      // truncated THD by ≈ 1/(6N·0.31) ≈ 2.7e-5; the check allows 3.5e-5 and must be below.
      const truncated = thd(harmonics(result.ab, 20001));
      const limit = Math.sqrt(Math.PI ** 2 / 9 - 1);
      assertInDelta(truncated, limit, 3.5e-5, 'line THD');
      expect(truncated).toBeLessThan(limit);
    });
  }
});
