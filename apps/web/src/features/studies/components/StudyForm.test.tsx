import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../../lib/api';
import { defaultDraft, type StudyDraft } from '../model/studyDraft';
import { StudyForm } from './StudyForm';

const projects = [
  {
    id: '00000000-0000-4000-8000-000000000001',
    name: 'Pump drive',
    description: '',
    studyCount: 0,
    createdAt: '',
    updatedAt: '',
  },
];

const renderForm = (draft: StudyDraft, props: Partial<Parameters<typeof StudyForm>[0]> = {}) =>
  render(
    <StudyForm
      draft={draft}
      onChange={() => undefined}
      readOnly={false}
      projects={projects}
      saveError={null}
      previewErrors={[]}
      {...props}
    />,
  );

describe('StudyForm', () => {
  it('shows the server field error beside its field (problem+json errors[path] into the design)', () => {
    const error = new ApiError(400, {
      type: 'about:blank',
      title: 'Bad request',
      status: 400,
      detail: 'modulation.ma out of range',
      errors: [
        {
          path: '/body/design/modulation/ma',
          message: 'design.modulation.ma must be > 0 and ≤ 4; got 9',
        },
      ],
    });
    renderForm(defaultDraft(projects[0]?.id), { saveError: error });
    const field = screen.getByLabelText(/^Modulation index ma/, { selector: 'input[type="text"]' });
    expect(field).toHaveAttribute('aria-invalid', 'true');
    expect(field).toHaveAccessibleDescription('design.modulation.ma must be > 0 and ≤ 4; got 9');
  });

  it('shows the library refusal of a field beside it, by its design path', () => {
    renderForm(defaultDraft(), {
      previewErrors: [
        { field: 'load.r', message: 'load.r must be ≥ 0.000001; got 0' },
        { field: 'carrierFrequency', message: 'carrierFrequency must be a whole multiple' },
      ],
    });
    expect(screen.getByLabelText(/Resistance R/)).toHaveAccessibleDescription(
      'load.r must be ≥ 0.000001; got 0',
    );
    expect(screen.getByLabelText(/Carrier frequency/)).toHaveAccessibleDescription(
      'carrierFrequency must be a whole multiple',
    );
  });

  it('lists a refusal no field claims at the top', () => {
    renderForm(defaultDraft(), {
      previewErrors: [{ field: 'design', message: 'design must be an object' }],
    });
    expect(screen.getByRole('alert')).toHaveTextContent('design must be an object');
  });

  it('reports numbers while typing, L in millihenry, and NaN for text that is not a number (shown as typed)', () => {
    const onChange = vi.fn();
    renderForm(defaultDraft(), { onChange });
    const inductance = screen.getByLabelText(/Inductance L/);
    fireEvent.change(inductance, { target: { value: '5' } });
    expect(onChange).toHaveBeenLastCalledWith({ loadL: 0.005 });
    fireEvent.change(inductance, { target: { value: '5x' } });
    expect(onChange).toHaveBeenLastCalledWith({ loadL: Number.NaN });
    expect(inductance).toHaveValue('5x');
    fireEvent.change(inductance, { target: { value: '' } });
    expect(onChange).toHaveBeenLastCalledWith({ loadL: Number.NaN });
  });

  it('sets the carrier from the mf slider and shows mf beside the carrier frequency', () => {
    const onChange = vi.fn();
    renderForm(defaultDraft(), { onChange });
    expect(screen.getByLabelText(/Carrier frequency/)).toHaveValue('1050');
    expect(screen.getByText(/mf = 21/)).toBeInTheDocument();
    fireEvent.change(screen.getByRole('slider', { name: 'Frequency ratio mf slider' }), {
      target: { value: '41' },
    });
    expect(onChange).toHaveBeenCalledWith({ carrierFrequency: 41 * 50 });
  });

  it('keeps mf when the fundamental changes (the carrier follows)', () => {
    const onChange = vi.fn();
    renderForm(defaultDraft(), { onChange });
    fireEvent.change(screen.getByLabelText(/Fundamental frequency/), { target: { value: '60' } });
    expect(onChange).toHaveBeenLastCalledWith({
      fundamentalFrequency: 60,
      carrierFrequency: 21 * 60,
    });
  });

  it('offers the space-vector options: sequence, clamping (five segments), sampling, overmodulation', () => {
    renderForm({ ...defaultDraft(), method: 'space-vector', sequence: 'five-segment' });
    const clamping = screen.getByRole('combobox', { name: 'Zero-vector clamping' });
    expect(
      within(clamping)
        .getAllByRole('option')
        .map((o) => o.getAttribute('value')),
    ).toEqual(['dpwm-min', 'dpwm-max', 'dpwm0', 'dpwm1', 'dpwm2', 'dpwm3']);
    expect(screen.getByRole('combobox', { name: 'Overmodulation' })).toHaveValue('two-mode');
    expect(screen.getByRole('combobox', { name: 'Sampling' })).toHaveValue('symmetric');
    expect(screen.queryByLabelText(/Zero split/)).toBeNull();
  });

  it('lists every method of the library; the pattern methods only for a study that holds such a pattern', () => {
    renderForm(defaultDraft());
    const options = within(screen.getByRole('combobox', { name: 'Method' })).getAllByRole('option');
    expect(options.map((o) => o.getAttribute('value'))).toEqual([
      'sine-triangle',
      'three-phase',
      'space-vector',
      'selective-harmonic-elimination',
      'optimal-pattern',
    ]);
    expect(
      options.filter((o) => (o as HTMLOptionElement).disabled).map((o) => o.getAttribute('value')),
    ).toEqual(['selective-harmonic-elimination', 'optimal-pattern']);
  });

  it('disables every control for a read-only (viewer) form', () => {
    renderForm(defaultDraft(), { readOnly: true });
    for (const control of [
      ...screen.getAllByRole('textbox'),
      ...screen.getAllByRole('slider'),
      ...screen.getAllByRole('combobox'),
      ...screen.getAllByRole('checkbox'),
    ]) {
      expect(control).toBeDisabled();
    }
  });

  it("lists a stored pattern's angles read-only, without carrier controls (harmonic elimination and optimal pattern)", () => {
    for (const method of ['selective-harmonic-elimination', 'optimal-pattern'] as const) {
      const draft = {
        ...defaultDraft(projects[0]?.id),
        method,
        pattern: {
          method,
          kind: 'bipolar' as const,
          angles: [0.2, 0.5, 0.9],
          ...(method === 'selective-harmonic-elimination' ? { eliminate: [5, 7] } : {}),
          fundamental: 150,
        },
      };
      const { unmount } = renderForm(draft);
      const table = screen.getByRole('table', { name: 'First-quarter switching angles' });
      expect(table.querySelectorAll('tbody tr')).toHaveLength(3);
      expect(table).toHaveTextContent('0.500000000');
      if (method === 'selective-harmonic-elimination')
        expect(screen.getByTestId('she-pattern')).toHaveTextContent('eliminates orders 5, 7');
      expect(screen.queryByRole('slider', { name: /Modulation index ma/ })).toBeNull();
      expect(screen.queryByLabelText(/Carrier frequency/)).toBeNull();
      expect(screen.getByRole('combobox', { name: 'Method' })).toHaveValue(method);
      unmount();
    }
  });

  it('shows the damping capacitor only for the parallel R-C damping, and the resonance from the report', () => {
    renderForm(
      { ...defaultDraft(), filterOn: true, dampingPlacement: 'parallel-rc' },
      { filterResonance: 795.77 },
    );
    expect(screen.getByLabelText(/Damping C/)).toHaveValue('20');
    expect(screen.getByTestId('filter-resonance')).toHaveTextContent('Resonance 795.8 Hz');
  });
});
