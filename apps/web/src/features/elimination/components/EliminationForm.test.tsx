import { fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { describe, expect, it, vi } from 'vitest';
import {
  DEFAULT_ELIMINATION_FORM,
  maScaleOf,
  solvedPatternOf,
  type EliminationForm as Form,
} from '../model/eliminationForm';
import { EliminationForm } from './EliminationForm';

/** The form as the page holds it, so typing changes what is shown. */
function Harness({ initial }: { initial: Form }) {
  const [form, setForm] = useState(initial);
  return (
    <>
      <EliminationForm
        form={form}
        onChange={setForm}
        onSubmit={vi.fn()}
        running={false}
        error={undefined}
        job={undefined}
      />
      <output data-testid="scale">{maScaleOf(solvedPatternOf(form), 3)}</output>
    </>
  );
}

describe('EliminationForm: cell sources of a staircase (issue 13)', () => {
  const staircase: Form = { ...DEFAULT_ELIMINATION_FORM, kind: 'staircase', eliminate: '5, 7' };

  it('asks for cell sources only for a SHE staircase', () => {
    const { unmount } = render(<Harness initial={DEFAULT_ELIMINATION_FORM} />);
    expect(screen.queryByLabelText(/Cell sources/)).not.toBeInTheDocument();
    unmount();
    render(<Harness initial={{ ...staircase, type: 'optimal' }} />);
    expect(screen.queryByLabelText(/Cell sources/)).not.toBeInTheDocument();
  });

  it("shows the library's message for a list that is not one source per angle, and takes a good one", () => {
    render(<Harness initial={staircase} />);
    const field = screen.getByLabelText(/Cell sources/);
    // Eliminating 5 and 7 takes three angles, so three sources (one per cell).
    fireEvent.change(field, { target: { value: '455, 390' } });
    expect(field).toHaveAccessibleDescription(/cellVoltages\.length must be count = 3/);
    expect(field).toHaveAttribute('aria-invalid', 'true');
    fireEvent.change(field, { target: { value: '455, 0, 420' } });
    expect(field).toHaveAccessibleDescription(/cellVoltages\[1\] must be/);
    fireEvent.change(field, { target: { value: '455, 390, 420' } });
    expect(field).not.toHaveAttribute('aria-invalid');
    // ma is V1 over the sources' sum, so ma = 4/π is the staircase's limit 4ΣV_k/π (Tolbert et
    // al. 2005, from memory): 455 + 390 + 420 = 1265 V.
    expect(screen.getByTestId('scale')).toHaveTextContent('1265');
    fireEvent.change(field, { target: { value: '' } });
    // Blank: every cell at the DC level, 3 × 300 V.
    expect(screen.getByTestId('scale')).toHaveTextContent('900');
  });
});
