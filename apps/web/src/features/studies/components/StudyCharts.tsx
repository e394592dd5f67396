import type { StudyReport } from '../../../lib/api';
import { useState } from 'react';
import { FigureCards } from '../../../components/charts/FigureCards';
import { HarmonicTable } from '../../../components/charts/HarmonicTable';
import { PeriodChart, type PeriodTrace } from '../../../components/charts/PeriodChart';
import { SpectrumChart, type SpectrumSeries } from '../../../components/charts/SpectrumChart';
import { WaveformChart } from '../../../components/charts/WaveformChart';
import { formatNumber } from '../../../lib/format';
import { reportFigures } from '../model/reportFigures';
import { CarrierSpanNote } from './CarrierSpanNote';
import { CommonModePanel } from './CommonModePanel';
import { GridPanel } from './GridPanel';
import { LossPanel } from './LossPanel';
import { MotorLoadPanel } from './MotorLoadPanel';
import { MultilevelBalancePanel } from './multilevel/MultilevelBalancePanel';
import { MultilevelFiguresPanel } from './multilevel/MultilevelFiguresPanel';
import { MultilevelLevelChart } from './multilevel/MultilevelLevelChart';
import { MultilevelLossPanel } from './multilevel/MultilevelLossPanel';

const CURRENT_COLOURS = {
  inverter: 'var(--color-trace-current)',
  capacitor: 'var(--color-trace-carrier)',
  load: 'var(--color-ink)',
} as const;

const selectClass = 'rounded border border-rule bg-panel px-1.5 py-0.5 text-xs';

/** Every figure and chart of a design report, in reading order; each draws what the report holds. */
export function StudyCharts({ report, fileStem }: { report: StudyReport; fileStem: string }) {
  return (
    <div className="flex flex-col gap-4">
      <CarrierSpanNote report={report} />
      <FigureCards figures={reportFigures(report)} label="Summary" />
      <VoltageChart report={report} fileStem={fileStem} />
      {report.multilevel ? (
        <>
          <MultilevelLevelChart multilevel={report.multilevel} fileStem={fileStem} />
          <MultilevelFiguresPanel multilevel={report.multilevel} />
          {report.multilevel.balance ? (
            <MultilevelBalancePanel balance={report.multilevel.balance} fileStem={fileStem} />
          ) : null}
          {report.multilevel.losses ? (
            <MultilevelLossPanel losses={report.multilevel.losses} fileStem={fileStem} />
          ) : null}
        </>
      ) : null}
      <ReportSpectrum report={report} fileStem={fileStem} />
      {report.currents.length ? <CurrentsChart report={report} fileStem={fileStem} /> : null}
      <MotorLoadPanel report={report} />
      <CommonModePanel report={report} fileStem={fileStem} />
      <GridPanel report={report} fileStem={fileStem} />
      <LossPanel report={report} fileStem={fileStem} />
      <HarmonicTable
        harmonics={report.bridge.spectrum}
        title={`Harmonics, ${report.bridge.name}`}
        fileName={`${fileStem}-harmonics`}
      />
      {report.output ? (
        <HarmonicTable
          harmonics={report.output.spectrum}
          title={`Harmonics, ${report.output.name}`}
          fileName={`${fileStem}-output-harmonics`}
        />
      ) : null}
    </div>
  );
}

/** The bridge's voltages by the report's names, with the filter's output over phase a. */
function VoltageChart({ report, fileStem }: { report: StudyReport; fileStem: string }) {
  const [chosen, setChosen] = useState(0);
  const voltage = report.voltages[chosen] ?? report.voltages[0];
  if (!voltage) return null;
  const overlay =
    report.output && voltage.name === report.bridge.name
      ? {
          name: report.output.name,
          angles: report.output.series.angles,
          values: report.output.series.values,
        }
      : undefined;
  // Over a span the voltages cover q periods and the modulator the first: drawn over its 2π/q.
  const span = report.carrierSpan;
  return (
    <WaveformChart
      title={`${report.modulator ? 'Modulator and bridge voltage' : 'Bridge voltage'}${span ? ` over ${span.q} fundamental periods` : ''}`}
      modulator={report.modulator ?? undefined}
      {...(span ? { fundamentalPeriods: span.q } : {})}
      output={voltage.waveform}
      outputName={voltage.name}
      overlay={overlay}
      fileName={`${fileStem}-voltage`}
      controls={
        report.voltages.length > 1 ? (
          <select
            aria-label="Voltage shown"
            className={selectClass}
            value={chosen}
            onChange={(e) => setChosen(Number(e.target.value))}
          >
            {report.voltages.map((v, i) => (
              <option key={v.name} value={i}>
                {v.name}
              </option>
            ))}
          </select>
        ) : null
      }
    />
  );
}

/** The labelled spectrum of the bridge voltage (phase, or line to line), with the filter's output beside it. */
function ReportSpectrum({ report, fileStem }: { report: StudyReport; fileStem: string }) {
  const [line, setLine] = useState(false);
  const shown = line && report.lineToLine ? report.lineToLine : report.bridge;
  const series: SpectrumSeries[] = [
    { name: shown.name, color: 'var(--color-ink)', harmonics: shown.spectrum },
  ];
  if (report.output && shown === report.bridge)
    series.push({
      name: report.output.name,
      color: 'var(--color-signal)',
      harmonics: report.output.spectrum,
    });
  return (
    <SpectrumChart
      series={series}
      fileName={`${fileStem}-spectrum`}
      title={`Spectrum to order ${report.maxOrder}`}
      fundamentalFrequency={report.fundamentalFrequency}
      controls={
        report.lineToLine ? (
          <select
            aria-label="Spectrum of"
            className={selectClass}
            value={line ? 'line' : 'phase'}
            onChange={(e) => setLine(e.target.value === 'line')}
          >
            <option value="phase">{report.bridge.name}</option>
            <option value="line">{report.lineToLine.name}</option>
          </select>
        ) : null
      }
    />
  );
}

function currentTraces(phase: StudyReport['currents'][number]): PeriodTrace[] {
  const traces: PeriodTrace[] = [
    { name: phase.inverter.name, color: CURRENT_COLOURS.inverter, ...phase.inverter.series },
  ];
  if (phase.capacitor)
    traces.push({
      name: phase.capacitor.name,
      color: CURRENT_COLOURS.capacitor,
      ...phase.capacitor.series,
    });
  // Without a filter the load's current is the switch current: drawn once.
  if (phase.load && phase.capacitor)
    traces.push({
      name: phase.load.name,
      color: CURRENT_COLOURS.load,
      dashed: true,
      ...phase.load.series,
    });
  return traces;
}

/** The currents of one phase over a period: switch, capacitor and load, with their RMS and ripple. */
function CurrentsChart({ report, fileStem }: { report: StudyReport; fileStem: string }) {
  const [index, setIndex] = useState(0);
  const phase = report.currents[index] ?? report.currents[0];
  if (!phase) return null;
  const rows = [phase.inverter, phase.capacitor, phase.capacitor ? phase.load : null].filter(
    (c) => c !== null,
  );
  return (
    <PeriodChart
      title={`${report.phaseCount === 3 ? `Currents of phase ${phase.phase}` : 'Currents'}${report.carrierSpan ? ` over ${report.carrierSpan.q} fundamental periods` : ''}`}
      fileName={`${fileStem}-currents`}
      {...(report.carrierSpan ? { fundamentalPeriods: report.carrierSpan.q } : {})}
      unit="amperes"
      traces={currentTraces(phase)}
      controls={
        report.currents.length > 1 ? (
          <select
            aria-label="Phase"
            className={selectClass}
            value={index}
            onChange={(e) => setIndex(Number(e.target.value))}
          >
            {report.currents.map((c, i) => (
              <option key={c.phase} value={i}>
                phase {c.phase}
              </option>
            ))}
          </select>
        ) : null
      }
      footer={
        <>
          {phase.capacitor ? null : (
            <p className="mt-1 text-xs text-ink-soft">
              Without a filter the load carries the switch current.
            </p>
          )}
          <table className="mt-2 w-full text-xs" aria-label="Current figures">
            <thead className="text-left text-ink-soft">
              <tr>
                <th className="font-medium">Current</th>
                <th className="font-medium">RMS (A)</th>
                <th className="font-medium">Peak (A)</th>
                <th className="font-medium">Fundamental (A peak)</th>
                <th className="font-medium">Ripple RMS (A)</th>
                <th className="font-medium">Ripple peak-to-peak (A)</th>
              </tr>
            </thead>
            <tbody className="num">
              {rows.map((c) => (
                <tr key={c.name} className="border-t border-rule/60">
                  <td className="font-sans">{c.name}</td>
                  <td>{formatNumber(c.rms)}</td>
                  <td>{formatNumber(c.peak)}</td>
                  <td>{formatNumber(c.fundamental)}</td>
                  <td>{formatNumber(c.rippleRms)}</td>
                  <td>{formatNumber(c.ripplePeakToPeak)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      }
    />
  );
}
