import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  angleTable,
  angleTableMidpointErrors,
  angleTableToJson,
  type EliminationTablePattern,
} from '@pulsewright/modulation';
import { AppProviders, createQueryClient } from '../../app/providers';
import { formatNumber } from '../../lib/format';
import { AngleTablePanel } from './AngleTablePanel';

afterEach(() => vi.unstubAllGlobals());

// Staircase, two cells, 3rd removed: the branch b = a + π/3 ends at V₁/(4vdc/π) = 1.5 (pen and
// paper), so a table over ma 0.6–1.05 has rows past the branch's end.
const PATTERN: EliminationTablePattern = {
  method: 'selective-harmonic-elimination',
  kind: 'staircase',
  vdc: 10,
  eliminate: [3],
};

const renderPanel = () =>
  render(
    <AppProviders client={createQueryClient()}>
      <AngleTablePanel pattern={PATTERN} initialRange={{ from: 0.6, to: 1.05 }} />
    </AppProviders>,
  );

describe('AngleTablePanel', () => {
  it('asks the service for the table and draws its rows, gaps and midpoint errors', async () => {
    // The answer the service gives: the library's own document for this request.
    const table = angleTable({ pattern: PATTERN, ma: { from: 0.6, to: 1.05 }, rows: 10 });
    const midpointErrors = angleTableMidpointErrors(table);
    const body = angleTableToJson(table, {
      midpointErrors,
      fixedPoint: { timerClock: 72e6, fundamentalFrequency: 50 },
    });
    const fetch = vi.fn(() =>
      Promise.resolve(
        new Response(body, { status: 200, headers: { 'Content-Type': 'application/json' } }),
      ),
    );
    vi.stubGlobal('fetch', fetch);
    renderPanel();
    await userEvent.clear(screen.getByLabelText('Number of rows'));
    await userEvent.type(screen.getByLabelText('Number of rows'), '10');
    await userEvent.click(screen.getByRole('button', { name: 'Build the table' }));
    const rows = await screen.findByRole('table', { name: 'Angle table rows' });
    const [sent] = fetch.mock.calls[0] as unknown as [Request];
    expect(sent.url).toMatch(/\/api\/v1\/angle-tables\?format=json$/);
    expect(await sent.json()).toMatchObject({
      pattern: PATTERN,
      ma: { from: 0.6, to: 1.05 },
      rows: 10,
      timerClock: 72e6,
      fundamentalFrequency: 50,
    });
    const lines = within(rows).getAllByRole('row').slice(1);
    expect(lines).toHaveLength(10);
    table.rows.forEach((row, i) => {
      const cells = within(lines[i] as HTMLElement).getAllByRole('cell');
      // Columns: row, ma, α1, α2, to next row. Degrees as the library's radians × 180/π.
      if (row.solved) {
        expect(cells[2]).toHaveTextContent(
          formatNumber(((row.angles[0] as number) * 180) / Math.PI),
        );
        expect(cells[3]).toHaveTextContent(
          formatNumber(((row.angles[1] as number) * 180) / Math.PI),
        );
      } else {
        expect(cells[2]).toHaveTextContent('no solution');
      }
      const interval = midpointErrors.intervals[i];
      if (interval && !interval.interpolable)
        expect(cells[4]).toHaveTextContent('do not interpolate');
      if (interval?.interpolable)
        expect(cells[4]).toHaveTextContent(
          `residual ${(interval.worstResidual as number).toExponential(2)}`,
        );
    });
    expect(table.gaps.length).toBeGreaterThan(0);
    expect(screen.getByTestId('angle-table-summary')).toHaveTextContent('do not interpolate');
    expect(screen.getByRole('button', { name: 'C header' })).toBeInTheDocument();
  });

  it('puts the service message on the field it names', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(() =>
        Promise.resolve(
          new Response(
            JSON.stringify({
              type: 'urn:pulsewright:problem:validation-error',
              title: 'Bad request',
              status: 400,
              detail:
                'ma.from must be a modulation index at which the pattern has a solution; got 0.3',
              errors: [
                {
                  path: 'ma.from',
                  message:
                    'ma.from must be a modulation index at which the pattern has a solution; got 0.3',
                },
              ],
            }),
            { status: 400, headers: { 'Content-Type': 'application/problem+json' } },
          ),
        ),
      ),
    );
    renderPanel();
    await userEvent.click(screen.getByRole('button', { name: 'Build the table' }));
    const field = screen.getByLabelText('ma from');
    expect(await screen.findAllByText(/ma\.from must be a modulation index/)).not.toHaveLength(0);
    expect(field).toHaveAttribute('aria-invalid', 'true');
  });
});
