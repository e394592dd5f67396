import {
  combineWaveforms,
  filteredSpectrum,
  harmonics,
  labelHarmonics,
  rlCurrentSeries,
  rlSteadyState,
  sheWaveform,
  sineReference,
  sineTriangle,
  spaceVectorWaveforms,
  thd,
  threePhase,
  threePhaseReference,
  triangleCarrier,
  wthd,
  TAU,
  type LabelledHarmonic,
  type RlLoadOptions,
  type RlSteadyState,
  type Waveform,
} from '@pulsewright/modulation';
import type { StudyDraft } from './studyDraft';

/** Everything the editor's charts draw, computed by the library from a draft. Plain data. */
export interface Preview {
  /** The analysed output voltage (volts) and its name. */
  output: Waveform;
  outputName: string;
  /** Reference and carrier sampled over one period for the modulator chart (per unit of the carrier peak); null without a modulator (a stored pattern). */
  modulator: { angles: number[]; reference: number[]; carrier: number[] | null } | null;
  /** Harmonics 0..maxOrder, labelled by carrier group and sideband. */
  spectrum: LabelledHarmonic[];
  maxOrder: number;
  thd: number;
  wthd: number;
  /** Fundamental amplitude, peak volts. */
  fundamental: number;
  load: { series: { angles: number[]; current: number[] }; steady: RlSteadyState; voltageName: string } | null;
  filtered: { spectrum: LabelledHarmonic[]; thd: number } | null;
}

/** A field the library refused, with its message (the library names the field). */
export interface PreviewFieldError {
  field: string;
  message: string;
}

/** The preview (null when the modulation itself was refused) and the fields the library refused. */
export interface PreviewOutcome {
  preview: Preview | null;
  errors: PreviewFieldError[];
}

/** Highest order analysed: past the third carrier group so its sidebands show. */
export function previewMaxOrder(mf: number): number {
  return Math.min(5000, Math.max(60, Math.ceil(3 * mf + 20)));
}

/** Highest order analysed for a harmonic-elimination pattern: well past the eliminated orders. */
export function patternMaxOrder(eliminate: readonly number[]): number {
  return Math.min(5000, Math.max(99, 2 * Math.max(0, ...eliminate) + 21));
}

/** The highest order a draft's preview (and the saved study's server spectrum) goes to. */
export function draftMaxOrder(draft: StudyDraft): number {
  return draft.method === 'selective-harmonic-elimination' ? patternMaxOrder(draft.she?.eliminate ?? []) : previewMaxOrder(draft.mf);
}

function fieldOf(error: unknown): string {
  const field = (error as { field?: unknown }).field;
  return typeof field === 'string' ? field : 'modulation';
}

function asFieldError(error: unknown, prefix = ''): PreviewFieldError {
  const message = error instanceof Error ? error.message : String(error);
  return { field: prefix + fieldOf(error), message };
}

interface Modulated {
  output: Waveform;
  outputName: string;
  loadVoltage: Waveform;
  loadVoltageName: string;
  reference: ((theta: number) => number) | null;
  carrier: ((theta: number) => number) | null;
  /** Carrier ratio for the spectrum's sideband labels. */
  labelRatio: number;
}

function modulate(draft: StudyDraft): Modulated {
  const { ma, mf, vdc } = draft;
  if (draft.method === 'sine-triangle') {
    const output = sineTriangle({ scheme: draft.scheme, ma, mf, vdc, sampling: draft.sampling });
    const reference = sineReference(ma);
    return {
      output,
      outputName: 'Bridge output',
      loadVoltage: output,
      loadVoltageName: 'bridge output',
      reference: reference.value,
      carrier: (theta) => triangleCarrier(theta, { mf }),
      labelRatio: mf,
    };
  }
  if (draft.method === 'selective-harmonic-elimination') {
    const she = draft.she ?? { kind: 'bipolar' as const, angles: [], eliminate: [] };
    const output = sheWaveform(she.angles, { kind: she.kind, vdc });
    const name = she.kind === 'staircase' ? 'Staircase output' : 'Bridge output';
    // No carrier: a ratio past every analysed order labels each harmonic by its order alone.
    const labelRatio = 2 * patternMaxOrder(she.eliminate) + 1;
    return { output, outputName: name, loadVoltage: output, loadVoltageName: name.toLowerCase(), reference: null, carrier: null, labelRatio };
  }
  if (draft.method === 'three-phase') {
    const result = threePhase({ ma, mf, vdc, zeroSequence: draft.zeroSequence, sampling: draft.sampling });
    const { a, b, c } = result.legs;
    // Phase voltage of a balanced star load: v_an = (2a − b − c)/3 (standard circuit analysis).
    const phase = combineWaveforms([a, b, c], ([va = 0, vb = 0, vc = 0]) => (2 * va - vb - vc) / 3);
    const reference = threePhaseReference(0, { ma, zeroSequence: draft.zeroSequence });
    return {
      output: result.lineToLine.ab,
      outputName: 'Line-to-line a−b',
      loadVoltage: phase,
      loadVoltageName: 'phase a of a star load',
      reference: reference.value,
      carrier: (theta) => triangleCarrier(theta, { mf }),
      labelRatio: mf,
    };
  }
  const result = spaceVectorWaveforms({ ma, vdc, frequencyRatio: mf, sequence: draft.sequence });
  const reference = sineReference(ma);
  return {
    output: result.ab,
    outputName: 'Line-to-line a−b',
    loadVoltage: result.an,
    loadVoltageName: 'phase a of a star load',
    reference: reference.value,
    carrier: null,
    labelRatio: mf,
  };
}

/**
 * Builds the live preview of a draft with the library: waveform, labelled spectrum, THD, WTHD,
 * the R-L load's steady-state current and the filtered spectrum. Errors come back per field.
 */
export function computePreview(draft: StudyDraft, { points = 1200 }: { points?: number } = {}): PreviewOutcome {
  let modulated: Modulated;
  try {
    modulated = modulate(draft);
  } catch (error) {
    return { preview: null, errors: [asFieldError(error)] };
  }
  const maxOrder = draftMaxOrder(draft);
  const raw = harmonics(modulated.output, maxOrder);
  const spectrum = labelHarmonics(raw, modulated.labelRatio);
  const fundamental = raw[1]?.amplitude ?? 0;
  let totalThd = Number.NaN;
  let weightedThd = Number.NaN;
  if (fundamental > 0) {
    totalThd = thd(raw);
    weightedThd = wthd(raw);
  }

  // Enough samples that each carrier cycle gets several points.
  const samples = Math.max(points, draft.mf * 8);
  const angles = Array.from({ length: samples + 1 }, (_, k) => (TAU * k) / samples);
  const { reference, carrier } = modulated;
  const modulator = reference ? { angles, reference: angles.map((t) => reference(t)), carrier: carrier ? angles.map((t) => carrier(t)) : null } : null;

  const errors: PreviewFieldError[] = [];
  let load: Preview['load'] = null;
  try {
    const options: RlLoadOptions = {
      r: draft.r,
      l: draft.l,
      frequency: draft.frequency,
      ...(draft.emf > 0 ? { emf: { amplitude: draft.emf, phase: draft.emfPhase } } : {}),
    };
    load = {
      series: rlCurrentSeries(modulated.loadVoltage, { ...options, points: Math.max(1000, draft.mf * 16) }),
      steady: rlSteadyState(modulated.loadVoltage, options),
      voltageName: modulated.loadVoltageName,
    };
  } catch (error) {
    errors.push(asFieldError(error));
  }

  let filtered: Preview['filtered'] = null;
  if (draft.filterOn) {
    try {
      const out = filteredSpectrum(raw, { filter: { l: draft.filterL, c: draft.filterC, rDamping: draft.filterR }, fundamentalFrequency: draft.frequency });
      filtered = { spectrum: labelHarmonics(out, modulated.labelRatio), thd: (out[1]?.amplitude ?? 0) > 0 ? thd(out) : Number.NaN };
    } catch (error) {
      errors.push(asFieldError(error, 'filter.'));
    }
  }
  return {
    errors,
    preview: {
      output: modulated.output,
      outputName: modulated.outputName,
      modulator,
      spectrum,
      maxOrder,
      thd: totalThd,
      wthd: weightedThd,
      fundamental,
      load,
      filtered,
    },
  };
}
