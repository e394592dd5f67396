import { describe, expect, it } from 'vitest';
import { TAU } from '../../../math.js';
import { assertInDelta } from '../../../testing/assertInDelta.js';
import { multilevelCarrier } from '../../carrier/multilevelCarrier.js';
import type { MultilevelWaveforms } from '../../MultilevelTypes.js';
import { flyingCapacitorCharge } from '../flyingCapacitorCharge.js';

const PEAK = 10;
const F1 = 50;

function flyingCapacitor(levels: number, mf: number, ma: number, phaseCount: 1 | 3) {
  return multilevelCarrier({
    topology: 'flying-capacitor',
    levels,
    carriers: 'phase-shifted',
    phaseCount,
    ma,
    mf,
    vdc: 800,
  });
}

describe('flyingCapacitorCharge', () => {
  it('sign convention on a hand-built three-level leg: i_C = (s₁ − s₂)·i charges the capacitor (circuit analysis)', () => {
    // Cell 1 (outer) high on [0, π), cell 2 (inner) high on [π/2, 3π/2); i = Î sin θ out of the
    // leg. On [0, π/2) the current enters the capacitor's positive plate through cell 1's upper
    // switch and leaves through cell 2's lower switch: +Î·(1 − cos(π/2))/ω = +Î/ω; on [π, 3π/2)
    // it flows the other way: −∫ Î sin θ = +Î/ω again. Net 2Î/ω.
    const s1 = { edges: [0, Math.PI], levels: [1, 0] };
    const s2 = { edges: [Math.PI / 2, (3 * Math.PI) / 2], levels: [1, 0] };
    const waveforms: MultilevelWaveforms = {
      phaseCount: 3,
      levels: 3,
      legs: ['a', 'b', 'c'].map((name) => ({
        name: `leg ${name}`,
        output: { edges: [0], levels: [0] },
        switches: [],
        cells: [
          { name: 'cell 1', waveform: s1 },
          { name: 'cell 2', waveform: s2 },
        ],
      })),
    };
    const omega = TAU * F1;
    const result = flyingCapacitorCharge(
      waveforms,
      { peakCurrent: PEAK },
      { mf: 1, fundamentalFrequency: F1, capacitance: 1e-3, carrierPhase: -Math.PI / 2 },
    );
    const capacitor = result.legs[0]!.capacitors[0]!;
    assertInDelta(capacitor.netCharge, (2 * PEAK) / omega, 1e-12, 'net');
    // Ripple, worked here: with the drift (2Î/ω)·θ/2π removed, in units of Î/ω the running charge
    // is 1 − cos θ − θ/π on [0, π/2], 1 − θ/π on [π/2, π], 2 + cos θ − θ/π on [π, 3π/2] and
    // 2 − θ/π after: highest 1/2 (at π/2 and 3π/2), lowest where sin θ = 1/π inside the first
    // piece (and its mirror in the third), 1 − √(1 − 1/π²) − asin(1/π)/π.
    const lowest = 1 - Math.sqrt(1 - 1 / Math.PI ** 2) - Math.asin(1 / Math.PI) / Math.PI;
    const expected = ((0.5 - lowest) * PEAK) / omega / 1e-3;
    assertInDelta(capacitor.voltageRipple as number, expected, 1e-9 * expected, 'ripple');
    // Carrier-period windows (mf 1, the window from 0): one window holds the whole net charge.
    assertInDelta(capacitor.chargePerCarrierPeriod.values[0]!, (2 * PEAK) / omega, 1e-12, 'window');
  });

  it('phase-shifted carriers balance every flying capacitor: net charge zero, little per carrier period (Meynard and Foch 1992, from memory)', () => {
    for (const [levels, mf] of [
      [5, 21],
      [4, 20],
      [5, 201],
    ] as const) {
      const result = flyingCapacitorCharge(
        flyingCapacitor(levels, mf, 0.85, 3),
        { peakCurrent: PEAK, currentAngle: 0.5 },
        { mf, fundamentalFrequency: F1 },
      );
      // The charge one full carrier period of Î would carry: the scale of a carrier period.
      const unit = (PEAK * (TAU / mf)) / (TAU * F1);
      for (const leg of result.legs) {
        expect(leg.capacitors).toHaveLength(levels - 2);
        for (const c of leg.capacitors) {
          assertInDelta(c.netCharge, 0, 1e-9 * unit, `${levels} levels net`);
          // Each cell's duty over a carrier period is the same (1 + m)/2, so the carrier-period
          // charge is zero in the average model; the rest (current and reference changing
          // within the period) measured 4–7 % of the unit at mf 20–21, 0.5 % at mf 201.
          expect(c.maxChargePerCarrierPeriod).toBeLessThan((mf > 100 ? 0.01 : 0.1) * unit);
        }
      }
    }
  });

  it('three-level leg: voltage ripple max |i|·min(d, 1 − d)·Ts/C (Holmes and Lipo 2003, ch. 11; common practice)', () => {
    // With two cells at duty d = (1 + m sin θ)/2 and carriers 180° apart, the capacitor is in
    // series with the current for min(d, 1 − d)·Ts once each way a carrier period.
    for (const [mf, ma, phi, tolerance] of [
      [51, 0.9, 0.5, 0.003],
      [201, 0.8, 1.0, 0.003],
      [21, 0.8, 0.3, 0.01],
    ] as const) {
      const capacitance = 1e-4;
      const result = flyingCapacitorCharge(
        flyingCapacitor(3, mf, ma, 1),
        { peakCurrent: PEAK, currentAngle: phi },
        { mf, fundamentalFrequency: F1, capacitance },
      );
      let worst = 0;
      for (let q = 0; q < 100_000; q++) {
        const t = (TAU * q) / 100_000;
        worst = Math.max(
          worst,
          (Math.abs(PEAK * Math.sin(t - phi)) * (1 - Math.abs(ma * Math.sin(t)))) / 2,
        );
      }
      const expected = worst / (mf * F1) / capacitance;
      for (const leg of result.legs) {
        assertInDelta(
          leg.capacitors[0]!.voltageRipple as number,
          expected,
          tolerance * expected,
          `mf ${mf}`,
        );
      }
    }
  });

  it('names the field of bad input', () => {
    const bridge = flyingCapacitor(4, 20, 0.8, 3);
    const sine = { peakCurrent: PEAK };
    expect(() =>
      flyingCapacitorCharge({ ...bridge, levels: 5 }, sine, { mf: 20, fundamentalFrequency: F1 }),
    ).toThrow(/^waveforms\.legs\[0\]\.cells\.length must be 4/);
    expect(() => flyingCapacitorCharge(bridge, sine, { mf: 20, fundamentalFrequency: -1 })).toThrow(
      /^fundamentalFrequency must be/,
    );
    expect(() =>
      flyingCapacitorCharge(bridge, sine, { mf: 20, fundamentalFrequency: F1, capacitance: 0 }),
    ).toThrow(/^capacitance must be/);
    expect(() =>
      flyingCapacitorCharge(
        bridge,
        [
          [1, 2, 3, 4],
          [1, 2, 3, 4],
          [1, 2, 3],
        ],
        { mf: 20, fundamentalFrequency: F1 },
      ),
    ).toThrow(/^currents\[2\]\.length must be/);
  });
});
