import { analyseDesign } from '@pulsewright/modulation';

/**
 * The picked point's figures from the library's design report (the same model as every other
 * page): the bridge or staircase voltage's labelled spectrum and its exact whole-waveform THD.
 * The fundamental frequency does not change a voltage spectrum; 50 Hz is only a placeholder.
 */
export function pointSpectrum(
  kind: 'bipolar' | 'staircase',
  vdc: number,
  angles: number[],
  eliminate: number[],
) {
  const report = analyseDesign({
    vdc,
    fundamentalFrequency: 50,
    modulation: { method: 'selective-harmonic-elimination', kind, angles, eliminate },
  });
  return { spectrum: report.bridge.spectrum, thd: report.bridge.thd };
}
