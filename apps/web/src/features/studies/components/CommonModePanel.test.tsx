import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber } from '../../../lib/format';
import { CommonModePanel } from './CommonModePanel';

const design = (zeroSequence: 'azspwm1' | 'min-max'): InverterDesign => ({
  vdc: 600,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 51,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence },
});

describe('CommonModePanel', () => {
  it('shows the levels, steps and switching of the report, and the range of a reduced common-mode method', () => {
    const report = analyseDesign(design('azspwm1'));
    render(<CommonModePanel report={report} fileStem="t" />);
    const table = screen.getByRole('table', { name: 'Common-mode figures' });
    expect(table).toHaveTextContent(
      (report.commonMode?.levels ?? []).map((l) => formatNumber(l)).join(', '),
    );
    expect(table).toHaveTextContent(`${report.commonMode?.stepsPerPeriod} a period`);
    expect(table).toHaveTextContent(`${report.switching?.legEdgesPerPeriod} edges a period`);
    expect(screen.getByTestId('reduced-common-mode-range')).toHaveTextContent(
      `ma from ${formatNumber(0)} to ${formatNumber(2 / Math.sqrt(3))}`,
    );
    expect(within(table).getAllByRole('row')).toHaveLength(4);
  });

  it('has no range note for a standard method and draws nothing for a single-phase design', () => {
    const { unmount } = render(
      <CommonModePanel report={analyseDesign(design('min-max'))} fileStem="t" />,
    );
    expect(screen.queryByTestId('reduced-common-mode-range')).toBeNull();
    unmount();
    const single = analyseDesign({
      ...design('min-max'),
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9 },
    });
    const { container } = render(<CommonModePanel report={single} fileStem="t" />);
    expect(container).toBeEmptyDOMElement();
  });
});
