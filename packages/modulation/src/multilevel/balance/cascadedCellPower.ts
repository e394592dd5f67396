import { TAU } from '../../math.js';
import { assertNumberInRange } from '../../validation/assertions.js';
import { ParameterRangeError } from '../../validation/errors.js';
import type { MultilevelWaveforms } from '../MultilevelTypes.js';
import { assertMultilevelWaveforms } from './assertMultilevelWaveforms.js';
import { forEachPiece } from './forEachPiece.js';
import { legCurrentModel } from './legCurrentModel.js';
import type { MultilevelPhaseCurrents } from './MultilevelPhaseCurrents.js';

/** Options of {@link cascadedCellPower}. */
export interface CascadedCellPowerOptions {
  /** Each cell's DC source voltage, V, > 0 (the `vdc` given to `multilevelCarrier`). */
  vdc: number;
}

/** One H-bridge cell's DC source. */
export interface CascadedCellSource {
  /** `cell k` as the waveforms name it. */
  name: string;
  /** Mean of the source's current over the period, A (positive: the source delivers power). */
  meanCurrent: number;
  /** RMS of the source's current over the period, A. */
  rmsCurrent: number;
  /** Mean power the source delivers, W (vdc × meanCurrent). */
  power: number;
}

/** The cells of one string. */
export interface CascadedStringPower {
  name: string;
  cells: CascadedCellSource[];
  /** Sum over the cells, W. */
  power: number;
  /**
   * (highest − lowest cell power) ÷ (the string's power / cells): 0 when the cells share the
   * power evenly; null when the string carries no power.
   */
  powerSpread: number | null;
}

/** Power drawn from each cell's source of a cascaded H-bridge. */
export interface CascadedCellPower {
  strings: CascadedStringPower[];
  /** The largest `powerSpread` of the strings; null when none carries power. */
  powerSpread: number | null;
}

/**
 * The current and power each isolated DC source of a cascaded H-bridge delivers. A cell whose
 * output is v_k ∈ {−vdc, 0, +vdc} draws i_dc,k = (v_k/vdc)·i from its source, i the string's
 * current (standard circuit analysis of the H-bridge), so its power is the mean of v_k·i;
 * integrated exactly piece by piece (see {@link MultilevelPhaseCurrents}).
 *
 * Phase-shifted carriers give every cell the same fundamental and so the same power; level-shifted
 * carriers load the inner cells (those of the bands nearest zero) most (B. P. McGrath and D. G.
 * Holmes, IEEE Trans. Ind. Electron., 2002; Holmes and Lipo, 2003, ch. 11).
 *
 * @param waveforms - `multilevelCarrier` output of a `cascaded-h-bridge` (cell outputs in `cells`)
 * @param currents - the phase currents, see {@link MultilevelPhaseCurrents}
 * @throws ParameterRangeError / ParameterTypeError naming `waveforms…` (a cell level other than
 *   −vdc, 0, +vdc), `currents…` or `vdc`
 */
export function cascadedCellPower(
  waveforms: MultilevelWaveforms,
  currents: MultilevelPhaseCurrents,
  options: CascadedCellPowerOptions,
): CascadedCellPower {
  assertMultilevelWaveforms(waveforms);
  const { vdc } = options;
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true, max: 1e5 });
  waveforms.legs.forEach((leg, k) => {
    if (leg.cells.length === 0) {
      throw new ParameterRangeError(
        `waveforms.legs[${k}].cells.length`,
        'at least 1 (the cells of a cascaded string)',
        0,
      );
    }
    leg.cells.forEach((cell, j) => {
      cell.waveform.levels.forEach((level, i) => {
        if (Math.min(Math.abs(level), Math.abs(Math.abs(level) - vdc)) > 1e-9 * vdc) {
          throw new ParameterRangeError(
            `waveforms.legs[${k}].cells[${j}].waveform.levels[${i}]`,
            `−vdc, 0 or +vdc (vdc = ${vdc} V)`,
            level,
          );
        }
      });
    });
  });
  const model = legCurrentModel(waveforms, currents);
  const strings = waveforms.legs.map((leg, legIndex): CascadedStringPower => {
    const count = leg.cells.length;
    const sums = new Float64Array(count);
    const squares = new Float64Array(count);
    forEachPiece(
      leg.cells.map((cell) => cell.waveform),
      model.knots,
      (a, b, outputs) => {
        const c = model.coefficients(legIndex, a, b);
        const integral = model.integral(c, a, b);
        const square = model.squareIntegral(c, a, b);
        for (let k = 0; k < count; k++) {
          const s = Math.round((outputs[k] as number) / vdc);
          if (s === 0) continue;
          sums[k] = (sums[k] as number) + s * integral;
          squares[k] = (squares[k] as number) + square;
        }
      },
    );
    const cells = leg.cells.map((cell, k): CascadedCellSource => {
      const meanCurrent = (sums[k] as number) / TAU;
      return {
        name: cell.name,
        meanCurrent,
        rmsCurrent: Math.sqrt(Math.max(0, (squares[k] as number) / TAU)),
        power: vdc * meanCurrent,
      };
    });
    const powers = cells.map((c) => c.power);
    const power = powers.reduce((x, y) => x + y, 0);
    return {
      name: leg.name,
      cells,
      power,
      powerSpread:
        power === 0 ? null : (Math.max(...powers) - Math.min(...powers)) / Math.abs(power / count),
    };
  });
  const spreads = strings.flatMap((s) => (s.powerSpread === null ? [] : [s.powerSpread]));
  return { strings, powerSpread: spreads.length === 0 ? null : Math.max(...spreads) };
}
