import type { LimitStandard } from './voltageHarmonicLimits.js';

/**
 * One row of a current-distortion limit table: the largest individual harmonic current by
 * order band, and the largest total, each as a ratio of the reference current (IEEE Std 519:
 * the maximum demand load current I_L; IEEE Std 1547: the rated current).
 */
export interface CurrentLimitRow {
  /** The row's range of the short-circuit ratio I_SC/I_L, lower end inclusive, upper exclusive; null for a table with one row. */
  shortCircuitRatio: { min: number; max: number } | null;
  /** The row in words, as the table heads it. */
  label: string;
  /** Odd orders: limit of each order in [minOrder, maxOrder], ratio of the reference current. */
  oddBands: readonly { minOrder: number; maxOrder: number; limit: number }[];
  /** Total demand (519) or total rated-current (1547) distortion limit, ratio. */
  total: number;
}

/** IEEE Std 519-2022, Table 2 (current distortion, systems rated 120 V through 69 kV). */
export const IEEE_519_2022_CURRENT: LimitStandard = {
  name: 'IEEE Std 519',
  edition: '2022',
  table: 'Table 2, current distortion limits for systems rated 120 V through 69 kV',
  recalledFromMemory: true,
  maxOrder: 50,
};

/** IEEE Std 1547-2018, Tables 26 and 27 (harmonic current distortion of a distributed energy resource). */
export const IEEE_1547_2018_CURRENT: LimitStandard = {
  name: 'IEEE Std 1547',
  edition: '2018',
  table:
    'Tables 26 (odd) and 27 (even), maximum harmonic current distortion in percent of rated current',
  recalledFromMemory: true,
  maxOrder: 50,
};

const bands = (
  limits: readonly [number, number, number, number, number],
): CurrentLimitRow['oddBands'] => [
  { minOrder: 3, maxOrder: 10, limit: limits[0] },
  { minOrder: 11, maxOrder: 16, limit: limits[1] },
  { minOrder: 17, maxOrder: 22, limit: limits[2] },
  { minOrder: 23, maxOrder: 34, limit: limits[3] },
  { minOrder: 35, maxOrder: 50, limit: limits[4] },
];

/**
 * IEEE Std 519-2022 Table 2, recalled from memory (confirm with the standard and the utility):
 * odd-order limits in percent of I_L by band 3 ≤ h < 11, 11 ≤ h < 17, 17 ≤ h < 23, 23 ≤ h < 35,
 * 35 ≤ h ≤ 50, and the TDD limit, by I_SC/I_L. Even orders are limited to 25 % of the odd
 * limit of their band (a footnote of the table, from memory). The table heads its rows < 20,
 * 20 < 50, 50 < 100, 100 < 1000, > 1000; a ratio exactly on a boundary is put in the upper row
 * here (the table does not say). A footnote (from memory) holds all power-generation equipment
 * to the first row whatever its actual I_SC/I_L: {@link checkGridCurrentLimits} applies it.
 */
export const IEEE_519_2022_CURRENT_LIMITS: readonly CurrentLimitRow[] = [
  {
    shortCircuitRatio: { min: 0, max: 20 },
    label: 'I_SC/I_L < 20',
    oddBands: bands([0.04, 0.02, 0.015, 0.006, 0.003]),
    total: 0.05,
  },
  {
    shortCircuitRatio: { min: 20, max: 50 },
    label: '20 < I_SC/I_L < 50',
    oddBands: bands([0.07, 0.035, 0.025, 0.01, 0.005]),
    total: 0.08,
  },
  {
    shortCircuitRatio: { min: 50, max: 100 },
    label: '50 < I_SC/I_L < 100',
    oddBands: bands([0.1, 0.045, 0.04, 0.015, 0.007]),
    total: 0.12,
  },
  {
    shortCircuitRatio: { min: 100, max: 1000 },
    label: '100 < I_SC/I_L < 1000',
    oddBands: bands([0.12, 0.055, 0.05, 0.02, 0.01]),
    total: 0.15,
  },
  {
    shortCircuitRatio: { min: 1000, max: Number.POSITIVE_INFINITY },
    label: 'I_SC/I_L > 1000',
    oddBands: bands([0.15, 0.07, 0.06, 0.025, 0.014]),
    total: 0.2,
  },
];

/**
 * IEEE Std 1547-2018 Table 26, recalled from memory (confirm with the standard and the utility):
 * odd orders in percent of rated current by band h < 11, 11 ≤ h < 17, 17 ≤ h < 23, 23 ≤ h < 35,
 * 35 ≤ h < 50, and the total rated-current distortion (TRD) limit 5 %. Even orders follow
 * {@link IEEE_1547_2018_EVEN_LIMITS}.
 */
export const IEEE_1547_2018_CURRENT_LIMITS: CurrentLimitRow = {
  shortCircuitRatio: null,
  label: 'any short-circuit ratio',
  oddBands: bands([0.04, 0.02, 0.015, 0.006, 0.003]),
  total: 0.05,
};

/**
 * IEEE Std 1547-2018 Table 27, recalled from memory: order 2 at 1 %, 4 at 2 %, 6 at 3 % of rated
 * current; even orders 8 ≤ h < 50 at the odd limit of their band (Table 26).
 */
export const IEEE_1547_2018_EVEN_LIMITS: Readonly<Record<number, number>> = {
  2: 0.01,
  4: 0.02,
  6: 0.03,
};

/** The caution shown with every current limit check. */
export const GRID_CURRENT_LIMIT_CAUTION =
  'The current limits are IEEE Std 519-2022 Table 2 and IEEE Std 1547-2018 Tables 26–27 values recalled from memory, not ' +
  'read from the standards: confirm them with the standards and the utility before relying on them. The grid current is ' +
  'predicted for ideal switches, a linear filter and a sinusoidal grid behind the stated impedance; background grid ' +
  'distortion, the controller and measurement are not modelled. Grid-connected inverters need the protection and ' +
  'certification that apply where they are installed; their DC buses and outputs are lethal.';
