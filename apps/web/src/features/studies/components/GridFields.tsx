import { DESIGN_BOUNDS } from '@pulsewright/modulation';
import { NumberField } from '../../../components/ui/Field';
import { rangeText } from '../../../lib/fieldRange';
import { draftPhaseCount, type StudyDraft } from '../model/studyDraft';
import { draftSetter } from './draftSetter';
import type { StudyFieldErrors } from './studyFieldErrors';
import { DEGREES, RADIANS_TO_DEGREES } from './studyFormUnits';
import { LclSizing } from './LclSizing';

/**
 * The study form's grid connection fieldset: grid voltage (V rms), phase (radians, shown in degrees), grid-side L2, grid R and L, the control bandwidth (Hz, 0 leaves it out) and, for a three-phase bridge, the LCL sizing that fills the filter fields and L2 ({@link LclSizing}). A render function, not a component: the form calls it
 * while rendering so the messages it asks for are claimed before the form lists the unclaimed ones.
 */
export function gridFields({
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
        Grid connection
      </legend>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={draft.gridOn}
          onChange={(e) => set('gridOn')(e.target.checked)}
          className="accent-signal"
        />
        Feed a grid instead of the load (the filter&apos;s L and C with L2 make an LCL)
      </label>
      {draft.gridOn ? (
        <div className="grid grid-cols-2 gap-3">
          <NumberField
            label="Grid voltage"
            unit={threePhase ? 'V rms, line' : 'V rms'}
            value={draft.gridLineVoltage}
            {...limits('grid.lineVoltage', 'Grid voltage', draft.gridLineVoltage, { unit: 'V' })}
            onChange={set('gridLineVoltage')}
          />
          <NumberField
            label="Grid phase"
            unit="°"
            value={draft.gridPhase}
            scale={RADIANS_TO_DEGREES}
            {...limits('grid.phase', 'Grid phase', draft.gridPhase, DEGREES)}
            onChange={set('gridPhase')}
          />
          <NumberField
            label="Grid-side L2"
            unit="mH"
            value={draft.gridL2}
            scale={1e3}
            {...limits('grid.l2', 'Grid-side L2', draft.gridL2, { scale: 1e3, unit: 'mH' })}
            onChange={set('gridL2')}
          />
          <NumberField
            label="Grid R"
            unit="Ω"
            value={draft.gridR}
            {...limits('grid.r', 'Grid R', draft.gridR, { unit: 'Ω' })}
            onChange={set('gridR')}
          />
          <NumberField
            label="Grid L"
            unit="mH"
            value={draft.gridL}
            scale={1e3}
            {...limits('grid.l', 'Grid L', draft.gridL, { scale: 1e3, unit: 'mH' })}
            onChange={set('gridL')}
          />
          <NumberField
            label="Control bandwidth"
            unit="Hz"
            value={draft.gridControlBandwidth}
            {...limits(
              'grid.controlBandwidth',
              'Control bandwidth',
              draft.gridControlBandwidth,
              { unit: 'Hz' },
              { ...DESIGN_BOUNDS['grid.controlBandwidth'], min: 0 },
            )}
            hint={`0 (left out) or ${rangeText(DESIGN_BOUNDS['grid.controlBandwidth'], { unit: 'Hz' })}; the LCL resonance is compared with it`}
            onChange={set('gridControlBandwidth')}
          />
          {threePhase ? (
            <LclSizing draft={draft} onChange={onChange} readOnly={readOnly} />
          ) : (
            <p className="col-span-2 text-xs text-ink-soft">
              The LCL sizing (Liserre et al. 2005) is for three-phase bridges.
            </p>
          )}
        </div>
      ) : null}
    </fieldset>
  );
}
