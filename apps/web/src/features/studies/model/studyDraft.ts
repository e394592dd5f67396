import {
  spaceVectorWaveforms,
  type BridgeScheme,
  type CarrierSampling,
  type SpaceVectorSequenceKind,
  type ZeroSequence,
} from '@pulsewright/modulation';
import type { Study, StudyCreate } from '../api/studies';

/** Methods the editor offers. The API's spec names the modulation by `method`. */
export type StudyMethod = 'sine-triangle' | 'three-phase' | 'space-vector' | 'selective-harmonic-elimination';
export type Scheme = BridgeScheme;
export type Sampling = CarrierSampling;
export type ZeroSequenceChoice = ZeroSequence;
export type SvSequence = SpaceVectorSequenceKind;

/** A solved harmonic-elimination pattern: it is picked on the elimination page, not edited here. */
export interface ShePattern {
  kind: 'bipolar' | 'staircase';
  /** First-quarter switching angles, radians, ascending in (0, π/2). */
  angles: number[];
  /** Odd orders the angles were solved to eliminate. */
  eliminate: number[];
  /** The fundamental they were solved for, peak volts (when one was set). */
  fundamental?: number;
}

/** The editor's state: every field of a study, in the units the form shows. */
export interface StudyDraft {
  name: string;
  note: string;
  projectId: string;
  method: StudyMethod;
  scheme: Scheme;
  sampling: Sampling;
  zeroSequence: ZeroSequenceChoice;
  sequence: SvSequence;
  /** The pattern of a harmonic-elimination study (null for the other methods). */
  she: ShePattern | null;
  /** DC bus, volts. */
  vdc: number;
  ma: number;
  mf: number;
  /** Fundamental frequency, hertz. */
  frequency: number;
  /** Load resistance, ohm. */
  r: number;
  /** Load inductance, henry (the form shows millihenry). */
  l: number;
  /** Back-EMF e = emf·sin(θ + emfPhase): peak volts and radians. */
  emf: number;
  emfPhase: number;
  filterOn: boolean;
  /** Filter inductance, henry; capacitance, farad; damping resistance, ohm. */
  filterL: number;
  filterC: number;
  filterR: number;
}

/** Allowed ranges, the same as the API document's (apps/api/openapi.yaml). */
export const RANGES = {
  vdc: { min: 1, max: 100_000, step: 1, label: 'DC bus', unit: 'V' },
  ma: { min: 0.01, max: 4, step: 0.01, label: 'Modulation index ma', unit: '' },
  mf: { min: 1, max: 1000, step: 1, label: 'Frequency ratio mf', unit: '' },
  frequency: { min: 0.1, max: 100_000, step: 0.1, label: 'Fundamental', unit: 'Hz' },
  r: { min: 0.001, max: 1_000_000, step: 0.1, label: 'Load R', unit: 'Ω' },
  lMilli: { min: 0.001, max: 100_000, step: 0.1, label: 'Load L', unit: 'mH' },
  emf: { min: 0, max: 100_000, step: 1, label: 'Back-EMF', unit: 'V peak' },
  emfPhaseDegrees: { min: -360, max: 360, step: 1, label: 'Back-EMF phase', unit: '°' },
  filterLMilli: { min: 0.001, max: 100_000, step: 0.01, label: 'Filter L', unit: 'mH' },
  filterCMicro: { min: 0.001, max: 1_000_000, step: 0.1, label: 'Filter C', unit: 'µF' },
  filterR: { min: 0, max: 1_000_000, step: 0.1, label: 'Filter damping R', unit: 'Ω' },
} as const;

/** Sliders cover the useful part of each range; the number box accepts the whole range. */
export const SLIDER_LIMITS = { ma: { min: 0.02, max: 1.5 }, mf: { min: 1, max: 201 }, vdc: { min: 10, max: 1000 } } as const;

export const METHOD_OPTIONS = [
  { value: 'sine-triangle', label: 'Sine-triangle, single-phase bridge' },
  { value: 'three-phase', label: 'Three-phase carrier with zero sequence' },
  { value: 'space-vector', label: 'Space vector (regular sampled)' },
] as const;

/** Shown only for a study saved from the harmonic-elimination page (its angles come from there). */
export const SHE_METHOD_OPTION = { value: 'selective-harmonic-elimination', label: 'Harmonic elimination (solved angles)' } as const;

/** Space vector's ma = 2m/√3 ends at six-step, 4/π (the API document's bound). */
export const SPACE_VECTOR_MA_MAX = 1.2732395447351628;

export const ZERO_SEQUENCE_OPTIONS: { value: ZeroSequenceChoice; label: string }[] = [
  { value: 'none', label: 'None (pure sine)' },
  { value: 'third-harmonic', label: 'Third harmonic (1/6)' },
  { value: 'min-max', label: 'Min-max (centred)' },
  { value: 'clamp-60-peak', label: 'Clamp 60° at peaks' },
  { value: 'clamp-60-lead', label: 'Clamp 60° leading' },
  { value: 'clamp-60-lag', label: 'Clamp 60° lagging' },
  { value: 'clamp-120-top', label: 'Clamp 120° to top rail' },
  { value: 'clamp-120-bottom', label: 'Clamp 120° to bottom rail' },
];

export function defaultDraft(projectId = ''): StudyDraft {
  return {
    name: 'New study',
    note: '',
    projectId,
    method: 'sine-triangle',
    scheme: 'bipolar',
    sampling: 'natural',
    zeroSequence: 'none',
    sequence: 'seven-segment',
    she: null,
    vdc: 400,
    ma: 0.8,
    mf: 21,
    frequency: 50,
    r: 10,
    l: 0.02,
    emf: 0,
    emfPhase: 0,
    filterOn: false,
    filterL: 0.002,
    filterC: 20e-6,
    filterR: 0,
  };
}

const num = (value: unknown, fallback: number) => (typeof value === 'number' && Number.isFinite(value) ? value : fallback);
const str = <T extends string>(value: unknown, fallback: T): T => (typeof value === 'string' ? (value as T) : fallback);

/** Reads a stored study back into the editor's state. */
export function draftFromStudy(study: Pick<Study, 'name' | 'note' | 'projectId' | 'modulation' | 'load' | 'filter'>): StudyDraft {
  const base = defaultDraft(study.projectId);
  const m = study.modulation as Record<string, unknown>;
  const numbers = (value: unknown): number[] => (Array.isArray(value) ? value.filter((x): x is number => typeof x === 'number') : []);
  const she: ShePattern | null =
    m.method === 'selective-harmonic-elimination'
      ? {
          kind: m.kind === 'staircase' ? 'staircase' : 'bipolar',
          angles: numbers(m.angles),
          eliminate: numbers(m.eliminate),
          ...(typeof m.fundamental === 'number' ? { fundamental: m.fundamental } : {}),
        }
      : null;
  return {
    ...base,
    name: study.name,
    note: study.note ?? '',
    method: str(m.method, base.method),
    scheme: str(m.scheme, base.scheme),
    sampling: str(m.sampling, base.sampling),
    zeroSequence: str(m.zeroSequence, base.zeroSequence),
    sequence: str(m.sequence, base.sequence),
    she,
    vdc: num(m.vdc, base.vdc),
    ma: num(m.ma, spaceVectorMa(m) ?? base.ma),
    mf: num(m.mf, num(m.frequencyRatio, base.mf)),
    frequency: num(study.load?.frequency, base.frequency),
    r: num(study.load?.r, base.r),
    l: num(study.load?.l, base.l),
    emf: num(study.load?.emf?.amplitude, 0),
    emfPhase: num(study.load?.emf?.phase, 0),
    filterOn: Boolean(study.filter),
    filterL: num(study.filter?.l, base.filterL),
    filterC: num(study.filter?.c, base.filterC),
    filterR: num(study.filter?.rDamping, 0),
  };
}

/** A space-vector study stored with m (scripts may send it) read as ma, by the library. */
function spaceVectorMa(m: Record<string, unknown>): number | undefined {
  if (m.method !== 'space-vector' || typeof m.m !== 'number') return undefined;
  try {
    return spaceVectorWaveforms({ m: m.m, vdc: 1, frequencyRatio: 1 }).ma;
  } catch {
    return undefined;
  }
}

/** The modulation object sent to the API for this draft. */
export function modulationOf(draft: StudyDraft): Record<string, unknown> {
  const { method, ma, mf, vdc } = draft;
  if (method === 'sine-triangle') return { method, scheme: draft.scheme, ma, mf, vdc, sampling: draft.sampling };
  if (method === 'three-phase') return { method, ma, mf, vdc, zeroSequence: draft.zeroSequence, sampling: draft.sampling };
  if (method === 'selective-harmonic-elimination') {
    const she = draft.she ?? { kind: 'bipolar', angles: [], eliminate: [] };
    return { method, kind: she.kind, vdc, angles: she.angles, eliminate: she.eliminate, ...(she.fundamental !== undefined ? { fundamental: she.fundamental } : {}) };
  }
  return { method, ma, vdc, frequencyRatio: mf, sequence: draft.sequence };
}

/** The body of a create (and, with baseRevision, an update). */
export function studyContentOf(draft: StudyDraft): StudyCreate {
  return {
    projectId: draft.projectId,
    name: draft.name,
    note: draft.note,
    // Built per method above; the API document types `modulation` as a union by `method`.
    modulation: modulationOf(draft) as StudyCreate['modulation'],
    // The load also carries the fundamental frequency, so it is always sent.
    load: { r: draft.r, l: draft.l, frequency: draft.frequency, ...(draft.emf > 0 ? { emf: { amplitude: draft.emf, phase: draft.emfPhase } } : {}) },
    filter: draft.filterOn ? { l: draft.filterL, c: draft.filterC, rDamping: draft.filterR } : null,
  };
}

/** Fields outside the ranges the API accepts, with the allowed range in words. */
export function draftRangeErrors(draft: StudyDraft): { field: string; message: string }[] {
  const errors: { field: string; message: string }[] = [];
  const check = (field: string, value: number, min: number, max: number, unit: string, { integer = false, minExclusive = false } = {}) => {
    const low = minExclusive ? value <= min : value < min;
    if (!Number.isFinite(value) || low || value > max || (integer && !Number.isInteger(value))) {
      errors.push({ field, message: `${field} must be ${integer ? 'a whole number ' : ''}${minExclusive ? 'above' : 'from'} ${min} up to ${max}${unit ? ` ${unit}` : ''}; got ${value}` });
    }
  };
  if (!draft.name.trim()) errors.push({ field: 'name', message: 'name must not be empty' });
  if (!draft.projectId) errors.push({ field: 'projectId', message: 'choose a project for the study' });
  check('vdc', draft.vdc, 0, 100_000, 'V', { minExclusive: true });
  if (draft.method === 'selective-harmonic-elimination') {
    if (!draft.she?.angles.length) errors.push({ field: 'angles', message: 'a harmonic-elimination study needs its solved angles (pick a point on the elimination page)' });
  } else {
    check('ma', draft.ma, 0, draft.method === 'space-vector' ? SPACE_VECTOR_MA_MAX : 4, '', { minExclusive: true });
    check('mf', draft.mf, 1, 1000, '', { integer: true });
  }
  check('frequency', draft.frequency, 0, 100_000, 'Hz', { minExclusive: true });
  check('r', draft.r, 0, 1_000_000, 'Ω', { minExclusive: true });
  check('l', draft.l, 0, 100, 'H', { minExclusive: true });
  check('emf', draft.emf, 0, 100_000, 'V');
  check('emfPhase', draft.emfPhase, -2 * Math.PI, 2 * Math.PI, 'rad');
  if (draft.filterOn) {
    check('filter.l', draft.filterL, 0, 100, 'H', { minExclusive: true });
    check('filter.c', draft.filterC, 0, 1, 'F', { minExclusive: true });
    check('filter.rDamping', draft.filterR, 0, 1_000_000, 'Ω');
  }
  return errors;
}
