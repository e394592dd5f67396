import { DESIGN_BOUNDS } from '@pulsewright/modulation';
import { NumberField } from '../../../components/ui/Field';
import { rangeText } from '../../../lib/fieldRange';
import { draftPhaseCount } from '../model/studyDraft';
import { designNumberFields } from './designNumberFields';
import { draftSetter } from './draftSetter';
import { DraftSwitch } from './DraftSwitch';
import type { StudyFieldsetArgs } from './studyFieldsetArgs';
import { DEGREES } from './studyFormUnits';
import { LclSizing } from './LclSizing';

/**
 * The study form's grid connection fieldset: grid voltage (V rms), phase (radians, shown in degrees), grid-side L2, grid R and L, the control bandwidth (Hz, 0 leaves it out), whether the bridge generates power (IEEE 519's row) and, for a three-phase bridge, the LCL sizing that fills the filter fields and L2 ({@link LclSizing}). A render function, not a component: the form calls it
 * while rendering so the messages it asks for are claimed before the form lists the unclaimed ones.
 */
export function gridFields({ draft, onChange, readOnly, fields: { limits } }: StudyFieldsetArgs) {
  const set = draftSetter(onChange);
  const threePhase = draftPhaseCount(draft) === 3;
  return (
    <fieldset disabled={readOnly} className="flex flex-col gap-3">
      <legend className="mb-1 text-sm font-semibold tracking-wide uppercase">
        Grid connection
      </legend>
      <DraftSwitch draft={draft} name="gridOn" onChange={onChange}>
        Feed a grid instead of the load (the filter&apos;s L and C with L2 make an LCL)
      </DraftSwitch>
      {draft.gridOn ? (
        <div className="grid grid-cols-2 gap-3">
          {designNumberFields(
            [
              {
                key: 'gridLineVoltage',
                path: 'grid.lineVoltage',
                label: 'Grid voltage',
                unit: { unit: 'V' },
                shownUnit: threePhase ? 'V rms, line' : 'V rms',
              },
              { key: 'gridPhase', path: 'grid.phase', label: 'Grid phase', unit: DEGREES },
              {
                key: 'gridL2',
                path: 'grid.l2',
                label: 'Grid-side L2',
                unit: { scale: 1e3, unit: 'mH' },
              },
              { key: 'gridR', path: 'grid.r', label: 'Grid R', unit: { unit: 'Ω' } },
              { key: 'gridL', path: 'grid.l', label: 'Grid L', unit: { scale: 1e3, unit: 'mH' } },
            ],
            { draft, onChange, limits },
          )}
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
          <DraftSwitch
            draft={draft}
            name="gridGeneration"
            onChange={onChange}
            className="col-span-2"
          >
            The bridge delivers power to the grid (IEEE 519 then reads it on its I_SC/I_L &lt; 20
            row, by the table&apos;s footnote for generating equipment; clear it for a bridge that
            draws power, read on the row of its own ratio)
          </DraftSwitch>
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
