import { EXAMPLE_IGBT } from '@pulsewright/modulation';
import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { defaultDraft, type StudyDraft } from '../model/studyDraft';
import { StudyForm } from './StudyForm';

const renderForm = (draft: StudyDraft, onChange = vi.fn()) => {
  render(
    <StudyForm
      draft={draft}
      onChange={onChange}
      readOnly={false}
      projects={[]}
      saveError={null}
      previewErrors={[]}
    />,
  );
  return onChange;
};

describe('the switching device fieldset', () => {
  it('offers none, an IGBT or a MOSFET; an IGBT shows its datasheet values in V, mΩ and mJ', () => {
    const onChange = renderForm(defaultDraft('p'));
    const select = screen.getByLabelText('Device for the losses');
    expect(screen.queryByLabelText(/Turn-on energy/)).toBeNull();
    fireEvent.change(select, { target: { value: 'igbt' } });
    expect(onChange).toHaveBeenCalledWith({ deviceKind: 'igbt' });
  });

  it('shows the values in the units of the form and sends them in SI units', () => {
    const onChange = renderForm({ ...defaultDraft('p'), deviceKind: 'igbt' });
    const eon = screen.getByLabelText(/Turn-on energy/);
    // 2.1 mJ stored in joules, shown in mJ.
    expect(eon).toHaveValue(String(EXAMPLE_IGBT.eon * 1e3));
    fireEvent.change(eon, { target: { value: '-1' } });
    expect(onChange).toHaveBeenLastCalledWith({ igbt: { ...EXAMPLE_IGBT, eon: -1e-3 } });
  });

  it('refuses a value out of range with the range of LOSS_DEVICE_BOUNDS in the unit shown', () => {
    renderForm({ ...defaultDraft('p'), deviceKind: 'igbt', igbt: { ...EXAMPLE_IGBT, eon: -1e-3 } });
    const eon = screen.getByLabelText(/Turn-on energy/);
    expect(eon).toHaveAttribute('aria-invalid', 'true');
    expect(eon).toHaveAccessibleDescription(/0 to 1,000,000 mJ/);
  });
});
