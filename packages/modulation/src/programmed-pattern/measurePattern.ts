/** The exact figures of one set of first-quarter angles (internal to programmed-pattern/). */
import { buildSheWaveform } from '../she/buildSheWaveform.js';
import { harmonics } from '../spectrum/harmonics.js';
import { waveformWthd } from '../spectrum/waveformWthd.js';
import type { AngleTableResidual } from './angleTableTypes.js';
import type { ResolvedPattern } from './resolveAngleTable.js';

export interface PatternFigures {
  /** b₁, peak volts in phase with sin θ (negative in antiphase). */
  fundamental: number;
  residuals: AngleTableResidual[];
  /** Largest residual / |b₁|, null when nothing is eliminated. */
  worstResidual: number | null;
  /** Whole-waveform WTHD, exact. */
  wthd: number;
}

/** Figures of the waveform the angles define, by the library's exact spectrum (no sampling). */
export function measurePattern(
  pattern: ResolvedPattern,
  angles: readonly number[],
): PatternFigures {
  const waveform = buildSheWaveform(pattern.kind, pattern.vdc, angles);
  const eliminate = pattern.method === 'selective-harmonic-elimination' ? pattern.eliminate : [];
  const spectrum = harmonics(waveform, Math.max(1, ...eliminate));
  const first = spectrum[1] as { amplitude: number; phase: number };
  const fundamental = first.amplitude * Math.cos(first.phase);
  const residuals = eliminate.map((order) => ({
    order,
    amplitude: spectrum[order]?.amplitude ?? 0,
  }));
  const worstResidual =
    residuals.length === 0
      ? null
      : Math.max(...residuals.map((r) => r.amplitude)) / Math.abs(fundamental);
  return { fundamental, residuals, worstResidual, wthd: waveformWthd(waveform) };
}
