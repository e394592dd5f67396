import { timerTable, timerTableToSpiceNetlist } from '@pulsewright/modulation';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { catchDownloads } from '../../../testing/downloads';
import { NetlistPanel } from './NetlistPanel';

const table = timerTable({
  modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.85 },
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  timerClock: 72e6,
  deadTime: 5e-7,
  vdc: 360,
});

afterEach(() => vi.restoreAllMocks());

describe('NetlistPanel', () => {
  it("downloads the library's netlist with the rise and fall times, periods and gate level typed", async () => {
    const downloads = catchDownloads();
    render(<NetlistPanel table={table} fileStem="pump" />);
    fireEvent.change(screen.getByLabelText(/Rise time/), { target: { value: '50' } });
    fireEvent.change(screen.getByLabelText(/Fall time/), { target: { value: '20' } });
    fireEvent.change(screen.getByLabelText(/Fundamental periods/), { target: { value: '2' } });
    fireEvent.click(screen.getByRole('button', { name: 'SPICE netlist' }));
    const { file, text } = await downloads.saved();
    expect(file).toBe('pump.cir');
    expect(text).toBe(
      timerTableToSpiceNetlist(table, {
        riseTime: 50e-9,
        fallTime: 20e-9,
        periods: 2,
        gateVoltage: 15,
      }),
    );
  });

  it("writes the page's on-state drops into the leg voltages, as the library does", async () => {
    const downloads = catchDownloads();
    const onStateDrop = { transistor: 1.2, diode: 1.7 };
    render(<NetlistPanel table={table} fileStem="pump" onStateDrop={onStateDrop} />);
    expect(
      screen.getByText(/on-state drops \(1\.2 V transistor, 1\.7 V diode\) in the leg voltages/),
    ).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'SPICE netlist' }));
    const { text } = await downloads.saved();
    expect(text).toBe(
      timerTableToSpiceNetlist(table, {
        riseTime: 100e-9,
        fallTime: 100e-9,
        periods: 1,
        gateVoltage: 15,
        onStateDrop,
      }),
    );
    expect(text).toMatch(/on-state drops of 1\.2 V a transistor, 1\.7 V a diode/);
  });

  it('shows a rise time longer than a pulse on its field, in the library words, and saves nothing', () => {
    const click = vi
      .spyOn(HTMLAnchorElement.prototype, 'click')
      .mockImplementation(() => undefined);
    render(<NetlistPanel table={table} fileStem="pump" />);
    // 40 µs: longer than the narrowest pulse of a 10 kHz carrier (100 µs period) near the peak.
    fireEvent.change(screen.getByLabelText(/Rise time/), { target: { value: '40000' } });
    fireEvent.click(screen.getByRole('button', { name: 'SPICE netlist' }));
    expect(screen.getByRole('alert').textContent).toMatch(
      /^(riseTime|fallTime) must be shorter than the shortest time between two edges/,
    );
    expect(click).not.toHaveBeenCalled();
  });
});
