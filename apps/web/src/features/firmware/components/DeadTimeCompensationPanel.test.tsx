import { deadTimeCompensation, timerTable } from '@pulsewright/modulation';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber } from '../../../lib/format';
import { DeadTimeCompensationPanel } from './DeadTimeCompensationPanel';

const table = timerTable({
  modulation: { method: 'three-phase', zeroSequence: 'dpwm1', ma: 0.9 },
  fundamentalFrequency: 50,
  carrierFrequency: 5000,
  timerClock: 16e6,
  deadTime: 1e-6,
  vdc: 650,
});

describe('DeadTimeCompensationPanel', () => {
  it('shows the library’s figures with no dead time, with it and corrected, for the angle typed', () => {
    render(<DeadTimeCompensationPanel table={table} fileStem="t" prefix="pwm" />);
    const figures = screen.getByRole('table', { name: 'Compensation figures' });
    const expected = deadTimeCompensation(table, { currentAngle: Math.PI / 6 });
    const rows = within(figures).getAllByRole('row');
    expect(rows[2]).toHaveTextContent(formatNumber(expected.uncompensated.fundamental));
    expect(rows[3]).toHaveTextContent(formatNumber(expected.compensated.fundamental));
    fireEvent.change(screen.getByLabelText(/Predicted load angle/), { target: { value: '0' } });
    const atZero = deadTimeCompensation(table, { currentAngle: 0 });
    expect(within(figures).getAllByRole('row')[3]).toHaveTextContent(
      formatNumber(atZero.compensated.fundamental),
    );
  });

  it('draws nothing for a table without dead time', () => {
    const { container } = render(
      <DeadTimeCompensationPanel
        table={{ ...table, deadTimeCounts: 0 }}
        fileStem="t"
        prefix="pwm"
      />,
    );
    expect(container).toBeEmptyDOMElement();
  });
});
