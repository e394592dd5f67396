import { optimalPulsePattern } from '../she/optimalPulsePattern.js';
import type { QuarterWavePattern } from '../she/SheKind.js';
import { solveShe } from '../she/solveShe.js';
import { waveformWthd } from '../spectrum/waveformWthd.js';
import type {
  AngleTable,
  AngleTableInterval,
  AngleTableMidpointErrors,
  AngleTableRow,
} from './angleTableTypes.js';
import { measurePattern } from './measurePattern.js';
import { maScale, type ResolvedPattern } from './resolveAngleTable.js';

/**
 * What linear interpolation between rows costs: for each interval of an {@link angleTable},
 * the angles a controller would use at its midpoint (the mean of the two rows' angles) and the
 * exact pattern there (solved from those angles, on the same branch), both measured on the
 * library's exact spectrum: the worst eliminated-order residual |V_n|/V₁ of the interpolated
 * angles, the error of their fundamental against the wanted one, and their whole-waveform WTHD
 * minus that of the exact pattern.
 *
 * For a smooth branch the interpolation error of the angles is (h²/8)·α″ (the remainder of
 * linear interpolation, a fact of calculus), so these errors fall as 1/N² with the number of
 * rows N. Intervals touching a row without a solution, ending on a row where the optimum jumped,
 * or whose midpoint has no solution on the branch are `interpolable: false` with the reason;
 * they are left out of the worst values.
 *
 * @param table - as {@link angleTable} returned it
 */
export function angleTableMidpointErrors(table: AngleTable): AngleTableMidpointErrors {
  const { pattern } = table.parameters;
  const intervals: AngleTableInterval[] = [];
  for (let i = 0; i + 1 < table.rows.length; i++) {
    intervals.push(
      intervalError(pattern, table.rows[i] as AngleTableRow, table.rows[i + 1] as AngleTableRow),
    );
  }
  const usable = intervals.filter((v) => v.interpolable);
  const worst = (pick: (v: AngleTableInterval) => number | null): number | null => {
    const values = usable
      .map(pick)
      .filter((x): x is number => x !== null)
      .map(Math.abs);
    return values.length === 0 ? null : Math.max(...values);
  };
  return {
    intervals,
    worstResidual: worst((v) => v.worstResidual),
    worstFundamentalError: worst((v) => v.fundamentalError),
    worstWthdChange: worst((v) => v.wthdChange),
  };
}

function intervalError(
  pattern: ResolvedPattern,
  a: AngleTableRow,
  b: AngleTableRow,
): AngleTableInterval {
  const blank = {
    from: a.ma,
    to: b.ma,
    interpolable: false,
    exactAngles: [],
    interpolatedAngles: [],
    worstResidual: null,
    fundamentalError: null,
    wthdChange: null,
  };
  if (!a.solved || !b.solved) {
    return {
      ...blank,
      reason: `no solution on the branch at ma ${(a.solved ? b : a).ma.toPrecision(6)}`,
    };
  }
  if (!b.continued) {
    return { ...blank, reason: `the optimum jumps to another family at ma ${b.ma.toPrecision(6)}` };
  }
  const interpolated = a.angles.map((x, k) => (x + (b.angles[k] as number)) / 2);
  const wanted = ((a.ma + b.ma) / 2) * maScale(pattern);
  const exact = exactPattern(pattern, interpolated, wanted);
  if (exact === null) {
    return {
      ...blank,
      reason: `no solution on the branch at the midpoint ma ${((a.ma + b.ma) / 2).toPrecision(6)}`,
    };
  }
  const measured = measurePattern(pattern, interpolated);
  return {
    from: a.ma,
    to: b.ma,
    interpolable: true,
    reason: '',
    exactAngles: exact.angles,
    interpolatedAngles: interpolated,
    worstResidual: measured.worstResidual,
    fundamentalError: (measured.fundamental - wanted) / wanted,
    // The solver's own waveform of the exact angles: only its WTHD is wanted, not a spectrum.
    wthdChange: measured.wthd - waveformWthd(exact.waveform),
  };
}

/**
 * The exact pattern at `fundamental` volts (its angles and the waveform the solver built from
 * them), Newton from `start` alone (no other starts).
 */
function exactPattern(
  pattern: ResolvedPattern,
  start: number[],
  fundamental: number,
): QuarterWavePattern | null {
  const { kind, vdc } = pattern;
  if (pattern.method === 'selective-harmonic-elimination') {
    const solved = solveShe({
      kind,
      vdc,
      angles: start,
      eliminate: pattern.eliminate,
      fundamental,
      starts: 0,
    });
    return solved.converged ? solved : null;
  }
  const { objective, maxOrder } = pattern;
  const optimum = optimalPulsePattern({
    kind,
    vdc,
    angles: start,
    objective,
    maxOrder,
    fundamental,
    starts: 0,
  });
  return optimum.converged ? optimum : null;
}
