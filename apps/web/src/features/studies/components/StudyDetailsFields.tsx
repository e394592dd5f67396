import { SelectField, TextField } from '../../../components/ui/Field';
import type { Project } from '../../../lib/api';
import { draftSetter } from './draftSetter';
import type { StudyFieldsetArgs } from './studyFieldsetArgs';

/**
 * The study form's "Study" fieldset: name, project and note. A render function, not a component:
 * the form calls it while rendering so the messages it asks for are claimed before the form lists
 * the unclaimed ones.
 */
export function studyDetailsFields({
  draft,
  onChange,
  readOnly,
  projects,
  fields: { error },
}: StudyFieldsetArgs & { projects: readonly Project[] }) {
  const set = draftSetter(onChange);
  return (
    <fieldset disabled={readOnly} className="flex flex-col gap-3">
      <legend className="mb-1 text-sm font-semibold tracking-wide uppercase">Study</legend>
      <TextField
        label="Name"
        value={draft.name}
        onChange={(e) => set('name')(e.target.value)}
        error={error('name')}
        maxLength={120}
        required
      />
      <SelectField
        label="Project"
        value={draft.projectId}
        onChange={(e) => set('projectId')(e.target.value)}
        error={error('projectId')}
        options={[
          { value: '', label: projects.length ? 'Choose a project…' : 'No projects yet' },
          ...projects.map((p) => ({ value: p.id, label: p.name })),
        ]}
      />
      <TextField
        label="Note"
        value={draft.note}
        onChange={(e) => set('note')(e.target.value)}
        error={error('note')}
        maxLength={2000}
      />
    </fieldset>
  );
}
