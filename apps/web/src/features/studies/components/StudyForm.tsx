import {
  DESIGN_BOUNDS,
  designFrequencyRatio,
  MAX_DESIGN_FREQUENCY_RATIO,
  spaceVectorIndices,
  type DesignBoundsField,
  type ModulationMethod,
  type NumberBounds,
} from '@pulsewright/modulation';
import { useState } from 'react';
import { rangeError, rangeText, type FieldUnit } from '../../../lib/fieldRange';
import { fieldErrorOf } from '../../../lib/api';
import { NumberField, SelectField, SliderField, TextField } from '../../../components/ui/Field';
import type { Project } from '../../../lib/api';
import { FilterSizing } from './FilterSizing';
import type { PreviewFieldError } from '../model/designPreview';
import { formatNumber } from '../../../lib/format';
import {
  CLAMPING_OPTIONS,
  DAMPING_OPTIONS,
  labelOf,
  METHOD_OPTIONS,
  OVERMODULATION_OPTIONS,
  PATTERN_KIND_OPTIONS,
  SAMPLING_OPTIONS,
  SCHEME_OPTIONS,
  SEQUENCE_OPTIONS,
  SPACE_VECTOR_SAMPLING_OPTIONS,
  ZERO_SEQUENCE_OPTIONS,
} from '../../../lib/modulationOptions';
import { hasAsynchronousCarrier } from '../model/asynchronousCarrier';
import {
  isCarrierMethod,
  isPatternMethod,
  type StoredPattern,
  type StudyDraft,
} from '../model/studyDraft';

export interface StudyFormProps {
  draft: StudyDraft;
  onChange: (patch: Partial<StudyDraft>) => void;
  readOnly: boolean;
  projects: readonly Project[];
  /** The server's answer to the last save (problem+json field errors). */
  saveError: unknown;
  /** What the library refused in the live preview, by path in the design. */
  previewErrors: readonly PreviewFieldError[];
  /** The loaded filter's resonance from the live report, hertz (shown beside the filter). */
  filterResonance?: number | undefined;
}

/** Sliders cover the useful part of a range; the number box beside takes the whole range. */
const SLIDERS = {
  vdc: { min: 10, max: 1000 },
  ma: { min: 0.02, max: 1.5 },
  mf: { min: 1, max: 201 },
} as const;

const RADIANS_TO_DEGREES = 180 / Math.PI;

/** Angles are held in radians and shown in degrees. */
const DEGREES: FieldUnit = { scale: RADIANS_TO_DEGREES, unit: '°' };

/** The frequency ratio's range: a whole number from 1 to the library's largest. */
const RATIO_BOUNDS: NumberBounds = { min: 1, max: MAX_DESIGN_FREQUENCY_RATIO, integer: true };

/**
 * The space-vector ma range: the library's bounds on m (up to six-step) read as ma through the
 * library's own conversion, so the field states one range in the quantity it shows.
 */
const SPACE_VECTOR_MA_BOUNDS: NumberBounds = {
  min: 0,
  minExclusive: true,
  max: spaceVectorIndices({ m: DESIGN_BOUNDS['modulation.m'].max }).ma,
};

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
  const claimed = new Set<string>();
  const matches = (field: string, path: string) =>
    field === path || field.startsWith(`${path}.`) || field.startsWith(`${path}[`);
  /** The error of a field by its design path(s): the server's answer to a save first, then the library's. */
  const error = (...paths: string[]) => {
    for (const e of previewErrors) if (paths.some((p) => matches(e.field, p))) claimed.add(e.field);
    return (
      paths.map((p) => fieldErrorOf(saveError, p)).find(Boolean) ??
      previewErrors.find((e) => paths.some((p) => matches(e.field, p)))?.message
    );
  };
  /**
   * A number field's hint and message: its range in the unit it shows (the library's bounds),
   * the message for what was entered when the bounds refuse it, else the server's or the
   * library's message for that field.
   */
  const limits = (
    path: DesignBoundsField,
    label: string,
    value: number,
    unit: FieldUnit = {},
    bounds: NumberBounds = DESIGN_BOUNDS[path],
  ) => {
    const fromLibrary = error(path);
    return {
      hint: rangeText(bounds, unit),
      error: rangeError(label, value, bounds, unit) ?? fromLibrary,
    };
  };
  const set =
    <K extends keyof StudyDraft>(key: K) =>
    (value: StudyDraft[K]) =>
      onChange({ [key]: value });
  const { method } = draft;
  const pattern = isPatternMethod(method);
  const threePhase = method === 'three-phase' || method === 'space-vector';
  // A pattern method is listed for a study that holds such a pattern; new ones come from the elimination page.
  const methodOptions = METHOD_OPTIONS.map((o) =>
    isPatternMethod(o.value) && draft.pattern?.method !== o.value
      ? { ...o, label: `${o.label} (saved from the elimination page)`, disabled: true }
      : o,
  );
  let ratio = Number.NaN;
  try {
    ratio = designFrequencyRatio(draft);
  } catch {
    // The library's message goes on the carrier field through the preview's errors.
  }
  // Only an allowed fundamental moves the carrier: a 0 or an emptied box would otherwise take the
  // carrier to 0 Hz and lose mf when the fundamental is typed again.
  const fundamentalAllowed = (f: number) =>
    rangeError('', f, DESIGN_BOUNDS.fundamentalFrequency) === undefined;
  // The frequency ratio as typed (null once the carrier frequency is typed instead): a fraction is
  // kept and refused on this field, never rounded into another carrier (issue 10: 0.5 saved as 1).
  const [typedRatio, setTypedRatio] = useState<number | null>(null);
  const setRatio = (mf: number) => {
    setTypedRatio(mf);
    onChange({ carrierFrequency: mf * draft.fundamentalFrequency });
  };
  const setCarrier = (carrierFrequency: number) => {
    setTypedRatio(null);
    onChange({ carrierFrequency });
  };
  const carrierError = error('carrierFrequency');
  const ratioError =
    typedRatio === null ? undefined : rangeError('Frequency ratio mf', typedRatio, RATIO_BOUNDS);
  // The carrier's own message, in hertz with what was entered; a ratio typed in the mf box is
  // judged there instead (its message would otherwise quote a carrier the user never typed).
  const carrierRangeMessage =
    typedRatio !== null
      ? undefined
      : rangeError('Carrier frequency', draft.carrierFrequency, DESIGN_BOUNDS.carrierFrequency, {
          unit: 'Hz',
        });
  // A carrier in range that is not a whole multiple: the report needs a whole mf, and the page's
  // "Carrier as typed" panel analyses the carrier as typed (a ratio p/q over q periods).
  const asynchronous = typedRatio === null && hasAsynchronousCarrier(draft);
  const typedMultiple = draft.carrierFrequency / draft.fundamentalFrequency;
  const nearestWhole = Math.min(MAX_DESIGN_FREQUENCY_RATIO, Math.max(1, Math.round(typedMultiple)));
  const carrierMessage =
    typedRatio !== null
      ? undefined
      : (carrierRangeMessage ??
        (asynchronous
          ? `Carrier frequency ${formatNumber(draft.carrierFrequency, 9)} Hz is ${formatNumber(typedMultiple, 6)} times the fundamental, ${formatNumber(draft.fundamentalFrequency, 6)} Hz: the design report takes a whole multiple (1 to ${MAX_DESIGN_FREQUENCY_RATIO} times), the nearest being mf = ${nearestWhole} (${formatNumber(nearestWhole * draft.fundamentalFrequency, 9)} Hz), so set that to save the study; the panel "Carrier as typed" analyses ${formatNumber(draft.carrierFrequency, 9)} Hz as it is`
          : carrierError));
  // Synchronous carrier PWM: a new fundamental keeps the frequency ratio, so the carrier follows.
  const setFundamental = (f: number) =>
    onChange(
      isCarrierMethod(method) && Number.isFinite(ratio) && fundamentalAllowed(f)
        ? { fundamentalFrequency: f, carrierFrequency: ratio * f }
        : { fundamentalFrequency: f },
    );

  const body = (
    <>
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
              onChange={(e) =>
                set('overmodulation')(e.target.value as StudyDraft['overmodulation'])
              }
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
        <NumberField
          label="Fundamental frequency"
          unit="Hz"
          value={draft.fundamentalFrequency}
          {...limits('fundamentalFrequency', 'Fundamental frequency', draft.fundamentalFrequency, {
            unit: 'Hz',
          })}
          onChange={setFundamental}
        />
        {isCarrierMethod(method) ? (
          <>
            <SliderField
              label="Frequency ratio mf"
              value={
                Number.isFinite(ratio) ? ratio : draft.carrierFrequency / draft.fundamentalFrequency
              }
              min={SLIDERS.mf.min}
              max={SLIDERS.mf.max}
              step={1}
              hint={`carrier ÷ fundamental, ${rangeText(RATIO_BOUNDS)}${method === 'space-vector' ? ' (switching periods per fundamental period)' : '; odd values give quarter-wave symmetry'}`}
              error={ratioError}
              onChange={setRatio}
            />
            <NumberField
              label="Carrier frequency"
              unit="Hz"
              value={draft.carrierFrequency}
              hint={
                Number.isFinite(ratio)
                  ? `mf = ${ratio} · a whole multiple of the fundamental`
                  : 'a whole multiple of the fundamental'
              }
              error={carrierMessage}
              onChange={setCarrier}
            />
            {method !== 'space-vector' ? (
              <NumberField
                label="Carrier phase"
                unit="°"
                value={draft.carrierPhase}
                scale={RADIANS_TO_DEGREES}
                {...limits('modulation.carrierPhase', 'Carrier phase', draft.carrierPhase, DEGREES)}
                hint={`${rangeText(DESIGN_BOUNDS['modulation.carrierPhase'], DEGREES)}; 0 puts a carrier valley at the reference's positive peak`}
                onChange={set('carrierPhase')}
              />
            ) : null}
          </>
        ) : null}
      </fieldset>

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

      <fieldset disabled={readOnly} className="flex flex-col gap-3">
        <legend className="mb-1 text-sm font-semibold tracking-wide uppercase">
          {threePhase ? 'Output filter per phase (LC, star)' : 'Output filter (LC)'}
        </legend>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={draft.filterOn}
            onChange={(e) => set('filterOn')(e.target.checked)}
            className="accent-signal"
          />
          Include an LC output filter
        </label>
        {draft.filterOn ? (
          <>
            <div className="grid grid-cols-2 gap-3">
              <NumberField
                label="Filter L"
                unit="mH"
                value={draft.filterL}
                scale={1e3}
                {...limits('filter.l', 'Filter L', draft.filterL, { scale: 1e3, unit: 'mH' })}
                onChange={set('filterL')}
              />
              <NumberField
                label="Filter C"
                unit="µF"
                value={draft.filterC}
                scale={1e6}
                {...limits('filter.c', 'Filter C', draft.filterC, { scale: 1e6, unit: 'µF' })}
                onChange={set('filterC')}
              />
              <NumberField
                label="Damping R"
                unit="Ω"
                value={draft.filterR}
                {...limits('filter.rDamping', 'Damping R', draft.filterR, { unit: 'Ω' })}
                onChange={set('filterR')}
              />
              {draft.dampingPlacement === 'parallel-rc' ? (
                <NumberField
                  label="Damping C"
                  unit="µF"
                  value={draft.cDamping}
                  scale={1e6}
                  {...limits('filter.cDamping', 'Damping C', draft.cDamping, {
                    scale: 1e6,
                    unit: 'µF',
                  })}
                  onChange={set('cDamping')}
                />
              ) : null}
            </div>
            <FilterSizing draft={draft} onChange={onChange} carrier={isCarrierMethod(method)} />
            <SelectField
              label="Damping"
              value={draft.dampingPlacement}
              onChange={(e) =>
                set('dampingPlacement')(e.target.value as StudyDraft['dampingPlacement'])
              }
              error={error('filter.dampingPlacement')}
              options={DAMPING_OPTIONS}
            />
            {filterResonance !== undefined ? (
              <p className="text-xs text-ink-soft" data-testid="filter-resonance">
                Resonance {formatNumber(filterResonance)} Hz
                {Number.isFinite(ratio)
                  ? ` (carrier ${formatNumber(draft.carrierFrequency)} Hz)`
                  : ''}
              </p>
            ) : null}
          </>
        ) : null}
      </fieldset>

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
          </div>
        ) : null}
      </fieldset>
    </>
  );
  // Refusals no field above claims (the design as a whole, an option): listed at the top.
  const unclaimed = previewErrors.filter((e) => !claimed.has(e.field));
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

/** The stored pattern of a pattern study, read-only: its angles come from the elimination page. */
function PatternSummary({
  pattern,
  vdc,
  error,
}: {
  pattern: StoredPattern | null;
  vdc: number;
  error?: string | undefined;
}) {
  if (!pattern)
    return (
      <p role="alert" className="text-sm text-bad">
        {error ??
          'This study has no pattern: pick a point on the harmonic-elimination page and save it as a study.'}
      </p>
    );
  return (
    <div
      className="rounded border border-rule bg-panel px-3 py-2 text-sm"
      data-testid="she-pattern"
    >
      <p>
        {labelOf(PATTERN_KIND_OPTIONS, pattern.kind)} · DC level{' '}
        <span className="num">{formatNumber(vdc)} V</span>
        {pattern.eliminate?.length ? (
          <>
            {' '}
            · eliminates orders <span className="num">{pattern.eliminate.join(', ')}</span>
          </>
        ) : null}
        {pattern.fundamental !== undefined ? (
          <>
            {' '}
            · solved for <span className="num">{formatNumber(pattern.fundamental)} V</span>
          </>
        ) : null}
      </p>
      <table className="mt-2 w-full text-left text-xs" aria-label="First-quarter switching angles">
        <thead>
          <tr>
            <th className="font-semibold">Angle</th>
            <th className="font-semibold">degrees</th>
            <th className="font-semibold">radians</th>
          </tr>
        </thead>
        <tbody className="num">
          {pattern.angles.map((angle, k) => (
            <tr key={k}>
              <td>α{k + 1}</td>
              <td>{formatNumber(angle * RADIANS_TO_DEGREES, 6)}°</td>
              <td>{angle.toFixed(9)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-soft">
        The angles were solved on the harmonic-elimination page; pick another point there to change
        them. Name, note, fundamental frequency, load and filter can be edited here.
      </p>
      {error ? (
        <p role="alert" className="mt-1 text-xs text-bad">
          {error}
        </p>
      ) : null}
    </div>
  );
}
