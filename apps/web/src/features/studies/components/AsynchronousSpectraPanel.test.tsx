import { asynchronousDesignSpectra, type InverterDesign } from '@pulsewright/modulation';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { formatNumber, formatPercent } from '../../../lib/format';
import { AsynchronousSpectraPanel } from './AsynchronousSpectraPanel';

afterEach(() => vi.unstubAllGlobals());

// Invented values: a 70 Hz carrier at a 30 Hz fundamental, mf = 7/3 exactly.
const design: InverterDesign = {
  vdc: 400,
  fundamentalFrequency: 30,
  carrierFrequency: 70,
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.5 },
};

const renderPanel = (d: InverterDesign = design) =>
  render(
    <AppProviders client={createQueryClient()}>
      <MemoryRouter>
        <AsynchronousSpectraPanel design={d} />
      </MemoryRouter>
    </AppProviders>,
  );

const answer = (body: unknown, status = 200) =>
  vi.fn(() =>
    Promise.resolve(
      new Response(JSON.stringify(body), {
        status,
        headers: {
          'Content-Type': status === 200 ? 'application/json' : 'application/problem+json',
        },
      }),
    ),
  );

describe('AsynchronousSpectraPanel', () => {
  it('asks the service for the design at its carrier and shows p/q, the carrier error and the 1/3 sub-harmonic by its label', async () => {
    // The answer the service gives: the library's own figures for this design.
    const result = asynchronousDesignSpectra(design, { maxOrder: 50 });
    const fetch = answer(result);
    vi.stubGlobal('fetch', fetch);
    renderPanel();
    await userEvent.click(screen.getByRole('button', { name: 'Analyse at this carrier' }));
    expect(await screen.findByTestId('async-ratio')).toHaveTextContent('7/3');
    const [sent] = fetch.mock.calls[0] as unknown as [Request];
    expect(sent.url).toMatch(/\/api\/v1\/designs\/asynchronous-spectra$/);
    expect(await sent.json()).toEqual({ design, maxOrder: 50 });
    expect(screen.getByTestId('async-error')).toHaveTextContent(
      `${formatNumber(result.carrierError, 4)} Hz`,
    );
    const spectrum = result.voltages[0]!.spectrum;
    expect(screen.getByTestId('async-distortion')).toHaveTextContent(
      `${formatPercent(spectrum.thd)}, ${formatPercent(spectrum.wthd)}`,
    );
    // At mf = 7/3 the first carrier group's sideband m = 1, n = −2 falls at 1/3 of the
    // fundamental (Holmes and Lipo 2003, ch. 3): the table lists it, at 10 Hz.
    const table = screen.getByRole('table', { name: 'Sub-harmonics and largest components' });
    const third = within(table).getByText('1/3').closest('tr') as HTMLElement;
    expect(third).toHaveTextContent(formatNumber(10, 6));
    expect(third).toHaveTextContent(formatNumber(spectrum.components[1]!.amplitude));
    expect(
      screen.getByRole('img', { name: /Spectrum of bridge output over 3 periods/ }),
    ).toBeTruthy();
  });

  it('shows the service’s refusal, naming the field', async () => {
    vi.stubGlobal(
      'fetch',
      answer(
        {
          type: 'about:blank',
          title: 'Bad request',
          status: 400,
          detail: 'design.carrierFrequency must be 1 to 1000 times fundamentalFrequency 30 Hz',
          errors: [{ path: 'design.carrierFrequency', message: 'out of range' }],
        },
        400,
      ),
    );
    renderPanel({ ...design, carrierFrequency: 20 });
    await userEvent.click(screen.getByRole('button', { name: 'Analyse at this carrier' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(/design\.carrierFrequency/);
  });
});
