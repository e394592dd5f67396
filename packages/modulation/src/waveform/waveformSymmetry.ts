import { HALF_PI, TAU } from '../math.js';
import type { Waveform } from './Waveform.js';

/**
 * Tolerance (radians) for matching an edge with its image under a symmetry: 4 ulp at 2π. An
 * edge off by that much moves any amplitude by at most |jump|·tolerance/π (the 1/n of the
 * coefficient cancels the n of the phase), below 1e-14 of the jump.
 */
export const SYMMETRY_TOLERANCE = 4 * Number.EPSILON * TAU;

/**
 * True when v(θ + π) = 2c − v(θ) for one constant c, to {@link SYMMETRY_TOLERANCE}: edge i + N/2
 * is edge i half a period on, and its level mirrors level i about c. Internal: the exact spectra
 * read each such pair once.
 */
export function hasHalfWaveSymmetry({ edges, levels }: Waveform): boolean {
  const count = edges.length;
  if (count < 2 || count % 2 === 1) return false;
  const half = count / 2;
  const levelSum = (levels[0] as number) + (levels[half] as number);
  for (let i = 0; i < half; i++) {
    if ((levels[i] as number) + (levels[i + half] as number) !== levelSum) return false;
    const gap = (edges[i + half] as number) - (edges[i] as number) - Math.PI;
    if (Math.abs(gap) > SYMMETRY_TOLERANCE) return false;
  }
  return true;
}

/**
 * True when v(θ + π) = c − v(θ) for the given constant c (`hasHalfWaveSymmetry` with the levels
 * mirrored about c/2): a leg voltage about zero (c = 0) or a 0/1 switching state (c = 1).
 */
export function hasHalfWaveSymmetryAbout(waveform: Waveform, sum: number): boolean {
  const half = waveform.levels.length / 2;
  return (
    hasHalfWaveSymmetry(waveform) &&
    (waveform.levels[0] as number) + (waveform.levels[half] as number) === sum
  );
}

/**
 * True when the S samples of one period (S even) at 2πj/S + π are exactly the negated samples at
 * 2πj/S, as the half-wave synthesis writes them.
 */
export function hasAntisymmetricHalves(samples: Float64Array): boolean {
  const half = samples.length / 2;
  if (samples.length % 2 === 1) return false;
  for (let j = 0; j < half; j++) if (samples[j + half] !== -(samples[j] as number)) return false;
  return true;
}

/**
 * How one waveform is another read backwards in angle: second(θ) = first(2α − θ) about the
 * axis α (see {@link waveformMirror}).
 */
export interface WaveformMirror {
  /** The axis α, radians: π/2 or 0 (the only ones tried). */
  axis: number;
  /** The second's edge (offset − i) mod N is the image 2α − θᵢ of the first's edge i. */
  offset: number;
}

/**
 * The axes {@link waveformMirror} tries: a carrier modulation's reference peaks at π/2 and its
 * carrier is symmetric about its peaks, so leg a of a three-phase bridge (and a single-phase
 * bridge) is its own mirror image about π/2, and leg c is leg b's (their references
 * sin(θ ∓ 2π/3) swap under θ → π − θ, and so do the zero sequences built from all three).
 * About 0 as well when the ratio is odd.
 */
const MIRROR_AXES = [HALF_PI, 0] as const;

/**
 * Whether `second` is `first` mirrored, second(θ) = first(2α − θ), about α = π/2 or 0: each
 * edge θᵢ of the first has an edge of the second at 2α − θᵢ (to {@link SYMMETRY_TOLERANCE}, round
 * the circle) and the level the first holds after θᵢ is the one the second holds before that
 * image. Reading a waveform backwards keeps its levels and reverses its edges, so a jump Δ at θ
 * becomes −Δ at 2α − θ. Pass one waveform twice to test its own mirror symmetry. Null when
 * neither axis fits (or either waveform has fewer than two edges). O(N). Internal: the exact
 * spectra read a mirror image from its original (`mirroredPhasors`) and a self-mirrored
 * waveform's edges once a pair.
 */
export function waveformMirror(first: Waveform, second: Waveform): WaveformMirror | null {
  const count = first.edges.length;
  if (count < 2 || second.edges.length !== count) return null;
  for (const axis of MIRROR_AXES) {
    const offset = mirrorOffset(first, second, axis);
    if (offset !== null) return { axis, offset };
  }
  return null;
}

/** The offset of {@link WaveformMirror} about `axis`, or null when the second is not the image. */
function mirrorOffset(first: Waveform, second: Waveform, axis: number): number | null {
  const count = first.edges.length;
  // The second's edge nearest the image of the first's edge 0 fixes the pairing.
  const image = 2 * axis - (first.edges[0] as number);
  let offset = 0;
  let nearest = Infinity;
  for (let k = 0; k < count; k++) {
    const gap = circularGap(second.edges[k] as number, image);
    if (gap < nearest) {
      nearest = gap;
      offset = k;
    }
  }
  for (let i = 0; i < count; i++) {
    const k = (((offset - i) % count) + count) % count;
    const gap = circularGap(second.edges[k] as number, 2 * axis - (first.edges[i] as number));
    if (gap > SYMMETRY_TOLERANCE) return null;
    // The first holds level i after edge i; the second holds it before edge k, i.e. from k − 1.
    if (second.levels[(k + count - 1) % count] !== first.levels[i]) return null;
  }
  return offset;
}

/** The distance between two angles round the circle, radians, in [0, π]. */
function circularGap(x: number, y: number): number {
  const gap = Math.abs(x - y) % TAU;
  return Math.min(gap, TAU - gap);
}
