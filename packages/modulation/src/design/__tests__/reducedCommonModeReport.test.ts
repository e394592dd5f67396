import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { SQRT3 } from '../../math.js';
import { triangleCarrier } from '../../carrier/triangleCarrier.js';
import type { ZeroSequence } from '../../three-phase/ZeroSequence.js';
import { analyseDesign } from '../analyseDesign.js';
import type { InverterDesign } from '../InverterDesign.js';

const vdc = 650;
const design = (zeroSequence: ZeroSequence, ma = 0.9): InverterDesign => ({
  vdc,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 201,
  modulation: { method: 'three-phase', ma, zeroSequence },
  load: { r: 6, l: 0.008 },
});

describe('the design report of the reduced common-mode methods', () => {
  it('common mode at ±vdc/6 only (A. M. Hava and E. Ün, IEEE Trans. Power Electronics, 2009), with the range', () => {
    for (const zeroSequence of ['azspwm1', 'nspwm'] as const) {
      const { commonMode } = analyseDesign(design(zeroSequence));
      // The report rounds levels to 12 significant digits.
      expect(commonMode?.levels.map((l) => l * (6 / vdc))).toEqual(
        [-1, 1].map((x) => expect.closeTo(x, 9)),
      );
      // A two-level waveform at ±vdc/6 has RMS vdc/6 exactly.
      assertInDelta(commonMode?.rms ?? NaN, vdc / 6, 1e-9, `${zeroSequence} rms`);
      expect(commonMode?.reducedRange?.max).toBeCloseTo(2 / SQRT3, 12);
    }
    expect(analyseDesign(design('nspwm')).commonMode?.reducedRange?.min).toBeCloseTo(
      4 / (3 * SQRT3),
      12,
    );
    const standard = analyseDesign(design('min-max')).commonMode;
    expect(standard?.levels.map((l) => l * (6 / vdc))).toEqual(
      [-3, -1, 1, 3].map((x) => expect.closeTo(x, 9)),
    );
    expect(standard?.reducedRange).toBeNull();
  });

  it('average device switching frequency: the carrier for continuous PWM, about 2/3 of it for the 120° clamps', () => {
    // Common practice: a continuous carrier method turns each switch on once per carrier period;
    // a discontinuous one leaves each leg unswitched for 120° of the period (Holmes and Lipo
    // 2003, ch. 7), so about 2/3 as often.
    const carrier = 50 * 201;
    expect(analyseDesign(design('min-max')).switching?.averageDeviceFrequency).toBe(carrier);
    for (const zeroSequence of ['dpwm1', 'nspwm'] as const)
      assertInDelta(
        analyseDesign(design(zeroSequence)).switching?.averageDeviceFrequency ?? NaN,
        (2 / 3) * carrier,
        0.02 * carrier,
        zeroSequence,
      );
    // AZSPWM1 switches as space vector does, plus a swap of carriers four times a period.
    assertInDelta(
      analyseDesign(design('azspwm1')).switching?.averageDeviceFrequency ?? NaN,
      carrier,
      0.01 * carrier,
      'azspwm1',
    );
    // A single-phase bipolar bridge's switches also turn on once a carrier period (Holmes and
    // Lipo ch. 3): the carrier frequency.
    expect(
      analyseDesign({
        ...design('none'),
        modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9 },
      }).switching?.averageDeviceFrequency,
    ).toBe(carrier);
  });

  it('the modulator chart shows the inverted carrier while phase a is the middle phase', () => {
    const { modulator } = analyseDesign(design('azspwm1'), { points: 4000 });
    const angles = modulator?.angles ?? [];
    const carrier = modulator?.carrier ?? [];
    const at = (degrees: number) => {
      const k = angles.findIndex((a) => a >= (degrees * Math.PI) / 180);
      return { theta: angles[k] ?? NaN, value: carrier[k] ?? NaN };
    };
    // Phase a is the middle phase round its zero crossings (0°, 180°), not round its peak (90°).
    for (const degrees of [5, 185]) {
      const { theta, value } = at(degrees);
      expect(value).toBeCloseTo(-triangleCarrier(theta, { mf: 201 }), 12);
    }
    const { theta, value } = at(95);
    expect(value).toBeCloseTo(triangleCarrier(theta, { mf: 201 }), 12);
  });
});
