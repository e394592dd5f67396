import type { DesignResonance } from '@pulsewright/modulation';
import type { Project } from '../../../lib/api';
import type { PreviewFieldError } from '../model/designPreview';
import type { StudyDraft } from '../model/studyDraft';
import { deviceFields } from './DeviceFields';
import { filterFields } from './FilterFields';
import { gridFields } from './GridFields';
import { loadFields } from './LoadFields';
import { modulationFields } from './ModulationFields';
import { studyDetailsFields } from './StudyDetailsFields';
import { studyFieldErrors } from './studyFieldErrors';
import { useCarrierFields } from './useCarrierFields';

export interface StudyFormProps {
  draft: StudyDraft;
  onChange: (patch: Partial<StudyDraft>) => void;
  readOnly: boolean;
  projects: readonly Project[];
  /** The server's answer to the last save (problem+json field errors). */
  saveError: unknown;
  /** What the library refused in the live preview, by path in the design. */
  previewErrors: readonly PreviewFieldError[];
  /** The live report's resonance, named (`designResonance`: the LCL's with a grid), shown beside the filter. */
  filterResonance?: DesignResonance | null | undefined;
}

/** The study's design with units and the library's ranges; errors from the server and the library beside each field. */
export function StudyForm({
  draft,
  onChange,
  readOnly,
  projects,
  saveError,
  previewErrors,
  filterResonance,
}: StudyFormProps) {
  const fields = studyFieldErrors(saveError, previewErrors);
  const carrier = useCarrierFields(draft, onChange, fields.error);
  const section = { draft, onChange, readOnly, fields };
  // The fieldsets are rendered here (render functions, not components) so every message they ask
  // for is claimed before the refusals no field shows are listed below.
  const body = (
    <>
      {studyDetailsFields({ ...section, projects })}
      {modulationFields({ ...section, carrier })}
      {loadFields(section)}
      {filterFields({ ...section, ratio: carrier.ratio, filterResonance })}
      {gridFields(section)}
      {deviceFields(section)}
    </>
  );
  // Refusals no field above claims (the design as a whole, an option): listed at the top.
  const unclaimed = previewErrors.filter((e) => !fields.claimed.has(e.field));
  return (
    <form
      className="flex flex-col gap-4"
      onSubmit={(e) => e.preventDefault()}
      aria-label="Study parameters"
      noValidate
    >
      {unclaimed.length ? (
        <ul role="alert" className="list-disc rounded-md bg-bad-soft py-2 pl-8 text-sm text-bad">
          {unclaimed.map((e) => (
            <li key={e.field}>{e.message}</li>
          ))}
        </ul>
      ) : null}
      {body}
    </form>
  );
}
