import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber } from '../../../lib/format';
import { MotorLoadPanel } from './MotorLoadPanel';

const design: InverterDesign = {
  vdc: 600,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 27,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'third-harmonic' },
  load: { r: 1.5, l: 6e-3, emf: { amplitude: 220, phase: -0.35 } },
};

describe('MotorLoadPanel', () => {
  it('labels every phase and shows the report’s torque-producing current and power', () => {
    const report = analyseDesign(design);
    render(<MotorLoadPanel report={report} />);
    const currents = screen.getByRole('table', { name: 'Load currents per phase' });
    for (const phase of ['a', 'b', 'c'])
      expect(currents).toHaveTextContent(`load current, phase ${phase}`);
    const torque = screen.getByRole('table', { name: 'Torque-producing current per phase' });
    const rows = within(torque).getAllByRole('row');
    expect(rows).toHaveLength(4);
    expect(rows[2]).toHaveTextContent(`phase b${formatNumber(220)}`);
    expect(rows[1]).toHaveTextContent(formatNumber(report.motor?.phases[0]?.torqueCurrent ?? NaN));
    expect(screen.getByTestId('motor-totals')).toHaveTextContent(
      `Air-gap power ${formatNumber(report.motor?.electromagneticPower ?? NaN)} W`,
    );
  });

  it('shows the load without motor figures when there is no EMF, and nothing without a load', () => {
    const { unmount } = render(
      <MotorLoadPanel report={analyseDesign({ ...design, load: { r: 1.5, l: 6e-3 } })} />,
    );
    expect(screen.getByRole('table', { name: 'Load currents per phase' })).toBeInTheDocument();
    expect(screen.queryByRole('table', { name: 'Torque-producing current per phase' })).toBeNull();
    unmount();
    const { load: _load, ...unloaded } = design;
    const { container } = render(<MotorLoadPanel report={analyseDesign(unloaded)} />);
    expect(container).toBeEmptyDOMElement();
  });

  it('says "per phase" only where there are phases: a single-phase bridge has one load', () => {
    const single: InverterDesign = {
      ...design,
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.9 },
    };
    const report = analyseDesign(single);
    expect(report.phaseCount).toBe(1);
    render(<MotorLoadPanel report={report} />);
    expect(screen.getByRole('region', { name: 'Motor load' })).toBeInTheDocument();
    expect(screen.queryByText(/per phase/)).toBeNull();
    expect(screen.queryByText(/phase a|all phases/)).toBeNull();
    const currents = screen.getByRole('table', { name: 'Load current' });
    expect(within(currents).getAllByRole('row')).toHaveLength(2);
    const torque = screen.getByRole('table', { name: 'Torque-producing current' });
    expect(within(torque).getAllByRole('columnheader')).toHaveLength(5);
  });

  it('keeps "per phase" on a three-phase bridge', () => {
    render(<MotorLoadPanel report={analyseDesign(design)} />);
    expect(screen.getByRole('region', { name: 'Motor load, per phase' })).toBeInTheDocument();
  });
});
