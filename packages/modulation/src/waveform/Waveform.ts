/**
 * One fundamental period of a piecewise-constant voltage, exact (no sampling).
 *
 * - `edges`: switching angles in radians, in [0, 2π), strictly ascending, at least one.
 * - `levels[i]`: the voltage (volts) held from `edges[i]` to `edges[i + 1]`; the last level
 *   wraps round to `edges[0] + 2π`.
 *
 * Any literal of this shape is a valid input to the library's functions.
 */
export interface Waveform {
  edges: number[];
  levels: number[];
}
