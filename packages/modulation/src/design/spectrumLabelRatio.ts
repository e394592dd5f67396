/**
 * The ratio a design's spectra are labelled by: the frequency ratio (labels `mf−2`, `2mf+1`, …),
 * or for a stored pattern, which has no carrier, a ratio past every shown order so each harmonic
 * is labelled by its order alone. Internal: shared by analyseDesign and voltageFigures.
 */
export function spectrumLabelRatio(maxOrder: number, frequencyRatio: number | null): number {
  return frequencyRatio ?? 2 * maxOrder + 1;
}
