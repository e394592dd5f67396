import { bestRationalApproximation } from '../numeric/bestRationalApproximation.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { MAX_DESIGN_FREQUENCY_RATIO, MAX_DESIGN_FUNDAMENTAL_PERIODS } from './designBounds.js';
import { ASYNCHRONOUS_METHODS } from './designCarrierSpan.js';
import { designSpanMaxOrder } from './designSpanMaxOrder.js';
import type { DesignReport } from './DesignReport.js';
import type { InverterDesign } from './InverterDesign.js';

/**
 * What candidate designs are compared at:
 * - `equal-carrier`: each at its own carrier frequency (as designed);
 * - `equal-device-frequency`: each carrier scaled so that the report's average device switching
 *   frequency (`switching.averageDeviceFrequency`) equals the reference's; a discontinuous
 *   method, whose legs rest for 120° a period, then runs its carrier 1.5× faster (A. M. Hava,
 *   R. J. Kerkman, T. A. Lipo, IEEE Trans. Power Electronics, 1999, from memory);
 * - `equal-switching-loss`: each carrier scaled so that the report's switching loss
 *   (`losses.switching`, which needs the design's device) equals the reference's.
 */
export type EqualCondition = 'equal-carrier' | 'equal-device-frequency' | 'equal-switching-loss';

/** The conditions, in the order the dashboard lists them. */
export const EQUAL_CONDITIONS: readonly EqualCondition[] = [
  'equal-carrier',
  'equal-device-frequency',
  'equal-switching-loss',
];

/** A label a person reads for each condition. */
export const EQUAL_CONDITION_LABELS: Readonly<Record<EqualCondition, string>> = {
  'equal-carrier': 'Equal carrier frequency',
  'equal-device-frequency': 'Equal average device switching frequency',
  'equal-switching-loss': 'Equal switching loss',
};

/** One design to compare, with the figures of its own report that the conditions read. */
export interface EqualConditionCandidate {
  design: InverterDesign;
  /** `analyseDesign(design)`'s `switching` and `losses` (the whole report will do). */
  report: Pick<DesignReport, 'switching' | 'losses'>;
}

/** Options of {@link equalConditions}. */
export interface EqualConditionOptions {
  condition: EqualCondition;
  /** Index of the candidate the others are matched to. @default 0 */
  reference?: number;
}

/** One candidate at the condition. */
export interface EqualConditionCandidateResult {
  /** The design at the condition: its carrier frequency scaled, the rest as given. */
  design: InverterDesign;
  /** Carrier frequency at the condition, hertz; null for a stored pattern (no carrier). */
  carrierFrequency: number | null;
  /** The factor the condition asks of the carrier (the figure's ratio), before rounding; null when not adjusted. */
  wantedFactor: number | null;
  /**
   * The factor applied: the new carrier over the given one (1 when not adjusted). Where the
   * report spans a carrier that is no whole multiple of the fundamental, the wanted factor to
   * within the nearest fraction mf = p/q the span's cost allows (under 1/q of an mf step); for a
   * multilevel design or one with a filter or grid, after rounding to a whole mf.
   */
  factor: number;
  /** Why the carrier was left as given (no carrier, no figure, mf out of range); null when adjusted or at equal carrier. */
  note: string | null;
}

/** Result of {@link equalConditions}; plain serialisable data. */
export interface EqualConditionResult {
  condition: EqualCondition;
  reference: number;
  /** The reference's figure every candidate is matched to: hertz (device frequency) or watts (switching loss); null at equal carrier. */
  target: number | null;
  candidates: EqualConditionCandidateResult[];
}

/**
 * Puts candidate designs at one condition for a fair comparison: each candidate's carrier
 * frequency is multiplied by the reference's figure over its own (average device switching
 * frequency, or switching loss), its ratio mf to the fundamental kept within 1 to
 * {@link MAX_DESIGN_FREQUENCY_RATIO}. A sine-triangle, three-phase carrier or space-vector design
 * without a filter or grid keeps the scaled carrier as asked: its report spans a ratio p/q over q
 * fundamental periods (`designCarrierSpan`), so mf is set to the fraction nearest the scaled
 * ratio (continued fractions, `bestRationalApproximation`) with the largest q ≤ 64 whose span the
 * report can afford (`designSpanMaxOrder`'s bound, p·q ≤ 4·10⁵; q = 1 always can), so the
 * carrier differs from the one asked for by less than 1/N of an mf step, N the largest q allowed
 * (the fractions of denominator ≤ N either side of a ratio are 1/(b·d) apart with b + d > N;
 * Farey sequences, a fact of number theory), under 0.03 of a step at mf 150. A multilevel
 * design, or one with a filter or grid, whose report needs a whole mf, is rounded to one, so its
 * `factor` may differ from `wantedFactor` by up to half an mf step.
 *
 * Both figures are proportional to the carrier frequency in the model, which is why one scaling
 * suffices: each leg's edges per period grow with mf for a given waveform shape (the device
 * frequency is edges/2 × f₁), and the switching loss is the sum over the edges of the linearly
 * scaled energies at the current there (`analyseDesign`'s losses). The current's ripple, which
 * the carrier changes, moves the edge currents slightly; analyse the returned designs for the
 * figures at the condition.
 *
 * @throws ParameterRangeError / ParameterTypeError naming `candidates`, `condition`,
 *   `reference`, or the reference's missing figure (`candidates[0].report.losses`, "a design
 *   with a device …")
 */
export function equalConditions(
  candidates: readonly EqualConditionCandidate[],
  options: EqualConditionOptions,
): EqualConditionResult {
  if (typeof candidates !== 'object' || candidates === null || candidates.length === 0)
    throw new ParameterTypeError(
      'candidates',
      'a non-empty array of { design, report }',
      candidates,
    );
  const { condition, reference = 0 } = options;
  assertOneOf('condition', condition, EQUAL_CONDITIONS);
  assertNumberInRange('reference', reference, {
    min: 0,
    max: candidates.length - 1,
    integer: true,
  });
  const figureOf = (candidate: EqualConditionCandidate): number | null =>
    condition === 'equal-device-frequency'
      ? (candidate.report.switching?.averageDeviceFrequency ?? null)
      : condition === 'equal-switching-loss'
        ? (candidate.report.losses?.switching ?? null)
        : null;
  const unchanged = (
    design: InverterDesign,
    note: string | null,
  ): EqualConditionCandidateResult => ({
    design,
    carrierFrequency: design.carrierFrequency ?? null,
    wantedFactor: null,
    factor: 1,
    note,
  });
  if (condition === 'equal-carrier')
    return {
      condition,
      reference,
      target: null,
      candidates: candidates.map((c) => unchanged(c.design, null)),
    };

  const target = figureOf(candidates[reference] as EqualConditionCandidate);
  if (
    target === null ||
    !(target > 0) ||
    candidates[reference]?.design.carrierFrequency === undefined
  )
    throw new ParameterRangeError(
      `candidates[${reference}].report.${condition === 'equal-device-frequency' ? 'switching' : 'losses'}`,
      condition === 'equal-device-frequency'
        ? 'the figures of a design with a carrier whose report gives its average device switching frequency (a three-phase or multilevel bridge), as the reference'
        : 'the figures of a design with a carrier and a device whose report gives its switching loss, as the reference',
      null,
    );
  const what =
    condition === 'equal-device-frequency'
      ? 'average device switching frequency'
      : 'switching loss';
  return {
    condition,
    reference,
    target,
    candidates: candidates.map((candidate): EqualConditionCandidateResult => {
      const { design } = candidate;
      const carrier = design.carrierFrequency;
      if (carrier === undefined)
        return unchanged(design, 'a stored pattern has no carrier to scale');
      const figure = figureOf(candidate);
      if (figure === null || !(figure > 0))
        return unchanged(
          design,
          condition === 'equal-device-frequency'
            ? 'its report gives no average device switching frequency (a staircase pattern)'
            : 'its report gives no switching loss (no device, or no load or filter)',
        );
      const wantedFactor = target / figure;
      const mf = carrier / design.fundamentalFrequency;
      const spans =
        ASYNCHRONOUS_METHODS.includes(design.modulation.method) && !design.filter && !design.grid;
      const wanted = Math.max(1, mf * wantedFactor);
      const scaled = spans ? wanted : Math.round(wanted);
      if (scaled > MAX_DESIGN_FREQUENCY_RATIO)
        return {
          ...unchanged(
            design,
            `equal ${what} needs mf ${Number(scaled.toPrecision(6))}, above the largest ${MAX_DESIGN_FREQUENCY_RATIO}`,
          ),
          wantedFactor,
        };
      const carrierFrequency = spans
        ? affordableSpanRatio(design, scaled) * design.fundamentalFrequency
        : scaled * design.fundamentalFrequency;
      return {
        design: { ...design, carrierFrequency },
        carrierFrequency,
        wantedFactor,
        factor: carrierFrequency / carrier,
        note: null,
      };
    }),
  };
}

/**
 * The fraction p/q nearest to `ratio` with the largest q ≤ 64 whose span the design report can
 * afford (`designSpanMaxOrder` does not refuse it): continued fractions' best approximation,
 * tried with fewer periods until the span's p·q fits. q = 1 (a whole mf ≤ 1000) always fits.
 */
function affordableSpanRatio(design: InverterDesign, ratio: number): number {
  for (let periods = MAX_DESIGN_FUNDAMENTAL_PERIODS; periods > 1; periods--) {
    const { p, q } = bestRationalApproximation(ratio, periods);
    try {
      designSpanMaxOrder(design, { p, q, error: 0 });
      return p / q;
    } catch (error) {
      if (!(error instanceof ParameterRangeError)) throw error;
    }
  }
  return Math.round(ratio);
}
