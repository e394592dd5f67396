import {
  ASYNCHRONOUS_METHODS,
  DESIGN_BOUNDS,
  designFrequencyRatio,
  designRationalRatio,
  MAX_DESIGN_FREQUENCY_RATIO,
  type NumberBounds,
  type RationalRatio,
} from '@pulsewright/modulation';
import { useState } from 'react';
import { rangeError } from '../../../lib/fieldRange';
import { formatNumber } from '../../../lib/format';
import { hasAsynchronousCarrier } from '../model/asynchronousCarrier';
import { isCarrierMethod, type StudyDraft } from '../model/studyDraft';
import type { StudyFieldErrors } from './studyFieldErrors';

/** The frequency ratio's range: a whole number from 1 to the library's largest. */
export const RATIO_BOUNDS: NumberBounds = {
  min: 1,
  max: MAX_DESIGN_FREQUENCY_RATIO,
  integer: true,
};

/**
 * Whether the design report takes a ratio that is not whole for this draft: sine-triangle,
 * three-phase carrier and space vector, with a filter or grid too (analysed over q periods of its
 * nearest p/q; the library's designSpanMaxOrder refuses a span too costly, on the carrier field
 * through the preview's errors).
 */
export function spansCarrier(draft: Pick<StudyDraft, 'method'>): boolean {
  return ASYNCHRONOUS_METHODS.includes(draft.method);
}

/** The frequency ratio's range: any ratio where the report spans it, else a whole number. */
export function ratioBounds(draft: Pick<StudyDraft, 'method'>): NumberBounds {
  return spansCarrier(draft) ? { ...RATIO_BOUNDS, integer: false } : RATIO_BOUNDS;
}

/**
 * The fundamental, frequency ratio mf and carrier fields' state: mf as typed (kept and refused,
 * never rounded into another carrier, issue 10), the carrier's message in hertz, and setters that
 * keep mf when the fundamental moves (synchronous carrier PWM).
 */
export function useCarrierFields(
  draft: StudyDraft,
  onChange: (patch: Partial<StudyDraft>) => void,
  error: StudyFieldErrors['error'],
) {
  const { method } = draft;
  let ratio = Number.NaN;
  try {
    ratio = designFrequencyRatio(draft);
  } catch {
    // The library's message goes on the carrier field through the preview's errors.
  }
  // Only an allowed fundamental moves the carrier: a 0 or an emptied box would otherwise take the
  // carrier to 0 Hz and lose mf when the fundamental is typed again.
  const fundamentalAllowed = (f: number) =>
    rangeError('', f, DESIGN_BOUNDS.fundamentalFrequency) === undefined;
  // The frequency ratio as typed (null once the carrier frequency is typed instead): a fraction is
  // kept and refused on this field, never rounded into another carrier (issue 10: 0.5 saved as 1).
  const [typedRatio, setTypedRatio] = useState<number | null>(null);
  const setRatio = (mf: number) => {
    setTypedRatio(mf);
    onChange({ carrierFrequency: mf * draft.fundamentalFrequency });
  };
  const setCarrier = (carrierFrequency: number) => {
    setTypedRatio(null);
    onChange({ carrierFrequency });
  };
  const carrierError = error('carrierFrequency');
  const ratioError =
    typedRatio === null
      ? undefined
      : rangeError('Frequency ratio mf', typedRatio, ratioBounds(draft));
  // The carrier's own message, in hertz with what was entered; a ratio typed in the mf box is
  // judged there instead (its message would otherwise quote a carrier the user never typed).
  const carrierRangeMessage =
    typedRatio !== null
      ? undefined
      : rangeError('Carrier frequency', draft.carrierFrequency, DESIGN_BOUNDS.carrierFrequency, {
          unit: 'Hz',
        });
  // A carrier in range that is not a whole multiple: sine-triangle, three-phase carrier and
  // space vector are analysed over q periods of its nearest p/q (stated in the carrier's hint);
  // a multilevel design needs a whole mf, and the page's "Carrier as typed" panel analyses it.
  const spanned = hasAsynchronousCarrier(draft);
  const spannable = spansCarrier(draft);
  const asynchronous = typedRatio === null && spanned && !spannable;
  const span = spanned && spannable ? spanOf(draft) : null;
  const spanHint =
    span === null
      ? undefined
      : `mf = ${span.p}/${span.q} ≈ ${formatNumber(span.p / span.q, 6)}: the report is exact over ${span.q} fundamental period${span.q === 1 ? '' : 's'} (${span.p} carrier cycles) with its sub-harmonics; carrier analysed ${formatNumber((span.p / span.q) * draft.fundamentalFrequency, 9)} Hz, ${formatNumber(span.error, 3)} Hz from the one entered`;
  const typedMultiple = draft.carrierFrequency / draft.fundamentalFrequency;
  const nearestWhole = Math.min(MAX_DESIGN_FREQUENCY_RATIO, Math.max(1, Math.round(typedMultiple)));
  const carrierMessage =
    typedRatio !== null
      ? undefined
      : (carrierRangeMessage ??
        (asynchronous
          ? `Carrier frequency ${formatNumber(draft.carrierFrequency, 9)} Hz is ${formatNumber(typedMultiple, 6)} times the fundamental, ${formatNumber(draft.fundamentalFrequency, 6)} Hz: the design report takes a whole multiple (1 to ${MAX_DESIGN_FREQUENCY_RATIO} times), the nearest being mf = ${nearestWhole} (${formatNumber(nearestWhole * draft.fundamentalFrequency, 9)} Hz), so set that to save the study; the panel "Carrier as typed" analyses ${formatNumber(draft.carrierFrequency, 9)} Hz as it is`
          : carrierError));
  // Synchronous carrier PWM: a new fundamental keeps the frequency ratio, so the carrier follows.
  const setFundamental = (f: number) =>
    onChange(
      isCarrierMethod(method) && Number.isFinite(ratio) && fundamentalAllowed(f)
        ? { fundamentalFrequency: f, carrierFrequency: ratio * f }
        : { fundamentalFrequency: f },
    );
  return { ratio, ratioError, carrierMessage, spanHint, setRatio, setCarrier, setFundamental };
}

/** The draft's ratio as its nearest p/q, or null when the ratio is out of range (said on the field). */
function spanOf(draft: StudyDraft): RationalRatio | null {
  try {
    return designRationalRatio(draft);
  } catch {
    return null;
  }
}

/** What `useCarrierFields` returns, handed to the frequency fields. */
export type CarrierFields = ReturnType<typeof useCarrierFields>;
