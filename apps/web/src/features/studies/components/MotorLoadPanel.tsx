import type { StudyReport } from '../../../lib/api';
import { formatNumber, formatPercent } from '../../../lib/format';

/**
 * The load of every phase, labelled a, b, c: its current's RMS, fundamental, distortion and
 * ripple; and for a load with back-EMF (a motor winding) the torque-producing current of each
 * phase against its EMF, the power the EMFs take in and the torque per pole pair. "Per phase"
 * and the phase column only where the bridge has phases: a single-phase bridge's one load is
 * labelled as the load. Draws what the report holds; nothing is computed here.
 */
export function MotorLoadPanel({ report }: { report: StudyReport }) {
  const loads = report.currents.flatMap((c) =>
    c.load ? [{ phase: c.phase, current: c.load }] : [],
  );
  if (loads.length === 0) return null;
  const { motor } = report;
  const three = report.phaseCount === 3;
  const perPhase = three ? ' per phase' : '';
  const title = `${motor ? 'Motor load' : 'Load'}${three ? ', per phase' : ''}`;
  return (
    <section
      aria-label={title}
      className="flex flex-col gap-2 rounded-md border border-rule bg-panel p-3"
    >
      <h3 className="text-sm font-medium">{title}</h3>
      <table className="w-full text-xs" aria-label={`Load current${three ? 's' : ''}${perPhase}`}>
        <thead className="text-left text-ink-soft">
          <tr>
            <th className="font-medium">Load current</th>
            <th className="font-medium">RMS (A)</th>
            <th className="font-medium">Peak (A)</th>
            <th className="font-medium">Fundamental (A peak)</th>
            <th className="font-medium">THD</th>
            <th className="font-medium">Distortion factor</th>
            <th className="font-medium">Ripple RMS (A)</th>
            <th className="font-medium">Ripple peak-to-peak (A)</th>
          </tr>
        </thead>
        <tbody className="num">
          {loads.map(({ phase, current }) => (
            <tr key={phase} className="border-t border-rule/60">
              <td className="font-sans">{current.name}</td>
              <td>{formatNumber(current.rms)}</td>
              <td>{formatNumber(current.peak)}</td>
              <td>{formatNumber(current.fundamental)}</td>
              <td>{current.thd === null ? '—' : formatPercent(current.thd)}</td>
              <td>{formatNumber(current.distortionFactor)}</td>
              <td>{formatNumber(current.rippleRms)}</td>
              <td>{formatNumber(current.ripplePeakToPeak)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {motor ? (
        <>
          <table className="w-full text-xs" aria-label={`Torque-producing current${perPhase}`}>
            <thead className="text-left text-ink-soft">
              <tr>
                {three ? <th className="font-medium">Phase</th> : null}
                <th className="font-medium">EMF (V peak)</th>
                <th className="font-medium">Current leads EMF by (°)</th>
                <th className="font-medium">Torque-producing current (A peak)</th>
                <th className="font-medium">Quadrature current (A peak)</th>
                <th className="font-medium">Power into the EMF (W)</th>
              </tr>
            </thead>
            <tbody className="num">
              {motor.phases.map((p) => (
                <tr key={p.phase} className="border-t border-rule/60">
                  {three ? <td className="font-sans">phase {p.phase}</td> : null}
                  <td>{formatNumber(p.emfAmplitude)}</td>
                  <td>{formatNumber((p.currentAngle * 180) / Math.PI)}</td>
                  <td>{formatNumber(p.torqueCurrent)}</td>
                  <td>{formatNumber(p.quadratureCurrent)}</td>
                  <td>{formatNumber(p.electromagneticPower)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="text-xs" data-testid="motor-totals">
            Air-gap power {formatNumber(motor.electromagneticPower)} W (
            {three ? 'all phases; ' : ''}
            positive motoring) · torque {formatNumber(motor.torquePerPolePair)} N·m per pole pair
            (multiply by the machine&apos;s pole pairs) · copper loss{' '}
            {formatNumber(report.loadPower ?? 0)} W
          </p>
          <p className="text-xs text-ink-soft">
            Only the fundamental makes torque against a sinusoidal EMF; the distortion and ripple
            above heat the winding. Idealised: a real machine&apos;s EMF, saturation and slot
            harmonics differ, so measure before relying on these figures.
          </p>
        </>
      ) : null}
    </section>
  );
}
