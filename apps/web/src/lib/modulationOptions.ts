// Option lists of the modulation model for every form of the dashboard.
import {
  BRIDGE_SCHEME_LABELS,
  BRIDGE_SCHEMES,
  CARRIER_SAMPLING_LABELS,
  CARRIER_SAMPLINGS,
  DAMPING_PLACEMENT_LABELS,
  DAMPING_PLACEMENTS,
  MODULATION_METHOD_LABELS,
  MODULATION_METHODS,
  MULTILEVEL_CARRIER_ARRANGEMENT_LABELS,
  MULTILEVEL_CARRIER_ARRANGEMENTS,
  MULTILEVEL_TOPOLOGIES,
  MULTILEVEL_TOPOLOGY_LABELS,
  MULTILEVEL_ZERO_SEQUENCES,
  OVERMODULATION_METHOD_LABELS,
  OVERMODULATION_METHODS,
  PHASE_COUNT_LABELS,
  PHASE_COUNTS,
  SHE_KIND_LABELS,
  SHE_KINDS,
  SPACE_VECTOR_SAMPLING_LABELS,
  SPACE_VECTOR_SAMPLINGS,
  SPACE_VECTOR_SEQUENCE_LABELS,
  SPACE_VECTOR_SEQUENCES,
  TIMER_ZERO_SEQUENCES,
  ZERO_SEQUENCE_LABELS,
  ZERO_SEQUENCES,
  ZERO_VECTOR_CLAMPING_LABELS,
  ZERO_VECTOR_CLAMPINGS,
} from '@pulsewright/modulation';

// The choices and their labels come from the library's lists, in its order (one vocabulary).

export interface Option<T extends string> {
  value: T;
  label: string;
}

const options = <T extends string>(
  values: readonly T[],
  labels: Readonly<Record<T, string>>,
): Option<T>[] => values.map((value) => ({ value, label: labels[value] }));

export const METHOD_OPTIONS = options(MODULATION_METHODS, MODULATION_METHOD_LABELS);
export const SCHEME_OPTIONS = options(BRIDGE_SCHEMES, BRIDGE_SCHEME_LABELS);
export const SAMPLING_OPTIONS = options(CARRIER_SAMPLINGS, CARRIER_SAMPLING_LABELS);
export const ZERO_SEQUENCE_OPTIONS = options(ZERO_SEQUENCES, ZERO_SEQUENCE_LABELS);
/** The zero sequences a timer table takes (not the reduced common-mode methods). */
export const TIMER_ZERO_SEQUENCE_OPTIONS = options(TIMER_ZERO_SEQUENCES, ZERO_SEQUENCE_LABELS);
export const SEQUENCE_OPTIONS = options(SPACE_VECTOR_SEQUENCES, SPACE_VECTOR_SEQUENCE_LABELS);
export const SPACE_VECTOR_SAMPLING_OPTIONS = options(
  SPACE_VECTOR_SAMPLINGS,
  SPACE_VECTOR_SAMPLING_LABELS,
);
export const CLAMPING_OPTIONS = options(ZERO_VECTOR_CLAMPINGS, ZERO_VECTOR_CLAMPING_LABELS);
export const OVERMODULATION_OPTIONS = options(OVERMODULATION_METHODS, OVERMODULATION_METHOD_LABELS);
export const PATTERN_KIND_OPTIONS = options(SHE_KINDS, SHE_KIND_LABELS);
export const DAMPING_OPTIONS = options(DAMPING_PLACEMENTS, DAMPING_PLACEMENT_LABELS);
export const MULTILEVEL_TOPOLOGY_OPTIONS = options(
  MULTILEVEL_TOPOLOGIES,
  MULTILEVEL_TOPOLOGY_LABELS,
);
/** Every arrangement; a form offers those its topology accepts (MULTILEVEL_CARRIERS_BY_TOPOLOGY). */
export const MULTILEVEL_CARRIER_OPTIONS = options(
  MULTILEVEL_CARRIER_ARRANGEMENTS,
  MULTILEVEL_CARRIER_ARRANGEMENT_LABELS,
);
/** A multilevel bridge's phase counts as a select's text values ('3', '1'), with the library's labels. */
export const PHASE_COUNT_OPTIONS = PHASE_COUNTS.map((count) => ({
  value: String(count) as `${typeof count}`,
  label: PHASE_COUNT_LABELS[count],
}));
/** The zero sequences of a three-phase multilevel bridge, with the two-level labels. */
export const MULTILEVEL_ZERO_SEQUENCE_OPTIONS = options(
  MULTILEVEL_ZERO_SEQUENCES,
  ZERO_SEQUENCE_LABELS,
);

/** The label of a value among options (the value itself when it is not listed). */
export function labelOf<T extends string>(list: readonly Option<T>[], value: T): string {
  return list.find((o) => o.value === value)?.label ?? value;
}
