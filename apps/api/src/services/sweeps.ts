import {
  sheSweep,
  sweepModulationIndex,
  waveformThd,
  waveformWthd,
  type ModulationIndexSweep,
  type SheKind,
  type Waveform,
} from '@pulsewright/modulation';
import { voltageAtMa, type CarrierModulation } from './compute.js';
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
 * The result of an ma sweep: the voltage analysed, by the library's name (`bridge output` of a
 * single-phase bridge, `line a−b` of a three-phase one), and at each point the fundamental, THD
 * and WTHD exact over the whole waveform (waveformThd, waveformWthd, as the design report gives
 * them), the THD and WTHD of orders up to maxOrder only (`spectrumThd`, `spectrumWthd`), and the
 * requested orders.
 */
export interface MaSweepResult extends ModulationIndexSweep {
  voltage: string;
  spectrumThd: number[];
  spectrumWthd: number[];
}

/** Chunks of an ma sweep (at least one). */
export function maSweepChunkCount(input: MaSweepInput): number {
  return chunkBounds(input.ma.points, MA_POINTS_PER_CHUNK).length;
}

/**
 * Chunk `index` of an ma sweep by the library's sweepModulationIndex: the chunk's points (the
 * first one left out after chunk 0, as it repeats the previous chunk's last). Pure: it runs in a
 * compute worker, and the job appends the parts in order ({@link appendMaSweepPart}).
 */
export function maSweepChunk(input: MaSweepInput, index: number): MaSweepResult {
  const { from, to, points } = input.ma;
  const [k0, k1] = chunkBounds(points, MA_POINTS_PER_CHUNK)[index] as [number, number];
  const build = voltageAtMa(input.modulation);
  // sweepModulationIndex builds each point's waveform once; keep them for the exact figures.
  const built: Waveform[] = [];
  let voltage = '';
  const waveformAt = (ma: number): Waveform => {
    const output = build(ma);
    voltage = output.name;
    built.push(output.waveform);
    return output.waveform;
  };
  let part: ModulationIndexSweep;
  let exact: { thd: number[]; wthd: number[] };
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
  const skip = index === 0 ? 0 : 1;
  return {
    voltage,
    ma: part.ma.slice(skip),
    fundamental: part.fundamental.slice(skip),
    thd: exact.thd.slice(skip),
    wthd: exact.wthd.slice(skip),
    spectrumThd: part.thd.slice(skip),
    spectrumWthd: part.wthd.slice(skip),
    harmonics: part.harmonics.map((series) => ({
      order: series.order,
      amplitude: series.amplitude.slice(skip),
    })),
  };
}

/** An empty ma sweep result, for {@link appendMaSweepPart}. */
export function emptyMaSweep(input: MaSweepInput): MaSweepResult {
  return {
    voltage: '',
    ma: [],
    fundamental: [],
    thd: [],
    wthd: [],
    spectrumThd: [],
    spectrumWthd: [],
    harmonics: (input.orders ?? []).map((order) => ({ order, amplitude: [] })),
  };
}

/** Appends a chunk's part to the sweep so far. */
export function appendMaSweepPart(total: MaSweepResult, part: MaSweepResult): void {
  total.voltage = part.voltage;
  total.ma.push(...part.ma);
  total.fundamental.push(...part.fundamental);
  total.thd.push(...part.thd);
  total.wthd.push(...part.wthd);
  total.spectrumThd.push(...part.spectrumThd);
  total.spectrumWthd.push(...part.spectrumWthd);
  part.harmonics.forEach((series, i) => total.harmonics[i]?.amplitude.push(...series.amplitude));
}

export interface SheSweepInput {
  kind: SheKind;
  vdc: number;
  count: number;
  eliminate: number[];
  fundamental: { from: number; to: number; points: number };
  initialAngles?: number[];
  /** Staircase only: each cell's DC source, volts, one per angle (the library's `cellVoltages`). */
  cellVoltages?: number[];
}

export interface SheSweepPointResult {
  fundamental: number;
  angles: number[];
  converged: boolean;
}

export interface SheSweepResult {
  points: SheSweepPointResult[];
  solvedFraction: number;
  iterations: number;
}

/** Chunks of a SHE sweep (at least one). */
export function sheSweepChunkCount(input: SheSweepInput): number {
  return chunkBounds(input.fundamental.points, SHE_POINTS_PER_CHUNK).length;
}

/**
 * Chunk `index` of a selective harmonic elimination sweep over a range of fundamentals by the
 * library's sheSweep, seeded with the last solution of the chunks before (`seed`) so the sweep
 * follows one branch (Patel and Hoft, 1973, with continuation). Pure: it runs in a compute
 * worker; the job appends the points in order and passes the last solved angles on.
 */
export function sheSweepChunk(
  input: SheSweepInput,
  index: number,
  seed: number[] | undefined,
): { points: SheSweepPointResult[]; iterations: number } {
  const { from, to, points } = input.fundamental;
  const [k0, k1] = chunkBounds(points, SHE_POINTS_PER_CHUNK)[index] as [number, number];
  const grid = Array.from({ length: k1 - k0 + 1 }, (_, i) => gridValue(from, to, points, k0 + i));
  let part;
  try {
    part = sheSweep({
      kind: input.kind,
      vdc: input.vdc,
      count: input.count,
      eliminate: input.eliminate,
      fundamentals: {
        from: grid[0] as number,
        to: grid[grid.length - 1] as number,
        points: grid.length,
      },
      ...(seed ? { angles: seed } : {}),
      ...(input.cellVoltages ? { cellVoltages: input.cellVoltages } : {}),
      maxBranches: 1,
    });
  } catch (error) {
    throw asBadRequest('', error);
  }
  const skip = index === 0 ? 0 : 1;
  const solved = grid.slice(skip).map((fundamental): SheSweepPointResult => {
    const hit = part.branches
      .flatMap((b) => b.points)
      .find(
        (p) =>
          p.converged &&
          Math.abs(p.fundamental - fundamental) <= 1e-9 * Math.max(1, Math.abs(fundamental)),
      );
    return hit
      ? { fundamental, angles: hit.angles, converged: true }
      : { fundamental, angles: [], converged: false };
  });
  return { points: solved, iterations: part.iterations };
}

/** The seed of the next chunk: the last converged angles of the sweep so far (none: the library's own start). */
export function nextSheSeed(points: SheSweepPointResult[]): number[] | undefined {
  return [...points].reverse().find((p) => p.converged)?.angles;
}
