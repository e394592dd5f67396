import { harmonics, labelHarmonics, sineTriangle } from '@pulsewright/modulation';
import { fireEvent, render } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { SpectrumChart } from './SpectrumChart';

// A bipolar bridge at odd mf: the library's exact spectrum, labelled by the library.
const mf = 15;
const spectrum = labelHarmonics(
  harmonics(sineTriangle({ scheme: 'bipolar', ma: 0.8, mf, vdc: 100 }), 60),
  mf,
);

function bars(container: HTMLElement) {
  return Array.from(container.querySelectorAll('svg[data-chart="spectrum"] rect[data-bar]'));
}

describe('SpectrumChart', () => {
  it('draws one bar per harmonic order from 1 to the highest', () => {
    const { container } = render(
      <SpectrumChart series={[{ name: 'out', color: '#000', harmonics: spectrum }]} />,
    );
    const drawn = bars(container).map((rect) => Number(rect.getAttribute('data-order')));
    expect(drawn).toEqual(Array.from({ length: 60 }, (_, i) => i + 1));
  });

  it('prints labels that are exactly the library labels of those orders', () => {
    const { container } = render(
      <SpectrumChart series={[{ name: 'out', color: '#000', harmonics: spectrum }]} />,
    );
    const texts = Array.from(container.querySelectorAll('[data-labels] text'));
    expect(texts.length).toBeGreaterThan(0);
    for (const text of texts) {
      const order = Number(text.getAttribute('data-label-order'));
      expect(text.textContent).toBe(spectrum.find((h) => h.order === order)?.label);
    }
    // The carrier harmonic at mf dominates the bipolar spectrum at ma = 0.8 (Holmes and Lipo,
    // 2003, ch. 3: m = 1, n = 0 term; Mohan et al. table, 1.006·Vdc at ma = 0.6 falling with ma).
    expect(texts.map((t) => t.textContent)).toContain('mf');
  });

  it('draws the even orders of an odd-mf bipolar waveform as empty bars (half-wave symmetry, a fact of the trade)', () => {
    const { container } = render(
      <SpectrumChart series={[{ name: 'out', color: '#000', harmonics: spectrum }]} />,
    );
    const even = bars(container).filter(
      (rect) => Number(rect.getAttribute('data-order')) % 2 === 0,
    );
    const fundamental = bars(container).find((rect) => rect.getAttribute('data-order') === '1');
    const tallest = Number(fundamental?.getAttribute('height'));
    expect(tallest).toBeGreaterThan(100);
    for (const rect of even)
      expect(Number(rect.getAttribute('height'))).toBeLessThan(tallest * 1e-6);
  });

  it('switches between linear and logarithmic scales and shows a value on hover', () => {
    const { container, getByRole } = render(
      <SpectrumChart series={[{ name: 'out', color: '#000', harmonics: spectrum }]} />,
    );
    const svg = container.querySelector('svg[data-chart="spectrum"]');
    expect(svg?.getAttribute('data-scale')).toBe('linear');
    fireEvent.click(getByRole('button', { name: 'Log scale' }));
    expect(svg?.getAttribute('data-scale')).toBe('log');
    const carrierBar = bars(container).find(
      (rect) => rect.getAttribute('data-order') === String(mf),
    );
    fireEvent.mouseEnter(carrierBar as Element);
    expect(container.textContent).toContain(`order ${mf} (mf)`);
  });

  it('overlays several series with one bar per order each', () => {
    const other = labelHarmonics(
      harmonics(sineTriangle({ scheme: 'unipolar', ma: 0.8, mf, vdc: 100 }), 60),
      mf,
    );
    const { container } = render(
      <SpectrumChart
        series={[
          { name: 'bipolar', color: '#000', harmonics: spectrum },
          { name: 'unipolar', color: '#f00', harmonics: other },
        ]}
      />,
    );
    expect(bars(container)).toHaveLength(120);
    expect(container.querySelectorAll('g[data-series]')).toHaveLength(2);
  });
});
