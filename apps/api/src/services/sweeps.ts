import {
  sheSweep,
  sweepModulationIndex,
  waveformThd,
  waveformWthd,
  type ModulationIndexSweep,
  type SheKind,
  type Waveform,
} from '@pulsewright/modulation';
import type { ChunkedWork } from './jobs.js';
import { waveformAtMa, type CarrierModulation } from './compute.js';
import { asBadRequest } from './library.js';

/** Points per chunk: each chunk is a few milliseconds of work at the largest allowed inputs. */
const MA_POINTS_PER_CHUNK = 8;
const SHE_POINTS_PER_CHUNK = 10;

/** Splits grid indices 0..points−1 into overlapping chunks [k0, k1] of at least two points. */
function chunkBounds(points: number, size: number): [number, number][] {
  const bounds: [number, number][] = [];
  for (let k0 = 0; k0 < points - 1; k0 += size) bounds.push([k0, Math.min(k0 + size, points - 1)]);
  return bounds;
}

const gridValue = (from: number, to: number, points: number, k: number): number =>
  k === points - 1 ? to : from + ((to - from) * k) / (points - 1);

export interface MaSweepInput {
  modulation: CarrierModulation;
  ma: { from: number; to: number; points: number };
  maxOrder: number;
  orders?: number[];
}

/**
 * The result of an ma sweep: at each point the fundamental, THD and WTHD exact over the whole
 * waveform (waveformThd, waveformWthd, as the design report gives them), the THD and WTHD of
 * orders up to maxOrder only (`spectrumThd`, `spectrumWthd`), and the requested orders.
 */
export interface MaSweepResult extends ModulationIndexSweep {
  spectrumThd: number[];
  spectrumWthd: number[];
}

/** A sweep of the modulation index by the library's sweepModulationIndex, chunk by chunk. */
export function maSweepWork(input: MaSweepInput): ChunkedWork {
  const { from, to, points } = input.ma;
  const bounds = chunkBounds(points, MA_POINTS_PER_CHUNK);
  const build = waveformAtMa(input.modulation);
  // sweepModulationIndex builds each point's waveform once; keep them for the exact figures.
  let built: Waveform[] = [];
  const waveformAt = (ma: number): Waveform => {
    const waveform = build(ma);
    built.push(waveform);
    return waveform;
  };
  const total: MaSweepResult = {
    ma: [],
    fundamental: [],
    thd: [],
    wthd: [],
    spectrumThd: [],
    spectrumWthd: [],
    harmonics: (input.orders ?? []).map((order) => ({ order, amplitude: [] })),
  };
  return {
    chunks: bounds.length,
    runChunk(index) {
      const [k0, k1] = bounds[index] as [number, number];
      let part: ModulationIndexSweep;
      let exact: { thd: number[]; wthd: number[] };
      built = [];
      try {
        part = sweepModulationIndex(waveformAt, {
          from: gridValue(from, to, points, k0),
          to: gridValue(from, to, points, k1),
          points: k1 - k0 + 1,
          maxOrder: input.maxOrder,
          orders: input.orders ?? [],
        });
        exact = { thd: built.map(waveformThd), wthd: built.map(waveformWthd) };
      } catch (error) {
        throw asBadRequest('', error);
      }
      const skip = index === 0 ? 0 : 1; // the first point repeats the previous chunk's last
      total.ma.push(...part.ma.slice(skip));
      total.fundamental.push(...part.fundamental.slice(skip));
      total.thd.push(...exact.thd.slice(skip));
      total.wthd.push(...exact.wthd.slice(skip));
      total.spectrumThd.push(...part.thd.slice(skip));
      total.spectrumWthd.push(...part.wthd.slice(skip));
      part.harmonics.forEach((series, i) => total.harmonics[i]?.amplitude.push(...series.amplitude.slice(skip)));
    },
    result: () => total,
  };
}

export interface SheSweepInput {
  kind: SheKind;
  vdc: number;
  count: number;
  eliminate: number[];
  fundamental: { from: number; to: number; points: number };
  initialAngles?: number[];
}

export interface SheSweepPointResult {
  fundamental: number;
  angles: number[];
  converged: boolean;
}

/**
 * Selective harmonic elimination over a range of fundamentals by the library's sheSweep, chunk
 * by chunk, each chunk seeded with the last solution of the one before so the sweep follows
 * one branch (Patel and Hoft, 1973, with continuation).
 */
export function sheSweepWork(input: SheSweepInput): ChunkedWork {
  const { from, to, points } = input.fundamental;
  const bounds = chunkBounds(points, SHE_POINTS_PER_CHUNK);
  const solved: SheSweepPointResult[] = [];
  let seed = input.initialAngles;
  let iterations = 0;
  return {
    chunks: bounds.length,
    runChunk(index) {
      const [k0, k1] = bounds[index] as [number, number];
      const grid = Array.from({ length: k1 - k0 + 1 }, (_, i) => gridValue(from, to, points, k0 + i));
      let part;
      try {
        part = sheSweep({
          kind: input.kind,
          vdc: input.vdc,
          count: input.count,
          eliminate: input.eliminate,
          fundamentals: { from: grid[0] as number, to: grid[grid.length - 1] as number, points: grid.length },
          ...(seed ? { angles: seed } : {}),
          maxBranches: 1,
        });
      } catch (error) {
        throw asBadRequest('', error);
      }
      iterations += part.iterations;
      const skip = index === 0 ? 0 : 1;
      grid.slice(skip).forEach((fundamental) => {
        const hit = part.branches
          .flatMap((b) => b.points)
          .find((p) => p.converged && Math.abs(p.fundamental - fundamental) <= 1e-9 * Math.max(1, Math.abs(fundamental)));
        solved.push(hit ? { fundamental, angles: hit.angles, converged: true } : { fundamental, angles: [], converged: false });
      });
      const last = [...solved].reverse().find((p) => p.converged);
      seed = last ? last.angles : undefined;
    },
    result: () => ({
      points: solved,
      solvedFraction: solved.filter((p) => p.converged).length / Math.max(1, solved.length),
      iterations,
    }),
  };
}
