import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { defaultDraft, type StudyDraft } from '../model/studyDraft';
import { StudyForm } from './StudyForm';

const renderForm = (draft: StudyDraft, props: Partial<Parameters<typeof StudyForm>[0]> = {}) =>
  render(
    <StudyForm
      draft={draft}
      onChange={() => undefined}
      readOnly={false}
      projects={[]}
      saveError={null}
      previewErrors={[]}
      {...props}
    />,
  );

describe('StudyForm, grid connection (issue 12, capability 6)', () => {
  it('turns the grid on from its checkbox', () => {
    const onChange = vi.fn();
    renderForm(defaultDraft(), { onChange });
    expect(screen.queryByLabelText(/Grid voltage/)).toBeNull();
    fireEvent.click(screen.getByRole('checkbox', { name: /Feed a grid/ }));
    expect(onChange).toHaveBeenCalledWith({ gridOn: true });
  });

  it('shows the grid fields with the library’s ranges, L in millihenry, and the library’s refusal beside its field', () => {
    const onChange = vi.fn();
    renderForm(
      { ...defaultDraft(), gridOn: true },
      {
        onChange,
        previewErrors: [{ field: 'grid.r', message: 'grid.r must be ≥ 0.000001; got 0' }],
      },
    );
    expect(screen.getByLabelText(/Grid R/)).toHaveAccessibleDescription(
      'grid.r must be ≥ 0.000001; got 0',
    );
    expect(screen.getByLabelText(/Grid voltage/)).toHaveAccessibleDescription(
      'above 0 to 1,000,000 V',
    );
    fireEvent.change(screen.getByLabelText(/Grid-side L2/), { target: { value: '1.5' } });
    expect(onChange).toHaveBeenCalledWith({ gridL2: 0.0015 });
  });
});
