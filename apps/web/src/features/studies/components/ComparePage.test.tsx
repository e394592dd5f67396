import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { formatNumber, formatPercent } from '../../../lib/format';
import { ComparePage } from './ComparePage';

const A = '00000000-0000-4000-8000-0000000000a1';
const B = '00000000-0000-4000-8000-0000000000b2';
const designs: Record<string, InverterDesign> = {
  [A]: {
    vdc: 400,
    fundamentalFrequency: 50,
    carrierFrequency: 20_000,
    modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
    load: { r: 10, l: 0.01 },
    filter: { l: 0.001, c: 10e-6 },
  },
  [B]: {
    vdc: 100,
    fundamentalFrequency: 50,
    modulation: {
      method: 'selective-harmonic-elimination',
      kind: 'bipolar',
      angles: [0.3, 0.5, 0.9],
      eliminate: [5, 7],
    },
    load: { r: 10, l: 0.01 },
  },
};
const study = (id: string, name: string) => ({
  id,
  projectId: A,
  revision: 1,
  name,
  method: designs[id]?.modulation.method,
  design: designs[id],
  note: '',
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
});
const studies = [study(A, 'Unipolar 20 kHz filtered'), study(B, 'SHE 5 7')];
// The service's answer is the library's report sent as JSON.
const reports = Object.fromEntries(
  Object.entries(designs).map(([id, d]) => [id, JSON.parse(JSON.stringify(analyseDesign(d)))]),
);
const json = (body: unknown) =>
  new Response(JSON.stringify(body), {
    status: 200,
    headers: { 'Content-Type': 'application/json' },
  });

afterEach(() => vi.unstubAllGlobals());

describe('ComparePage', () => {
  it("tabulates each study's report figures and overlays spectra labelled by each report", async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async (request: Request) => {
        const path = new URL(request.url).pathname;
        const report = /\/studies\/([\w-]+)\/report$/.exec(path);
        if (report) return json(reports[report[1] ?? '']);
        const one = /\/studies\/([\w-]+)$/.exec(path);
        if (one) return json(studies.find((s) => s.id === one[1]));
        return json(studies);
      }),
    );
    render(
      <AppProviders client={createQueryClient()}>
        <MemoryRouter initialEntries={[`/compare?ids=${A},${B}`]}>
          <ComparePage />
        </MemoryRouter>
      </AppProviders>,
    );
    const table = await screen.findByTestId('compare-figures');
    const row = (name: string) => table.querySelector(`tr[data-study="${name}"]`) as HTMLElement;
    const cell = (name: string, column: string) =>
      row(name).querySelector(`[data-column="${column}"]`);
    const filtered = reports[A];
    expect(cell('Unipolar 20 kHz filtered', 'THD, exact')).toHaveTextContent(
      formatPercent(filtered.bridge.thd),
    );
    expect(cell('Unipolar 20 kHz filtered', 'WTHD, exact')).toHaveTextContent(
      formatPercent(filtered.bridge.wthd, 3),
    );
    expect(cell('Unipolar 20 kHz filtered', 'Switch current (A rms)')).toHaveTextContent(
      formatNumber(filtered.currents[0].inverter.rms),
    );
    expect(cell('Unipolar 20 kHz filtered', 'Current ripple (A rms)')).toHaveTextContent(
      formatNumber(filtered.currents[0].inverter.rippleRms),
    );
    expect(cell('Unipolar 20 kHz filtered', 'Filter resonance (Hz)')).toHaveTextContent(
      formatNumber(filtered.filter.characteristics.resonanceFrequency),
    );
    expect(cell('Unipolar 20 kHz filtered', 'Load power (W)')).toHaveTextContent(
      formatNumber(filtered.loadPower),
    );
    expect(cell('Unipolar 20 kHz filtered', 'Limit check')).toHaveTextContent(
      filtered.limitCheck.pass ? 'pass' : 'fail',
    );
    // A unipolar bridge at mf 400 is far from distortion-free: its exact THD is tens of percent, not 0.00 % (issue 9).
    expect(filtered.bridge.thd).toBeGreaterThan(0.3);
    expect(cell('SHE 5 7', 'Filter resonance (Hz)')).toHaveTextContent('—');
    // Common mode is a three-phase figure: single-phase bridges show none. Device switching is
    // every two-level bridge's: a unipolar bridge's switches turn on once a carrier period.
    expect(cell('SHE 5 7', 'Common mode (V rms)')).toHaveTextContent('—');
    expect(cell('Unipolar 20 kHz filtered', 'Device switching (Hz)')).toHaveTextContent(
      formatNumber(20_000),
    );
    // Both spectra drawn; the pattern's series keeps its own order labels (its bars carry no "mf").
    const chart = screen.getByRole('figure', { name: 'Spectra overlaid' });
    expect(chart.querySelectorAll('g[data-series]')).toHaveLength(2);
    expect(
      reports[B].bridge.spectrum.every((h: { label: string }) => !h.label.includes('mf')),
    ).toBe(true);
    expect(within(chart).getByRole('combobox', { name: 'Spectra of' })).toHaveValue('bridge');
    // Sorted by a figure on a click of its heading, ascending then descending.
    const order = () =>
      [...table.querySelectorAll('tbody tr')].map((r) => r.getAttribute('data-study'));
    const byThd = [A, B]
      .map((id) => ({ id, thd: reports[id].bridge.thd as number }))
      .sort((x, y) => x.thd - y.thd)
      .map(({ id }) => (id === A ? 'Unipolar 20 kHz filtered' : 'SHE 5 7'));
    fireEvent.click(within(table).getByRole('button', { name: /^THD, exact/ }));
    expect(order()).toEqual(byThd);
    fireEvent.click(within(table).getByRole('button', { name: /^THD, exact/ }));
    expect(order()).toEqual([...byThd].reverse());
    expect(screen.getByRole('button', { name: 'CSV' })).toBeInTheDocument();
  });
});
