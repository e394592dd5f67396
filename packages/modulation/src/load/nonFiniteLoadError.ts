import { TAU } from '../math.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { RlLoadOptions } from './RlLoad.js';

/**
 * The error for a load whose valid but extreme values make a result (`bad`, e.g. `rmsCurrent`)
 * non-finite in IEEE 754 double precision (internal to the load folder). It names `r` when
 * (peak source + EMF volts)/r or the power overflows; otherwise, when the time constant
 * 2π·frequency·l/r overflows, the largest of its factors (`l`, `frequency`, or `r` for 1/r);
 * otherwise the input furthest from 1 in orders of magnitude.
 */
export function nonFiniteLoadError(
  waveform: Waveform,
  options: RlLoadOptions,
  bad: string,
): ParameterRangeError {
  const { r, l, frequency } = options;
  const volts =
    waveform.levels.reduce((m, v) => Math.max(m, Math.abs(v)), 0) + (options.emf?.amplitude ?? 0);
  const current = volts / r;
  const why = `(it makes ${bad} non-finite in double precision)`;
  if (!Number.isFinite(current) || !Number.isFinite(current * current * r)) {
    const least = volts === 0 ? Number.MIN_VALUE : volts / Math.sqrt(Number.MAX_VALUE);
    return new ParameterRangeError(
      'r',
      `a finite number ≥ ${least.toPrecision(3)} ohm for peak volts ${volts.toPrecision(3)} ${why}`,
      r,
    );
  }
  const magnitude = (x: number): number => (x > 0 ? Math.abs(Math.log10(x)) : 0);
  if (!Number.isFinite((TAU * frequency * l) / r)) {
    const factors: [string, number, number][] = [
      ['l', l, Math.log10(l)],
      ['frequency', frequency, Math.log10(frequency)],
      ['r', r, -Math.log10(r)],
    ];
    const [field, value] = factors.reduce((a, b) => (b[2] > a[2] ? b : a));
    return new ParameterRangeError(
      field,
      `a finite number for which the time constant 2π·frequency·l/r stays below 1.8e308 ${why}`,
      value,
    );
  }
  const candidates: [string, number][] = [
    ['r', r],
    ['l', l],
    ['frequency', frequency],
    ['emf.amplitude', options.emf?.amplitude ?? 1],
  ];
  const [field, value] = candidates.reduce((a, b) => (magnitude(b[1]) > magnitude(a[1]) ? b : a));
  return new ParameterRangeError(field, `a less extreme finite number ${why}`, value);
}
