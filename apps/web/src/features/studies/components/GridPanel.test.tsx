import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber, formatPercent, formatWorstOrder } from '../../../lib/format';
import { GridPanel } from './GridPanel';

// Invented values: a 400 V, 50 Hz grid fed through an LCL filter from 700 V at 10 kHz.
const design: InverterDesign = {
  vdc: 700,
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
  filter: { l: 2e-3, c: 10e-6, rDamping: 2 },
  grid: { lineVoltage: 400, phase: -0.1, r: 0.05, l: 0.2e-3, l2: 0.5e-3, controlBandwidth: 1000 },
};

describe('GridPanel', () => {
  it('shows the report’s grid figures, its verdict against IEEE 519 and then IEEE 1547, and the caution', () => {
    const report = analyseDesign(design, { points: 256 });
    const grid = report.grid!;
    render(<GridPanel report={report} fileStem="lcl" />);
    const figures = screen.getByRole('table', { name: 'Grid figures' });
    expect(figures).toHaveTextContent(formatNumber(grid.resonance!.frequency));
    expect(figures).toHaveTextContent(formatNumber(grid.dampingLoss));
    expect(figures).toHaveTextContent(formatNumber(grid.shortCircuitRatio));
    expect(within(figures).getByText(/carrier .*× above it/)).toBeInTheDocument();
    const verdict = screen.getByTestId('grid-verdict');
    expect(verdict).toHaveTextContent('IEEE Std 519-2022');
    expect(verdict).toHaveTextContent(`TDD ${formatPercent(grid.limits.ieee519.total)}`);
    expect(verdict).toHaveTextContent(
      `worst order ${formatWorstOrder(grid.limits.ieee519.worstIndividual)}.`,
    );
    expect(verdict).toHaveTextContent('the row for generating equipment');
    // I_SC/I_L is above 20 here, yet the footnote for generating equipment applies the first row
    // of IEEE 519's Table 2 (from memory): the panel says why, and not under IEEE 1547.
    expect(grid.shortCircuitRatio).toBeGreaterThan(20);
    expect(screen.getByTestId('grid-row-reason')).toHaveTextContent(
      /^The I_SC\/I_L < 20 row is used although I_SC\/I_L is .*generating equipment whatever the actual ratio \(from memory: confirm with the standard and the utility\)\.$/,
    );
    expect(screen.getByTestId('grid-caution')).toHaveTextContent(/recalled from memory/);
    fireEvent.change(screen.getByRole('combobox', { name: 'Limits of' }), {
      target: { value: 'ieee1547' },
    });
    expect(screen.getByTestId('grid-verdict')).toHaveTextContent('IEEE Std 1547-2018');
    expect(screen.queryByTestId('grid-row-reason')).toBeNull();
    expect(screen.getByTestId('grid-verdict')).toHaveTextContent(
      `TRD ${formatPercent(grid.limits.ieee1547.total)}`,
    );
  });

  it('lists the harmonic groups a carrier span’s limits were read on, with the rule and its caution (60 Hz, 10 kHz: 500/3)', () => {
    const report = analyseDesign({ ...design, fundamentalFrequency: 60 }, { points: 256 });
    expect(report.carrierSpan).toMatchObject({ p: 500, q: 3 });
    const grouping = report.grid!.harmonicGrouping!;
    render(<GridPanel report={report} fileStem="lcl" />);
    const section = screen.getByTestId('grid-grouping');
    expect(section).toHaveTextContent(
      /IEC 61000-4-7, from memory; confirm with the standard and the utility/,
    );
    expect(section).toHaveTextContent(grouping.rule);
    const rows = within(screen.getByRole('table', { name: 'Harmonic groups' })).getAllByRole('row');
    // A header and groups 1..50; group 5 took the components at 14/3 and 16/3 (4.667 and 5.333).
    expect(rows).toHaveLength(51);
    expect(rows[5]).toHaveTextContent(/^5/);
    expect(rows[5]).toHaveTextContent('4.667: ');
    expect(rows[5]).toHaveTextContent('5.333: ');
    const reference = report.grid!.limits.ieee519.referenceCurrent;
    expect(rows[5]).toHaveTextContent(formatPercent(grouping.groups[4]!.amplitude / reference));
  });

  it('names the currents as the report does: by phase on a three-phase bridge, without one on a single-phase bridge', () => {
    const three = render(
      <GridPanel report={analyseDesign(design, { points: 256 })} fileStem="lcl" />,
    );
    expect(three.container).toHaveTextContent('grid current, phase a');
    three.unmount();
    const single = analyseDesign(
      {
        ...design,
        modulation: { method: 'sine-triangle', ma: 0.9, scheme: 'unipolar' },
        grid: { ...design.grid!, lineVoltage: 230 },
      },
      { points: 256 },
    );
    const { container } = render(<GridPanel report={single} fileStem="lcl" />);
    expect(container).toHaveTextContent('grid current');
    expect(container).toHaveTextContent('inverter (switch) current');
    expect(container).not.toHaveTextContent('phase a');
  });

  it('draws nothing without a grid', () => {
    const { grid: _grid, ...alone } = design;
    const { container } = render(
      <GridPanel report={analyseDesign(alone, { points: 256 })} fileStem="lc" />,
    );
    expect(container).toBeEmptyDOMElement();
  });
});
