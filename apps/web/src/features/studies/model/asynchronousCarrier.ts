import { DESIGN_BOUNDS, designFrequencyRatio } from '@pulsewright/modulation';
import { rangeError } from '../../../lib/fieldRange';
import { isCarrierMethod, type StudyDraft } from './studyDraft';

/**
 * Whether a draft's carrier, with both frequencies in range, is not a whole multiple (1 to the
 * library's largest) of its fundamental (the library's designFrequencyRatio): the design report
 * analyses it over q periods of its nearest p/q for sine-triangle, three-phase carrier and space
 * vector, with a filter or grid too (its `carrierSpan`), and POST /designs/asynchronous-spectra
 * gives the spectra of any two-level carrier design as it is typed.
 */
export function hasAsynchronousCarrier(
  draft: Pick<StudyDraft, 'method' | 'carrierFrequency' | 'fundamentalFrequency'>,
): boolean {
  if (!isCarrierMethod(draft.method)) return false;
  if (rangeError('', draft.carrierFrequency, DESIGN_BOUNDS.carrierFrequency) !== undefined)
    return false;
  if (rangeError('', draft.fundamentalFrequency, DESIGN_BOUNDS.fundamentalFrequency) !== undefined)
    return false;
  try {
    designFrequencyRatio(draft);
    return false;
  } catch {
    return true;
  }
}
