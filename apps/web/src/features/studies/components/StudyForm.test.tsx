import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../../lib/api';
import { defaultDraft } from '../model/studyDraft';
import { StudyForm } from './StudyForm';

const projects = [{ id: '00000000-0000-4000-8000-000000000001', name: 'Pump drive', description: '', studyCount: 0, createdAt: '', updatedAt: '' }];

describe('StudyForm', () => {
  it('shows the server field error beside its field (problem+json errors[path])', () => {
    const error = new ApiError(400, {
      type: 'about:blank',
      title: 'Bad request',
      status: 400,
      detail: 'ma must be above 0',
      errors: [{ path: '/body/modulation/ma', message: 'ma must be above 0 and at most 4; got 9' }],
    });
    render(<StudyForm draft={defaultDraft(projects[0]?.id)} onChange={() => undefined} readOnly={false} projects={projects} saveError={error} previewErrors={[]} />);
    const field = screen.getByRole('spinbutton', { name: /Modulation index ma/ });
    expect(field).toHaveAttribute('aria-invalid', 'true');
    expect(field).toHaveAccessibleDescription('ma must be above 0 and at most 4; got 9');
  });

  it('shows the library refusal of a field from the live preview', () => {
    render(<StudyForm draft={defaultDraft()} onChange={() => undefined} readOnly={false} projects={projects} saveError={null} previewErrors={[{ field: 'r', message: 'r must be > 0; got 0' }]} />);
    expect(screen.getByLabelText(/Resistance R/)).toHaveAccessibleDescription('r must be > 0; got 0');
  });

  it('reports slider and number changes, with L entered in millihenry', () => {
    const onChange = vi.fn();
    render(<StudyForm draft={defaultDraft()} onChange={onChange} readOnly={false} projects={projects} saveError={null} previewErrors={[]} />);
    fireEvent.change(screen.getByRole('slider', { name: 'Frequency ratio mf slider' }), { target: { value: '41' } });
    expect(onChange).toHaveBeenCalledWith({ mf: 41 });
    const inductance = screen.getByLabelText(/Inductance L/);
    fireEvent.change(inductance, { target: { value: '5' } });
    fireEvent.blur(inductance);
    expect(onChange).toHaveBeenCalledWith({ l: 0.005 });
  });

  it('disables every control for a read-only (viewer) form', () => {
    render(<StudyForm draft={defaultDraft()} onChange={() => undefined} readOnly projects={projects} saveError={null} previewErrors={[]} />);
    for (const control of [...screen.getAllByRole('textbox'), ...screen.getAllByRole('slider'), ...screen.getAllByRole('combobox'), ...screen.getAllByRole('spinbutton')]) {
      expect(control).toBeDisabled();
    }
  });

  it('lists a harmonic-elimination study\'s angles read-only, without carrier controls', () => {
    const draft = { ...defaultDraft(projects[0]?.id), method: 'selective-harmonic-elimination' as const, she: { kind: 'bipolar' as const, angles: [0.2, 0.5, 0.9], eliminate: [5, 7], fundamental: 150 } };
    render(<StudyForm draft={draft} onChange={() => undefined} readOnly={false} projects={projects} saveError={null} previewErrors={[]} />);
    const table = screen.getByRole('table', { name: 'First-quarter switching angles' });
    expect(table.querySelectorAll('tbody tr')).toHaveLength(3);
    expect(table).toHaveTextContent('0.500000000');
    expect(screen.getByTestId('she-pattern')).toHaveTextContent('eliminates orders 5, 7');
    expect(screen.queryByRole('slider', { name: /Modulation index ma/ })).toBeNull();
    expect(screen.getByRole('combobox', { name: 'Method' })).toHaveValue('selective-harmonic-elimination');
  });
});
