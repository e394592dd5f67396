import { describe, expect, it } from 'vitest';
import {
  harmonics,
  multilevelCarrier,
  subtractWaveforms,
  thd,
  type Harmonic,
  type MultilevelCarrierOptions,
  type Waveform,
} from '@pulsewright/modulation';
import {
  cascadedPhaseShiftedString,
  difference,
  flyingCapacitorLeg,
  levelShiftedLeg,
  phaseReference,
  type Arrangement,
} from './multilevelComparators.js';
import {
  doubleFourierGroups,
  doubleFourierPhasors,
  type ComparatorSum,
  type Phasor,
} from './multilevelDoubleFourier.js';

// The library's exact multilevel carrier waveforms against the double Fourier series of
// naturally sampled multicarrier PWM (H. S. Black, 1953; Holmes and Lipo, 2003, ch. 3 and 11;
// G. Carrara et al., IEEE Trans. Power Electron., 1992; B. P. McGrath and D. G. Holmes, IEEE
// Trans. Ind. Electron., 2002), computed independently in ./multilevelDoubleFourier.ts: inner
// integral in closed form, outer by Gauss–Legendre quadrature.

const vdc = 100;

/** Cosine and sine coefficients (a, b) of order h: v_h = a·cos hθ + b·sin hθ. */
function coefficients(spectrum: readonly Harmonic[], order: number): [number, number] {
  const entry = spectrum[order];
  if (entry === undefined) throw new Error(`order ${order} is not in the spectrum`);
  return [entry.amplitude * Math.sin(entry.phase), entry.amplitude * Math.cos(entry.phase)];
}

/** |exact − series| of order h as a vector in (a, b); V_h gives a = 2·Re V, b = −2·Im V. */
function departure(
  spectrum: readonly Harmonic[],
  series: readonly Phasor[],
  order: number,
): number {
  const [a, b] = coefficients(spectrum, order);
  const p = series[order] as Phasor;
  return Math.hypot(a - 2 * p.re, b + 2 * p.im);
}

function amplitudeAt(spectrum: readonly Harmonic[], order: number): number {
  return spectrum[order]?.amplitude ?? NaN;
}

interface Case {
  title: string;
  options: MultilevelCarrierOptions;
  /** The library's waveform under test. */
  pick: (legs: Waveform[]) => Waveform;
  /** The same voltage as comparators, built from the methods' definitions. */
  model: (mf: number) => ComparatorSum;
}

function levelShiftedCases(carriers: Arrangement): Case[] {
  const ma = 0.9;
  const npc = (phase: number): ComparatorSum =>
    levelShiftedLeg(phaseReference(ma, phase), carriers, 2, -vdc / 2, vdc / 2);
  return [
    {
      title: `NPC three-phase ${carriers}, leg a`,
      options: { topology: 'npc', levels: 3, carriers, phaseCount: 3, ma, mf: 0, vdc },
      pick: (legs) => legs[0] as Waveform,
      model: () => npc(0),
    },
    {
      title: `NPC three-phase ${carriers}, line ab`,
      options: { topology: 'npc', levels: 3, carriers, phaseCount: 3, ma, mf: 0, vdc },
      pick: (legs) => subtractWaveforms(legs[0] as Waveform, legs[1] as Waveform),
      model: () => difference(npc(0), npc(1)),
    },
    {
      title: `cascaded five-level single-phase ${carriers}`,
      options: {
        topology: 'cascaded-h-bridge',
        levels: 5,
        carriers,
        phaseCount: 1,
        ma,
        mf: 0,
        vdc,
      },
      pick: (legs) => legs[0] as Waveform,
      // Two cells: the string is −2·vdc plus vdc for each of the four bands it is above.
      model: () => levelShiftedLeg(phaseReference(ma, 0), carriers, 4, -2 * vdc, vdc),
    },
  ];
}

const CASES: Case[] = [
  ...levelShiftedCases('pd'),
  ...levelShiftedCases('pod'),
  ...levelShiftedCases('apod'),
  {
    title: 'NPC three-phase pd with min-max at ma 1.1, leg a',
    options: {
      topology: 'npc',
      levels: 3,
      carriers: 'pd',
      phaseCount: 3,
      ma: 1.1,
      mf: 0,
      vdc,
      zeroSequence: 'min-max',
    },
    pick: (legs) => legs[0] as Waveform,
    model: () => levelShiftedLeg(phaseReference(1.1, 0, 'min-max'), 'pd', 2, -vdc / 2, vdc / 2),
  },
  {
    title: 'flying capacitor four-level three-phase, third harmonic at ma 1.05, leg a',
    options: {
      topology: 'flying-capacitor',
      levels: 4,
      carriers: 'phase-shifted',
      phaseCount: 3,
      ma: 1.05,
      mf: 0,
      vdc,
      zeroSequence: 'third-harmonic',
    },
    pick: (legs) => legs[0] as Waveform,
    model: () => flyingCapacitorLeg(phaseReference(1.05, 0, 'third-harmonic'), 3, vdc),
  },
  {
    title: 'flying capacitor four-level single-phase, full bridge a − b',
    options: {
      topology: 'flying-capacitor',
      levels: 4,
      carriers: 'phase-shifted',
      phaseCount: 1,
      ma: 0.8,
      mf: 0,
      vdc,
    },
    pick: (legs) => subtractWaveforms(legs[0] as Waveform, legs[1] as Waveform),
    model: () =>
      difference(
        flyingCapacitorLeg(phaseReference(0.8, 0), 3, vdc),
        flyingCapacitorLeg({ value: (y) => -0.8 * Math.sin(y), kinks: [] }, 3, vdc),
      ),
  },
  {
    title: 'cascaded three cells phase-shifted single-phase',
    options: {
      topology: 'cascaded-h-bridge',
      levels: 7,
      carriers: 'phase-shifted',
      phaseCount: 1,
      ma: 0.9,
      mf: 0,
      vdc,
    },
    pick: (legs) => legs[0] as Waveform,
    model: () => cascadedPhaseShiftedString(phaseReference(0.9, 0), 3, vdc),
  },
];

describe('large mf (41): every component to the fourth carrier group within 1e-3 of vdc', () => {
  const mf = 41;
  const maxOrder = 4 * mf + 20;
  for (const { title, options, pick, model } of CASES) {
    it(title, () => {
      const legs = multilevelCarrier({ ...options, mf }).legs.map((leg) => leg.output);
      const spectrum = harmonics(pick(legs), maxOrder);
      // Carrier groups m = −5…9: PD's and POD's terms fall off slowly in n, so groups up to
      // five carrier groups away still reach these orders at 1e-4 of vdc (measured: with
      // m = −2…6 PD's worst departure was 6e-4 of vdc, with −5…9 it is 8e-5).
      const series = doubleFourierPhasors(model(mf), mf, maxOrder, -5, 9);
      let worst = 0;
      for (let order = 1; order <= maxOrder; order++) {
        worst = Math.max(worst, departure(spectrum, series, order));
      }
      console.log(`${title}: worst departure ${(worst / vdc).toExponential(2)} of vdc`);
      expect(worst / vdc).toBeLessThan(1e-3);
    });
  }
});

describe('small mf: the exact spectrum departs from the single-term table by sideband overlap', () => {
  // Where carrier groups overlap, several (m, n) terms land on one order h; the exact amplitude
  // is their phasor sum, so | |exact| − |largest term| | ≤ Σ |other terms at h| (triangle
  // inequality), as tests/reference/doubleFourier.test.ts shows for two levels.
  const ma = 0.8;
  const cases = [
    {
      title: 'cascaded three cells phase-shifted, mf 3',
      mf: 3,
      options: { topology: 'cascaded-h-bridge', levels: 7, carriers: 'phase-shifted' } as const,
      model: cascadedPhaseShiftedString(phaseReference(ma, 0), 3, vdc),
    },
    {
      title: 'cascaded five-level pd, mf 5',
      mf: 5,
      options: { topology: 'cascaded-h-bridge', levels: 5, carriers: 'pd' } as const,
      model: levelShiftedLeg(phaseReference(ma, 0), 'pd', 4, -2 * vdc, vdc),
    },
  ];
  for (const { title, mf, options, model } of cases) {
    it(`${title}: departure shown, bounded, and closed by the sum of the groups`, () => {
      const maxOrder = 9 * mf;
      const legs = multilevelCarrier({ ...options, phaseCount: 1, ma, mf, vdc }).legs;
      const spectrum = harmonics((legs[0] as { output: Waveform }).output, maxOrder);
      const fullSumDeparture = (groups: Map<number, Phasor[]>): number => {
        let worst = 0;
        for (let order = 1; order <= maxOrder; order++) {
          let re = 0;
          let im = 0;
          for (const group of groups.values()) {
            re += (group[order] as Phasor).re;
            im += (group[order] as Phasor).im;
          }
          worst = Math.max(worst, Math.abs(amplitudeAt(spectrum, order) - 2 * Math.hypot(re, im)));
        }
        return worst;
      };
      const groups = doubleFourierGroups(model, mf, maxOrder, -40, 40);
      let largestSingle = 0;
      for (let order = 1; order <= maxOrder; order++) {
        const terms = [...groups.values()].map(
          (g) => 2 * Math.hypot((g[order] as Phasor).re, (g[order] as Phasor).im),
        );
        const largest = Math.max(...terms);
        const others = terms.reduce((sum, t) => sum + t, 0) - largest;
        const single = Math.abs(amplitudeAt(spectrum, order) - largest);
        // The terms of |m| > 40 are left out of `others`: 1e-3 of vdc covers them (see below).
        expect(single).toBeLessThanOrEqual(others + 1e-3 * vdc);
        largestSingle = Math.max(largestSingle, single);
      }
      console.log(
        `${title}: largest departure from the single-term table ${(largestSingle / vdc).toExponential(2)} of vdc`,
      );
      expect(largestSingle / vdc).toBeGreaterThan(1e-2);
      const full = fullSumDeparture(groups);
      if (options.carriers === 'phase-shifted') {
        // No reference reaches ±1 (ma 0.8), so each cell's a(y) is smooth and the terms fall
        // off faster than any power of m: 40 groups either side close the sum to rounding.
        expect(full / vdc).toBeLessThan(1e-9);
      } else {
        // PD's bands clip the reference, a kink in a(y), so terms fall off as 1/(m·mf)² and the
        // sum's tail as 1/M: measured 1.1e-2, 4.8e-3, 1.6e-3 of vdc for M = 10, 20, 40.
        const fewer = fullSumDeparture(doubleFourierGroups(model, mf, maxOrder, -10, 10));
        expect(full).toBeLessThan(fewer / 3);
        expect(full / vdc).toBeLessThan(3e-3);
      }
    });
  }
});

describe('known facts of multicarrier PWM', () => {
  const mf = 21;
  const maxOrder = 50 * mf;

  it('PD: no carrier harmonic at mf in the line-to-line voltage, present in each leg (McGrath and Holmes, 2002)', () => {
    // All three legs share PD's carriers, so the carrier harmonic (m = 1, n = 0) is the same in
    // each and cancels between two legs; POD moves the group's energy to sidebands instead.
    const legs = multilevelCarrier({
      topology: 'npc',
      levels: 3,
      carriers: 'pd',
      phaseCount: 3,
      ma: 0.9,
      mf: 39,
      vdc,
    }).legs;
    const leg = harmonics((legs[0] as { output: Waveform }).output, 39);
    const line = harmonics(
      subtractWaveforms(
        (legs[0] as { output: Waveform }).output,
        (legs[1] as { output: Waveform }).output,
      ),
      39,
    );
    expect(amplitudeAt(leg, 39) / vdc).toBeGreaterThan(0.05);
    expect(amplitudeAt(line, 39) / vdc).toBeLessThan(1e-3);
  });

  for (const [topology, levels] of [
    ['npc', 3],
    ['cascaded-h-bridge', 5],
  ] as const) {
    it(`${topology} ${levels}-level three-phase at ma 0.9: PD has the lowest line THD of PD, POD, APOD (McGrath and Holmes, 2002; Holmes and Lipo, 2003, ch. 11)`, () => {
      const lineThd = (carriers: Arrangement): number => {
        const legs = multilevelCarrier({
          topology,
          levels,
          carriers,
          phaseCount: 3,
          ma: 0.9,
          mf,
          vdc,
        }).legs;
        return thd(
          harmonics(
            subtractWaveforms(
              (legs[0] as { output: Waveform }).output,
              (legs[1] as { output: Waveform }).output,
            ),
            maxOrder,
          ),
        );
      };
      const [pd, pod, apod] = [lineThd('pd'), lineThd('pod'), lineThd('apod')];
      console.log(
        `${topology}: line THD to order ${maxOrder}: PD ${pd.toFixed(4)}, POD ${pod.toFixed(4)}, APOD ${apod.toFixed(4)}`,
      );
      expect(pd).toBeLessThan(pod);
      expect(pd).toBeLessThan(apod);
    });
  }

  it('phase-shifted cascaded, three cells: nothing but the fundamental below the first group at 2·3·mf (Holmes and Lipo, 2003, ch. 11)', () => {
    // Unipolar cells cancel the odd carrier groups and the cells' π/3 shifts all but m = 6k; the
    // 6·mf group's sidebands J_n(6π·ma/2) are below 1e-9 for |n| ≥ 30 at ma 0.9 (from memory,
    // checked in the first suite).
    const cells = 3;
    const output = multilevelCarrier({
      topology: 'cascaded-h-bridge',
      levels: 2 * cells + 1,
      carriers: 'phase-shifted',
      phaseCount: 1,
      ma: 0.9,
      mf,
      vdc,
    }).legs[0]?.output as Waveform;
    const spectrum = harmonics(output, 2 * cells * mf + 10);
    for (let order = 2; order <= 2 * cells * mf - 30; order++) {
      expect(amplitudeAt(spectrum, order) / vdc, `order ${order}`).toBeLessThan(1e-9);
    }
    const firstGroup = Math.max(...spectrum.slice(2 * cells * mf - 10).map((h) => h.amplitude));
    expect(firstGroup / vdc).toBeGreaterThan(1e-2);
  });

  it('phase-shifted flying capacitor, four levels: the first group sits at 3·mf (Holmes and Lipo, 2003, ch. 11)', () => {
    const output = multilevelCarrier({
      topology: 'flying-capacitor',
      levels: 4,
      carriers: 'phase-shifted',
      phaseCount: 1,
      ma: 0.9,
      mf,
      vdc,
    }).legs[0]?.output as Waveform;
    const spectrum = harmonics(output, 3 * mf + 10);
    for (let order = 2; order <= 3 * mf - 25; order++) {
      expect(amplitudeAt(spectrum, order) / vdc, `order ${order}`).toBeLessThan(1e-9);
    }
    expect(amplitudeAt(spectrum, 3 * mf) / vdc).toBeGreaterThan(1e-2);
  });

  for (const options of [
    { topology: 'npc', levels: 3, carriers: 'pd', tolerance: 1e-3 },
    // The min-max reference has kinks every 60°, so the 6·mf group's terms fall off as a power
    // of n and reach order 1 at about 2e-7 of the range (measured).
    { topology: 'cascaded-h-bridge', levels: 7, carriers: 'phase-shifted', tolerance: 1e-5 },
  ] as const) {
    it(`${options.topology} ${options.carriers}: min-max stays linear to ma = 2/√3 (1.15), a plain sine does not (Holmes and Lipo, 2003, ch. 5 and 11)`, () => {
      const ma = 1.15;
      const halfRange = options.topology === 'npc' ? vdc / 2 : 3 * vdc;
      const fundamental = (zeroSequence: 'none' | 'min-max'): number => {
        const legs = multilevelCarrier({
          ...options,
          phaseCount: 3,
          ma,
          mf: 81,
          vdc,
          zeroSequence,
        }).legs;
        const [a, b] = coefficients(harmonics((legs[0] as { output: Waveform }).output, 1), 1);
        expect(Math.abs(a)).toBeLessThan(options.tolerance * halfRange); // in phase with sin θ
        return b;
      };
      // PD's fundamental differs from ma·range/2 by sideband overlap, about 1e-5 at mf 81.
      expect(Math.abs(fundamental('min-max') - ma * halfRange)).toBeLessThan(
        options.tolerance * halfRange,
      );
      // Without the zero sequence the references pass ±1 and the output saturates.
      expect(fundamental('none')).toBeLessThan(0.995 * ma * halfRange);
    });
  }
});

describe('brute force: the exact level at 10⁶ instants, from the carriers themselves', () => {
  // An independent comparator: the unit triangle with a valley at θ = π/2 (the library's
  // alignment, docs/methods.md), each band's carrier scaled into its band, evaluated at N
  // instants and compared with the exact waveform's level there; instants within 1e-7 rad of
  // an exact edge are skipped, where the sampled comparator cannot tell which side it is on.
  const N = 1_000_000;
  const triangle = (x: number): number => {
    const u = x - 2 * Math.PI * Math.floor(x / (2 * Math.PI));
    return u <= Math.PI ? -1 + (2 * u) / Math.PI : 3 - (2 * u) / Math.PI;
  };
  /** The last carrier extreme at or before x: its carrier angle (peaks only when symmetric). */
  const lastSample = (x: number, sampling: 'regular-symmetric' | 'regular-asymmetric'): number => {
    const step = sampling === 'regular-symmetric' ? 2 * Math.PI : Math.PI;
    const offset = sampling === 'regular-symmetric' ? Math.PI : 0;
    return offset + step * Math.floor((x - offset) / step);
  };

  type Sampling = 'natural' | 'regular-symmetric' | 'regular-asymmetric';
  const cases: {
    options: MultilevelCarrierOptions;
    level: (theta: number, sampling: Sampling) => number;
  }[] = [];
  /** 1 when reference r (a function of θ) is above the triangle delayed by φ at θ. */
  const state = (
    r: (t: number) => number,
    phi: number,
    mf: number,
    theta: number,
    sampling: Sampling,
  ): number => {
    const x = mf * (theta - Math.PI / 2) - phi;
    const held =
      sampling === 'natural' ? theta : Math.PI / 2 + (lastSample(x, sampling) + phi) / mf;
    return r(held) > triangle(x) ? 1 : 0;
  };
  /** f with its last value remembered: the bands of one instant share one reference value. */
  const remembered = (f: (t: number) => number): ((t: number) => number) => {
    let lastT = Number.NaN;
    let lastValue = 0;
    return (t) => {
      if (t !== lastT) {
        lastT = t;
        lastValue = f(t);
      }
      return lastValue;
    };
  };
  const mf = 15;
  for (const carriers of ['pd', 'pod', 'apod'] as const) {
    for (const sampling of ['natural', 'regular-symmetric', 'regular-asymmetric'] as const) {
      const minMax = remembered(phaseReference(1.1, 0, 'min-max').value);
      cases.push({
        options: {
          topology: 'cascaded-h-bridge',
          levels: 5,
          carriers,
          phaseCount: 3,
          ma: 1.1,
          mf,
          vdc,
          zeroSequence: 'min-max',
          sampling,
        },
        level: (theta, sampling) => {
          let count = 0;
          for (let k = 0; k < 4; k++) {
            const lo = -1 + k / 2;
            const fromZero = k - 2;
            const opposed =
              carriers === 'pd' ? false : carriers === 'pod' ? fromZero < 0 : fromZero % 2 !== 0;
            count += state(
              (t) => 4 * (minMax(t) - lo) - 1,
              opposed ? Math.PI : 0,
              mf,
              theta,
              sampling,
            );
          }
          return (count - 2) * vdc;
        },
      });
    }
  }
  cases.push({
    options: {
      topology: 'flying-capacitor',
      levels: 5,
      carriers: 'phase-shifted',
      phaseCount: 1,
      ma: 0.95,
      mf: 16,
      vdc,
      carrierPhase: 0.3,
    },
    level: (theta) => {
      let count = 0;
      for (let k = 0; k < 4; k++)
        count += state((t) => 0.95 * Math.sin(t), 0.3 + (k * Math.PI) / 2, 16, theta, 'natural');
      return -vdc / 2 + (count * vdc) / 4;
    },
  });
  const thirdHarmonic = remembered(phaseReference(1, 0, 'third-harmonic').value);
  cases.push({
    options: {
      topology: 'cascaded-h-bridge',
      levels: 7,
      carriers: 'phase-shifted',
      phaseCount: 3,
      ma: 1,
      mf,
      vdc,
      zeroSequence: 'third-harmonic',
    },
    level: (theta) => {
      const reference = thirdHarmonic;
      let sum = 0;
      for (let k = 0; k < 3; k++) {
        const phi = (k * Math.PI) / 3;
        sum +=
          state(reference, phi, mf, theta, 'natural') -
          state((t) => -reference(t), phi, mf, theta, 'natural');
      }
      return sum * vdc;
    },
  });
  for (const { options, level } of cases) {
    it(`${options.topology} ${options.levels}-level ${options.carriers} ${options.sampling ?? 'natural'}`, () => {
      const output = multilevelCarrier(options).legs[0]?.output as Waveform;
      const edges = output.edges;
      let compared = 0;
      let mismatches = 0;
      let edgeIndex = 0;
      for (let i = 0; i < N; i++) {
        const theta = ((i + 0.5) * 2 * Math.PI) / N;
        while (edgeIndex < edges.length && (edges[edgeIndex] as number) < theta) edgeIndex++;
        const next =
          edgeIndex < edges.length
            ? (edges[edgeIndex] as number)
            : (edges[0] as number) + 2 * Math.PI;
        const previous =
          edgeIndex > 0
            ? (edges[edgeIndex - 1] as number)
            : (edges[edges.length - 1] as number) - 2 * Math.PI;
        if (next - theta < 1e-7 || theta - previous < 1e-7) continue;
        compared++;
        // The level held since the last edge before θ (the last one wraps round from 2π).
        const exact = output.levels[
          edgeIndex > 0 ? edgeIndex - 1 : output.levels.length - 1
        ] as number;
        if (Math.abs(exact - level(theta, options.sampling ?? 'natural')) > 1e-9 * vdc) {
          mismatches++;
        }
      }
      expect(compared).toBeGreaterThan(0.99 * N);
      expect(mismatches).toBe(0);
    });
  }
});
