import { describe, expect, it } from 'vitest';
import {
  assertLossSweepOptions,
  EXAMPLE_IGBT,
  lossesByPowerFactor,
  type IgbtDevice,
} from '../../index.js';

// An invented device (not from any real part).
const igbt: IgbtDevice = { ...EXAMPLE_IGBT };
const base = { device: igbt, vdc: 650, ma: 0.9, peakCurrent: 28, switchingFrequency: 10_000 };

describe('assertLossSweepOptions: the sweep checked before any work', () => {
  it('gives the defaults the sweep runs with: 50 Hz, every zero sequence, 100 angles over ±π/2', () => {
    const checked = assertLossSweepOptions(base);
    expect(checked.fundamentalFrequency).toBe(50);
    expect(checked.angles).toHaveLength(100);
    expect(checked.basis).toBe('equal-carrier');
    expect(checked.point.switchingFrequency).toBe(10_000);
  });

  it('refuses a device value far past any real part, naming it, before the sweep is sized', () => {
    // Switching energies are millijoules, up to some 10 J a pulse for the largest modules
    // (common practice, from memory); 1e308 J would make every loss infinite.
    for (const field of ['eon', 'eoff', 'err', 'vce0', 'rce', 'vf0', 'rf', 'referenceCurrent']) {
      expect(() =>
        assertLossSweepOptions({ ...base, device: { ...igbt, [field]: 1e308 } }),
      ).toThrow(new RegExp(`^device\\.${field} must be`));
    }
    // The device is checked first: with a fundamental that asks for 1e331 carrier periods as well,
    // the error still names the device's energy.
    expect(() =>
      assertLossSweepOptions({
        ...base,
        device: { ...igbt, eon: 1e308 },
        switchingFrequency: 1e8,
        fundamentalFrequency: 4.4e-323,
      }),
    ).toThrow(/^device\.eon must be/);
    expect(() =>
      assertLossSweepOptions({ ...base, device: { ...igbt, referenceVoltage: 1e-300 } }),
    ).toThrow(/^device\.referenceVoltage must be/);
  });

  it('names the carrier periods a tiny fundamental asks for', () => {
    expect(() => assertLossSweepOptions({ ...base, fundamentalFrequency: 4.4e-323 })).toThrow(
      /switchingFrequency\/fundamentalFrequency/,
    );
  });

  it('keeps every loss finite at the bounds it allows', () => {
    // The largest energies and resistances with the smallest reference point, the largest bus
    // and current: the sums stay finite numbers (the API refuses NaN and ±∞ in an answer).
    const extreme: IgbtDevice = {
      kind: 'igbt',
      vce0: 1e3,
      rce: 1e3,
      vf0: 1e3,
      rf: 1e3,
      eon: 1e3,
      eoff: 1e3,
      err: 1e3,
      referenceVoltage: 1e-3,
      referenceCurrent: 1e-3,
    };
    const sweep = lossesByPowerFactor({
      device: extreme,
      vdc: 1e5,
      ma: 0.9,
      peakCurrent: 1e6,
      switchingFrequency: 1e5,
      fundamentalFrequency: 1e3,
      zeroSequences: ['none', 'dpwm1'],
      angles: [0, 1],
    });
    for (const series of sweep.series) {
      for (const value of [...series.total, ...series.conduction, ...series.switching])
        expect(Number.isFinite(value)).toBe(true);
    }
  });
});
