import { fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { HarmonicTable } from './HarmonicTable';

// Square wave of ±1 V: amplitude 4/(nπ) on odd n (standard Fourier series, any signals text).
const square = Array.from({ length: 10 }, (_, i) => ({
  order: i,
  amplitude: i % 2 === 1 ? 4 / (i * Math.PI) : 0,
  phase: 0,
}));

afterEach(() => vi.restoreAllMocks());

describe('HarmonicTable', () => {
  it('lists the non-zero orders, largest first, and sorts by order on request', () => {
    render(<HarmonicTable harmonics={square} />);
    const orders = () =>
      screen
        .getAllByRole('row')
        .slice(1)
        .map((row) => within(row).getAllByRole('cell')[0]?.textContent);
    expect(orders()).toEqual(['1', '3', '5', '7', '9']);
    // The third harmonic of a square wave is 1/3 of the fundamental.
    expect(screen.getAllByRole('row')[2]?.textContent).toContain('33.333 %');
    fireEvent.click(screen.getByRole('button', { name: /Order/ }));
    expect(orders()).toEqual(['1', '3', '5', '7', '9']);
    fireEvent.click(screen.getByRole('button', { name: /Order/ }));
    expect(orders()).toEqual(['9', '7', '5', '3', '1']);
  });

  it('downloads every order as CSV', async () => {
    let saved: Blob | undefined;
    vi.spyOn(URL, 'createObjectURL').mockImplementation((blob) => {
      saved = blob as Blob;
      return 'blob:test';
    });
    vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => undefined);
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    render(<HarmonicTable harmonics={square} fileName="square" />);
    fireEvent.click(screen.getByRole('button', { name: 'Download CSV' }));
    const text = await new Promise<string>((resolve) => {
      const reader = new FileReader();
      reader.onload = () => resolve(typeof reader.result === 'string' ? reader.result : '');
      reader.readAsText(saved as Blob);
    });
    const lines = text.trim().split('\n');
    expect(lines[0]).toBe('order,label,amplitude_V_peak,phase_rad,ratio_to_fundamental');
    expect(lines).toHaveLength(11);
    expect(Number(lines[4]?.split(',')[2])).toBeCloseTo(4 / (3 * Math.PI), 12);
  });
});
