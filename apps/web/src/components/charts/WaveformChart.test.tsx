import { sineReference, sineTriangle, triangleCarrier } from '@pulsewright/modulation';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { WaveformChart } from './WaveformChart';

const mf = 9;
const output = sineTriangle({ scheme: 'bipolar', ma: 0.8, mf, vdc: 200 });
const angles = Array.from({ length: 401 }, (_, k) => (2 * Math.PI * k) / 400);
const modulator = {
  angles,
  reference: angles.map(sineReference(0.8).value),
  carrier: angles.map((t) => triangleCarrier(t, { mf })),
};

afterEach(() => vi.restoreAllMocks());

describe('WaveformChart', () => {
  it('draws reference, carrier and the switched output, and names its edges', () => {
    const { container } = render(
      <WaveformChart modulator={modulator} output={output} outputName="Bridge output" />,
    );
    const svg = container.querySelector('svg[data-chart="waveform"]');
    // Bipolar at odd mf switches twice per carrier cycle: 2·mf edges per period (a fact of the trade).
    expect(svg?.getAttribute('aria-label')).toContain(`${2 * mf} switching edges`);
    expect(output.edges).toHaveLength(2 * mf);
    // Each of the three traces is drawn once, as a line through its points.
    for (const trace of ['ref', 'carrier', 'out']) {
      const drawn = container.querySelectorAll(
        `svg[data-chart="waveform"] path[stroke="var(--color-trace-${trace})"]`,
      );
      expect(drawn).toHaveLength(1);
      expect(drawn[0]?.getAttribute('d')).toMatch(/^M[^L]+L/);
    }
  });

  it('zooms in and out with its buttons (keyboard-reachable), narrowing the angle window', () => {
    render(<WaveformChart modulator={modulator} output={output} outputName="Bridge output" />);
    expect(screen.getByText(/window 0 to 2π/)).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Zoom in' }));
    expect(screen.queryByText(/window 0 to 2π/)).not.toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Reset' }));
    expect(screen.getByText(/window 0 to 2π/)).toBeInTheDocument();
  });

  it('exports a standalone SVG file', async () => {
    let saved: Blob | undefined;
    vi.spyOn(URL, 'createObjectURL').mockImplementation((blob) => {
      saved = blob as Blob;
      return 'blob:test';
    });
    vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => undefined);
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    render(<WaveformChart modulator={modulator} output={output} outputName="Bridge output" />);
    fireEvent.click(screen.getByRole('button', { name: /as SVG/ }));
    const text = await new Promise<string>((resolve) => {
      const reader = new FileReader();
      reader.onload = () => resolve(typeof reader.result === 'string' ? reader.result : '');
      reader.readAsText(saved as Blob);
    });
    expect(saved?.type).toBe('image/svg+xml');
    expect(text).toMatch(/^<svg[^>]+xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(text).toContain('Bridge output');
  });
});
