import type { BridgeScheme } from '../carrier/sineTriangle.js';
import type { CarrierSampling } from '../carrier/CarrierSampling.js';
import type { DampingPlacement } from '../filter/LcFilterOptions.js';
import type { SheKind } from '../she/SheKind.js';
import type { SpaceVectorSampling } from '../space-vector/spaceVectorWaveforms.js';
import type {
  OvermodulationMethod,
  SpaceVectorSequenceKind,
  ZeroVectorClamping,
} from '../space-vector/spaceVectorTypes.js';
import type { ZeroSequence } from '../three-phase/ZeroSequence.js';

// The words a person reads for each option of the design model, one set for every layer (the
// dashboard's forms, the API's descriptions, the command line), keyed by the library's types so
// a value added to a type fails the type check until it has a label. The trade's names where
// there are some (DPWM, SVPWM, Holtz's two modes; glossary in docs/methods.md).

/** Labels of {@link BridgeScheme}. */
export const BRIDGE_SCHEME_LABELS: Readonly<Record<BridgeScheme, string>> = {
  bipolar: 'Bipolar (two-level, ±Vdc)',
  unipolar: 'Unipolar (three-level, +Vdc/0/−Vdc)',
};

/** Labels of {@link CarrierSampling}. */
export const CARRIER_SAMPLING_LABELS: Readonly<Record<CarrierSampling, string>> = {
  natural: 'Natural (exact intersections)',
  'regular-symmetric': 'Regular, symmetric',
  'regular-asymmetric': 'Regular, asymmetric',
};

/** Labels of {@link ZeroSequence}. */
export const ZERO_SEQUENCE_LABELS: Readonly<Record<ZeroSequence, string>> = {
  none: 'None (sine references, SPWM)',
  'third-harmonic': 'Third harmonic (1/6)',
  'min-max': 'Min-max (centred, equals SVPWM)',
  dpwm1: 'DPWM1: clamp 60° at the peaks',
  dpwm0: 'DPWM0: clamp 60°, leading 30°',
  dpwm2: 'DPWM2: clamp 60°, lagging 30°',
  'dpwm-max': 'DPWMMAX: clamp 120° to the top rail',
  'dpwm-min': 'DPWMMIN: clamp 120° to the bottom rail',
  azspwm1: 'AZSPWM1: active zero states, common mode ±Vdc/6',
  nspwm: 'NSPWM: near states, common mode ±Vdc/6 for ma ≥ 0.770',
};

/** Labels of {@link SpaceVectorSequenceKind}. */
export const SPACE_VECTOR_SEQUENCE_LABELS: Readonly<Record<SpaceVectorSequenceKind, string>> = {
  'seven-segment': 'Seven segments (continuous)',
  'five-segment': 'Five segments (clamped, discontinuous)',
};

/** Labels of {@link SpaceVectorSampling}. */
export const SPACE_VECTOR_SAMPLING_LABELS: Readonly<Record<SpaceVectorSampling, string>> = {
  symmetric: 'Regular, symmetric (once per period)',
  asymmetric: 'Regular, asymmetric (twice per period)',
};

/** Labels of {@link ZeroVectorClamping}. */
export const ZERO_VECTOR_CLAMPING_LABELS: Readonly<Record<ZeroVectorClamping, string>> = {
  'dpwm-min': 'DPWMMIN: always 000',
  'dpwm-max': 'DPWMMAX: always 111',
  dpwm0: 'DPWM0: 60° clamps leading the peaks by 30°',
  dpwm1: 'DPWM1: 60° clamps centred on the peaks',
  dpwm2: 'DPWM2: 60° clamps lagging the peaks by 30°',
  dpwm3: 'DPWM3: 30° clamps either side of DPWM1',
};

/** Labels of {@link OvermodulationMethod}. */
export const OVERMODULATION_METHOD_LABELS: Readonly<Record<OvermodulationMethod, string>> = {
  'two-mode': 'Two modes, continuous to six-step (Holtz)',
  'hexagon-limit': 'Clip to the hexagon',
};

/** Labels of {@link SheKind}. */
export const SHE_KIND_LABELS: Readonly<Record<SheKind, string>> = {
  bipolar: 'Two-level (bipolar)',
  staircase: 'Multilevel staircase',
};

/** Labels of {@link DampingPlacement}. */
export const DAMPING_PLACEMENT_LABELS: Readonly<Record<DampingPlacement, string>> = {
  'series-with-capacitor': 'R in series with C',
  'parallel-rc': 'R-C branch across C',
  'parallel-with-inductor': 'R across L',
};

/** The bridges a multilevel carrier modulation's `phaseCount` chooses, in the order forms list them. */
export const PHASE_COUNTS: readonly (1 | 3)[] = [3, 1];

/** Labels of {@link PHASE_COUNTS}. */
export const PHASE_COUNT_LABELS: Readonly<Record<1 | 3, string>> = {
  3: 'Three-phase (legs in star)',
  1: 'Single-phase (full bridge of two legs, or one cascaded string)',
};
