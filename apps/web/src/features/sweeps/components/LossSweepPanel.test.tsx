import { EXAMPLE_IGBT, lossesByPowerFactor } from '@pulsewright/modulation';
import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber } from '../../../lib/format';
import { LossSweepPanel } from './LossSweepPanel';

describe('LossSweepPanel', () => {
  it('names the library’s lowest-loss sequence at unity power factor and follows the basis', () => {
    render(<LossSweepPanel />);
    const sweep = lossesByPowerFactor({
      device: EXAMPLE_IGBT,
      vdc: 650,
      ma: 0.9,
      peakCurrent: 28,
      switchingFrequency: 10_000,
      fundamentalFrequency: 50,
      points: 91,
    });
    expect(sweep.lowest[45]).toBe('dpwm1');
    expect(screen.getByTestId('lowest-loss')).toHaveTextContent(
      '0°: DPWM1: clamp 60° at the peaks',
    );
    const byDevice = screen.getByRole('table', { name: 'Loss by device at unity power factor' });
    const dpwm1 = sweep.series.find((s) => s.zeroSequence === 'dpwm1');
    expect(byDevice).toHaveTextContent(formatNumber(dpwm1?.transistor.switching[45] ?? Number.NaN));
    expect(byDevice).toHaveTextContent(formatNumber(dpwm1?.diode.conduction[45] ?? Number.NaN));
    fireEvent.change(screen.getByLabelText(/Compare at/), { target: { value: 'equal-switching' } });
    expect(screen.getByLabelText(/Average switching frequency/)).toBeInTheDocument();
  });

  it('puts the library’s refusal on the field', () => {
    render(<LossSweepPanel />);
    fireEvent.change(screen.getByLabelText(/Modulation index/), { target: { value: '9' } });
    expect(screen.getByText(/ma must be/)).toBeInTheDocument();
  });
});
