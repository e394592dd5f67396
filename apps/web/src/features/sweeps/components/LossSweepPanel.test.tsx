import { lossesByPowerFactor } from '@pulsewright/modulation';
import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { LossSweepPanel } from './LossSweepPanel';

describe('LossSweepPanel', () => {
  it('names the library’s lowest-loss sequence at unity power factor and follows the basis', () => {
    render(<LossSweepPanel />);
    const device = {
      kind: 'igbt' as const,
      vce0: 0.9,
      rce: 0.012,
      vf0: 1.05,
      rf: 0.009,
      eon: 2.1e-3,
      eoff: 2.6e-3,
      err: 1.3e-3,
      referenceVoltage: 600,
      referenceCurrent: 100,
    };
    const sweep = lossesByPowerFactor({
      device,
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
    fireEvent.change(screen.getByLabelText(/Compare at/), { target: { value: 'equal-switching' } });
    expect(screen.getByLabelText(/Average switching frequency/)).toBeInTheDocument();
  });

  it('puts the library’s refusal on the field', () => {
    render(<LossSweepPanel />);
    fireEvent.change(screen.getByLabelText(/Modulation index/), { target: { value: '9' } });
    expect(screen.getByText(/ma must be/)).toBeInTheDocument();
  });
});
