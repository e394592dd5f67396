import { describe, expect, it } from 'vitest';
import {
  EXAMPLE_IGBT,
  LOSS_ZERO_SEQUENCES,
  lossesByPowerFactor,
  semiconductorLosses,
  semiconductorLossesByIntegration,
  type IgbtDevice,
  type LossZeroSequence,
} from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

// An invented device (not from any real part).
const igbt: IgbtDevice = { ...EXAMPLE_IGBT };
const base = { device: igbt, vdc: 650, ma: 0.9, peakCurrent: 28, fundamentalFrequency: 50 };
const DEG = Math.PI / 180;

/** ∫ₐᵇ |sin x| dx, exactly (piecewise over the zeros kπ). */
function integralOfAbsSine(a: number, b: number): number {
  let sum = 0;
  let x = a;
  while (x < b) {
    const next = Math.min(b, (Math.floor(x / Math.PI) + 1) * Math.PI);
    sum += Math.abs(Math.cos(x) - Math.cos(next));
    x = next;
  }
  return sum;
}

/**
 * The switching-loss function of a clamp: switching loss against continuous PWM at the same
 * carrier, for a load current Î·sin(θ − φ). Switching energy scales with |i| (linear, common
 * practice), so continuous PWM loses in proportion to ∫₀^2π |sin(θ − φ)| dθ = 4 and a clamp
 * saves the clamped windows' share: SLF = 1 − (1/4)·Σ ∫_window |sin(θ − φ)| dθ. This is the
 * form of A. M. Hava, R. J. Kerkman and T. A. Lipo (IEEE Trans. Power Electronics, 1998/1999)
 * and J. W. Kolar, H. Ertl, F. C. Zach (IEEE Trans. Ind. Appl., 1991), written here from the
 * clamp windows of Holmes and Lipo (2003, ch. 7) (from memory); the windows of leg a, degrees:
 * DPWM1 [60, 120] and [240, 300]; DPWM0 30° earlier, DPWM2 30° later; DPWMMAX [30, 150],
 * DPWMMIN [210, 330]; GDPWM DPWM1's shifted by ψ = φ limited to ±30°. Hence DPWM1:
 * SLF = 1 − cos φ/2 for |φ| ≤ 30° (0.5 at unity power factor), DPWMMAX/MIN: 1 − (√3/4)·cos φ,
 * GDPWM: 0.5 for every |φ| ≤ 30°.
 */
function switchingLossFunction(zeroSequence: LossZeroSequence, phi: number): number {
  const shift =
    zeroSequence === 'dpwm0'
      ? -30
      : zeroSequence === 'dpwm2'
        ? 30
        : zeroSequence === 'gdpwm'
          ? Math.max(-30, Math.min(30, phi / DEG))
          : 0;
  const windows: [number, number][] =
    zeroSequence === 'dpwm-max'
      ? [[30, 150]]
      : zeroSequence === 'dpwm-min'
        ? [[210, 330]]
        : [
            [60 + shift, 120 + shift],
            [240 + shift, 300 + shift],
          ];
  let saved = 0;
  for (const [from, to] of windows)
    saved += integralOfAbsSine(from * DEG - phi + 2 * Math.PI, to * DEG - phi + 2 * Math.PI);
  return 1 - saved / 4;
}

describe('lossesByPowerFactor: switching losses of every clamp against the switching-loss function', () => {
  // 30 kHz at 50 Hz: 600 carrier periods, so each 60° window holds 100 whole periods and the
  // quantised clamp edges move the ratio by under 1 %.
  const sweep = lossesByPowerFactor({
    ...base,
    switchingFrequency: 30_000,
    angles: [-90, -60, -45, -30, -15, 0, 15, 30, 45, 60, 90].map((d) => d * DEG),
  });
  const none = sweep.series.find((s) => s.zeroSequence === 'none');
  for (const zeroSequence of [
    'dpwm1',
    'dpwm0',
    'dpwm2',
    'dpwm-max',
    'dpwm-min',
    'gdpwm',
    'nspwm',
  ] as const)
    it(`${zeroSequence}: switching loss / continuous PWM's, φ from −90° to 90°`, () => {
      const series = sweep.series.find((s) => s.zeroSequence === zeroSequence);
      // NSPWM has DPWM1's modulation waves, hence its clamps (Hava and Ün 2009).
      const clamp = zeroSequence === 'nspwm' ? 'dpwm1' : zeroSequence;
      sweep.angles.forEach((phi, k) => {
        const ratio = (series?.switching[k] ?? NaN) / (none?.switching[k] ?? NaN);
        assertInDelta(ratio, switchingLossFunction(clamp, phi), 0.01, `φ = ${phi / DEG}°`);
      });
    });

  it('the closed forms themselves: DPWM1 0.5 at unity power factor, DPWMMAX 1 − √3/4, GDPWM 0.5 to ±30°', () => {
    expect(switchingLossFunction('dpwm1', 0)).toBeCloseTo(0.5, 12);
    expect(switchingLossFunction('dpwm1', 20 * DEG)).toBeCloseTo(1 - Math.cos(20 * DEG) / 2, 12);
    expect(switchingLossFunction('dpwm-max', 0)).toBeCloseTo(1 - Math.sqrt(3) / 4, 12);
    expect(switchingLossFunction('gdpwm', 25 * DEG)).toBeCloseTo(0.5, 12);
  });

  it('continuous sequences switch every period: the same switching loss as plain PWM', () => {
    for (const zeroSequence of ['third-harmonic', 'min-max', 'azspwm1'] as const) {
      const series = sweep.series.find((s) => s.zeroSequence === zeroSequence);
      series?.switching.forEach((value, k) =>
        assertInDelta(value, none?.switching[k] ?? NaN, 1e-9 * value, `${zeroSequence} ${k}`),
      );
    }
  });

  it('GDPWM is never worse than DPWM0, DPWM1 and DPWM2 in switching loss (its clamp follows the current)', () => {
    const of = (z: LossZeroSequence) => sweep.series.find((s) => s.zeroSequence === z);
    sweep.angles.forEach((_, k) => {
      const best = Math.min(
        ...(['dpwm0', 'dpwm1', 'dpwm2'] as const).map((z) => of(z)?.switching[k] ?? NaN),
      );
      expect(of('gdpwm')?.switching[k]).toBeLessThanOrEqual(best * (1 + 1e-9));
    });
  });
});

describe('equal average device switching frequency', () => {
  it('the 120° clamps run their carrier 1.5× faster; DPWM1 then saves 25 % at unity power factor (1.5 × 0.5)', () => {
    const sweep = lossesByPowerFactor({
      ...base,
      switchingFrequency: 10_000,
      angles: [0, 20 * DEG],
      basis: 'equal-switching',
      zeroSequences: ['none', 'dpwm1', 'gdpwm'],
    });
    const [none, dpwm1, gdpwm] = sweep.series;
    // Holmes and Lipo (2003, ch. 7): a discontinuous method switches 2/3 as often, so 1.5× the
    // carrier gives the same average switching frequency (common practice). 10 kHz × 1.5 at
    // 50 Hz is 300 carrier periods, 200 of which switch.
    expect(none?.carrierFrequency).toBe(10_000);
    assertInDelta(dpwm1?.carrierFrequency ?? NaN, 15_000, 1e-9);
    assertInDelta(dpwm1?.averageSwitchingFrequency ?? NaN, 10_000, 1e-9);
    const ratio = (s: typeof dpwm1, k: number) =>
      (s?.switching[k] ?? NaN) / (none?.switching[k] ?? NaN);
    assertInDelta(ratio(dpwm1, 0), 1.5 * switchingLossFunction('dpwm1', 0), 0.015, 'dpwm1 φ 0');
    assertInDelta(ratio(dpwm1, 1), 1.5 * switchingLossFunction('dpwm1', 20 * DEG), 0.015, 'φ 20°');
    assertInDelta(ratio(gdpwm, 1), 0.75, 0.015, 'gdpwm φ 20°');
  });
});

describe('conduction losses and the closed form', () => {
  it('a device whose transistor and diode drop alike conducts the same under every zero sequence', () => {
    // One device of the leg always carries the current (common practice: the current has to
    // flow somewhere), so with equal drops the modulation cannot change the conduction loss.
    const even: IgbtDevice = { ...igbt, vf0: igbt.vce0, rf: igbt.rce };
    const sweep = lossesByPowerFactor({
      ...base,
      device: even,
      switchingFrequency: 10_000,
      angles: [-1, 0, 0.5, 1.4],
    });
    const first = sweep.series[0]?.conduction ?? [];
    for (const s of sweep.series)
      s.conduction.forEach((value, k) =>
        assertInDelta(value, first[k] ?? NaN, 1e-9 * value, `${s.zeroSequence} ${k}`),
      );
  });

  it('agrees with the closed form (Bierhoff and Fuchs, PESC 2004, from memory) for continuous PWM', () => {
    const sweep = lossesByPowerFactor({
      ...base,
      switchingFrequency: 20_000,
      angles: [-0.8, 0, 0.45, 1.2],
      zeroSequences: ['none'],
    });
    sweep.angles.forEach((currentAngle, k) => {
      const closed = semiconductorLosses(igbt, {
        ...base,
        switchingFrequency: 20_000,
        currentAngle,
      });
      assertInDelta(sweep.series[0]?.total[k] ?? NaN, closed.total, 1e-4 * closed.total, `${k}`);
    });
  });

  it('GDPWM takes DPWM0, DPWM1 and DPWM2 at φ = −90°, 0 and 90°', () => {
    const at = (zeroSequence: LossZeroSequence, currentAngle: number) =>
      semiconductorLossesByIntegration(igbt, {
        ...base,
        switchingFrequency: 9_000,
        zeroSequence,
        currentAngle,
      }).total;
    assertInDelta(at('gdpwm', -Math.PI / 2), at('dpwm0', -Math.PI / 2), 1e-9, 'lead');
    assertInDelta(at('gdpwm', 0), at('dpwm1', 0), 1e-9, 'unity');
    assertInDelta(at('gdpwm', Math.PI / 2), at('dpwm2', Math.PI / 2), 1e-9, 'lag');
  });
});

describe('loss by device', () => {
  it('six transistors and six diodes make up the converter total at every angle', () => {
    const sweep = lossesByPowerFactor({ ...base, switchingFrequency: 10_000, points: 7 });
    for (const s of sweep.series)
      s.total.forEach((total, k) => {
        const device =
          6 *
          ((s.transistor.conduction[k] ?? NaN) +
            (s.transistor.switching[k] ?? NaN) +
            (s.diode.conduction[k] ?? NaN) +
            (s.diode.switching[k] ?? NaN));
        assertInDelta(device, total, 1e-9 * total, `${s.zeroSequence} ${k}`);
      });
  });

  it('at unity power factor the diodes conduct less than the transistors (Bierhoff and Fuchs, PESC 2004, from memory)', () => {
    // m·cos φ/8 moves conduction from the diode to the transistor when power flows to the load.
    const sweep = lossesByPowerFactor({
      ...base,
      switchingFrequency: 10_000,
      angles: [0],
      zeroSequences: ['none'],
    });
    const [none] = sweep.series;
    expect(none?.diode.conduction[0]).toBeLessThan(none?.transistor.conduction[0] ?? 0);
  });
});

describe('the sweep', () => {
  it('lists every zero sequence by default, 100 angles over ±90°, and names the lowest at each', () => {
    const sweep = lossesByPowerFactor({ ...base, switchingFrequency: 10_000 });
    expect(sweep.series.map((s) => s.zeroSequence)).toEqual(LOSS_ZERO_SEQUENCES);
    expect(sweep.angles).toHaveLength(100);
    assertInDelta(sweep.angles[0] ?? NaN, -Math.PI / 2, 1e-15);
    assertInDelta(sweep.powerFactor[99] ?? NaN, 0, 1e-15);
    sweep.lowest.forEach((name, k) => {
      const least = Math.min(...sweep.series.map((s) => s.total[k] ?? NaN));
      expect(sweep.series.find((s) => s.zeroSequence === name)?.total[k]).toBe(least);
    });
  });

  it('names the field and the range of bad input', () => {
    expect(() => lossesByPowerFactor({ ...base, switchingFrequency: 10_000, points: 1 })).toThrow(
      /points must be/,
    );
    expect(() =>
      lossesByPowerFactor({ ...base, switchingFrequency: 10_000, angles: [0, 4] }),
    ).toThrow(/angles\[1\]/);
    expect(() =>
      lossesByPowerFactor({
        ...base,
        switchingFrequency: 10_000,
        zeroSequences: ['none', 'dpwm7' as never],
      }),
    ).toThrow(/zeroSequences\[1\] must be one of/);
    expect(() => lossesByPowerFactor({ ...base, switchingFrequency: 1e6 })).toThrow(
      /switchingFrequency\/fundamentalFrequency/,
    );
  });
});
