import { describe, expect, it } from 'vitest';
import { harmonics } from '../../../spectrum/harmonics.js';
import { multilevelCarrier } from '../../carrier/multilevelCarrier.js';
import { deviceSwitchingFrequencies } from '../deviceSwitchingFrequencies.js';

const F1 = 50;
const MF = 21;

/** The first order above 5 whose amplitude exceeds 1 % of the fundamental (the first sideband). */
function firstCarrierGroup(waveform: Parameters<typeof harmonics>[0], maxOrder: number): number {
  const spectrum = harmonics(waveform, maxOrder);
  const floor = 0.01 * spectrum[1]!.amplitude;
  return spectrum.find((h) => h.order > 5 && h.amplitude > floor)?.order ?? Infinity;
}

describe('deviceSwitchingFrequencies', () => {
  it('cascaded, phase-shifted, 3 cells: devices at mf·f₁, the output at 2N·mf·f₁ (Holmes and Lipo 2003, ch. 11)', () => {
    const waveforms = multilevelCarrier({
      topology: 'cascaded-h-bridge',
      levels: 7,
      carriers: 'phase-shifted',
      phaseCount: 1,
      ma: 0.9,
      mf: MF,
      vdc: 100,
    });
    const result = deviceSwitchingFrequencies(waveforms, F1);
    const leg = result.legs[0]!;
    expect(leg.switches).toHaveLength(12);
    // Each cell leg compares the reference with one carrier: one pulse a carrier period (fact of
    // sine-triangle PWM in the linear range, common practice).
    for (const s of leg.switches) expect(s.frequency).toBe(MF * F1);
    expect(result.maxDeviceFrequency).toBe(MF * F1);
    // McGrath and Holmes 2002: the string's first carrier group at 2·cells·mf. A few of the
    // cells' edges fall where the output's level does not change (a pulse of one cell meeting
    // the opposite pulse of another near the peaks), so the count may fall short by a few.
    expect(Math.abs(leg.outputEdgesPerPeriod - 4 * 3 * MF)).toBeLessThanOrEqual(4);
    // Its sidebands reach some ten orders either side of the group's centre (Bessel terms).
    expect(
      Math.abs(firstCarrierGroup(waveforms.legs[0]!.output, 8 * MF) - 6 * MF),
    ).toBeLessThanOrEqual(12);
  });

  it('flying capacitor, 5 levels: devices at mf·f₁, the output at (levels − 1)·mf·f₁', () => {
    const waveforms = multilevelCarrier({
      topology: 'flying-capacitor',
      levels: 5,
      carriers: 'phase-shifted',
      phaseCount: 3,
      ma: 0.85,
      mf: MF,
      vdc: 800,
    });
    const result = deviceSwitchingFrequencies(waveforms, F1);
    for (const leg of result.legs) {
      for (const s of leg.switches) expect(s.frequency).toBe(MF * F1);
      expect(Math.abs(leg.outputEdgesPerPeriod - 2 * 4 * MF)).toBeLessThanOrEqual(4);
    }
    const group = firstCarrierGroup(waveforms.legs[0]!.output, 8 * MF);
    expect(Math.abs(group - 4 * MF)).toBeLessThanOrEqual(12);
    expect(result.meanDeviceFrequency).toBe(MF * F1);
  });

  it('NPC, PD: each outer device switches only in its half period, half the carrier frequency on average', () => {
    const waveforms = multilevelCarrier({
      topology: 'npc',
      levels: 3,
      carriers: 'pd',
      phaseCount: 3,
      ma: 0.8,
      mf: MF,
      vdc: 800,
    });
    const leg = deviceSwitchingFrequencies(waveforms, F1).legs[0]!;
    // S1 pulses once a carrier period while the reference is positive, about mf/2 a period
    // (Holmes and Lipo 2003, ch. 11: the level-shifted band of a device is active half the time).
    for (const s of leg.switches)
      expect(Math.abs(s.turnOnsPerPeriod - MF / 2)).toBeLessThanOrEqual(1);
    expect(Math.abs(leg.outputEdgesPerPeriod - 2 * MF)).toBeLessThanOrEqual(2);
  });

  it('counts a hand-built gate exactly', () => {
    const on = { edges: [0.5, 1, 2, 3], levels: [1, 0, 1, 0] };
    const result = deviceSwitchingFrequencies(
      {
        phaseCount: 1,
        levels: 3,
        legs: [{ name: 'leg a', output: on, switches: [{ name: 'S1', on }], cells: [] }],
      },
      60,
    );
    expect(result.legs[0]!.switches[0]!.frequency).toBe(120);
    expect(result.legs[0]!.effectiveFrequency).toBe(120);
  });

  it('names the field of bad input', () => {
    const waveforms = { phaseCount: 3 as const, levels: 3, legs: [] };
    expect(() => deviceSwitchingFrequencies(waveforms, 50)).toThrow(
      /^waveforms\.legs\.length must be 3/,
    );
    expect(() =>
      deviceSwitchingFrequencies(
        {
          phaseCount: 1,
          levels: 3,
          legs: [{ name: 'a', output: { edges: [0], levels: [0] }, switches: [], cells: [] }],
        },
        0,
      ),
    ).toThrow(/^fundamentalFrequency must be/);
  });
});
