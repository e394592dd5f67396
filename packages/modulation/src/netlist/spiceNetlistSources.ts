import type { TimerTable } from '../firmware/timerTableTypes.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { PwlSource, SpiceNetlistOptions, SpiceNetlistSources } from './netlistTypes.js';
import { pwlPoints } from './pwlPoints.js';
import { switchWaveforms } from './switchWaveforms.js';

/**
 * Most (time, value) points a netlist may hold, over all its sources: it keeps the text to tens
 * of megabytes at most (about 25 bytes a point).
 */
export const MAX_NETLIST_POINTS = 2_000_000;

/**
 * The piecewise-linear sources of a timer table's switching pattern: one per switch's gate
 * (0 V off, `gateVoltage` on, the table's dead time between the two gates of a leg) and one per
 * leg's voltage to the DC midpoint (±vdc/2, the freewheeling diode's rail during dead time with
 * the load current `currentAngle` behind sin θ, less the devices' `onStateDrop` when given), over `periods` realised fundamental periods from
 * t = 0. Each edge at angle θ of the library's `timerTableWaveforms` becomes a ramp that starts
 * at t = θ/2π·period (seconds) and reaches the new level `riseTime` or `fallTime` later.
 *
 * @throws ParameterRangeError naming `riseTime`, `fallTime`, `periods`, `gateVoltage` or
 *   `currentAngle`, `onStateDrop.transistor`, `onStateDrop.diode` when out of range, when a ramp would reach the signal's next edge, or when
 *   the sources would hold more than {@link MAX_NETLIST_POINTS} points
 */
export function spiceNetlistSources(
  table: TimerTable,
  options: SpiceNetlistOptions = {},
): SpiceNetlistSources {
  const { riseTime = 1e-7, periods = 1, gateVoltage = 1, currentAngle = 0, onStateDrop } = options;
  const fallTime = options.fallTime ?? riseTime;
  const period = 1 / table.realisedFundamentalFrequency;
  assertNumberInRange('riseTime', riseTime, { min: 0, minExclusive: true, max: period });
  assertNumberInRange('fallTime', fallTime, { min: 0, minExclusive: true, max: period });
  assertNumberInRange('periods', periods, { min: 1, max: 1000, integer: true });
  assertNumberInRange('gateVoltage', gateVoltage, { min: 0, minExclusive: true, max: 1000 });
  assertNumberInRange('currentAngle', currentAngle, { min: -2 * Math.PI, max: 2 * Math.PI });
  const { gates, legs } = switchWaveforms(table, currentAngle, onStateDrop);
  const edges = [...gates, ...legs].reduce((sum, s) => sum + s.waveform.edges.length, 0);
  // Each edge is two points (the ramp's start and end).
  if (2 * edges * periods > MAX_NETLIST_POINTS) {
    const most = Math.max(1, Math.floor(MAX_NETLIST_POINTS / (2 * edges)));
    throw new ParameterRangeError(
      'periods',
      `an integer from 1 to ${most} for this table (${edges} edges a period, at most ${MAX_NETLIST_POINTS} points)`,
      periods,
    );
  }
  const ramps = { period, periods, riseTime, fallTime };
  const source = (name: string, description: string, points: [number, number][]): PwlSource => ({
    name: `V${name}`,
    nodes: [name, '0'],
    description,
    points,
  });
  const sources = [
    ...gates.map((g) =>
      source(
        g.name,
        g.description,
        pwlPoints(
          { edges: g.waveform.edges, levels: g.waveform.levels.map((v) => v * gateVoltage) },
          ramps,
        ),
      ),
    ),
    ...legs.map((l) => source(l.name, l.description, pwlPoints(l.waveform, ramps))),
  ];
  return {
    table,
    period,
    periods,
    riseTime,
    fallTime,
    gateVoltage,
    currentAngle,
    onStateDrop: onStateDrop ?? null,
    sources,
  };
}
