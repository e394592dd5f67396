import type { TimerZeroSequence } from '@pulsewright/modulation';

/** The controller-tables form as typed: frequencies in Hz, times in ns, DC bus in V. */
export interface TimerFormState {
  method: 'sine-triangle' | 'three-phase';
  scheme: 'bipolar' | 'unipolar';
  zeroSequence: TimerZeroSequence;
  ma: number;
  fundamentalFrequency: number;
  carrierFrequency: number;
  timerClock: number;
  countingMode: 'centre-aligned' | 'edge-aligned';
  counterBits: number;
  deadTimeNs: number;
  minPulseNs: number;
  vdc: number;
  /** Device on-state drops, V (0 and 0: ideal switches). */
  transistorDropV: number;
  diodeDropV: number;
  /** Prefix of the C header's names. */
  prefix: string;
}
