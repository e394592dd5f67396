import { IEEE_519_2022_CURRENT_LIMITS } from './gridCurrentLimits.js';

/**
 * Why a grid current was checked against IEEE Std 519's first row (I_SC/I_L < 20) although its
 * short-circuit ratio is higher: one sentence, or null when the ratio itself picks that row or
 * the generation footnote did not choose it. Table 2's footnote applies the first row to all
 * power generation equipment whatever the actual I_SC/I_L (IEEE Std 519-2022, recalled from
 * memory: the sentence says to confirm it with the standard and the utility).
 *
 * @param row - the row a check applied (`GridCurrentLimitCheck.row`)
 * @param shortCircuitRatio - I_SC/I_L the check was given, > 0
 */
export function generationRowReason(
  row: { label: string; byGenerationRule: boolean },
  shortCircuitRatio: number,
): string | null {
  const first = IEEE_519_2022_CURRENT_LIMITS[0];
  const firstMax = first?.shortCircuitRatio?.max ?? 0;
  if (!row.byGenerationRule || !(shortCircuitRatio >= firstMax)) return null;
  return (
    `The ${row.label} row is used although I_SC/I_L is ${String(Number(shortCircuitRatio.toPrecision(4)))}: ` +
    'the table’s footnote applies it to generating equipment whatever the actual ratio ' +
    '(from memory: confirm with the standard and the utility).'
  );
}
