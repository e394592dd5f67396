import type { ReactNode } from 'react';
import type { StudyDraft } from '../model/studyDraft';

/** The draft's on/off fields (a load, a filter, a grid, a generating bridge). */
type SwitchKey = {
  [K in keyof StudyDraft]: StudyDraft[K] extends boolean ? K : never;
}[keyof StudyDraft];

/** A study-form box bound to one of the draft's on/off fields, its label the children. */
export function DraftSwitch({
  draft,
  name,
  onChange,
  className = '',
  children,
}: {
  draft: StudyDraft;
  name: SwitchKey;
  onChange: (patch: Partial<StudyDraft>) => void;
  className?: string;
  children: ReactNode;
}) {
  return (
    <label className={`flex items-center gap-2 text-sm ${className}`.trim()}>
      <input
        type="checkbox"
        checked={draft[name]}
        onChange={(e) => onChange({ [name]: e.target.checked })}
        className="accent-signal"
      />
      {children}
    </label>
  );
}
