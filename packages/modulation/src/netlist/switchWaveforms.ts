import { timerTableWaveforms } from '../firmware/timerTableWaveforms.js';
import type { TimerTable } from '../firmware/timerTableTypes.js';
import type { Waveform } from '../waveform/Waveform.js';

/** One signal of the bridge over a fundamental period: angles in radians of the realised period. */
export interface NamedWaveform {
  /** A SPICE-safe name: `gate_a_high`, `leg_b`, … */
  name: string;
  /** In words, for the netlist's comments. */
  description: string;
  waveform: Waveform;
}

/** The gate signals of every switch and the leg voltages a timer table produces. */
export interface SwitchWaveforms {
  /** Each switch's gate: 1 while it is on, 0 while off (dead time included). */
  gates: NamedWaveform[];
  /** Each leg's voltage to the DC midpoint, ±vdc/2 (during dead time the diode's rail). */
  legs: NamedWaveform[];
}

/** A waveform's levels mapped through `level` (the edges kept). */
const mapLevels = (waveform: Waveform, level: (value: number) => number): Waveform => ({
  edges: [...waveform.edges],
  levels: waveform.levels.map(level),
});

/**
 * The gate signals and leg voltages of a timer table, read from the library's
 * `timerTableWaveforms` (its timer conventions, dead time and diode model; no second model here).
 *
 * The library gives leg voltages only. Its dead-time model sets a leg, while neither switch is
 * on, to the negative rail when the current flows out of the leg and to the positive rail when
 * it flows in; so with the current forced out of every leg (`currentSign` > 0) a leg is at +vdc/2
 * exactly while its high-side switch is on, and with it forced in, at −vdc/2 exactly while its
 * low-side switch is on. Those two readings are the gate signals. The leg voltages themselves are
 * read with the load current's phase `currentAngle` (radians, as timerTableWaveforms takes it)
 * and, when given, the devices' on-state drops (`onStateDrop`, volts, its threshold model).
 *
 * A bipolar H-bridge has one timer channel: leg B's switches are driven crosswise from leg A's
 * (B high with A low, B low with A high), so its gates are A's swapped and vB = −vA (the
 * library's own statement for its vAB; with drops too, since B carries −i and conducts the
 * device of the same kind as A at every instant).
 */
export function switchWaveforms(
  table: TimerTable,
  currentAngle = 0,
  onStateDrop?: { transistor: number; diode: number },
): SwitchWaveforms {
  const out = timerTableWaveforms(table, { currentSign: () => 1 }).legs;
  const into = timerTableWaveforms(table, { currentSign: () => -1 }).legs;
  const legs = timerTableWaveforms(table, {
    currentAngle,
    ...(onStateDrop === undefined ? {} : { onStateDrop }),
  }).legs;
  const gates: NamedWaveform[] = [];
  const legList: NamedWaveform[] = [];
  table.channels.forEach((channel, k) => {
    const high = mapLevels(out[k] as Waveform, (v) => (v > 0 ? 1 : 0));
    const low = mapLevels(into[k] as Waveform, (v) => (v < 0 ? 1 : 0));
    gates.push(
      {
        name: `gate_${channel.name}_high`,
        description: `high-side switch of leg ${channel.name}`,
        waveform: high,
      },
      {
        name: `gate_${channel.name}_low`,
        description: `low-side switch of leg ${channel.name}`,
        waveform: low,
      },
    );
    legList.push({
      name: `leg_${channel.name}`,
      description: `leg ${channel.name} to the DC midpoint (${channel.description})`,
      waveform: legs[k] as Waveform,
    });
  });
  const { modulation } = table.parameters;
  if (modulation.method === 'sine-triangle' && modulation.scheme === 'bipolar') {
    const [high, low] = gates as [NamedWaveform, NamedWaveform];
    const legA = legList[0] as NamedWaveform;
    gates.push(
      {
        name: 'gate_b_high',
        description: "high-side switch of leg b (driven with leg a's low side)",
        waveform: low.waveform,
      },
      {
        name: 'gate_b_low',
        description: "low-side switch of leg b (driven with leg a's high side)",
        waveform: high.waveform,
      },
    );
    legList.push({
      name: 'leg_b',
      description: 'leg b to the DC midpoint (the complement of leg a: vB = −vA)',
      waveform: mapLevels(legA.waveform, (v) => -v),
    });
  }
  return { gates, legs: legList };
}
