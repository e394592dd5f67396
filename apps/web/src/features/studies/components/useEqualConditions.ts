import {
  equalConditions,
  type EqualCondition,
  type EqualConditionResult,
} from '@pulsewright/modulation';
import { useQueries } from '@tanstack/react-query';
import { designReportQueryOptions } from '../../../lib/api';
import type { ComparedRow } from './useComparedStudies';

/** A compared study at the chosen condition: its report is that of the design at the condition. */
export interface ConditionedRow extends ComparedRow {
  /** Carrier frequency at the condition, hertz; null for a stored pattern. */
  carrierFrequency: number | null;
  /** The new carrier over the one designed (1 when left as designed). */
  factor: number;
  /** Why the carrier was left as designed, in the library's words; null otherwise. */
  note: string | null;
}

/**
 * The compared studies at one condition (equal carrier, equal average device switching frequency
 * or equal switching loss): the library's `equalConditions` scales each carrier from the figures
 * of the study's own report, matched to the first study picked; the service then reports each
 * adjusted design (POST /designs/report, as few chart samples as Compare needs).
 */
export function useEqualConditions(rows: readonly ComparedRow[], condition: EqualCondition) {
  let result: EqualConditionResult | null = null;
  let refusal: string | null = null;
  if (rows.length > 0) {
    const candidates = rows.map((row) => ({ design: row.study.design, report: row.report }));
    try {
      result = equalConditions(candidates, { condition });
    } catch (error) {
      // Refused (the first study lacks the figure): the message on the choice, the table as designed.
      refusal = error instanceof Error ? error.message : String(error);
      result = equalConditions(candidates, { condition: 'equal-carrier' });
    }
  }
  const candidates = result?.candidates ?? [];
  const reports = useQueries({
    queries: candidates.map((c) => ({
      ...designReportQueryOptions({ design: c.design, points: 64 }),
      enabled: c.factor !== 1,
    })),
  });
  const adjusting = reports.filter((_, i) => candidates[i]?.factor !== 1);
  const pending = adjusting.some((q) => q.isPending);
  const failed = adjusting.find((q) => q.isError);
  const conditioned: ConditionedRow[] = rows.flatMap((row, i) => {
    const candidate = candidates[i];
    if (!candidate) return [];
    const report = candidate.factor === 1 ? row.report : reports[i]?.data;
    return report
      ? [
          {
            ...row,
            report,
            carrierFrequency: candidate.carrierFrequency,
            factor: candidate.factor,
            note: candidate.note,
          },
        ]
      : [];
  });
  return { rows: conditioned, refusal, pending, failed };
}
