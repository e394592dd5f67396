import { fieldErrorOf } from '../../../lib/api';
import { SelectField, SliderField, TextField } from '../../../components/ui/Field';
import type { Project } from '../api/studies';
import type { PreviewFieldError } from '../model/computePreview';
import { formatNumber } from '../../../lib/format';
import { METHOD_OPTIONS, RANGES, SHE_METHOD_OPTION, SLIDER_LIMITS, ZERO_SEQUENCE_OPTIONS, type ShePattern, type StudyDraft } from '../model/studyDraft';

export interface StudyFormProps {
  draft: StudyDraft;
  onChange: (patch: Partial<StudyDraft>) => void;
  readOnly: boolean;
  projects: readonly Project[];
  /** The server's answer to the last save (problem+json field errors). */
  saveError: unknown;
  /** What the library refused in the live preview. */
  previewErrors: readonly PreviewFieldError[];
}

const rangeHint = (r: { min: number; max: number }, unit = '') => `${r.min} to ${r.max}${unit ? ` ${unit}` : ''}`;

/** The study's parameters with units and ranges; errors from the server and the library beside each field. */
export function StudyForm({ draft, onChange, readOnly, projects, saveError, previewErrors }: StudyFormProps) {
  const error = (field: string, ...serverPaths: string[]) =>
    [field, ...serverPaths].map((p) => fieldErrorOf(saveError, p)).find(Boolean) ?? previewErrors.find((e) => e.field === field)?.message;
  const set = <K extends keyof StudyDraft>(key: K) => (value: StudyDraft[K]) => onChange({ [key]: value } as Partial<StudyDraft>);
  const isPattern = draft.method === 'selective-harmonic-elimination';
  const isCarrier = draft.method === 'sine-triangle' || draft.method === 'three-phase';
  // A stored pattern keeps its method in the list; it cannot be chosen for a new study.
  const methodOptions = isPattern || draft.she ? [...METHOD_OPTIONS, SHE_METHOD_OPTION] : METHOD_OPTIONS;

  return (
    <form className="flex flex-col gap-4" onSubmit={(e) => e.preventDefault()} aria-label="Study parameters">
      <fieldset disabled={readOnly} className="flex flex-col gap-3">
        <legend className="mb-1 text-sm font-semibold uppercase tracking-wide">Study</legend>
        <TextField label="Name" value={draft.name} onChange={(e) => set('name')(e.target.value)} error={error('name')} maxLength={120} required />
        <SelectField
          label="Project"
          value={draft.projectId}
          onChange={(e) => set('projectId')(e.target.value)}
          error={error('projectId')}
          options={[{ value: '', label: projects.length ? 'Choose a project…' : 'No projects yet' }, ...projects.map((p) => ({ value: p.id, label: p.name }))]}
        />
        <TextField label="Note" value={draft.note} onChange={(e) => set('note')(e.target.value)} error={error('note')} maxLength={2000} />
      </fieldset>

      <fieldset disabled={readOnly} className="flex flex-col gap-3">
        <legend className="mb-1 text-sm font-semibold uppercase tracking-wide">Modulation</legend>
        <SelectField label="Method" value={draft.method} onChange={(e) => set('method')(e.target.value as StudyDraft['method'])} error={error('method')} options={methodOptions} />
        {isPattern ? <PatternSummary pattern={draft.she} vdc={draft.vdc} error={error('angles', 'modulation.angles', 'modulation.eliminate', 'modulation.kind')} /> : null}
        {draft.method === 'sine-triangle' ? (
          <SelectField
            label="Bridge scheme"
            value={draft.scheme}
            onChange={(e) => set('scheme')(e.target.value as StudyDraft['scheme'])}
            error={error('scheme')}
            options={[
              { value: 'bipolar', label: 'Bipolar (two-level, ±Vdc)' },
              { value: 'unipolar', label: 'Unipolar (three-level, +Vdc/0/−Vdc)' },
            ]}
          />
        ) : null}
        {draft.method === 'three-phase' ? (
          <SelectField label="Zero sequence" value={draft.zeroSequence} onChange={(e) => set('zeroSequence')(e.target.value as StudyDraft['zeroSequence'])} error={error('zeroSequence')} options={ZERO_SEQUENCE_OPTIONS} />
        ) : null}
        {draft.method === 'space-vector' ? (
          <SelectField
            label="Switching sequence"
            value={draft.sequence}
            onChange={(e) => set('sequence')(e.target.value as StudyDraft['sequence'])}
            error={error('sequence')}
            options={[
              { value: 'seven-segment', label: 'Seven segments (continuous)' },
              { value: 'five-segment', label: 'Five segments (clamped)' },
            ]}
          />
        ) : null}
        {isCarrier ? (
          <SelectField
            label="Sampling"
            value={draft.sampling}
            onChange={(e) => set('sampling')(e.target.value as StudyDraft['sampling'])}
            error={error('sampling')}
            options={[
              { value: 'natural', label: 'Natural (exact intersections)' },
              { value: 'regular-symmetric', label: 'Regular, symmetric' },
              { value: 'regular-asymmetric', label: 'Regular, asymmetric' },
            ]}
          />
        ) : null}
        {isPattern ? null : (
          <>
            <SliderField label="DC bus" unit="V" value={draft.vdc} min={SLIDER_LIMITS.vdc.min} max={SLIDER_LIMITS.vdc.max} step={1} hint={rangeHint(RANGES.vdc, 'V')} error={error('vdc')} onChange={set('vdc')} />
            <SliderField
              label="Modulation index ma"
              value={draft.ma}
              min={SLIDER_LIMITS.ma.min}
              max={draft.method === 'space-vector' ? Math.min(SLIDER_LIMITS.ma.max, 1.27) : SLIDER_LIMITS.ma.max}
              step={0.01}
              hint={draft.method === 'space-vector' ? 'ma = 2m/√3, above 0 up to 4/π ≈ 1.273 (six-step); above 2/√3 ≈ 1.155 is overmodulation' : 'above 0, up to 4; above 1 is overmodulation'}
              error={error('ma', 'm', 'modulation.ma', 'modulation.m')}
              onChange={set('ma')}
            />
            <SliderField label="Frequency ratio mf" value={draft.mf} min={SLIDER_LIMITS.mf.min} max={SLIDER_LIMITS.mf.max} step={1} hint={draft.method === 'space-vector' ? 'switching periods per fundamental period, whole number, 1 to 1000' : 'whole number, 1 to 1000; odd values give quarter-wave symmetry'} error={error('mf', 'frequencyRatio', 'modulation.frequencyRatio')} onChange={(v) => set('mf')(Math.round(v))} />
          </>
        )}
      </fieldset>

      <fieldset disabled={readOnly} className="flex flex-col gap-3">
        <legend className="mb-1 text-sm font-semibold uppercase tracking-wide">Load (series R-L)</legend>
        <div className="grid grid-cols-2 gap-3">
          <NumberField label="Fundamental" unit="Hz" value={draft.frequency} range={RANGES.frequency} error={error('frequency', 'load.frequency')} onChange={set('frequency')} />
          <NumberField label="Resistance R" unit="Ω" value={draft.r} range={RANGES.r} error={error('r', 'load.r')} onChange={set('r')} />
          <NumberField label="Inductance L" unit="mH" value={draft.l * 1e3} range={RANGES.lMilli} error={error('l', 'load.l')} onChange={(v) => set('l')(v / 1e3)} />
          <NumberField label="Back-EMF" unit="V peak" value={draft.emf} range={RANGES.emf} error={error('emf', 'load.emf.amplitude', 'amplitude')} onChange={set('emf')} />
          <NumberField label="Back-EMF phase" unit="°" value={(draft.emfPhase * 180) / Math.PI} range={RANGES.emfPhaseDegrees} error={error('emfPhase', 'load.emf.phase', 'phase')} onChange={(v) => set('emfPhase')((v * Math.PI) / 180)} />
        </div>
      </fieldset>

      <fieldset disabled={readOnly} className="flex flex-col gap-3">
        <legend className="mb-1 text-sm font-semibold uppercase tracking-wide">Output filter (LC)</legend>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={draft.filterOn} onChange={(e) => set('filterOn')(e.target.checked)} className="accent-signal" />
          Include an LC output filter
        </label>
        {draft.filterOn ? (
          <div className="grid grid-cols-2 gap-3">
            <NumberField label="Filter L" unit="mH" value={draft.filterL * 1e3} range={RANGES.filterLMilli} error={error('filter.l', 'filter.l')} onChange={(v) => set('filterL')(v / 1e3)} />
            <NumberField label="Filter C" unit="µF" value={draft.filterC * 1e6} range={RANGES.filterCMicro} error={error('filter.c', 'filter.c')} onChange={(v) => set('filterC')(v / 1e6)} />
            <NumberField label="Damping R" unit="Ω" value={draft.filterR} range={RANGES.filterR} error={error('filter.rDamping', 'filter.r')} onChange={set('filterR')} />
          </div>
        ) : null}
      </fieldset>
    </form>
  );
}

/** The stored pattern of a harmonic-elimination study, read-only: its angles come from the elimination page. */
function PatternSummary({ pattern, vdc, error }: { pattern: ShePattern | null; vdc: number; error?: string | undefined }) {
  if (!pattern) return <p role="alert" className="text-sm text-bad">{error ?? 'This study has no pattern.'}</p>;
  return (
    <div className="rounded border border-rule bg-panel px-3 py-2 text-sm" data-testid="she-pattern">
      <p>
        {pattern.kind === 'staircase' ? 'Multilevel staircase' : 'Two-level (bipolar)'} · DC level <span className="num">{formatNumber(vdc)} V</span>
        {pattern.eliminate.length ? <> · eliminates orders <span className="num">{pattern.eliminate.join(', ')}</span></> : null}
        {pattern.fundamental !== undefined ? <> · solved for <span className="num">{formatNumber(pattern.fundamental)} V</span></> : null}
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
              <td>{formatNumber((angle * 180) / Math.PI, 6)}°</td>
              <td>{angle.toFixed(9)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-soft">The angles were solved on the harmonic-elimination page; pick another point there to change them. Name, note, load and filter can be edited here.</p>
      {error ? <p role="alert" className="mt-1 text-xs text-bad">{error}</p> : null}
    </div>
  );
}

function NumberField({ label, unit, value, range, error, onChange }: { label: string; unit: string; value: number; range: { min: number; max: number; step: number }; error?: string | undefined; onChange: (v: number) => void }) {
  return (
    <TextField
      label={label}
      unit={unit}
      type="number"
      inputMode="decimal"
      step={range.step}
      defaultValue={Number(value.toPrecision(8))}
      key={value}
      hint={rangeHint(range)}
      error={error}
      className="num"
      onBlur={(e) => {
        const n = Number(e.target.value);
        if (e.target.value.trim() !== '' && Number.isFinite(n)) onChange(n);
      }}
      onKeyDown={(e) => {
        if (e.key === 'Enter') {
          const n = Number((e.target as HTMLInputElement).value);
          if (Number.isFinite(n)) onChange(n);
        }
      }}
    />
  );
}
