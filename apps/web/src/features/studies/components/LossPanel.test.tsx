import { analyseDesign, EXAMPLE_IGBT, type InverterDesign } from '@pulsewright/modulation';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber, formatPercent } from '../../../lib/format';
import { LossPanel } from './LossPanel';

const design: InverterDesign = {
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 51,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'dpwm1' },
  load: { r: 8, l: 0.01 },
  device: { ...EXAMPLE_IGBT },
};

describe('LossPanel', () => {
  it('draws a bar per device of each leg, conduction and switching stacked, and the report’s totals', () => {
    const report = analyseDesign(design);
    const losses = report.losses;
    if (!losses) throw new Error('expected losses');
    render(<LossPanel report={report} fileStem="drive" />);
    const chart = screen.getByRole('figure', { name: 'Losses by device (IGBT and diode)' });
    const bars = chart.querySelectorAll('g[data-bar]');
    // Three legs, four devices each.
    expect(bars).toHaveLength(12);
    expect(bars[0]?.getAttribute('data-bar')).toBe('leg a, upper transistor');
    expect(bars[11]?.getAttribute('data-bar')).toBe('leg c, lower diode');
    // The stacked widths are in proportion to the report's watts.
    const width = (bar: Element | undefined, part: string) =>
      Number(bar?.querySelector(`rect[data-part="${part}"]`)?.getAttribute('width'));
    const a = losses.legs[0];
    if (!a) throw new Error('expected leg a');
    expect(width(bars[0], 'switching') / width(bars[0], 'conduction')).toBeCloseTo(
      a.upperTransistor.switching / a.upperTransistor.conduction,
      6,
    );
    expect(within(chart).getByRole('button', { name: /data as CSV/ })).toBeInTheDocument();
    const figures = screen.getByRole('table', { name: 'Loss figures' });
    expect(within(figures).getByText(formatNumber(losses.total))).toBeInTheDocument();
    expect(
      within(figures).getByText(formatPercent(losses.efficiency ?? Number.NaN, 3)),
    ).toBeInTheDocument();
  });

  it('shows nothing for a design without a device', () => {
    const { device: _device, ...bare } = design;
    const { container } = render(<LossPanel report={analyseDesign(bare)} fileStem="drive" />);
    expect(container).toBeEmptyDOMElement();
  });
});
