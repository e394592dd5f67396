import { HarmonicTable } from '../../../components/charts/HarmonicTable';
import { LoadCurrentChart } from '../../../components/charts/LoadCurrentChart';
import { SpectrumChart, type SpectrumSeries } from '../../../components/charts/SpectrumChart';
import { SummaryPanel } from '../../../components/charts/SummaryPanel';
import { WaveformChart } from '../../../components/charts/WaveformChart';
import type { Preview } from '../model/computePreview';

/** Every chart of a study preview, in reading order. */
export function StudyCharts({ preview, fileStem }: { preview: Preview; fileStem: string }) {
  const series: SpectrumSeries[] = [{ name: preview.outputName, color: 'var(--color-ink)', harmonics: preview.spectrum }];
  if (preview.filtered) series.push({ name: 'After LC filter', color: 'var(--color-signal)', harmonics: preview.filtered.spectrum });
  return (
    <div className="flex flex-col gap-4">
      <SummaryPanel
        outputName={preview.outputName}
        figures={{
          fundamental: preview.fundamental,
          thd: preview.thd,
          wthd: preview.wthd,
          rmsCurrent: preview.load?.steady.rmsCurrent,
          power: preview.load?.steady.power,
          filteredThd: preview.filtered?.thd,
        }}
      />
      <WaveformChart modulator={preview.modulator ?? undefined} output={preview.output} outputName={preview.outputName} fileName={`${fileStem}-waveform`} />
      <SpectrumChart series={series} fileName={`${fileStem}-spectrum`} title={`Spectrum to order ${preview.maxOrder}`} />
      {preview.load ? (
        <LoadCurrentChart
          angles={preview.load.series.angles}
          current={preview.load.series.current}
          rms={preview.load.steady.rmsCurrent}
          peakToPeak={preview.load.steady.peakToPeakCurrent}
          voltageName={preview.load.voltageName}
        />
      ) : null}
      <HarmonicTable harmonics={preview.spectrum} fileName={`${fileStem}-harmonics`} />
    </div>
  );
}
