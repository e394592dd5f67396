import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { harmonics, solveCascadedPattern, thd, wthd } from '@pulsewright/modulation';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { formatNumber } from '../../../lib/format';
import { CascadedPatternPanel } from './CascadedPatternPanel';

afterEach(() => vi.unstubAllGlobals());

const renderPanel = () =>
  render(
    <AppProviders client={createQueryClient()}>
      <CascadedPatternPanel />
    </AppProviders>,
  );

const json = (body: unknown, status = 200, type = 'application/json') =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': type } });

describe('CascadedPatternPanel (issue 13)', () => {
  it("sends ma × cells × vdc as the fundamental and lists each cell's solved angles", async () => {
    // The answer the service gives: the library's joint solve of three unipolar cells of two
    // angles (Patel and Hoft 1973, per cell), in the route's shape.
    const options = { cells: 3, vdc: 100, count: 2, eliminate: [5, 7, 11, 13, 17] };
    const solved = solveCascadedPattern({ ...options, fundamental: 0.4 * 3 * 100 });
    expect(solved.converged).toBe(true);
    const spectrum = harmonics(solved.output, 100);
    const fetch = vi.fn(() =>
      Promise.resolve(
        json({
          ...solved,
          output: { name: 'string output', waveform: solved.output },
          spectrum: {
            name: 'string output',
            harmonics: spectrum,
            thd: thd(spectrum),
            wthd: wthd(spectrum),
            spectrumThd: thd(spectrum),
          },
        }),
      ),
    );
    vi.stubGlobal('fetch', fetch);
    renderPanel();
    await userEvent.click(screen.getByRole('button', { name: 'Solve the cells' }));
    const table = await screen.findByRole('table', { name: 'Angles of each cell' });
    const [sent] = fetch.mock.calls[0] as unknown as [Request];
    expect(sent.url).toMatch(/\/api\/v1\/cascaded-patterns\/solve$/);
    const body = (await sent.json()) as { fundamental: number };
    expect(body).toMatchObject(options);
    expect(Math.abs(body.fundamental - 120)).toBeLessThan(1e-9);
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(3);
    solved.patterns.forEach((cell, c) => {
      const cells = within(rows[c] as HTMLElement).getAllByRole('cell');
      expect(cells[0]).toHaveTextContent(`cell ${c + 1} (unipolar)`);
      cell.angles.forEach((a, k) => {
        expect(cells[k + 1]).toHaveTextContent(formatNumber((a * 180) / Math.PI));
      });
    });
    expect(screen.getByRole('status')).toHaveTextContent(/^Solved\./);
    // The string's output or any one cell's can be drawn.
    const shown = screen.getByRole('combobox', { name: 'Voltage shown' });
    expect(
      within(shown)
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(['string output', 'cell 1', 'cell 2', 'cell 3']);
    await userEvent.selectOptions(shown, 'cell 2');
    expect(shown).toHaveValue('2');
  });

  it('puts the service message on the field it names', async () => {
    const message =
      'eliminate.length must be cells·count − 1 = 5 (one equation per angle; the fundamental takes one); got 2';
    vi.stubGlobal(
      'fetch',
      vi.fn(() =>
        Promise.resolve(
          json(
            {
              type: 'urn:pulsewright:problem:validation-error',
              title: 'Bad request',
              status: 400,
              detail: message,
              errors: [{ path: 'eliminate.length', message }],
            },
            400,
            'application/problem+json',
          ),
        ),
      ),
    );
    renderPanel();
    const field = screen.getByLabelText('Orders to eliminate');
    await userEvent.clear(field);
    await userEvent.type(field, '5, 7');
    await userEvent.click(screen.getByRole('button', { name: 'Solve the cells' }));
    expect(
      await screen.findAllByText(/eliminate\.length must be cells·count − 1 = 5/),
    ).not.toHaveLength(0);
    expect(field).toHaveAttribute('aria-invalid', 'true');
  });
});
