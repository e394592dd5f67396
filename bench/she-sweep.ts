/**
 * Benchmark (not a test): a 100-point selective-harmonic-elimination sweep of 5 bipolar angles
 * (eliminating orders 5, 7, 11, 13; Patel and Hoft, IEEE Trans. Ind. Appl., 1973) solved by
 * continuation (`sheSweep`: each point seeded by a tangent predictor from the previous one)
 * against plain multi-start Newton without continuation (`solveShe` at each point from the
 * library's seeded starts, a different seed per point, stopping at the first that converges).
 * Both are timed in the same run (median of several runs after warm-up); the printed ratio is
 * baseline time / continuation time. Goal from issue 3: the sweep in under 200 ms. No timing
 * is asserted. Every continuation point is also checked on the exact spectrum of its waveform.
 *
 * Run directly: `npx tsx bench/she-sweep.ts` (after building packages/modulation), or import
 * `runSheBench()`.
 */
import { pathToFileURL } from 'node:url';
import {
  harmonics,
  sheSweep,
  sheWaveform,
  solveShe,
  type SheSweepResult,
} from '@pulsewright/modulation';
import { medianTime } from './measure.js';

/** What {@link runSheBench} measured: printable lines and the raw figures. */
export interface SheBenchReport {
  name: string;
  lines: string[];
  figures: Record<string, number>;
}

const vdc = 400;
const scale = (4 * vdc) / Math.PI;
const count = 5;
const eliminate = [5, 7, 11, 13];
const points = 100;

function grid(from: number, to: number): number[] {
  return Array.from({ length: points }, (_, i) => from + ((to - from) * i) / (points - 1));
}

function continuation(from: number, to: number): SheSweepResult {
  return sheSweep({ kind: 'bipolar', vdc, count, eliminate, fundamentals: { from, to, points } });
}

/** Coverage and the worst eliminated residual, measured on the exact spectrum (not timed). */
function check(result: SheSweepResult): { solved: number; worstResidual: number } {
  let worstResidual = 0;
  const solved = new Set<number>();
  for (const branch of result.branches) {
    for (const point of branch.points) {
      if (!point.converged) continue;
      solved.add(point.fundamental);
      const spectrum = harmonics(sheWaveform(point.angles, { kind: 'bipolar', vdc }), 13);
      for (const n of eliminate)
        worstResidual = Math.max(
          worstResidual,
          (spectrum[n]?.amplitude ?? Infinity) / point.fundamental,
        );
    }
  }
  return { solved: solved.size / points, worstResidual };
}

function multiStart(from: number, to: number): { solved: number } {
  let solved = 0;
  grid(from, to).forEach((fundamental, i) => {
    if (solveShe({ kind: 'bipolar', vdc, count, eliminate, fundamental, seed: i + 1 }).converged)
      solved++;
  });
  return { solved: solved / points };
}

/** Runs both methods on two ranges of the fundamental and reports times, ratios and coverage. */
export async function runSheBench(): Promise<SheBenchReport> {
  const lines: string[] = [];
  const figures: Record<string, number> = {};
  const ranges: [string, number, number][] = [
    ['0.05–0.90 of 4vdc/π (solutions everywhere)', 0.05, 0.9],
    ['0.02–0.98 of 4vdc/π (with a range of no solution)', 0.02, 0.98],
  ];
  lines.push(
    `SHE sweep: bipolar, ${count} angles, eliminating ${eliminate.join(', ')}, ${points} fundamentals`,
  );
  ranges.forEach(([label, a, b], r) => {
    const from = a * scale;
    const to = b * scale;
    const last: { sweep?: SheSweepResult } = {};
    let plain = { solved: 0 };
    const sweepMs = medianTime(() => (last.sweep = continuation(from, to)), 9, 2);
    const sweep = last.sweep === undefined ? { solved: 0, worstResidual: NaN } : check(last.sweep);
    const plainMs = medianTime(() => (plain = multiStart(from, to)), 5, 1);
    const key = r === 0 ? 'solvable' : 'withGap';
    figures[`${key}ContinuationMs`] = sweepMs;
    figures[`${key}MultiStartMs`] = plainMs;
    figures[`${key}Ratio`] = plainMs / sweepMs;
    figures[`${key}ContinuationSolved`] = sweep.solved;
    figures[`${key}MultiStartSolved`] = plain.solved;
    figures[`${key}WorstResidual`] = sweep.worstResidual;
    lines.push(
      `  ${label}:`,
      `    continuation (sheSweep)      ${sweepMs.toFixed(1)} ms, ${(100 * sweep.solved).toFixed(0)} % of points solved` +
        ` (goal < 200 ms${sweepMs < 200 ? ', met' : ', NOT met'})`,
      `    multi-start Newton per point ${plainMs.toFixed(1)} ms, ${(100 * plain.solved).toFixed(0)} % of points solved`,
      `    ratio multi-start / continuation: ${(plainMs / sweepMs).toFixed(1)}×`,
      `    worst eliminated residual on the exact spectrum: ${sweep.worstResidual.toExponential(2)} of the fundamental`,
    );
  });
  lines.push(
    '  (the multi-start time includes the waveform and exact residual solveShe builds per point.)',
  );
  return { name: 'she-sweep', lines, figures };
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const report = await runSheBench();
  console.log(report.lines.join('\n'));
}
