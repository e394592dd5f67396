import type { DesignResonance } from '@pulsewright/modulation';
import { SelectField } from '../../../components/ui/Field';
import { formatNumber } from '../../../lib/format';
import { DAMPING_OPTIONS } from '../../../lib/modulationOptions';
import { draftPhaseCount, isCarrierMethod, type StudyDraft } from '../model/studyDraft';
import { designNumberFields } from './designNumberFields';
import { draftSetter } from './draftSetter';
import { DraftSwitch } from './DraftSwitch';
import { FilterSizing } from './FilterSizing';
import type { StudyFieldsetArgs } from './studyFieldsetArgs';

/**
 * The study form's LC output filter fieldset: filter L (H, shown in mH), C (F, shown in µF), damping R (Ω) and C, the damping placement, the sizing helper and the resonance (Hz) from the live report, named by the library's designResonance (a grid design's LCL resonance with its distances from the carrier and the control bandwidth). A render function, not a component: the form calls it
 * while rendering so the messages it asks for are claimed before the form lists the unclaimed ones.
 */
export function filterFields({
  draft,
  onChange,
  readOnly,
  fields: { error, limits },
  ratio,
  filterResonance,
}: StudyFieldsetArgs & {
  ratio: number;
  filterResonance?: DesignResonance | null | undefined;
}) {
  const set = draftSetter(onChange);
  const threePhase = draftPhaseCount(draft) === 3;
  return (
    <fieldset disabled={readOnly} className="flex flex-col gap-3">
      <legend className="mb-1 text-sm font-semibold tracking-wide uppercase">
        {threePhase ? 'Output filter per phase (LC, star)' : 'Output filter (LC)'}
      </legend>
      <DraftSwitch draft={draft} name="filterOn" onChange={onChange}>
        Include an LC output filter
      </DraftSwitch>
      {draft.filterOn ? (
        <>
          <div className="grid grid-cols-2 gap-3">
            {designNumberFields(
              [
                {
                  key: 'filterL',
                  path: 'filter.l',
                  label: 'Filter L',
                  unit: { scale: 1e3, unit: 'mH' },
                },
                {
                  key: 'filterC',
                  path: 'filter.c',
                  label: 'Filter C',
                  unit: { scale: 1e6, unit: 'µF' },
                },
                {
                  key: 'filterR',
                  path: 'filter.rDamping',
                  label: 'Damping R',
                  unit: { unit: 'Ω' },
                },
                ...(draft.dampingPlacement === 'parallel-rc'
                  ? [
                      {
                        key: 'cDamping',
                        path: 'filter.cDamping',
                        label: 'Damping C',
                        unit: { scale: 1e6, unit: 'µF' },
                      } as const,
                    ]
                  : []),
              ],
              { draft, onChange, limits },
            )}
          </div>
          <FilterSizing draft={draft} onChange={onChange} carrier={isCarrierMethod(draft.method)} />
          <SelectField
            label="Damping"
            value={draft.dampingPlacement}
            onChange={(e) =>
              set('dampingPlacement')(e.target.value as StudyDraft['dampingPlacement'])
            }
            error={error('filter.dampingPlacement')}
            options={DAMPING_OPTIONS}
          />
          {filterResonance ? (
            <p className="text-xs text-ink-soft" data-testid="filter-resonance">
              {filterResonance.name} {formatNumber(filterResonance.frequency)} Hz
              {filterResonance.distances !== null
                ? ` (${filterResonance.distances})`
                : Number.isFinite(ratio)
                  ? ` (carrier ${formatNumber(draft.carrierFrequency)} Hz)`
                  : ''}
            </p>
          ) : null}
        </>
      ) : null}
    </fieldset>
  );
}
