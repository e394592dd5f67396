import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { SweepCharts } from './SweepCharts';

// A small sweep as the service returns it (shape only; the figures are not checked here): THD
// from 300 % at low ma down to 50 %, two tracked orders.
const result = {
  voltage: 'line a−b',
  ma: [0.1, 0.5, 1, 1.5],
  fundamental: [40, 200, 400, 480],
  thd: [3, 1.2, 0.6, 0.5],
  wthd: [0.02, 0.01, 0.008, 0.01],
  spectrumThd: [3, 1.2, 0.6, 0.5],
  spectrumWthd: [0.02, 0.01, 0.008, 0.01],
  harmonics: [
    { order: 19, amplitude: [10, 40, 60, 70] },
    { order: 21, amplitude: [500, 400, 240, 100] },
  ],
};

describe('SweepCharts', () => {
  it('draws THD on a log axis by default and on a range the user picks (issue 10)', () => {
    const { container } = render(<SweepCharts result={result} />);
    const distortion = () => container.querySelectorAll('svg[data-chart="line"]')[0];
    expect(distortion()?.getAttribute('data-scale')).toBe('log');
    fireEvent.change(screen.getByRole('combobox', { name: 'THD axis' }), {
      target: { value: 'range' },
    });
    expect(distortion()?.getAttribute('data-scale')).toBe('linear');
    const top = screen.getByLabelText(/THD axis up to/);
    fireEvent.change(top, { target: { value: '80' } });
    // The top tick of a 0–80 % axis reads 80 %: the 300 % point is clipped, not rescaling it.
    expect(distortion()?.textContent).toContain('80 %');
    expect(distortion()?.textContent).not.toContain('300 %');
    fireEvent.change(top, { target: { value: '-3' } });
    expect(top).toHaveAccessibleDescription(
      'THD axis top must be above 0 to 10,000 % (entered -3 %)',
    );
  });

  it("shows any tracked harmonic's amplitude against ma beside the fundamental", () => {
    render(<SweepCharts result={result} />);
    expect(screen.getByText('Fundamental and order 19 against ma, line a−b')).toBeInTheDocument();
    fireEvent.change(screen.getByRole('combobox', { name: 'Harmonic shown' }), {
      target: { value: '21' },
    });
    expect(screen.getByText('Fundamental and order 21 against ma, line a−b')).toBeInTheDocument();
  });

  it('names the voltage the service analysed on both charts, and says when a stored sweep has none', () => {
    const { container, unmount } = render(<SweepCharts result={result} />);
    expect(screen.getByText('THD and WTHD against ma, line a−b')).toBeInTheDocument();
    expect(container.querySelectorAll('svg[data-chart="line"]')[1]?.textContent).toContain(
      'volts peak, line a−b',
    );
    unmount();
    const { voltage: _voltage, ...older } = result;
    render(<SweepCharts result={older} />);
    expect(screen.getByText('THD and WTHD against ma, voltage not recorded')).toBeInTheDocument();
  });
});
