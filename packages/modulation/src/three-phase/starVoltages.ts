import type { Waveform } from '../waveform/Waveform.js';
import { waveformFromAscending } from '../waveform/waveformFromAscending.js';

/** The voltages three legs set across a balanced star load, from {@link starVoltages}. */
export interface StarVoltages {
  /** Each phase to the star point, (2·v_k − v_k+1 − v_k+2)/3, phases a, b, c (volts). */
  phases: [Waveform, Waveform, Waveform];
  /** The lines v_k − v_k+1: a−b, b−c, c−a (volts). */
  lines: [Waveform, Waveform, Waveform];
  /** The star point to the legs' reference (the DC midpoint), (v_a + v_b + v_c)/3 (volts). */
  commonMode: Waveform;
}

/** Bits of {@link starVoltages}' merged edges: which legs change there. */
const LEG_A = 1;
const LEG_B = 2;
const LEG_C = 4;

/**
 * The phase, line and common-mode voltages of three leg voltages (to one reference: a two-level
 * leg's to the DC midpoint, a cascaded string's to its neutral end) feeding a balanced star
 * load, exact (standard circuit analysis: the star point sits at the legs' mean). One merge of
 * the three legs' edges serves all seven waveforms; each is then canonicalised from the merged
 * edges where its own legs change, as `combineWaveforms` of those legs canonicalises (the same
 * edges, clusters and levels, bit for bit: a line's waveform never sees the third leg's edges).
 * Internal: the design report's voltages and `spaceVectorWaveforms` read it.
 * @param legs - legs a, b, c, valid waveforms over the same period
 */
export function starVoltages(legs: readonly [Waveform, Waveform, Waveform]): StarVoltages {
  const [a, b, c] = legs;
  const total = a.edges.length + b.edges.length + c.edges.length;
  const angles = new Float64Array(total);
  const levelsA = new Float64Array(total);
  const levelsB = new Float64Array(total);
  const levelsC = new Float64Array(total);
  const changes = new Uint8Array(total);
  // Before the first edge each leg holds its last level (the period wraps round).
  let levelA = a.levels[a.levels.length - 1] as number;
  let levelB = b.levels[b.levels.length - 1] as number;
  let levelC = c.levels[c.levels.length - 1] as number;
  let nextA = 0;
  let nextB = 0;
  let nextC = 0;
  let count = 0;
  for (;;) {
    const edgeA = nextA < a.edges.length ? (a.edges[nextA] as number) : Infinity;
    const edgeB = nextB < b.edges.length ? (b.edges[nextB] as number) : Infinity;
    const edgeC = nextC < c.edges.length ? (c.edges[nextC] as number) : Infinity;
    const angle = Math.min(edgeA, edgeB, edgeC);
    if (angle === Infinity) break;
    // Every leg that changes at this exact angle changes before the levels are read.
    let changed = 0;
    if (edgeA === angle) {
      levelA = a.levels[nextA++] as number;
      changed |= LEG_A;
    }
    if (edgeB === angle) {
      levelB = b.levels[nextB++] as number;
      changed |= LEG_B;
    }
    if (edgeC === angle) {
      levelC = c.levels[nextC++] as number;
      changed |= LEG_C;
    }
    angles[count] = angle;
    levelsA[count] = levelA;
    levelsB[count] = levelB;
    levelsC[count] = levelC;
    changes[count] = changed;
    count++;
  }
  // One pair of buffers for every output's edges and levels (waveformFromAscending copies out).
  const scratch = { angles: new Float64Array(count), levels: new Float64Array(count) };
  const merged = { angles, levelsA, levelsB, levelsC, changes, count, scratch };
  return {
    phases: [
      waveformOf(merged, LEG_A | LEG_B | LEG_C, (x, y, z) => (2 * x - y - z) / 3),
      waveformOf(merged, LEG_A | LEG_B | LEG_C, (x, y, z) => (2 * y - z - x) / 3),
      waveformOf(merged, LEG_A | LEG_B | LEG_C, (x, y, z) => (2 * z - x - y) / 3),
    ],
    lines: [
      waveformOf(merged, LEG_A | LEG_B, (x, y) => x - y),
      waveformOf(merged, LEG_B | LEG_C, (_, y, z) => y - z),
      waveformOf(merged, LEG_C | LEG_A, (x, _, z) => z - x),
    ],
    commonMode: waveformOf(merged, LEG_A | LEG_B | LEG_C, (x, y, z) => (x + y + z) / 3),
  };
}

/**
 * The waveform `level` of the legs' levels takes over the merged edges where any leg of `legs`
 * (bits) changes, canonicalised (`waveformFromAscending`, which copies what it keeps, so the
 * merge's scratch buffers serve the next output).
 */
function waveformOf(
  merged: {
    angles: Float64Array;
    levelsA: Float64Array;
    levelsB: Float64Array;
    levelsC: Float64Array;
    changes: Uint8Array;
    count: number;
    scratch: { angles: Float64Array; levels: Float64Array };
  },
  legs: number,
  level: (a: number, b: number, c: number) => number,
): Waveform {
  const { angles, levelsA, levelsB, levelsC, changes, count } = merged;
  const { angles: own, levels: values } = merged.scratch;
  let kept = 0;
  for (let k = 0; k < count; k++) {
    if (((changes[k] as number) & legs) === 0) continue;
    own[kept] = angles[k] as number;
    values[kept] = level(levelsA[k] as number, levelsB[k] as number, levelsC[k] as number);
    kept++;
  }
  return waveformFromAscending(own, values, kept);
}
