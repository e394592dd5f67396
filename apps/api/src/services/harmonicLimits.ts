import { harmonics, thd, type Waveform } from '@pulsewright/modulation';
import { callLibrary } from './library.js';

/**
 * Voltage distortion limits of IEEE Std 519-2022, Table 1 (at the point of common coupling),
 * recalled from memory: confirm with the standard itself and the local utility.
 */
const IEEE_519_2022_VOLTAGE_LIMITS = [
  { maxBusVoltage: 1_000, busRange: 'V ≤ 1.0 kV', individual: 0.05, thd: 0.08 },
  { maxBusVoltage: 69_000, busRange: '1 kV < V ≤ 69 kV', individual: 0.03, thd: 0.05 },
  { maxBusVoltage: 161_000, busRange: '69 kV < V ≤ 161 kV', individual: 0.015, thd: 0.025 },
  { maxBusVoltage: Number.POSITIVE_INFINITY, busRange: 'V > 161 kV', individual: 0.01, thd: 0.015 },
] as const;

/** The standard evaluates harmonics up to the 50th. */
const MAX_ORDER = 50;

export const HARMONIC_LIMIT_CAUTION =
  'The limits are IEEE Std 519-2022 Table 1 values recalled from memory, not read from the standard: confirm them with the ' +
  'standard and the local utility. They apply to the voltage at the point of common coupling with the utility, not to an ' +
  "inverter's unfiltered output; this check is idealised (ideal switches, no grid impedance) and is no substitute for " +
  'measurement. Inverter DC buses and outputs are lethal.';

export interface HarmonicLimitResult {
  standard: { name: string; edition: string; table: string; recalledFromMemory: boolean };
  busVoltage: number;
  limits: { individual: number; thd: number; maxOrder: number; busRange: string };
  thd: number;
  worstIndividual: { order: number; ratio: number };
  violations: { order: number | string; ratio: number; limit: number }[];
  pass: boolean;
  caution: string;
}

/** Compares the exact spectrum of `waveform` (orders 2..50, relative to the fundamental) with the limits. */
export function checkHarmonicLimits(waveform: Waveform, busVoltage: number): HarmonicLimitResult {
  const row = IEEE_519_2022_VOLTAGE_LIMITS.find((r) => busVoltage <= r.maxBusVoltage) ?? IEEE_519_2022_VOLTAGE_LIMITS[3];
  const { spectrum, distortion } = callLibrary('', () => {
    const spectrum = harmonics(waveform, MAX_ORDER);
    return { spectrum, distortion: thd(spectrum) };
  });
  const fundamental = spectrum[1]?.amplitude ?? 0;
  const ratios = spectrum.slice(2).map((h) => ({ order: h.order, ratio: fundamental > 0 ? h.amplitude / fundamental : Infinity }));
  const worst = ratios.reduce((a, b) => (b.ratio > a.ratio ? b : a), { order: 2, ratio: 0 });
  const violations: HarmonicLimitResult['violations'] = ratios
    .filter((r) => r.ratio > row.individual)
    .map((r) => ({ ...r, limit: row.individual }));
  if (distortion > row.thd) violations.unshift({ order: 'thd', ratio: distortion, limit: row.thd });
  return {
    standard: { name: 'IEEE Std 519', edition: '2022', table: 'Table 1, voltage distortion limits', recalledFromMemory: true },
    busVoltage,
    limits: { individual: row.individual, thd: row.thd, maxOrder: MAX_ORDER, busRange: row.busRange },
    thd: distortion,
    worstIndividual: worst,
    violations,
    pass: violations.length === 0,
    caution: HARMONIC_LIMIT_CAUTION,
  };
}
