import { designFrequencyRatio, labelHarmonics, type InverterDesign } from '@pulsewright/modulation';
import { useState } from 'react';
import type { SpectrumSeries } from '../../../components/charts/SpectrumChart';
import {
  useCaptureComparison,
  useCaptureSpectrum,
  useStudies,
  type FftWindow,
} from '../../../lib/api';

/**
 * A capture's analysis: the FFT window and the study picked to compare with, the capture's
 * spectrum and its comparison from the service, and the spectrum series to draw (labelled by
 * carrier group when the study has a carrier, mf from the study's design).
 */
export function useCaptureAnalysis(captureId: string) {
  const [windowName, setWindowName] = useState<FftWindow>('hann');
  const [studyId, setStudyId] = useState('');
  const studies = useStudies();
  const study = studies.data?.find((s) => s.id === studyId);
  const spectrum = useCaptureSpectrum(captureId, windowName);
  const comparison = useCaptureComparison(captureId, studyId || null, windowName);
  const mf = study ? frequencyRatioOf(study.design) : 0;
  const label = (bars: { order: number; amplitude: number }[]) =>
    mf
      ? labelHarmonics(
          bars.map((b) => ({ ...b, phase: 0 })),
          mf,
        )
      : bars;
  const series: SpectrumSeries[] = [];
  if (comparison.data) {
    series.push({
      name: `Capture (${windowLabel(comparison.data)})`,
      color: 'var(--color-trace-current)',
      harmonics: label(
        comparison.data.orders.map((o) => ({ order: o.order, amplitude: o.measured })),
      ),
    });
    series.push({
      name: `Prediction: ${study?.name ?? 'study'} (revision ${comparison.data.studyRevision})`,
      color: 'var(--color-ink)',
      harmonics: label(
        comparison.data.orders.map((o) => ({ order: o.order, amplitude: o.predicted })),
      ),
    });
  } else if (spectrum.data) {
    series.push({
      name: `Capture (${windowLabel(spectrum.data)})`,
      color: 'var(--color-trace-current)',
      harmonics: spectrum.data.harmonics,
    });
  }
  return {
    windowName,
    setWindowName,
    studyId,
    setStudyId,
    studies,
    spectrum,
    comparison,
    series,
  };
}

/** The window the service applied, in words: none for an exactly periodic capture. */
function windowLabel(analysis: { periodic: boolean; window: string }): string {
  return analysis.periodic ? 'exactly periodic, no window' : `${analysis.window} window`;
}

/** The study's frequency ratio for the carrier-group labels (0 for a stored pattern: no labels). */
function frequencyRatioOf(design: InverterDesign): number {
  if (design.carrierFrequency === undefined) return 0;
  try {
    return designFrequencyRatio(design);
  } catch {
    return 0;
  }
}
