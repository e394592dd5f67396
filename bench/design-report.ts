/**
 * Benchmark (not a test): the full design report of a three-phase design at mf 101 (load, LC
 * filter, DC-link current, common-mode voltage, semiconductor losses) against the exact spectrum
 * of its phase voltage alone to 50·mf, measured in one run; issue 12 asks for the report under
 * 5 ms. Also the report without a filter (the exact piecewise-exponential currents) and without
 * losses, for the cost of each part.
 *
 * With a filter every current is read on a grid of S ≥ 16·N samples a period, N the analysis
 * order (spectra to 5000: N = 5000, S = 131072), so the cost grows with the spectrum asked for.
 * Issue 12 speed work (CPU time per report, lower quartile of 15 calls on the loaded 2-core
 * machine, before → after, every figure unchanged to rounding; wall times there bounce 2–5×
 * with the load): spectrum alone 1.1 ms; no filter, to 5000: 16.7 → 14.5 ms (with losses
 * 18.4 → 15.6 ms); LC filter, to 5000: 274 → 81 ms (with losses 289 → 102–106 ms); LC filter,
 * default order (3·mf + 20, so N = 1020, S = 16384): 29 → 9–14 ms (with losses 33 → 13–16 ms).
 * The 5 ms goal is not reached: at spectra to 5000 one transform of the 131072-point grid alone
 * takes about 3 ms here, and the report makes five (four syntheses, the DC link's spectrum).
 */
import {
  analyseDesign,
  harmonics,
  modulationVoltages,
  designModulation,
  type InverterDesign,
  EXAMPLE_IGBT,
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
const full: InverterDesign = { ...filtered, device: { ...EXAMPLE_IGBT } };

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
const reportFull = medianTime(() => analyseDesign(full, { maxOrder: 5000, points: 1200 }), 10, 3);
const reportFullDefault = medianTime(() => analyseDesign(full), 10, 3);

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
    [
      'full report: load, LC filter, losses, spectra to 5000',
      `${reportFull.toFixed(2)} ms (${(reportFull / spectrumOnly).toFixed(1)}×)`,
    ],
    [
      'full report: load, LC filter, losses, default spectrum order',
      `${reportFullDefault.toFixed(2)} ms (${(reportFullDefault / spectrumOnly).toFixed(1)}×)`,
    ],
    ['issue 12 goal for the full report', '5 ms'],
  ],
);
