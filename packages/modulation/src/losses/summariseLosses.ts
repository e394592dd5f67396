import type { DeviceLoss, SemiconductorLosses } from './lossTypes.js';

/** Internal: totals, output power and efficiency from one transistor's and one diode's loss. */
export function summariseLosses(
  transistor: Omit<DeviceLoss, 'total'>,
  diode: Omit<DeviceLoss, 'total'>,
  point: {
    vdc: number;
    ma: number;
    peakCurrent: number;
    currentAngle: number;
    topology: 'h-bridge' | 'three-phase';
  },
): SemiconductorLosses {
  const legs = point.topology === 'h-bridge' ? 2 : 3;
  const t = { ...transistor, total: transistor.conduction + transistor.switching };
  const d = { ...diode, total: diode.conduction + diode.switching };
  const perLeg = 2 * (t.total + d.total);
  const total = legs * perLeg;
  // Average leg voltage (vdc/2)·ma·sin θ times Î·sin(θ − φ): mean vdc·ma·Î·cos φ/4 per leg
  // (zero-sequence voltage carries no power into a balanced load with isolated neutral).
  const outputPower =
    (legs * point.vdc * point.ma * point.peakCurrent * Math.cos(point.currentAngle)) / 4;
  return {
    transistor: t,
    diode: d,
    perLeg,
    legs,
    total,
    conduction: legs * 2 * (t.conduction + d.conduction),
    switching: legs * 2 * (t.switching + d.switching),
    outputPower,
    efficiency: outputPower > 0 ? outputPower / (outputPower + total) : null,
  };
}
