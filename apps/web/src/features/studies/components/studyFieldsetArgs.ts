import type { StudyDraft } from '../model/studyDraft';
import type { StudyFieldErrors } from './studyFieldErrors';

/**
 * What each fieldset render function of the study form is given: the draft, how to change it,
 * whether the form is read-only (a viewer's), and the form's field messages to claim.
 */
export interface StudyFieldsetArgs {
  draft: StudyDraft;
  onChange: (patch: Partial<StudyDraft>) => void;
  readOnly: boolean;
  fields: StudyFieldErrors;
}
