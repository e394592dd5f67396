import { ParameterRangeError } from '../validation/errors.js';
import { assertLossInputs } from './assertLossInputs.js';
import type { LossOperatingPoint, SemiconductorDevice, SemiconductorLosses } from './lossTypes.js';
import { summariseLosses } from './summariseLosses.js';

/**
 * Semiconductor losses of a voltage-source inverter with sinusoidal PWM and a sinusoidal load
 * current, in closed form (average model: the duty cycle (1 + r)/2 of each carrier period
 * times the instantaneous conduction loss, integrated over the fundamental).
 *
 * With Î the peak current, φ the power-factor angle, m = ma (D. Bierhoff and F. W. Fuchs,
 * "Semiconductor losses in voltage source and current source IGBT converters based on
 * analytical derivation", IEEE PESC 2004, from memory):
 * - IGBT conduction P_T = vce0·Î·(1/(2π) + m·cos φ/8) + rce·Î²·(1/8 + m·cos φ/(3π))
 * - diode conduction P_D = vf0·Î·(1/(2π) − m·cos φ/8) + rf·Î²·(1/8 − m·cos φ/(3π))
 * - switching P_T,sw = fsw·(eon + eoff)·(1/π)·(vdc/Vref)·(Î/Iref), P_D,sw = fsw·err·(1/π)·(same)
 * - 'third-harmonic' (m3 = m/6 added as m3·sin 3θ) changes only the resistive terms, by
 *   −m3·rce·Î²·cos 3φ/(15π) for the IGBT and +m3·rf·Î²·cos 3φ/(15π) for the diode (the same
 *   integral with the extra term, worked here: ∫₀^π sin(3α + 3φ)·sin²α dα = −(4/15)·cos 3φ;
 *   the threshold terms gain nothing since ∫₀^π sin(3α + 3φ)·sin α dα = 0).
 * - MOSFET with synchronous rectification: each channel carries the current in both
 *   directions while on, P = rdsOn·Î²/4 per switch (the legs' two channels share
 *   rdsOn·Î²/2 = rdsOn·I_rms²); the body diode only recovers (err) at switching.
 *
 * Valid in the linear range (every carrier period switches, no clamping): ma ≤ 1 ('none') or
 * ≤ 2/√3 ('third-harmonic'); 'min-max', the discontinuous clamps, the reduced common-mode
 * methods and overmodulation: use {@link semiconductorLossesByIntegration}.
 *
 * @param device - datasheet values of one switch position
 * @throws ParameterRangeError for a zeroSequence other than 'none' or 'third-harmonic', or ma
 *   outside the linear range
 */
export function semiconductorLosses(
  device: SemiconductorDevice,
  options: LossOperatingPoint,
): SemiconductorLosses {
  const point = assertLossInputs(device, options);
  const {
    vdc,
    ma: m,
    peakCurrent: i,
    currentAngle: phi,
    switchingFrequency: fsw,
    zeroSequence,
  } = point;
  if (zeroSequence !== 'none' && zeroSequence !== 'third-harmonic') {
    throw new ParameterRangeError(
      'zeroSequence',
      "'none' or 'third-harmonic' for the closed form (use semiconductorLossesByIntegration for min-max, the discontinuous clamps and the reduced common-mode methods)",
      zeroSequence,
    );
  }
  const linearLimit = zeroSequence === 'none' ? 1 : 2 / Math.sqrt(3);
  if (m > linearLimit + 1e-12) {
    throw new ParameterRangeError(
      'ma',
      `≤ ${linearLimit} (the linear range of zeroSequence '${zeroSequence}'; use semiconductorLossesByIntegration beyond it)`,
      m,
    );
  }
  const cos = Math.cos(phi);
  const m3 = zeroSequence === 'third-harmonic' ? m / 6 : 0;
  const third = (m3 * Math.cos(3 * phi)) / (15 * Math.PI);
  const scale = ((vdc / device.referenceVoltage) * (i / device.referenceCurrent)) / Math.PI;
  if (device.kind === 'mosfet') {
    return summariseLosses(
      {
        conduction: (device.rdsOn * i * i) / 4,
        switching: fsw * (device.eon + device.eoff) * scale,
      },
      { conduction: 0, switching: fsw * device.err * scale },
      point,
    );
  }
  const transistor = {
    conduction:
      device.vce0 * i * (1 / (2 * Math.PI) + (m * cos) / 8) +
      device.rce * i * i * (1 / 8 + (m * cos) / (3 * Math.PI) - third),
    switching: fsw * (device.eon + device.eoff) * scale,
  };
  const diode = {
    conduction:
      device.vf0 * i * (1 / (2 * Math.PI) - (m * cos) / 8) +
      device.rf * i * i * (1 / 8 - (m * cos) / (3 * Math.PI) + third),
    switching: fsw * device.err * scale,
  };
  return summariseLosses(transistor, diode, point);
}
