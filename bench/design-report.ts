/**
 * Benchmark (not a test): the full design report of a three-phase design at mf 101 (load, LC
 * filter, DC-link current, common-mode voltage) against the exact spectrum of its phase voltage
 * alone to 50·mf, measured in one run; issue 12 asks for the report under 5 ms. Also the report
 * without a filter (the exact piecewise-exponential currents), for the cost of each part.
 */
import {
  analyseDesign,
  harmonics,
  modulationVoltages,
  designModulation,
  type InverterDesign,
} from '@pulsewright/modulation';
import { medianTime, printTable } from './measure.js';

const mf = 101;
const unfiltered: InverterDesign = {
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * mf,
  modulation: { method: 'three-phase', ma: 1.0, zeroSequence: 'min-max' },
  load: { r: 16, l: 0.03 },
};
const filtered: InverterDesign = { ...unfiltered, filter: { l: 0.002, c: 10e-6, rDamping: 3 } };

const phase = modulationVoltages(designModulation(unfiltered)).phases[0]?.waveform;
if (!phase) throw new Error('no phase voltage');
const spectrumOnly = medianTime(() => harmonics(phase, 50 * mf), 20, 5);
const reportUnfiltered = medianTime(
  () => analyseDesign(unfiltered, { maxOrder: 5000, points: 1200 }),
  10,
  3,
);
const reportFiltered = medianTime(
  () => analyseDesign(filtered, { maxOrder: 5000, points: 1200 }),
  10,
  3,
);
const reportDefault = medianTime(() => analyseDesign(filtered), 10, 3);

printTable(
  `Design report, three-phase, mf ${mf} (median ms; ratios against the spectrum alone in the same run)`,
  [
    ['exact spectrum of the phase voltage to 50·mf', `${spectrumOnly.toFixed(2)} ms (1.00)`],
    [
      'report, load, no filter, spectra to 5000',
      `${reportUnfiltered.toFixed(2)} ms (${(reportUnfiltered / spectrumOnly).toFixed(1)}×)`,
    ],
    [
      'report, load and LC filter, spectra to 5000',
      `${reportFiltered.toFixed(2)} ms (${(reportFiltered / spectrumOnly).toFixed(1)}×)`,
    ],
    [
      'report, load and LC filter, default spectrum order',
      `${reportDefault.toFixed(2)} ms (${(reportDefault / spectrumOnly).toFixed(1)}×)`,
    ],
    ['issue 12 goal for the full report', '5 ms'],
  ],
);
