import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { PatternSummary } from './PatternSummary';

describe('PatternSummary (issue 13)', () => {
  const pattern = {
    method: 'selective-harmonic-elimination' as const,
    kind: 'staircase' as const,
    angles: [0.2, 0.5, 0.9],
    eliminate: [5, 7],
  };

  it("lists each cell's own DC source beside the angle it switches at", () => {
    render(<PatternSummary pattern={{ ...pattern, cellVoltages: [430, 385, 360] }} vdc={400} />);
    const table = screen.getByRole('table', { name: 'First-quarter switching angles' });
    const rows = within(table).getAllByRole('row');
    expect(rows[0]).toHaveTextContent('cell source (V)');
    expect(rows.slice(1).map((r) => r.lastChild?.textContent)).toEqual(['430', '385', '360']);
    expect(screen.getByTestId('she-pattern')).not.toHaveTextContent('DC level');
  });

  it('gives the one DC level of equal cells', () => {
    render(<PatternSummary pattern={pattern} vdc={400} />);
    expect(screen.getByTestId('she-pattern')).toHaveTextContent('DC level 400 V');
    expect(screen.queryByText('cell source (V)')).not.toBeInTheDocument();
  });
});
