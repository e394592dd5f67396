import {
  type InverterDesign,
  type TimerModulation,
  type TimerTableOptions,
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
 * sampling is kept, and `natural` or `regular-symmetric` give `regular-symmetric`, except for the
 * reduced common-mode methods (`azspwm1`, `nspwm`), whose tables sample every half period: their
 * `natural` designs give `regular-asymmetric` (the library refuses them symmetric sampling).
 * @throws InputError naming the design field a timer table cannot follow (the method, a carrier
 *   phase)
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
    timerModulation = {
      method: 'three-phase',
      ma: modulation.ma,
      ...(zeroSequence === undefined ? {} : { zeroSequence }),
    };
  }
  const halfPeriods =
    modulation.method === 'three-phase' &&
    (modulation.zeroSequence === 'azspwm1' || modulation.zeroSequence === 'nspwm');
  const sampling =
    modulation.sampling === 'regular-asymmetric' || halfPeriods
      ? 'regular-asymmetric'
      : 'regular-symmetric';
  if (modulation.sampling === undefined || modulation.sampling === 'natural') {
    notes.push(
      halfPeriods
        ? "the design's natural sampling becomes regular-asymmetric in the timer table (one compare value and compare sense per half carrier period)"
        : "the design's natural sampling becomes regular-symmetric in the timer table (one compare value per carrier period)",
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
