import { bestRationalApproximation } from '../numeric/bestRationalApproximation.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { MAX_DESIGN_FREQUENCY_RATIO, MAX_DESIGN_FUNDAMENTAL_PERIODS } from './designBounds.js';
import { ASYNCHRONOUS_METHODS } from './designCarrierSpan.js';
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
   * within 0.1 % (mf a fraction p/q with few periods q); for a
   * multilevel design, after rounding to a whole mf.
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
 * (with a filter or grid too) keeps the scaled carrier as asked: its report spans a ratio p/q over q
 * fundamental periods (`designCarrierSpan`), so mf is set to the fraction with the fewest
 * periods q that lies within {@link SCALED_CARRIER_TOLERANCE} (0.1 %) of the scaled ratio
 * (continued fractions, `bestRationalApproximation`; the q ≤ 64 nearest where none does, below
 * mf 16). Fractions of denominator ≤ N leave no gap wider than 1/N (Farey sequences, a fact of
 * number theory), so q ≤ min(64, 1000/mf + 1) and the span's p·q stays below about 7·10⁴, far
 * inside the report's cost bound (`designSpanMaxOrder`, p·q ≤ 4·10⁵; with a filter ⌈10·p/q⌉ + 10
 * span orders within q·order ≤ 20000 and p·q·order ≤ 2·10⁷, which p ≤ 1000 + mf meets) and cheap to report; the
 * conditions themselves hold only to a few per cent (the clamps' partial periods, the ripple's
 * effect on the edge currents). A multilevel
 * design, whose report needs a whole mf, is rounded to one, so its
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
      const spans = ASYNCHRONOUS_METHODS.includes(design.modulation.method);
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
        ? spanRatioNear(scaled) * design.fundamentalFrequency
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
 * Relative distance from the scaled frequency ratio within which equalConditions takes a fraction
 * p/q with fewer periods q: 0.1 %, a tenth of the 1–3 % to which the conditions hold in the model
 * (common practice for a setting nobody can tell apart on the bench; no single source).
 */
export const SCALED_CARRIER_TOLERANCE = 1e-3;

/**
 * The fraction p/q with the fewest periods q ≤ 64 within SCALED_CARRIER_TOLERANCE of `ratio`
 * (best approximations by continued fractions for q = 1, 2, …), else the nearest with q ≤ 64.
 */
function spanRatioNear(ratio: number): number {
  for (let periods = 1; periods < MAX_DESIGN_FUNDAMENTAL_PERIODS; periods++) {
    const { p, q } = bestRationalApproximation(ratio, periods);
    if (Math.abs(p / q - ratio) <= SCALED_CARRIER_TOLERANCE * ratio) return p / q;
  }
  const { p, q } = bestRationalApproximation(ratio, MAX_DESIGN_FUNDAMENTAL_PERIODS);
  return p / q;
}
