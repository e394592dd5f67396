import type { ReferenceSignal } from '../../carrier/ReferenceSignal.js';
import type { Waveform } from '../../waveform/Waveform.js';

/**
 * One comparator of a multilevel modulator: 1 while `reference` is above the unit triangle
 * carrier delayed by `delay` carrier radians (on top of the options' `carrierPhase`), 0 below.
 */
export type CarrierComparator = (reference: ReferenceSignal, delay: number) => Waveform;
