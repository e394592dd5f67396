import { render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { solveShe } from '@pulsewright/modulation';
import { MemoryRouter } from 'react-router-dom';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { formatNumber } from '../../../lib/format';
import type { SolvedPattern } from '../model/eliminationForm';
import { EliminationResult } from './EliminationResult';
import type { SweepPoint } from './useEliminationSweep';

afterEach(() => vi.unstubAllGlobals());

const PATTERN: SolvedPattern = {
  type: 'she',
  kind: 'bipolar',
  vdc: 300,
  count: 3,
  orders: [5, 7],
  objective: 'wthd',
  maxOrder: 99,
};

// Three points of one branch, solved by the library (Patel and Hoft 1973), as the job returns them.
const POINTS: SweepPoint[] = [0.5, 0.6, 0.7].map((ma, i) => {
  const solved = solveShe({
    kind: 'bipolar',
    vdc: 300,
    count: 3,
    eliminate: [5, 7],
    fundamental: ma * 300,
  });
  return { fundamental: ma * 300, ma, angles: solved.angles, objective: null, continued: i > 0 };
});

describe('EliminationResult', () => {
  it('draws one coloured curve per angle with its legend, and the picked point as a table of angles', () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(() => Promise.resolve(new Response('{}', { status: 401 }))),
    );
    render(
      <AppProviders client={createQueryClient()}>
        <MemoryRouter>
          <EliminationResult
            pattern={PATTERN}
            points={POINTS}
            solvedFraction={1}
            picked={1}
            onPick={() => undefined}
          />
        </MemoryRouter>
      </AppProviders>,
    );
    const legends = screen.getAllByRole('list', { name: 'Legend' });
    const names = within(legends[0] as HTMLElement)
      .getAllByRole('listitem')
      .map((li) => li.textContent);
    expect(names).toEqual(['α1', 'α2', 'α3']);
    const table = screen.getByRole('table', { name: 'Angles at the picked point' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(3);
    POINTS[1]?.angles.forEach((a, k) => {
      expect(rows[k]).toHaveTextContent(`α${k + 1}${formatNumber((a * 180) / Math.PI)}`);
    });
    expect(screen.getByText(/ma 0\.6 · fundamental 180 V/)).toBeInTheDocument();
  });
});
