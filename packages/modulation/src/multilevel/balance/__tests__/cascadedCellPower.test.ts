import { describe, expect, it } from 'vitest';
import { harmonics } from '../../../spectrum/harmonics.js';
import { assertInDelta } from '../../../testing/assertInDelta.js';
import { multilevelCarrier } from '../../carrier/multilevelCarrier.js';
import type { MultilevelCarrierArrangement } from '../../MultilevelTypes.js';
import { cascadedCellPower } from '../cascadedCellPower.js';

const PEAK = 20;
const VDC = 100;
const CELLS = 3;

function cascaded(
  carriers: MultilevelCarrierArrangement,
  ma: number,
  mf: number,
  phaseCount: 1 | 3 = 1,
) {
  return multilevelCarrier({
    topology: 'cascaded-h-bridge',
    levels: 2 * CELLS + 1,
    carriers,
    phaseCount,
    ma,
    mf,
    vdc: VDC,
  });
}

/**
 * Average model of level-shifted carriers (Holmes and Lipo 2003, ch. 11): cell k (k = 1
 * innermost) averages vdc·clamp(N·m·|sin θ| − (k − 1), 0, 1)·sign(sin θ) over a carrier period,
 * N = cells. At unity power factor its power is (1/π)∫₀^π that·Î sin θ dθ; with
 * a_j = asin(j/(N·m)) the integral splits (worked here) into the band's ramp on [a_{k−1}, a_k]
 * (twice, by symmetry), N·m·∫sin² − (k − 1)·∫sin, and the full level on [a_k, π − a_k], 2·cos a_k.
 */
function levelShiftedCellPower(k: number, ma: number): number {
  const nm = CELLS * ma;
  if (nm <= k - 1) return 0;
  const angle = (j: number) => (j >= nm ? Math.PI / 2 : Math.asin(j / nm));
  const sinSquared = (a: number, b: number) =>
    (b - a) / 2 - (Math.sin(2 * b) - Math.sin(2 * a)) / 4;
  const lo = angle(k - 1);
  const hi = angle(k);
  const ramp = 2 * (nm * sinSquared(lo, hi) - (k - 1) * (Math.cos(lo) - Math.cos(hi)));
  const full = nm >= k ? 2 * Math.cos(hi) : 0;
  return (VDC * PEAK * (ramp + full)) / Math.PI;
}

describe('cascadedCellPower', () => {
  it('the string delivers ½·V₁·Î·cos(angle between them) (standard AC power; exact spectrum)', () => {
    const waveforms = cascaded('phase-shifted', 0.9, 21);
    const phi = 0.4;
    const result = cascadedCellPower(
      waveforms,
      { peakCurrent: PEAK, currentAngle: phi },
      { vdc: VDC },
    );
    // Only the voltage's fundamental carries power into a sinusoidal current.
    const v1 = harmonics(waveforms.legs[0]!.output, 1)[1]!;
    const expected = 0.5 * v1.amplitude * PEAK * Math.cos(v1.phase + phi);
    assertInDelta(result.strings[0]!.power, expected, 1e-9 * Math.abs(expected), 'string power');
    // Each cell likewise from its own fundamental.
    waveforms.legs[0]!.cells.forEach((cell, k) => {
      const c1 = harmonics(cell.waveform, 1)[1]!;
      const cellExpected = 0.5 * c1.amplitude * PEAK * Math.cos(c1.phase + phi);
      assertInDelta(
        result.strings[0]!.cells[k]!.power,
        cellExpected,
        1e-9 * Math.abs(expected),
        cell.name,
      );
      assertInDelta(
        result.strings[0]!.cells[k]!.meanCurrent,
        cellExpected / VDC,
        1e-9 * PEAK,
        cell.name,
      );
    });
  });

  it('phase-shifted carriers share the power evenly; level-shifted do not (McGrath and Holmes 2002)', () => {
    const shifted = cascadedCellPower(
      cascaded('phase-shifted', 0.8, 60, 3),
      { peakCurrent: PEAK },
      { vdc: VDC },
    );
    // Each cell's fundamental is ma·vdc in the linear range; what remains is sideband overlap
    // (measured: 2e-15 at mf 60; PD gives 1.31 at the same point).
    expect(shifted.powerSpread).toBeLessThan(1e-3);
    for (const string of shifted.strings) {
      for (const cell of string.cells)
        assertInDelta(cell.power, (0.8 * VDC * PEAK) / 2, 1e-3 * cell.power, cell.name);
    }
    const levelShifted = cascadedCellPower(
      cascaded('pd', 0.8, 60, 3),
      { peakCurrent: PEAK },
      { vdc: VDC },
    );
    expect(levelShifted.powerSpread).toBeGreaterThan(0.5);
  });

  it('level-shifted PD: each cell against the average model of its band (Holmes and Lipo 2003, ch. 11)', () => {
    for (const ma of [0.5, 0.9]) {
      const result = cascadedCellPower(
        cascaded('pd', ma, 120),
        { peakCurrent: PEAK },
        { vdc: VDC },
      );
      const total = result.strings[0]!.power;
      result.strings[0]!.cells.forEach((cell, index) => {
        // Natural sampling against the average model: within 0.5 % of the string's power at mf 120.
        assertInDelta(
          cell.power,
          levelShiftedCellPower(index + 1, ma),
          0.005 * total,
          `ma ${ma} ${cell.name}`,
        );
      });
    }
  });

  it('names the field of bad input', () => {
    const waveforms = cascaded('phase-shifted', 0.8, 21);
    const sine = { peakCurrent: PEAK };
    expect(() => cascadedCellPower(waveforms, sine, { vdc: 50 })).toThrow(
      /^waveforms\.legs\[0\]\.cells\[0\]\.waveform\.levels\[\d+\] must be −vdc, 0 or \+vdc/,
    );
    expect(() => cascadedCellPower(waveforms, sine, { vdc: 0 })).toThrow(/^vdc must be/);
    expect(() =>
      cascadedCellPower(waveforms, { peakCurrent: PEAK, currentAngle: 4 }, { vdc: VDC }),
    ).toThrow(/^currents\.currentAngle must be/);
    expect(() =>
      cascadedCellPower({ ...waveforms, legs: [{ ...waveforms.legs[0]!, cells: [] }] }, sine, {
        vdc: VDC,
      }),
    ).toThrow(/^waveforms\.legs\[0\]\.cells\.length must be at least 1/);
  });
});
