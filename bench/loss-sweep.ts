/**
 * Benchmark (not a test): the loss-versus-power-factor sweep (issue 12: a 100-point sweep under
 * 100 ms), every zero sequence including the discontinuous clamps and GDPWM, at equal carrier and
 * at equal average switching frequency, against the exact spectrum of a three-phase design's
 * phase voltage at mf 101 to 50·mf alone, measured in the same run.
 */
import {
  designModulation,
  EXAMPLE_IGBT,
  harmonics,
  lossesByPowerFactor,
  modulationVoltages,
  type IgbtDevice,
  type InverterDesign,
} from '@pulsewright/modulation';
import { medianTime, printTable } from './measure.js';

// An invented device (not from any real part).
const device: IgbtDevice = { ...EXAMPLE_IGBT };
const mf = 101;
const design: InverterDesign = {
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * mf,
  modulation: { method: 'three-phase', ma: 1.0, zeroSequence: 'min-max' },
};
const phase = modulationVoltages(designModulation(design)).phases[0]?.waveform;
if (!phase) throw new Error('no phase voltage');
const operating = { device, vdc: 650, ma: 0.9, peakCurrent: 28, fundamentalFrequency: 50 };

const spectrumOnly = medianTime(() => harmonics(phase, 50 * mf), 20, 5);
const all = medianTime(
  () => lossesByPowerFactor({ ...operating, switchingFrequency: 10_000, points: 100 }),
  10,
  3,
);
const equalSwitching = medianTime(
  () =>
    lossesByPowerFactor({
      ...operating,
      switchingFrequency: 10_000,
      points: 100,
      basis: 'equal-switching',
    }),
  10,
  3,
);
const one = medianTime(
  () =>
    lossesByPowerFactor({
      ...operating,
      switchingFrequency: 10_000,
      points: 100,
      zeroSequences: ['dpwm1'],
    }),
  10,
  3,
);
const ratio = (ms: number) => `${ms.toFixed(2)} ms (${(ms / spectrumOnly).toFixed(1)}×)`;

printTable(
  'Loss against power factor, 100 angles, 10 kHz at 50 Hz (median ms; ratios against the spectrum alone in the same run)',
  [
    [
      `exact spectrum of a phase voltage, mf ${mf}, to 50·mf`,
      `${spectrumOnly.toFixed(2)} ms (1.00)`,
    ],
    ['sweep, DPWM1 alone', ratio(one)],
    ['sweep, all 11 zero sequences, equal carrier', ratio(all)],
    ['sweep, all 11 zero sequences, equal average switching frequency', ratio(equalSwitching)],
    ['issue 12 goal for a 100-point sweep', '100 ms'],
  ],
);
