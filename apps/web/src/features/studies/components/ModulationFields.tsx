import {
  DESIGN_BOUNDS,
  spaceVectorIndices,
  type ModulationMethod,
  type NumberBounds,
} from '@pulsewright/modulation';
import { NumberField, SelectField, SliderField } from '../../../components/ui/Field';
import { rangeError, rangeText } from '../../../lib/fieldRange';
import { formatNumber } from '../../../lib/format';
import {
  CLAMPING_OPTIONS,
  labelOf,
  METHOD_OPTIONS,
  OVERMODULATION_OPTIONS,
  SAMPLING_OPTIONS,
  SCHEME_OPTIONS,
  SEQUENCE_OPTIONS,
  SPACE_VECTOR_SAMPLING_OPTIONS,
  ZERO_SEQUENCE_OPTIONS,
} from '../../../lib/modulationOptions';
import { isPatternMethod, type StudyDraft } from '../model/studyDraft';
import { draftSetter } from './draftSetter';
import { frequencyFields } from './FrequencyFields';
import { multilevelFields, multilevelSpaceVectorFields } from './multilevel/multilevelFields';
import { PatternSummary } from './PatternSummary';
import type { StudyFieldsetArgs } from './studyFieldsetArgs';
import type { CarrierFields } from './useCarrierFields';

/** Sliders cover the useful part of a range; the number box beside takes the whole range. */
const SLIDERS = {
  vdc: { min: 10, max: 1000 },
  ma: { min: 0.02, max: 1.5 },
} as const;

/**
 * The space-vector ma range: the library's bounds on m (up to six-step) read as ma through the
 * library's own conversion, so the field states one range in the quantity it shows.
 */
const SPACE_VECTOR_MA_BOUNDS: NumberBounds = {
  min: 0,
  minExclusive: true,
  max: spaceVectorIndices({ m: DESIGN_BOUNDS['modulation.m'].max }).ma,
};

/**
 * The study form's "Modulation" fieldset: the method and its options, DC bus (V), ma, then the
 * fundamental and carrier fields. A render function, not a component: the form calls it while
 * rendering so the messages it asks for are claimed before the form lists the unclaimed ones.
 */
export function modulationFields({
  draft,
  onChange,
  readOnly,
  fields,
  carrier,
}: StudyFieldsetArgs & {
  carrier: CarrierFields;
}) {
  const { error, limits } = fields;
  const set = draftSetter(onChange);
  const { method } = draft;
  const pattern = isPatternMethod(method);
  // A pattern method is listed for a study that holds such a pattern; new ones come from the elimination page.
  const methodOptions = METHOD_OPTIONS.map((o) =>
    isPatternMethod(o.value) && draft.pattern?.method !== o.value
      ? { ...o, label: `${o.label} (saved from the elimination page)`, disabled: true }
      : o,
  );
  return (
    <fieldset disabled={readOnly} className="flex flex-col gap-3">
      <legend className="mb-1 text-sm font-semibold tracking-wide uppercase">Modulation</legend>
      <SelectField
        label="Method"
        value={method}
        onChange={(e) => set('method')(e.target.value as ModulationMethod)}
        error={error('modulation.method', 'method')}
        options={methodOptions}
      />
      {pattern ? (
        <PatternSummary
          pattern={draft.pattern}
          vdc={draft.vdc}
          error={error(
            'modulation.angles',
            'modulation.eliminate',
            'modulation.kind',
            'modulation.fundamental',
            'modulation',
          )}
        />
      ) : null}
      {method === 'sine-triangle' ? (
        <SelectField
          label="Bridge scheme"
          value={draft.scheme}
          onChange={(e) => set('scheme')(e.target.value as StudyDraft['scheme'])}
          error={error('modulation.scheme')}
          options={SCHEME_OPTIONS}
        />
      ) : null}
      {method === 'three-phase' ? (
        <SelectField
          label="Zero sequence"
          value={draft.zeroSequence}
          onChange={(e) => set('zeroSequence')(e.target.value as StudyDraft['zeroSequence'])}
          error={error('modulation.zeroSequence')}
          options={ZERO_SEQUENCE_OPTIONS}
        />
      ) : null}
      {method === 'multilevel-carrier' ? multilevelFields({ draft, onChange, fields }) : null}
      {method === 'multilevel-space-vector'
        ? multilevelSpaceVectorFields({ draft, onChange, fields })
        : null}
      {method === 'sine-triangle' || method === 'three-phase' ? (
        <SelectField
          label="Sampling"
          value={draft.sampling}
          onChange={(e) => set('sampling')(e.target.value as StudyDraft['sampling'])}
          error={error('modulation.sampling')}
          options={SAMPLING_OPTIONS}
        />
      ) : null}
      {method === 'space-vector' ? (
        <>
          <SelectField
            label="Switching sequence"
            value={draft.sequence}
            onChange={(e) => set('sequence')(e.target.value as StudyDraft['sequence'])}
            error={error('modulation.sequence')}
            options={SEQUENCE_OPTIONS}
          />
          {draft.sequence === 'five-segment' ? (
            <SelectField
              label="Zero-vector clamping"
              value={draft.clamping}
              onChange={(e) =>
                onChange({
                  clamping: e.target.value as StudyDraft['clamping'],
                  keepClamping: true,
                })
              }
              error={error('modulation.clamping')}
              options={CLAMPING_OPTIONS}
            />
          ) : (
            <NumberField
              label="Zero split"
              value={draft.zeroSplit}
              {...limits('modulation.zeroSplit', 'Zero split', draft.zeroSplit)}
              hint={`share of the zero time on 000, ${rangeText(DESIGN_BOUNDS['modulation.zeroSplit'])}; 0.5 is centred`}
              onChange={(zeroSplit) => onChange({ zeroSplit, keepZeroSplit: true })}
            />
          )}
          {/* The design keeps the other sequence's choice (stored or picked): say so, as it is saved. */}
          {draft.sequence === 'seven-segment' && draft.keepClamping ? (
            <p className="text-xs text-ink-soft" data-testid="kept-sequence-option">
              Zero-vector clamping {labelOf(CLAMPING_OPTIONS, draft.clamping)} is kept with the
              design; only the five-segment sequence uses it.
            </p>
          ) : null}
          {draft.sequence === 'five-segment' && draft.keepZeroSplit ? (
            <p className="text-xs text-ink-soft" data-testid="kept-sequence-option">
              Zero split {formatNumber(draft.zeroSplit)} is kept with the design; only the
              seven-segment sequence uses it.
            </p>
          ) : null}
          <SelectField
            label="Sampling"
            value={draft.spaceVectorSampling}
            onChange={(e) =>
              set('spaceVectorSampling')(e.target.value as StudyDraft['spaceVectorSampling'])
            }
            error={error('modulation.sampling')}
            options={SPACE_VECTOR_SAMPLING_OPTIONS}
          />
          <SelectField
            label="Overmodulation"
            value={draft.overmodulation}
            onChange={(e) => set('overmodulation')(e.target.value as StudyDraft['overmodulation'])}
            error={error('modulation.overmodulation')}
            options={OVERMODULATION_OPTIONS}
          />
        </>
      ) : null}
      {pattern ? null : (
        <SliderField
          label="DC bus"
          unit="V"
          value={draft.vdc}
          min={SLIDERS.vdc.min}
          max={SLIDERS.vdc.max}
          step={1}
          {...limits('vdc', 'DC bus', draft.vdc, { unit: 'V' })}
          onChange={set('vdc')}
        />
      )}
      {pattern ? null : (
        <SliderField
          label="Modulation index ma"
          value={draft.ma}
          min={SLIDERS.ma.min}
          max={SLIDERS.ma.max}
          step={0.01}
          hint={
            method === 'space-vector'
              ? `${rangeText(SPACE_VECTOR_MA_BOUNDS)} (six-step at the top); above 2/√3 is overmodulation`
              : `${rangeText(DESIGN_BOUNDS['modulation.ma'])}; above 1 is overmodulation`
          }
          error={
            rangeError(
              'Modulation index ma',
              draft.ma,
              method === 'space-vector' ? SPACE_VECTOR_MA_BOUNDS : DESIGN_BOUNDS['modulation.ma'],
            ) ?? error('modulation.ma', 'modulation.m')
          }
          onChange={set('ma')}
        />
      )}
      {frequencyFields({ draft, onChange, fields, carrier })}
    </fieldset>
  );
}
