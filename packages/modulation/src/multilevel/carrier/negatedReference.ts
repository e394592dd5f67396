import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';

/** −reference, for the second leg of a full bridge or of an H-bridge cell (unipolar). */
export function negatedReference(reference: ReferenceSignal): ReferenceSignal {
  return { ...reference, value: (theta) => -reference.value(theta) };
}
