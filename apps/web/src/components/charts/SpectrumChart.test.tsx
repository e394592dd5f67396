import { harmonics, labelHarmonics, sineTriangle } from '@pulsewright/modulation';
import { fireEvent, render, screen } from '@testing-library/react';
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

  it('reads its x axis in Hz when given the fundamental: order n at n·f₁ (issue 10)', () => {
    const { container } = render(
      <SpectrumChart
        series={[{ name: 'out', color: '#000', harmonics: spectrum }]}
        fundamentalFrequency={50}
      />,
    );
    const svg = () => container.querySelector('svg[data-chart="spectrum"]');
    expect(svg()?.getAttribute('data-axis')).toBe('order');
    fireEvent.click(screen.getByRole('button', { name: 'Axis in Hz' }));
    expect(svg()?.getAttribute('data-axis')).toBe('frequency');
    expect(svg()?.textContent).toContain('frequency (Hz)');
    // Orders 1..60 at 50 Hz span 25 to 3025 Hz: d3's round ticks include 1000 and 3000 Hz.
    expect(svg()?.textContent).toContain('3000');
    // Order 15 (mf) sits where 750 Hz does.
    fireEvent.mouseEnter(container.querySelector('rect[data-order="15"]') as Element);
    expect(svg()?.textContent).toContain('order 15, 750 Hz');
  });
});
