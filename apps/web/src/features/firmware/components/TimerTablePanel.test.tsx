import { timerTable, timerTableToCsv } from '@pulsewright/modulation';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { catchDownloads } from '../../../testing/downloads';
import { TimerTablePanel } from './TimerTablePanel';

const options = (zeroSequence: 'azspwm1' | 'min-max') =>
  timerTable({
    modulation: { method: 'three-phase', zeroSequence, ma: 0.9 },
    fundamentalFrequency: 50,
    carrierFrequency: 2500,
    timerClock: 40e6,
    deadTime: 1e-6,
    vdc: 650,
  });

afterEach(() => vi.restoreAllMocks());

describe('TimerTablePanel', () => {
  it("shows each entry's compare sense for azspwm1 (the middle phase above) and downloads the library's CSV", async () => {
    const table = options('azspwm1');
    render(
      <TimerTablePanel table={table} stem="drive" prefix="drive_pwm" prefixError={undefined} />,
    );
    expect(screen.getByTestId('compare-sense-note').textContent).toMatch(/inverted carrier/);
    expect(screen.getByRole('columnheader', { name: 'a: duty / sense / high / low' })).toBeTruthy();
    // One channel of every entry is the middle phase: as many "above" cells as entries shown.
    const rows = Math.min(400, table.parameters.tableLength);
    expect(screen.getAllByText('above', { selector: 'td strong' })).toHaveLength(rows);
    const downloads = catchDownloads();
    fireEvent.click(screen.getByRole('button', { name: 'CSV' }));
    const { text } = await downloads.saved();
    expect(text).toBe(timerTableToCsv(table));
    expect(text.split('\r\n')[0]).toContain('a_sense');
  });

  it('shows no sense for a table whose entries are all below (min-max)', () => {
    render(
      <TimerTablePanel
        table={options('min-max')}
        stem="drive"
        prefix="p"
        prefixError={undefined}
      />,
    );
    expect(screen.queryByTestId('compare-sense-note')).toBeNull();
    expect(screen.getByRole('columnheader', { name: 'a: duty / high / low' })).toBeTruthy();
    expect(screen.queryAllByText('above', { selector: 'td strong' })).toHaveLength(0);
  });
});
