import { TAU } from '../math.js';
import { compareSenses } from './compareSenses.js';
import { complementaryCompares } from './complementaryCompares.js';
import { dutyFromReference } from './dutyFromReference.js';
import { legReferences } from './legReferences.js';
import { senseCompares } from './senseCompares.js';
import type { TimerTableInputs } from './timerTableInputs.js';
import type { TimerTiming } from './timerTableTiming.js';
import type { TimerChannel, TimerModulation } from './timerTableTypes.js';

/** How far past ±1 a reference may round and still be a clamp at the rail, not overmodulation. */
const RAIL_TOLERANCE = 1e-12;

const CHANNEL_NAMES = ['a', 'b', 'c'];

/** The table's rows and what the warnings need to know about them. */
export interface TimerChannels {
  /** θᵢ = (i + ½)·2π/tableLength (rad), the centre of the interval entry i governs. */
  entryAngles: number[];
  channels: TimerChannel[];
  /** References beyond ±1 (overmodulation), clamped to 0 or 100 % duty. */
  overmodulated: number;
  /** Largest |compare − duty·full| (counts). */
  maxRoundingCounts: number;
  /** Whether 100 % duty did not fit the register and was clamped to 2^counterBits − 1. */
  clampedToRegister: boolean;
}

/**
 * Internal to timerTable: per channel (inverter leg) the duty (1 + r)/2 of each entry's leg
 * reference, its compare sense ({@link compareSenses}), its compare value ({@link senseCompares}:
 * round(duty·full), or from the rounded counter threshold for an 'above' entry), and
 * the high- and low-side compare values as the registers take them, with the dead time offset
 * when the method is 'compare-offset'.
 */
export function timerTableChannels(inputs: TimerTableInputs, timing: TimerTiming): TimerChannels {
  const { tableLength, modulation, deadTimeMethod } = inputs;
  const full = timing.fullScaleCounts;
  const entryAngles = Array.from(
    { length: tableLength },
    (_, i) => ((i + 0.5) * TAU) / tableLength,
  );
  const references = entryAngles.map((theta) => legReferences(theta, modulation));
  const channelCount = (references[0] as number[]).length;
  const senses = compareSenses(inputs, channelCount);
  let overmodulated = 0;
  let maxRoundingCounts = 0;
  const duties = Array.from({ length: channelCount }, (_, k) =>
    references.map((r) => {
      const value = r[k] as number;
      // A clamped reference is s + (1 − s), an ulp either side of the rail: not overmodulation.
      if (value > 1 + RAIL_TOLERANCE || value < -1 - RAIL_TOLERANCE) overmodulated++;
      return dutyFromReference(value);
    }),
  );
  const compares = senseCompares(duties, senses, full);
  const channels: TimerChannel[] = [];
  for (let k = 0; k < channelCount; k++) {
    const duty = duties[k] as number[];
    const sense = senses[k] as TimerChannel['sense'];
    const compare = compares[k] as number[];
    duty.forEach((d, i) => {
      maxRoundingCounts = Math.max(maxRoundingCounts, Math.abs((compare[i] as number) - d * full));
    });
    const { highSide, lowSide } = complementaryCompares(
      compare,
      full,
      deadTimeMethod === 'compare-offset' ? timing.deadTimeCounts : 0,
      sense,
    );
    channels.push({
      name: CHANNEL_NAMES[k] as string,
      description: describeChannel(modulation, k),
      duty,
      compare,
      sense,
      highSide,
      lowSide,
    });
  }
  const clampedToRegister = clampToRegister(channels, inputs, full);
  return { entryAngles, channels, overmodulated, maxRoundingCounts, clampedToRegister };
}

/** Edge-aligned 100 % duty needs compare TOP + 1, which may not fit the register: clamp it. */
function clampToRegister(
  channels: TimerChannel[],
  inputs: TimerTableInputs,
  full: number,
): boolean {
  const largest = 2 ** inputs.counterBits - 1;
  if (
    inputs.countingMode !== 'edge-aligned' ||
    full <= largest ||
    !channels.some((c) => c.compare.includes(full))
  )
    return false;
  for (const c of channels)
    for (const list of [c.compare, c.highSide, c.lowSide])
      list.forEach((v, i) => {
        if (v > largest) list[i] = largest;
      });
  return true;
}

function describeChannel(modulation: TimerModulation, k: number): string {
  if (modulation.method === 'three-phase')
    return `leg ${'abc'[k]} (phase ${'abc'[k]}, reference at −${2 * k}π/3)`;
  if (modulation.scheme === 'bipolar') {
    return "leg A; drive leg B high side from this channel's low-side output and leg B low side from its high-side output (diagonal pairs switch together)";
  }
  return k === 0 ? 'leg A, reference +ma·sin θ' : 'leg B, reference −ma·sin θ';
}
