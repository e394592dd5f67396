// Option lists of the modulation model for every form of the dashboard.
import {
  BRIDGE_SCHEMES,
  CARRIER_SAMPLINGS,
  DAMPING_PLACEMENTS,
  MODULATION_METHOD_LABELS,
  MODULATION_METHODS,
  OVERMODULATION_METHODS,
  SHE_KINDS,
  SPACE_VECTOR_SEQUENCES,
  ZERO_SEQUENCES,
  ZERO_VECTOR_CLAMPINGS,
  type BridgeScheme,
  type CarrierSampling,
  type DampingPlacement,
  type OvermodulationMethod,
  type SheKind,
  type SpaceVectorSampling,
  type SpaceVectorSequenceKind,
  type ZeroSequence,
  type ZeroVectorClamping,
} from '@pulsewright/modulation';

// The choices come from the library's lists, in its order; only the words a person reads are
// the dashboard's, keyed by the library's types so a value added there fails the type check here.

export interface Option<T extends string> {
  value: T;
  label: string;
}

const options = <T extends string>(
  values: readonly T[],
  labels: Readonly<Record<T, string>>,
): Option<T>[] => values.map((value) => ({ value, label: labels[value] }));

export const METHOD_OPTIONS = options(MODULATION_METHODS, MODULATION_METHOD_LABELS);

export const SCHEME_OPTIONS = options<BridgeScheme>(BRIDGE_SCHEMES, {
  bipolar: 'Bipolar (two-level, ±Vdc)',
  unipolar: 'Unipolar (three-level, +Vdc/0/−Vdc)',
});

export const SAMPLING_OPTIONS = options<CarrierSampling>(CARRIER_SAMPLINGS, {
  natural: 'Natural (exact intersections)',
  'regular-symmetric': 'Regular, symmetric',
  'regular-asymmetric': 'Regular, asymmetric',
});

export const ZERO_SEQUENCE_OPTIONS = options<ZeroSequence>(ZERO_SEQUENCES, {
  none: 'None (sine references, SPWM)',
  'third-harmonic': 'Third harmonic (1/6)',
  'min-max': 'Min-max (centred, equals SVPWM)',
  dpwm1: 'DPWM1: clamp 60° at the peaks',
  dpwm0: 'DPWM0: clamp 60°, leading 30°',
  dpwm2: 'DPWM2: clamp 60°, lagging 30°',
  'dpwm-max': 'DPWMMAX: clamp 120° to the top rail',
  'dpwm-min': 'DPWMMIN: clamp 120° to the bottom rail',
});

export const SEQUENCE_OPTIONS = options<SpaceVectorSequenceKind>(SPACE_VECTOR_SEQUENCES, {
  'seven-segment': 'Seven segments (continuous)',
  'five-segment': 'Five segments (clamped, discontinuous)',
});

// The library keeps its list of space-vector samplings private; the record below has one entry per value of its type.
const SPACE_VECTOR_SAMPLING_LABELS: Readonly<Record<SpaceVectorSampling, string>> = {
  symmetric: 'Regular, symmetric (once per period)',
  asymmetric: 'Regular, asymmetric (twice per period)',
};
export const SPACE_VECTOR_SAMPLING_OPTIONS = options(
  Object.keys(SPACE_VECTOR_SAMPLING_LABELS) as SpaceVectorSampling[],
  SPACE_VECTOR_SAMPLING_LABELS,
);

export const CLAMPING_OPTIONS = options<ZeroVectorClamping>(ZERO_VECTOR_CLAMPINGS, {
  'dpwm-min': 'DPWMMIN: always 000',
  'dpwm-max': 'DPWMMAX: always 111',
  dpwm0: 'DPWM0: 60° clamps leading the peaks by 30°',
  dpwm1: 'DPWM1: 60° clamps centred on the peaks',
  dpwm2: 'DPWM2: 60° clamps lagging the peaks by 30°',
  dpwm3: 'DPWM3: 30° clamps either side of DPWM1',
});

export const OVERMODULATION_OPTIONS = options<OvermodulationMethod>(OVERMODULATION_METHODS, {
  'two-mode': 'Two modes, continuous to six-step (Holtz)',
  'hexagon-limit': 'Clip to the hexagon',
});

export const PATTERN_KIND_OPTIONS = options<SheKind>(SHE_KINDS, {
  bipolar: 'Two-level (bipolar)',
  staircase: 'Multilevel staircase',
});

export const DAMPING_OPTIONS = options<DampingPlacement>(DAMPING_PLACEMENTS, {
  'series-with-capacitor': 'R in series with C',
  'parallel-rc': 'R-C branch across C',
  'parallel-with-inductor': 'R across L',
});

/** The label of a value among options (the value itself when it is not listed). */
export function labelOf<T extends string>(list: readonly Option<T>[], value: T): string {
  return list.find((o) => o.value === value)?.label ?? value;
}
