import { NumberField } from '../../../components/ui/Field';
import { draftPhaseCount, type StudyDraft } from '../model/studyDraft';
import { draftSetter } from './draftSetter';
import type { StudyFieldErrors } from './studyFieldErrors';
import { DEGREES, RADIANS_TO_DEGREES } from './studyFormUnits';

/**
 * The study form's load fieldset: series R (Ω), L (H, shown in mH) and a back-EMF (V peak, phase in radians shown in degrees), per phase for three-phase methods. A render function, not a component: the form calls it
 * while rendering so the messages it asks for are claimed before the form lists the unclaimed ones.
 */
export function loadFields({
  draft,
  onChange,
  readOnly,
  fields: { limits },
}: {
  draft: StudyDraft;
  onChange: (patch: Partial<StudyDraft>) => void;
  readOnly: boolean;
  fields: StudyFieldErrors;
}) {
  const set = draftSetter(onChange);
  const threePhase = draftPhaseCount(draft) === 3;
  return (
    <fieldset disabled={readOnly} className="flex flex-col gap-3">
      <legend className="mb-1 text-sm font-semibold tracking-wide uppercase">
        {threePhase ? 'Load per phase (star, series R-L)' : 'Load (series R-L)'}
      </legend>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={draft.loadOn}
          onChange={(e) => set('loadOn')(e.target.checked)}
          className="accent-signal"
        />
        Include a load
      </label>
      {draft.loadOn ? (
        <div className="grid grid-cols-2 gap-3">
          <NumberField
            label="Resistance R"
            unit="Ω"
            value={draft.loadR}
            {...limits('load.r', 'Resistance R', draft.loadR, { unit: 'Ω' })}
            onChange={set('loadR')}
          />
          <NumberField
            label="Inductance L"
            unit="mH"
            value={draft.loadL}
            scale={1e3}
            {...limits('load.l', 'Inductance L', draft.loadL, { scale: 1e3, unit: 'mH' })}
            onChange={set('loadL')}
          />
          <NumberField
            label="Back-EMF"
            unit="V peak"
            value={draft.emf}
            {...limits('load.emf.amplitude', 'Back-EMF', draft.emf, { unit: 'V' })}
            onChange={set('emf')}
          />
          <NumberField
            label="Back-EMF phase"
            unit="°"
            value={draft.emfPhase}
            scale={RADIANS_TO_DEGREES}
            {...limits('load.emf.phase', 'Back-EMF phase', draft.emfPhase, DEGREES)}
            onChange={set('emfPhase')}
          />
        </div>
      ) : null}
    </fieldset>
  );
}
