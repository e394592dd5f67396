import { assertWaveform } from '../../waveform/assertWaveform.js';
import { ParameterRangeError, ParameterTypeError } from '../../validation/errors.js';
import type { MultilevelWaveforms } from '../MultilevelTypes.js';

/**
 * Internal: asserts a {@link MultilevelWaveforms} as the balance and loss figures read it:
 * `phaseCount` 1 or 3; `legs` three for a three-phase bridge, one or two for a single-phase one;
 * every leg's `output`, every switch's `on` and every cell's `waveform` a valid Waveform.
 * @throws ParameterTypeError / ParameterRangeError naming the field as `waveforms.legs[1].output…`
 */
export function assertMultilevelWaveforms(value: unknown): asserts value is MultilevelWaveforms {
  if (typeof value !== 'object' || value === null) {
    throw new ParameterTypeError('waveforms', 'an object { phaseCount, levels, legs }', value);
  }
  const { phaseCount, legs } = value as Partial<MultilevelWaveforms>;
  if (phaseCount !== 1 && phaseCount !== 3) {
    throw new ParameterRangeError('waveforms.phaseCount', '1 or 3', phaseCount);
  }
  if (!Array.isArray(legs)) throw new ParameterTypeError('waveforms.legs', 'an array', legs);
  const allowed = phaseCount === 3 ? [3] : [1, 2];
  if (!allowed.includes(legs.length)) {
    throw new ParameterRangeError(
      'waveforms.legs.length',
      phaseCount === 3 ? '3 for a three-phase bridge' : '1 or 2 for a single-phase bridge',
      legs.length,
    );
  }
  legs.forEach((leg: unknown, k) => {
    const field = `waveforms.legs[${k}]`;
    if (typeof leg !== 'object' || leg === null) {
      throw new ParameterTypeError(field, 'an object { name, output, switches, cells }', leg);
    }
    const { output, switches, cells } = leg as Partial<MultilevelWaveforms['legs'][number]>;
    assertWaveform(output, `${field}.output`);
    if (!Array.isArray(switches)) {
      throw new ParameterTypeError(`${field}.switches`, 'an array', switches);
    }
    switches.forEach((s: unknown, j) => {
      assertWaveform((s as { on?: unknown } | null)?.on, `${field}.switches[${j}].on`);
    });
    if (!Array.isArray(cells)) throw new ParameterTypeError(`${field}.cells`, 'an array', cells);
    cells.forEach((c: unknown, j) => {
      assertWaveform(
        (c as { waveform?: unknown } | null)?.waveform,
        `${field}.cells[${j}].waveform`,
      );
    });
  });
}
