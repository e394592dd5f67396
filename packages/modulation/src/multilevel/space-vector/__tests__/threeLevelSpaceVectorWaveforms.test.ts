import { describe, expect, it } from 'vitest';
import { threeLevelSpaceVectorWaveforms } from '../index.js';
import type { ThreeLevelSpaceVectorWaveformOptions } from '../index.js';
import { compareWithCarrier } from '../../../carrier/compareWithCarrier.js';
import { harmonics } from '../../../spectrum/harmonics.js';
import { assertInDelta } from '../../../testing/assertInDelta.js';
import { rangeErrorField } from '../../../testing/rangeErrorField.js';
import { combineWaveforms } from '../../../waveform/combineWaveforms.js';
import type { Waveform } from '../../../waveform/Waveform.js';
import { waveformIntegral } from '../../../waveform/waveformIntegral.js';
import { waveformValueAt } from '../../../waveform/waveformValueAt.js';

const TAU = 2 * Math.PI;
const vdc = 1500;

/** Reference line voltage va* − vb* at fundamental angle θ: (m·vdc/√3)·(sin θ − sin(θ − 2π/3)). */
function lineReference(m: number, theta: number): number {
  return ((m * vdc) / Math.sqrt(3)) * (Math.sin(theta) - Math.sin(theta - TAU / 3));
}

/**
 * The three references of level-shifted PD carrier PWM equivalent to three-level space vector,
 * normalised so that ±1 spans ±vdc/2: B. P. McGrath, D. G. Holmes, T. A. Lipo, "Optimized space
 * vector switching sequences for multilevel inverters", IEEE Trans. Power Electron., 2003 (from
 * memory): the sine references with the min-max offset, then a second offset computed on the
 * references taken modulo the carrier band (width 1 here) that centres them in their bands,
 * 1/2 − (max + min)/2 of the remainders.
 */
function mcGrathReferences(ma: number, theta: number): number[] {
  const sines = [0, 1, 2].map((k) => ma * Math.sin(theta - (k * TAU) / 3));
  const first = -(Math.max(...sines) + Math.min(...sines)) / 2;
  const shifted = sines.map((v) => v + first);
  const remainders = shifted.map((v) => v - Math.floor(v));
  const second = 0.5 - (Math.max(...remainders) + Math.min(...remainders)) / 2;
  return shifted.map((v) => v + second);
}

/**
 * One three-level leg under PD carriers (two in-phase unit triangles in the bands [0, 1] and
 * [−1, 0]; McGrath and Holmes, IEEE Trans. Ind. Electron., 2002), regular sampled with carrier
 * peaks at θ = 2πk/N: each band is the reference mapped into [−1, 1] against the library's
 * carrier comparator, and the leg's level is the count of bands the reference is above.
 */
function pdLeg(
  leg: number,
  ma: number,
  n: number,
  sampling: 'regular-symmetric' | 'regular-asymmetric',
): Waveform {
  // Carrier phase x = n·(θ − π/2) − carrierPhase puts a peak (x = π) at θ = 0.
  const carrierPhase = -n * (Math.PI / 2) - Math.PI;
  const band = (offset: number) =>
    compareWithCarrier(
      {
        value: (theta) => 2 * (mcGrathReferences(ma, theta)[leg] as number) + offset,
        slopeBound: 1e3,
      },
      { mf: n, carrierPhase, sampling, high: 1, low: 0 },
    );
  return combineWaveforms([band(-1), band(1)], ([u = 0, l = 0]) => ((u + l - 1) * vdc) / 2);
}

/** True when a sample's space-vector angle θ − π/2 lies on the π/6 grid of sector middles. */
function onSectorGrid(theta: number): boolean {
  const position = theta / (Math.PI / 6);
  return Math.abs(position - Math.round(position)) < 1e-9;
}

describe('threeLevelSpaceVectorWaveforms: volt-seconds and fundamental', () => {
  const cases: ThreeLevelSpaceVectorWaveformOptions[] = [
    { m: 0.9, vdc, frequencyRatio: 15 },
    { m: 0.35, vdc, frequencyRatio: 24, sampling: 'asymmetric' },
    { m: 1, vdc, frequencyRatio: 21, smallVectorSplit: 0.2, topology: 't-type' },
    { ma: 0.7, vdc, frequencyRatio: 9, sampling: 'asymmetric', smallVectorSplit: 1 },
  ];
  for (const options of cases) {
    it(`line volt-seconds equal the sampled reference each (half) period, ${JSON.stringify(options)}`, () => {
      // Dwell times realise the reference vector's volt-seconds (nearest-three-vector
      // principle, Celanovic and Boroyevich, IEEE Trans. Power Electron., 2000), so the mean of
      // va − vb over each switching period (each half with asymmetric sampling) is the sampled
      // reference's line voltage, checked on the exact waveform.
      const result = threeLevelSpaceVectorWaveforms(options);
      const [a, b] = result.legs.map((leg) => leg.output) as [Waveform, Waveform];
      const m = options.m ?? ((options.ma as number) * Math.sqrt(3)) / 2;
      const parts = options.sampling === 'asymmetric' ? 2 : 1;
      const count = options.frequencyRatio * parts;
      for (let k = 0; k < count; k++) {
        const from = (k * TAU) / count;
        const to = ((k + 1) * TAU) / count;
        const mean = (waveformIntegral(a, from, to) - waveformIntegral(b, from, to)) / (to - from);
        assertInDelta(mean, lineReference(m, from), 1e-9 * vdc, `part ${k}`);
      }
    });
  }

  it('gives the commanded fundamental m·vdc/√3 on each leg at a high frequency ratio', () => {
    // Linear range: phase fundamental |Vref| = m·vdc/√3 (as two-level; Holmes and Lipo 2003,
    // ch. 5 and 11); the zero sequence is triplen and leaves a leg's fundamental alone. Regular
    // sampling delays it by half a switching period, π/N (Bowes 1975), and leaves an amplitude
    // error falling as about 1/N² (below 1e-4 of vdc at N = 600, as in the two-level suite).
    for (const m of [0.3, 0.75, 1]) {
      const { legs } = threeLevelSpaceVectorWaveforms({ m, vdc, frequencyRatio: 600 });
      legs.forEach((leg, k) => {
        const fundamental = harmonics(leg.output, 1)[1] as { amplitude: number; phase: number };
        assertInDelta(fundamental.amplitude, (m * vdc) / Math.sqrt(3), 1e-4 * vdc, `m ${m}`);
        const expected = -Math.PI / 600 - (k * TAU) / 3;
        const error = Math.atan2(
          Math.sin(fundamental.phase - expected),
          Math.cos(fundamental.phase - expected),
        );
        assertInDelta(error, 0, 1e-5, `phase ${m} leg ${k}`);
      });
    }
  });
});

describe('threeLevelSpaceVectorWaveforms: equals PD carriers with the McGrath–Holmes–Lipo offset', () => {
  // With the small vector's dwell split equally, three-level space vector equals level-shifted
  // PD carrier PWM with the zero sequence of McGrath, Holmes and Lipo (IEEE Trans. Power
  // Electron., 2003), sample for sample. Compared edge by edge in each switching period, except
  // periods sampled exactly at a sector's middle: there both small vectors are equally near,
  // and the carriers take the band edge (a reference of exactly 0) as the upper band while the
  // space vector takes the sector's second half, so the two pick different small vectors.
  const cases = [
    { m: 0.9, frequencyRatio: 15, sampling: 'symmetric' as const },
    { m: 0.45, frequencyRatio: 21, sampling: 'symmetric' as const },
    { m: 0.7, frequencyRatio: 10, sampling: 'asymmetric' as const },
    { m: 0.98, frequencyRatio: 33, sampling: 'asymmetric' as const },
  ];
  for (const { m, frequencyRatio: n, sampling } of cases) {
    it(`m ${m}, N ${n}, ${sampling}`, () => {
      const { legs } = threeLevelSpaceVectorWaveforms({ m, vdc, frequencyRatio: n, sampling });
      const ma = (2 * m) / Math.sqrt(3);
      const carrierSampling = sampling === 'symmetric' ? 'regular-symmetric' : 'regular-asymmetric';
      const width = TAU / n;
      let compared = 0;
      legs.forEach((leg, index) => {
        const carrier = pdLeg(index, ma, n, carrierSampling);
        for (let k = 0; k < n; k++) {
          const start = k * width;
          if (onSectorGrid(start) || (sampling === 'asymmetric' && onSectorGrid(start + width / 2)))
            continue;
          const inside = (w: Waveform) =>
            w.edges.filter((e) => e > start + 1e-9 && e < start + width - 1e-9);
          const own = inside(leg.output);
          const theirs = inside(carrier);
          expect(own.length, `leg ${index} period ${k}`).toBe(theirs.length);
          own.forEach((edge, i) => assertInDelta(edge, theirs[i] as number, 1e-9, `edge ${i}`));
          // The same level between the edges (and at the period's ends).
          for (const [from, to] of pairs([start, ...own, start + width])) {
            const middle = (from + to) / 2;
            expect(waveformValueAt(leg.output, middle)).toBe(waveformValueAt(carrier, middle));
          }
          compared++;
        }
      });
      // Every leg of every period but the few (at most six here) sampled at a sector's middle.
      expect(compared).toBeGreaterThanOrEqual(3 * (n - 6));
    });
  }
});

function pairs(points: number[]): [number, number][] {
  return points.slice(1).map((to, i) => [points[i] as number, to]);
}

describe('threeLevelSpaceVectorWaveforms: legs and switches', () => {
  it('steps each leg one level at a time among −vdc/2, 0, +vdc/2', () => {
    // A three-level leg's output levels (Holmes and Lipo ch. 11); one-level steps keep each
    // device's blocking voltage at vdc/2 (common practice for NPC modulation).
    for (const sampling of ['symmetric', 'asymmetric'] as const) {
      const { legs, phaseCount, levels } = threeLevelSpaceVectorWaveforms({
        m: 0.8,
        vdc,
        frequencyRatio: 12,
        sampling,
        smallVectorSplit: 0.3,
      });
      expect([phaseCount, levels]).toEqual([3, 3]);
      expect(legs.map((leg) => leg.name)).toEqual(['leg a', 'leg b', 'leg c']);
      for (const { output } of legs) {
        output.levels.forEach((level, i) => {
          expect([-vdc / 2, 0, vdc / 2]).toContain(level);
          const before = output.levels[(i + output.levels.length - 1) % output.levels.length];
          expect(Math.abs(level - (before as number))).toBe(vdc / 2);
        });
      }
    }
  });

  it('gates the four switches of each leg as NPC and T-type legs need', () => {
    // NPC (Nabae, Takahashi, Akagi, IEEE Trans. Ind. Appl., 1981): S1 on at +vdc/2, S2 at +vdc/2
    // and 0, S3 at 0 and −vdc/2, S4 at −vdc/2 (S1/S3 and S2/S4 complementary). T-type: the same
    // gates, the midpoint pair S2 and S3 both on at 0 (M. Schweizer and J. W. Kolar, IEEE Trans.
    // Power Electron., 2013, from memory).
    const gatesAt = (v: number) => [v > 0, v >= 0, v <= 0, v < 0];
    const expected = { npc: gatesAt, 't-type': gatesAt };
    for (const topology of ['npc', 't-type'] as const) {
      const { legs } = threeLevelSpaceVectorWaveforms({ m: 0.6, vdc, frequencyRatio: 9, topology });
      for (const { output, switches } of legs) {
        expect(switches.map((s) => s.name)).toEqual(['S1', 'S2', 'S3', 'S4']);
        const angles = [...output.edges, ...switches.flatMap((s) => s.on.edges)].sort(
          (x, y) => x - y,
        );
        for (const [from, to] of pairs([...angles, (angles[0] as number) + TAU])) {
          if (to - from < 1e-12) continue;
          const middle = (from + to) / 2;
          const gates = switches.map((s) => waveformValueAt(s.on, middle) === 1);
          expect(gates).toEqual(expected[topology](waveformValueAt(output, middle)));
        }
      }
    }
  });

  it('refuses bad input, naming the field', () => {
    const base = { m: 0.5, vdc, frequencyRatio: 12 };
    const field = (options: object) =>
      rangeErrorField(() =>
        threeLevelSpaceVectorWaveforms(options as ThreeLevelSpaceVectorWaveformOptions),
      );
    expect(field({ ...base, m: 1.01 })).toBe('m');
    expect(field({ ...base, m: undefined, ma: 1.2 })).toBe('ma');
    expect(field({ ...base, ma: 0.5 })).toBe('ma');
    expect(field({ vdc, frequencyRatio: 12 })).toBe('m');
    expect(field({ ...base, frequencyRatio: 12.5 })).toBe('frequencyRatio');
    expect(field({ ...base, frequencyRatio: 0 })).toBe('frequencyRatio');
    expect(field({ ...base, frequencyRatio: 200_000 })).toBe('frequencyRatio');
    expect(field({ ...base, vdc: 0 })).toBe('vdc');
    expect(field({ ...base, sampling: 'natural' })).toBe('sampling');
    expect(field({ ...base, smallVectorSplit: -0.1 })).toBe('smallVectorSplit');
    expect(field({ ...base, topology: 'flying-capacitor' })).toBe('topology');
    expect(field(base)).toBeUndefined();
  });
});
