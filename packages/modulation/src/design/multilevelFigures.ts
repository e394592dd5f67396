import {
  MULTILEVEL_CARRIER_ARRANGEMENT_LABELS,
  MULTILEVEL_TOPOLOGY_LABELS,
  type MultilevelTopology,
  type MultilevelWaveforms,
} from '../multilevel/MultilevelTypes.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { MultilevelFigures } from './DesignReport.js';
import type { Modulation } from './Modulation.js';

/** Turn-ons of a 0/1 gate signal over one period: its 0 → 1 steps (the period wraps round). */
function turnOns(on: Waveform): number {
  const { levels } = on;
  let count = 0;
  for (let i = 0; i < levels.length; i++) {
    const previous = levels[(i - 1 + levels.length) % levels.length] as number;
    if (previous < 0.5 && (levels[i] as number) >= 0.5) count++;
  }
  return count;
}

/** The distinct values of a waveform, ascending, rounded so equal sums of cells compare equal. */
function distinctLevels(waveform: Waveform): number[] {
  return [...new Set(waveform.levels.map((level) => Number(level.toPrecision(12))))].sort(
    (x, y) => x - y,
  );
}

/**
 * The multilevel section of the design report from the bridge's own waveforms: each leg's
 * (string's) output and the levels it takes, leg a's cells for the level-by-level chart, how
 * often each device of leg a turns on, the mean over every device of every leg, and the
 * effective output frequency, the rate at which leg a's output steps: edges per period over 2,
 * times the fundamental frequency (fc for level-shifted carriers, N·fc for N phase-shifted
 * flying-capacitor cells, 2N·fc for a cascaded string of N phase-shifted cells; McGrath and
 * Holmes, IEEE Trans. Ind. Electron., 2002; Holmes and Lipo, 2003, ch. 11).
 * Internal: part of analyseDesign.
 */
export function multilevelFigures(
  modulation: Modulation,
  waveforms: MultilevelWaveforms & { topology: MultilevelTopology },
  fundamentalFrequency: number,
): Omit<MultilevelFigures, 'balance'> {
  const { topology, levels, legs } = waveforms;
  const carriers = modulation.method === 'multilevel-carrier' ? modulation.carriers : null;
  const [legA] = legs;
  const devices = (legA?.switches ?? []).map((device) => {
    const count = turnOns(device.on);
    return {
      name: device.name,
      turnOnsPerPeriod: count,
      switchingFrequency: count * fundamentalFrequency,
    };
  });
  const everyDevice = legs.flatMap((leg) => leg.switches.map((device) => turnOns(device.on)));
  const meanTurnOns =
    everyDevice.reduce((sum, count) => sum + count, 0) / Math.max(1, everyDevice.length);
  return {
    topology,
    topologyLabel: MULTILEVEL_TOPOLOGY_LABELS[topology],
    levels,
    carriers,
    carriersLabel: carriers === null ? null : MULTILEVEL_CARRIER_ARRANGEMENT_LABELS[carriers],
    legs: legs.map((leg) => ({
      name: leg.name,
      levels: distinctLevels(leg.output),
      edgesPerPeriod: leg.output.edges.length,
      waveform: leg.output,
    })),
    cells: (legA?.cells ?? []).map((cell) => ({ name: cell.name, waveform: cell.waveform })),
    devices,
    averageDeviceFrequency: meanTurnOns * fundamentalFrequency,
    effectiveOutputFrequency: ((legA?.output.edges.length ?? 0) / 2) * fundamentalFrequency,
  };
}
