import type { InverterDesign } from '@pulsewright/modulation';
import { useState } from 'react';
import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { Button } from '../../../components/ui/Button';
import { CautionBanner } from '../../../components/ui/Caution';
import { Panel } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import { useAsynchronousSpectra } from '../../../lib/api/asynchronousSpectra';
import { formatNumber, formatPercent } from '../../../lib/format';

/** Highest order asked for, in fundamentals: the first carrier groups at the low ratios this is for. */
const MAX_ORDER = 50;

/** How many of the largest components above the fundamental the table lists. */
const LISTED = 8;

/**
 * The components the table lists: every sub-harmonic (order below 1) that is not zero to
 * rounding, then the largest components above the fundamental, each group largest first.
 */
function listed<C extends { order: number; amplitude: number }>(
  components: readonly C[],
  fundamental: number,
): C[] {
  const byAmplitude = (a: C, b: C) => b.amplitude - a.amplitude;
  const floor = 1e-9 * fundamental;
  return [
    ...components
      .filter((c) => c.order > 0 && c.order < 1 && c.amplitude > floor)
      .sort(byAmplitude),
    ...components
      .filter((c) => c.order > 1)
      .sort(byAmplitude)
      .slice(0, LISTED),
  ];
}

export interface AsynchronousSpectraPanelProps {
  /** A carrier design whose carrier is not a whole multiple of its fundamental. */
  design: InverterDesign;
}

/**
 * The design at the carrier typed (POST /api/v1/designs/asynchronous-spectra): the ratio the
 * service analysed as p/q with the carrier error in hertz, and a voltage's spectrum over the q
 * fundamental periods after which it repeats, orders labelled as fractions (1/3, 47/3), with THD
 * and WTHD over the whole span. The service computes every figure; this panel draws them.
 */
export function AsynchronousSpectraPanel({ design }: AsynchronousSpectraPanelProps) {
  const analysis = useAsynchronousSpectra();
  const [chosen, setChosen] = useState(0);
  const result = analysis.data;
  const voltage = result?.voltages[Math.min(chosen, result.voltages.length - 1)];
  return (
    <Panel
      title="Carrier as typed"
      actions={
        <Button
          variant="secondary"
          disabled={analysis.isPending}
          onClick={() => analysis.mutate({ design, maxOrder: MAX_ORDER })}
        >
          {analysis.isPending ? 'Analysing…' : 'Analyse at this carrier'}
        </Button>
      }
    >
      <p className="text-sm text-ink-soft">
        The service takes the ratio {formatNumber(design.carrierFrequency ?? NaN, 9)} Hz ÷{' '}
        {formatNumber(design.fundamentalFrequency, 6)} Hz as the nearest fraction p/q (q at most 64)
        and analyses the voltages exactly over q fundamental periods: components between the
        harmonics (sub-harmonics and beats) appear at orders n/q.
      </p>
      {analysis.isError ? <ErrorState error={analysis.error} /> : null}
      {result && voltage ? (
        <div className="mt-3 flex flex-col gap-3">
          <table aria-label="Ratio analysed" className="text-sm">
            <tbody>
              <tr>
                <th className="pr-3 text-left font-medium">Ratio p/q</th>
                <td data-testid="async-ratio">
                  {result.p}/{result.q} = {formatNumber(result.frequencyRatio, 6)}
                </td>
              </tr>
              <tr>
                <th className="pr-3 text-left font-medium">Carrier analysed</th>
                <td>{formatNumber(result.carrierFrequency, 9)} Hz</td>
              </tr>
              <tr>
                <th className="pr-3 text-left font-medium">Carrier error</th>
                <td data-testid="async-error">{formatNumber(result.carrierError, 4)} Hz</td>
              </tr>
              <tr>
                <th className="pr-3 text-left font-medium">Repeats after</th>
                <td>
                  {result.q} fundamental period{result.q === 1 ? '' : 's'} (components every{' '}
                  {formatNumber(result.baseFrequency, 6)} Hz)
                </td>
              </tr>
              <tr>
                <th className="pr-3 text-left font-medium">THD, WTHD ({voltage.name})</th>
                <td data-testid="async-distortion">
                  {formatPercent(voltage.spectrum.thd)}, {formatPercent(voltage.spectrum.wthd)}
                </td>
              </tr>
            </tbody>
          </table>
          <table aria-label="Sub-harmonics and largest components" className="text-sm">
            <thead>
              <tr>
                <th className="pr-3 text-left font-medium">Order</th>
                <th className="pr-3 text-left font-medium">Hz</th>
                <th className="text-left font-medium">Peak V</th>
              </tr>
            </thead>
            <tbody>
              {listed(voltage.spectrum.components, voltage.spectrum.fundamental).map((c) => (
                <tr key={c.spanOrder}>
                  <td className="pr-3">{c.label}</td>
                  <td className="pr-3">{formatNumber(c.order * design.fundamentalFrequency, 6)}</td>
                  <td>{formatNumber(c.amplitude)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <SpectrumChart
            title={`Spectrum of ${voltage.name} over ${result.q} periods`}
            fileName="asynchronous-spectrum"
            fundamentalFrequency={design.fundamentalFrequency}
            series={[
              {
                name: voltage.name,
                color: '#12263a',
                harmonics: voltage.spectrum.components.map(({ order, amplitude, label }) => ({
                  order,
                  amplitude,
                  label,
                })),
              },
            ]}
            controls={
              result.voltages.length > 1 ? (
                <select
                  aria-label="Voltage"
                  className="rounded border border-rule px-2 py-1 text-sm"
                  value={chosen}
                  onChange={(event) => setChosen(Number(event.target.value))}
                >
                  {result.voltages.map((v, index) => (
                    <option key={v.name} value={index}>
                      {v.name}
                    </option>
                  ))}
                </select>
              ) : null
            }
          />
          <CautionBanner compact />
        </div>
      ) : null}
    </Panel>
  );
}
