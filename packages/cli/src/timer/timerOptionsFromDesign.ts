import {
  TIMER_ZERO_SEQUENCES,
  type InverterDesign,
  type TimerModulation,
  type TimerTableOptions,
  type TimerZeroSequence,
} from '@pulsewright/modulation';
import { InputError } from '../errors.js';

/** The timer-table fields a design supplies (the rest are the timer's: clock, counting mode, dead time, …). */
export type DesignTimerFields = Pick<
  TimerTableOptions,
  'modulation' | 'fundamentalFrequency' | 'carrierFrequency' | 'vdc' | 'sampling'
>;

/**
 * The fields of a timer table that a checked {@link InverterDesign} supplies: its modulation as
 * a regular-sampled sine reference (`sine-triangle` with its scheme, or `three-phase` with its
 * zero sequence), its fundamental and carrier frequencies and its DC bus. A timer table is
 * regular-sampled by nature (one compare value per update): a design's `regular-asymmetric`
 * sampling is kept, and `natural` or `regular-symmetric` give `regular-symmetric`.
 * @throws InputError naming the design field a timer table cannot follow (the method, a carrier
 *   phase, a zero sequence the table does not offer)
 */
export function timerOptionsFromDesign(design: InverterDesign): {
  fields: DesignTimerFields;
  notes: string[];
} {
  const { modulation } = design;
  const notes: string[] = [];
  if (modulation.method !== 'sine-triangle' && modulation.method !== 'three-phase') {
    throw new InputError(
      'design.modulation.method',
      `design.modulation.method must be 'sine-triangle' or 'three-phase' for a timer table (a regular-sampled sine reference); got ${JSON.stringify(modulation.method)}`,
    );
  }
  if (modulation.carrierPhase !== undefined && modulation.carrierPhase !== 0) {
    throw new InputError(
      'design.modulation.carrierPhase',
      `design.modulation.carrierPhase must be 0 or left out for a timer table (the table's carrier starts at the counter's own phase); got ${modulation.carrierPhase}`,
    );
  }
  let timerModulation: TimerModulation;
  if (modulation.method === 'sine-triangle') {
    timerModulation = { method: 'sine-triangle', scheme: modulation.scheme, ma: modulation.ma };
  } else {
    const zeroSequence = modulation.zeroSequence;
    if (zeroSequence !== undefined && !isTimerZeroSequence(zeroSequence)) {
      throw new InputError(
        'design.modulation.zeroSequence',
        `design.modulation.zeroSequence must be one of ${TIMER_ZERO_SEQUENCES.map((z) => `'${z}'`).join(', ')} for a timer table; got ${JSON.stringify(zeroSequence)}`,
      );
    }
    timerModulation = {
      method: 'three-phase',
      ma: modulation.ma,
      ...(zeroSequence === undefined ? {} : { zeroSequence }),
    };
  }
  const sampling =
    modulation.sampling === 'regular-asymmetric' ? 'regular-asymmetric' : 'regular-symmetric';
  if (modulation.sampling === undefined || modulation.sampling === 'natural') {
    notes.push(
      "the design's natural sampling becomes regular-symmetric in the timer table (one compare value per carrier period)",
    );
  }
  return {
    fields: {
      modulation: timerModulation,
      fundamentalFrequency: design.fundamentalFrequency,
      carrierFrequency: design.carrierFrequency as number,
      vdc: design.vdc,
      sampling,
    },
    notes,
  };
}

function isTimerZeroSequence(zeroSequence: string): zeroSequence is TimerZeroSequence {
  return (TIMER_ZERO_SEQUENCES as readonly string[]).includes(zeroSequence);
}
