import type { StudyDraft } from '../model/studyDraft';

/** A setter per draft key: `draftSetter(onChange)('vdc')(400)` sends `{ vdc: 400 }`. */
export function draftSetter(onChange: (patch: Partial<StudyDraft>) => void) {
  return <K extends keyof StudyDraft>(key: K) =>
    (value: StudyDraft[K]) =>
      onChange({ [key]: value });
}
