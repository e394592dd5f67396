import type { Harmonic } from '../spectrum/Harmonic.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import {
  HARMONIC_LIMIT_CAUTION,
  IEEE_519_2022_VOLTAGE,
  IEEE_519_2022_VOLTAGE_LIMITS,
  type LimitStandard,
  type VoltageLimitRow,
} from './voltageHarmonicLimits.js';
import { amplitudesByOrder } from './amplitudesByOrder.js';

/** A figure over its limit. `order` is a harmonic order, or `'thd'` (to the table's order) or `'thd-whole-waveform'`. */
export interface LimitViolation {
  order: number | 'thd' | 'thd-whole-waveform';
  ratio: number;
  limit: number;
}

/** The outcome of {@link checkVoltageHarmonicLimits}; plain data. */
export interface HarmonicLimitCheck {
  standard: LimitStandard;
  /** Bus voltage used to pick the row, volts rms line to line. */
  busVoltage: number;
  limits: { individual: number; thd: number; maxOrder: number; busRange: string };
  /** Each order 2..maxOrder as a ratio of the fundamental, with its limit. */
  table: { order: number; ratio: number; limit: number; pass: boolean }[];
  /** THD over orders 2..maxOrder (the table's definition), ratio. */
  thd: number;
  /** THD over the whole waveform, every order (exact, or an upper bound where a filter is analysed). */
  thdWholeWaveform: number;
  /** Distortion of the orders above the table, √(THD_whole² − THD_table²), ratio. */
  thdAboveTable: number;
  worstIndividual: { order: number; ratio: number };
  violations: LimitViolation[];
  /** True when every individual order, the table's THD and the whole-waveform THD are within the limits. */
  pass: boolean;
  /** Set when the content above the table's last order is large (above the THD limit on its own). */
  note: string | null;
  caution: string;
}

/** Options of {@link checkVoltageHarmonicLimits}. */
export interface HarmonicLimitOptions {
  /** Nominal bus voltage at the point of common coupling, volts rms line to line, > 0; picks the row. */
  busVoltage: number;
  /** THD over the whole waveform, ratio ≥ 0 (from `waveformThd`, or a bound). */
  thdWholeWaveform: number;
}

/**
 * Checks a voltage at the point of common coupling against IEEE Std 519-2022 Table 1 (recalled
 * from memory: the caution says so). The table's figures are evaluated to order 50 as the
 * standard does; the distortion above order 50 is real too, so the whole-waveform THD must also
 * be within the THD limit for a pass, and a note says when the content above order 50 alone
 * exceeds it (an unfiltered PWM voltage at a high frequency ratio would otherwise pass).
 *
 * @param spectrum - harmonics in the `harmonics` convention, orders 0..50 at least (peak volts)
 * @throws ParameterRangeError when the spectrum stops before order 50 or its fundamental is zero
 */
export function checkVoltageHarmonicLimits(
  spectrum: readonly Harmonic[],
  options: HarmonicLimitOptions,
): HarmonicLimitCheck {
  const { busVoltage, thdWholeWaveform } = options;
  assertNumberInRange('busVoltage', busVoltage, { min: 0, minExclusive: true });
  assertNumberInRange('thdWholeWaveform', thdWholeWaveform, { min: 0 });
  const standard = IEEE_519_2022_VOLTAGE;
  const row = IEEE_519_2022_VOLTAGE_LIMITS.find(
    (r) => busVoltage <= r.maxBusVoltage,
  ) as VoltageLimitRow;
  const byOrder = amplitudesByOrder(spectrum, standard.maxOrder);
  const fundamental = byOrder[1] ?? 0;
  if (!(fundamental > 0))
    throw new ParameterRangeError(
      'spectrum',
      'a spectrum whose fundamental has an amplitude > 0',
      fundamental,
    );
  if (byOrder[standard.maxOrder] === undefined) {
    throw new ParameterRangeError(
      'spectrum',
      `a spectrum holding orders up to ${standard.maxOrder}`,
      spectrum.length,
    );
  }
  const table = [];
  let sumOfSquares = 0;
  for (let order = 2; order <= standard.maxOrder; order++) {
    const ratio = (byOrder[order] ?? 0) / fundamental;
    sumOfSquares += ratio * ratio;
    table.push({ order, ratio, limit: row.individual, pass: ratio <= row.individual });
  }
  const thd = Math.sqrt(sumOfSquares);
  const thdAboveTable = Math.sqrt(Math.max(0, thdWholeWaveform * thdWholeWaveform - sumOfSquares));
  const worst = table.reduce((a, b) => (b.ratio > a.ratio ? b : a));
  const violations: LimitViolation[] = [];
  if (thdWholeWaveform > row.thd)
    violations.push({ order: 'thd-whole-waveform', ratio: thdWholeWaveform, limit: row.thd });
  if (thd > row.thd) violations.push({ order: 'thd', ratio: thd, limit: row.thd });
  for (const entry of table)
    if (!entry.pass)
      violations.push({ order: entry.order, ratio: entry.ratio, limit: entry.limit });
  const note =
    thdAboveTable > row.thd
      ? `The harmonics above order ${standard.maxOrder} alone amount to ${(100 * thdAboveTable).toFixed(2)} % of the fundamental, ` +
        `more than the ${(100 * row.thd).toFixed(1)} % THD limit: the table's orders do not show it, the voltage carries it.`
      : null;
  return {
    standard,
    busVoltage,
    limits: {
      individual: row.individual,
      thd: row.thd,
      maxOrder: standard.maxOrder,
      busRange: row.busRange,
    },
    table,
    thd,
    thdWholeWaveform,
    thdAboveTable,
    worstIndividual: { order: worst.order, ratio: worst.ratio },
    violations,
    pass: violations.length === 0,
    note,
    caution: HARMONIC_LIMIT_CAUTION,
  };
}
