import type { DesignBoundsField } from '@pulsewright/modulation';
import { NumberField } from '../../../components/ui/Field';
import type { FieldUnit } from '../../../lib/fieldRange';
import type { StudyDraft } from '../model/studyDraft';
import { draftSetter } from './draftSetter';
import type { StudyFieldErrors } from './studyFieldErrors';

/** The keys of the study draft that hold a number. */
type NumberDraftKey = {
  [K in keyof StudyDraft]: StudyDraft[K] extends number ? K : never;
}[keyof StudyDraft];

/** One number field of a design fieldset. */
export interface DesignNumberSpec {
  /** The draft value it edits (in the design's SI unit). */
  key: NumberDraftKey;
  /** Its path in the design: the library's bounds and the messages for it. */
  path: DesignBoundsField;
  label: string;
  /** How it is shown: the scale from the SI value and the unit its range is written in. */
  unit: FieldUnit;
  /** The unit beside the box when it says more than `unit.unit` (`V rms, line`, `V peak`). */
  shownUnit?: string;
}

/**
 * The number fields of a design fieldset from their specs: each shows its value in its unit,
 * its range (the library's DESIGN_BOUNDS) as the hint and the message for its design path.
 */
export function designNumberFields(
  specs: readonly DesignNumberSpec[],
  {
    draft,
    onChange,
    limits,
  }: {
    draft: StudyDraft;
    onChange: (patch: Partial<StudyDraft>) => void;
    limits: StudyFieldErrors['limits'];
  },
) {
  const set = draftSetter(onChange);
  return specs.map((spec) => (
    <NumberField
      key={spec.key}
      label={spec.label}
      unit={spec.shownUnit ?? spec.unit.unit ?? ''}
      value={draft[spec.key]}
      scale={spec.unit.scale ?? 1}
      {...limits(spec.path, spec.label, draft[spec.key], spec.unit)}
      onChange={set(spec.key)}
    />
  ));
}
