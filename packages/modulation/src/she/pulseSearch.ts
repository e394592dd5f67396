// Internal search steps shared by optimalPulsePattern and optimalPulseSweep (not exported).
import { harmonics } from '../spectrum/harmonics.js';
import { buildSheWaveform } from './buildSheWaveform.js';
import type { OptimalPulseResult } from './OptimalPulseResult.js';
import { optimisePulses, type PulseOutcome } from './pulseOptimizer.js';
import { pulseProblem, type ResolvedPulseBase } from './pulseOptions.js';

/** Runs the optimiser from each start; the best converged outcome, else the best attempt (internal). */
export function bestOptimum(
  base: ResolvedPulseBase,
  fundamental: number,
  starts: readonly (readonly number[])[],
): { best: PulseOutcome; iterations: number; found: number } {
  const problem = pulseProblem(base, fundamental / ((4 * base.vdc) / Math.PI));
  let best: PulseOutcome | null = null;
  let iterations = 0;
  let found = 0;
  for (const start of starts) {
    const outcome = optimisePulses(problem, start, base.settings);
    iterations += outcome.iterations;
    if (outcome.converged) found++;
    const better =
      best === null ||
      (outcome.converged && !best.converged) ||
      (outcome.converged === best.converged && outcome.value < best.value);
    if (better) best = outcome;
  }
  return { best: best as PulseOutcome, iterations, found };
}

/** Builds the public result of one optimum, measured on the exact spectrum (internal). */
export function describeOptimum(
  base: ResolvedPulseBase,
  outcome: PulseOutcome,
  iterations: number,
  tried: number,
  found: number,
): OptimalPulseResult {
  const waveform = buildSheWaveform(base.kind, base.vdc, outcome.angles);
  const spectrum = harmonics(waveform, Math.max(...base.orders));
  const first = spectrum[1];
  const fundamental = first === undefined ? 0 : first.amplitude * Math.cos(first.phase);
  let sum = 0;
  base.orders.forEach((order, i) => {
    sum += (base.orderWeights[i] as number) * (spectrum[order]?.amplitude ?? 0) ** 2;
  });
  return {
    converged: outcome.converged,
    message: outcome.converged
      ? `Strict local minimum found; ${found} of ${tried} start(s) converged, best kept.`
      : `No optimum found from ${tried} start(s): ${outcome.reason}.`,
    kind: base.kind,
    vdc: base.vdc,
    angles: [...outcome.angles],
    waveform,
    fundamental,
    objective: Math.sqrt(sum) / fundamental,
    iterations,
    starts: tried,
  };
}
