import { draftPhaseCount } from '../model/studyDraft';
import { designNumberFields } from './designNumberFields';
import { DraftSwitch } from './DraftSwitch';
import type { StudyFieldsetArgs } from './studyFieldsetArgs';
import { DEGREES } from './studyFormUnits';

/**
 * The study form's load fieldset: series R (Ω), L (H, shown in mH) and a back-EMF (V peak, phase in radians shown in degrees), per phase for three-phase methods. A render function, not a component: the form calls it
 * while rendering so the messages it asks for are claimed before the form lists the unclaimed ones.
 */
export function loadFields({ draft, onChange, readOnly, fields: { limits } }: StudyFieldsetArgs) {
  const threePhase = draftPhaseCount(draft) === 3;
  return (
    <fieldset disabled={readOnly} className="flex flex-col gap-3">
      <legend className="mb-1 text-sm font-semibold tracking-wide uppercase">
        {threePhase ? 'Load per phase (star, series R-L)' : 'Load (series R-L)'}
      </legend>
      <DraftSwitch draft={draft} name="loadOn" onChange={onChange}>
        Include a load
      </DraftSwitch>
      {draft.loadOn ? (
        <div className="grid grid-cols-2 gap-3">
          {designNumberFields(
            [
              { key: 'loadR', path: 'load.r', label: 'Resistance R', unit: { unit: 'Ω' } },
              {
                key: 'loadL',
                path: 'load.l',
                label: 'Inductance L',
                unit: { scale: 1e3, unit: 'mH' },
              },
              {
                key: 'emf',
                path: 'load.emf.amplitude',
                label: 'Back-EMF',
                unit: { unit: 'V' },
                shownUnit: 'V peak',
              },
              { key: 'emfPhase', path: 'load.emf.phase', label: 'Back-EMF phase', unit: DEGREES },
            ],
            { draft, onChange, limits },
          )}
        </div>
      ) : null}
    </fieldset>
  );
}
