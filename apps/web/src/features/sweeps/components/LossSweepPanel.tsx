import { useMemo, useState } from 'react';
import {
  EXAMPLE_IGBT,
  ZERO_SEQUENCE_LABELS,
  type IgbtDevice,
  type LossComparisonBasis,
  type LossZeroSequence,
} from '@pulsewright/modulation';
import { LineChart, type LineSeries } from '../../../components/charts/LineChart';
import { NumberField, SelectField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { formatNumber } from '../../../lib/format';
import { lossSweepOf } from '../model/lossSweep';

/** The sequences drawn, each in its own colour (the sweep computes all of them). */
const DRAWN: readonly { zeroSequence: LossZeroSequence; color: string; dashed?: boolean }[] = [
  { zeroSequence: 'min-max', color: 'var(--color-ink)' },
  { zeroSequence: 'dpwm0', color: 'var(--color-trace-carrier)' },
  { zeroSequence: 'dpwm1', color: 'var(--color-signal)' },
  { zeroSequence: 'dpwm2', color: 'var(--color-trace-current)' },
  { zeroSequence: 'dpwm-max', color: 'var(--color-ink-soft)', dashed: true },
  { zeroSequence: 'gdpwm', color: 'var(--color-good)', dashed: true },
];

const labelOf = (z: LossZeroSequence): string =>
  z === 'gdpwm' ? 'GDPWM: clamp follows the load angle' : ZERO_SEQUENCE_LABELS[z];

/** The operating point and device as typed (SI units; the example device is invented). */
interface LossForm {
  vdc: number;
  ma: number;
  peakCurrent: number;
  switchingFrequency: number;
  fundamentalFrequency: number;
  basis: LossComparisonBasis;
  device: IgbtDevice;
}

const DEVICE_FIELDS: readonly {
  key: keyof Omit<IgbtDevice, 'kind'>;
  label: string;
  unit: string;
  scale?: number;
}[] = [
  { key: 'vce0', label: 'Transistor threshold', unit: 'V' },
  { key: 'rce', label: 'Transistor slope resistance', unit: 'mΩ', scale: 1e3 },
  { key: 'vf0', label: 'Diode threshold', unit: 'V' },
  { key: 'rf', label: 'Diode slope resistance', unit: 'mΩ', scale: 1e3 },
  { key: 'eon', label: 'Turn-on energy', unit: 'mJ', scale: 1e3 },
  { key: 'eoff', label: 'Turn-off energy', unit: 'mJ', scale: 1e3 },
  { key: 'err', label: 'Diode recovery energy', unit: 'mJ', scale: 1e3 },
  { key: 'referenceVoltage', label: 'Energies measured at', unit: 'V' },
  { key: 'referenceCurrent', label: 'and at', unit: 'A' },
];

/**
 * Semiconductor losses of a three-phase bridge for the continuous and discontinuous zero sequences
 * and GDPWM against the load's power-factor angle (the library's `lossesByPowerFactor`; J. W.
 * Kolar, H. Ertl, F. C. Zach 1991; A. M. Hava, R. J. Kerkman, T. A. Lipo 1998), at one carrier
 * frequency or at equal average switching frequency, with the lowest-loss sequence at unity power
 * factor and at the extremes. Draws what the library returns.
 */
export function LossSweepPanel() {
  const [form, setForm] = useState<LossForm>({
    vdc: 650,
    ma: 0.9,
    peakCurrent: 28,
    switchingFrequency: 10_000,
    fundamentalFrequency: 50,
    basis: 'equal-carrier',
    // The library's invented example device, not a real part.
    device: { ...EXAMPLE_IGBT },
  });
  const outcome = useMemo(() => lossSweepOf({ ...form, points: 91 }), [form]);
  const errorOf = (field: string) =>
    outcome.error?.field === field ? outcome.error.message : undefined;
  const sweep = outcome.sweep;
  const degrees = sweep ? sweep.angles.map((a) => (a * 180) / Math.PI) : [];
  const series: LineSeries[] = sweep
    ? DRAWN.flatMap(({ zeroSequence, color, dashed }) => {
        const s = sweep.series.find((x) => x.zeroSequence === zeroSequence);
        return s
          ? [
              {
                name: labelOf(zeroSequence),
                color,
                x: degrees,
                y: s.total,
                ...(dashed ? { dashed } : {}),
              },
            ]
          : [];
      })
    : [];
  // The angle nearest unity power factor (the 91 default angles hold 0 exactly).
  const unity = degrees.reduce(
    (best, d, k) => (Math.abs(d) < Math.abs(degrees[best] ?? Infinity) ? k : best),
    0,
  );
  const lowestAt = (k: number) =>
    sweep ? `${formatNumber(degrees[k] ?? 0)}°: ${labelOf(sweep.lowest[k] ?? 'none')}` : '';
  const num =
    (key: 'vdc' | 'ma' | 'peakCurrent' | 'switchingFrequency' | 'fundamentalFrequency') =>
    (value: number) =>
      setForm((f) => ({ ...f, [key]: value }));
  return (
    <Panel title="Losses by load power factor">
      <div className="grid gap-4 lg:grid-cols-[280px_minmax(0,1fr)]">
        <form className="flex flex-col gap-2" onSubmit={(e) => e.preventDefault()}>
          <NumberField
            label="DC bus"
            unit="V"
            value={form.vdc}
            onChange={num('vdc')}
            error={errorOf('vdc')}
          />
          <NumberField
            label="Modulation index ma"
            value={form.ma}
            onChange={num('ma')}
            error={errorOf('ma')}
          />
          <NumberField
            label="Peak phase current"
            unit="A"
            value={form.peakCurrent}
            onChange={num('peakCurrent')}
            error={errorOf('peakCurrent')}
          />
          <NumberField
            label={form.basis === 'equal-carrier' ? 'Carrier' : 'Average switching frequency'}
            unit="Hz"
            value={form.switchingFrequency}
            onChange={num('switchingFrequency')}
            error={
              errorOf('switchingFrequency') ?? errorOf('switchingFrequency/fundamentalFrequency')
            }
          />
          <NumberField
            label="Fundamental"
            unit="Hz"
            value={form.fundamentalFrequency}
            onChange={num('fundamentalFrequency')}
            error={errorOf('fundamentalFrequency')}
          />
          <SelectField
            label="Compare at"
            value={form.basis}
            onChange={(e) => setForm({ ...form, basis: e.target.value as LossComparisonBasis })}
            options={[
              { value: 'equal-carrier', label: 'Equal carrier frequency' },
              { value: 'equal-switching', label: 'Equal average switching (clamps 1.5× carrier)' },
            ]}
          />
          <p className="text-xs text-ink-soft">
            IGBT and diode, datasheet values (the values shown are an invented example: enter your
            device's).
          </p>
          {DEVICE_FIELDS.map(({ key, label, unit, scale = 1 }) => (
            <NumberField
              key={key}
              label={label}
              unit={unit}
              scale={scale}
              value={form.device[key]}
              onChange={(value) =>
                setForm((f) => ({ ...f, device: { ...f.device, [key]: value } }))
              }
              error={errorOf(`device.${key}`)}
            />
          ))}
        </form>
        <div className="min-w-0">
          {outcome.error &&
          !DEVICE_FIELDS.some((d) => `device.${d.key}` === outcome.error.field) &&
          ![
            'vdc',
            'ma',
            'peakCurrent',
            'switchingFrequency',
            'switchingFrequency/fundamentalFrequency',
            'fundamentalFrequency',
          ].includes(outcome.error.field) ? (
            <p role="alert" className="text-sm text-bad">
              {outcome.error.message}
            </p>
          ) : null}
          {sweep ? (
            <>
              <LineChart
                title="Semiconductor losses, three legs"
                fileName="losses-by-power-factor"
                series={series}
                xLabel="load angle φ (°, current lagging)"
                yLabel="loss (W)"
              />
              <p className="mt-2 text-sm" data-testid="lowest-loss">
                Least loss at {lowestAt(0)}; {lowestAt(Math.floor(degrees.length / 2))};{' '}
                {lowestAt(degrees.length - 1)}.
              </p>
              <table
                className="num mt-2 w-full text-xs"
                aria-label="Loss by device at unity power factor"
              >
                <caption className="text-left font-sans text-ink-soft">
                  One device of each kind at φ = {formatNumber(degrees[unity] ?? 0)}° (W; six of
                  each in the bridge)
                </caption>
                <thead className="text-left text-ink-soft">
                  <tr>
                    <th className="font-medium">Zero sequence</th>
                    <th className="font-medium">Transistor conduction</th>
                    <th className="font-medium">Transistor switching</th>
                    <th className="font-medium">Diode conduction</th>
                    <th className="font-medium">Diode recovery</th>
                  </tr>
                </thead>
                <tbody>
                  {DRAWN.map(({ zeroSequence }) => {
                    const s = sweep.series.find((x) => x.zeroSequence === zeroSequence);
                    return s ? (
                      <tr key={zeroSequence} className="border-t border-rule/60">
                        <td className="font-sans">{labelOf(zeroSequence)}</td>
                        <td>{formatNumber(s.transistor.conduction[unity] ?? Number.NaN)}</td>
                        <td>{formatNumber(s.transistor.switching[unity] ?? Number.NaN)}</td>
                        <td>{formatNumber(s.diode.conduction[unity] ?? Number.NaN)}</td>
                        <td>{formatNumber(s.diode.switching[unity] ?? Number.NaN)}</td>
                      </tr>
                    ) : null;
                  })}
                </tbody>
              </table>
              <p className="mt-1 text-xs text-ink-soft">
                Average model per carrier period, linear switching energies, no thermal coupling:
                compare methods with it, then confirm the losses on the bench.
              </p>
            </>
          ) : null}
        </div>
      </div>
    </Panel>
  );
}
