import { analyseDesign, designResonance } from '@pulsewright/modulation';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
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

  it('never rounds a typed frequency ratio: 0.5 stays 0.5 and is refused on the mf field (issue 10)', () => {
    const onChange = vi.fn();
    const { rerender } = renderForm(defaultDraft(), { onChange });
    const mf = screen.getByLabelText('Frequency ratio mf', { selector: 'input[type="text"]' });
    fireEvent.change(mf, { target: { value: '0.5' } });
    // 0.5 × 50 Hz: the carrier the box stands for, not Math.round(0.5) = 1 × 50 Hz.
    expect(onChange).toHaveBeenLastCalledWith({ carrierFrequency: 25 });
    rerender(
      <StudyForm
        draft={{ ...defaultDraft(), carrierFrequency: 25 }}
        onChange={onChange}
        readOnly={false}
        projects={projects}
        saveError={null}
        previewErrors={[{ field: 'carrierFrequency', message: 'carrierFrequency must be …' }]}
      />,
    );
    expect(mf).toHaveValue('0.5');
    expect(mf).toHaveAccessibleDescription(
      // Sine-triangle takes any ratio from 1 (analysed over q periods of its p/q): 0.5 is below.
      'Frequency ratio mf must be from 1 to 1,000 (entered 0.5)',
    );
    // The carrier field does not repeat it with a value the user never typed.
    expect(screen.getByLabelText(/Carrier frequency/)).not.toHaveAttribute('aria-invalid');
  });

  it('states a typed carrier that is not a whole multiple as its ratio p/q and span; a multilevel one is refused with the nearest whole mf', () => {
    renderForm({ ...defaultDraft(), carrierFrequency: 1075 });
    const carrier = screen.getByLabelText(/Carrier frequency/);
    expect(carrier).not.toHaveAttribute('aria-invalid');
    expect(carrier).toHaveAccessibleDescription(
      'mf = 43/2 ≈ 21.5: the report is exact over 2 fundamental periods (43 carrier cycles) with its sub-harmonics; carrier analysed 1075 Hz, 0 Hz from the one entered',
    );
    cleanup();
    // With a filter or grid the report spans it too (issue 12 items 5-6).
    renderForm({ ...defaultDraft(), carrierFrequency: 1075, filterOn: true, gridOn: true });
    expect(screen.getByLabelText(/Carrier frequency/)).not.toHaveAttribute('aria-invalid');
    expect(screen.getByLabelText(/Carrier frequency/)).toHaveAccessibleDescription(
      'mf = 43/2 ≈ 21.5: the report is exact over 2 fundamental periods (43 carrier cycles) with its sub-harmonics; carrier analysed 1075 Hz, 0 Hz from the one entered',
    );
    cleanup();
    renderForm({ ...defaultDraft(), method: 'multilevel-carrier', carrierFrequency: 1075 });
    expect(screen.getByLabelText(/Carrier frequency/)).toHaveAccessibleDescription(
      'Carrier frequency 1075 Hz is 21.5 times the fundamental, 50 Hz: the design report takes a whole multiple (1 to 1000 times), the nearest being mf = 22 (1100 Hz), so set that to save the study; the panel "Carrier as typed" analyses 1075 Hz as it is',
    );
  });

  it('marks the field that is out of range in its own unit with one range (issue 10)', () => {
    // 1e308 V on the DC bus: the message is on the DC bus, not on another field.
    renderForm({ ...defaultDraft(), vdc: 1e308, ma: -1, loadL: 200, filterOn: true, filterC: 2 });
    const bus = screen.getByLabelText(/^DC bus/, { selector: 'input[type="text"]' });
    expect(bus).toHaveAccessibleDescription(
      'DC bus must be above 0 to 100,000 V (entered 1e+308 V)',
    );
    // ma −1: one limit, the library's (0, 4], not two that disagree.
    expect(
      screen.getByLabelText(/^Modulation index ma/, { selector: 'input[type="text"]' }),
    ).toHaveAccessibleDescription('Modulation index ma must be above 0 to 4 (entered -1)');
    // 200 H = 200,000 mH: the bound and the entry in mH, the field's unit (DESIGN_BOUNDS load.l ≤ 100 H).
    expect(screen.getByLabelText(/Inductance L/)).toHaveAccessibleDescription(
      'Inductance L must be from 0 to 100,000 mH (entered 200,000 mH)',
    );
    // 2 F = 2,000,000 µF against filter.c ≤ 1 F.
    expect(screen.getByLabelText(/Filter C/)).toHaveAccessibleDescription(
      'Filter C must be from 0.000001 to 1,000,000 µF (entered 2,000,000 µF)',
    );
    expect(screen.getByLabelText(/Resistance R/)).not.toHaveAttribute('aria-invalid');
  });

  it('asks for a number in an emptied or lettered field instead of keeping the previous value', () => {
    renderForm({ ...defaultDraft(), vdc: Number.NaN, ma: Number.NaN });
    expect(
      screen.getByLabelText(/^DC bus/, { selector: 'input[type="text"]' }),
    ).toHaveAccessibleDescription('Enter a number: DC bus is above 0 to 100,000 V');
    expect(
      screen.getByLabelText(/^Modulation index ma/, { selector: 'input[type="text"]' }),
    ).toHaveValue('');
  });

  it('leaves the carrier alone while the fundamental is refused (0 would take it to 0 Hz and lose mf)', () => {
    const onChange = vi.fn();
    renderForm(defaultDraft(), { onChange });
    fireEvent.change(screen.getByLabelText(/Fundamental frequency/), { target: { value: '0' } });
    expect(onChange).toHaveBeenLastCalledWith({ fundamentalFrequency: 0 });
  });

  it('sizes Filter L from a resonance or a ripple target through the library (issue 10)', () => {
    const onChange = vi.fn();
    renderForm({ ...defaultDraft(), filterOn: true }, { onChange });
    const from = screen.getByRole('combobox', { name: 'Filter L from' });
    fireEvent.change(from, { target: { value: 'resonance' } });
    fireEvent.change(screen.getByLabelText(/Resonance target/), { target: { value: '1000' } });
    // 1/((2π·1000 Hz)²·20 µF) = 1.2665 mH (LC resonance, standard circuit analysis).
    const resonant = onChange.mock.lastCall?.[0] as { filterL: number };
    expect(resonant.filterL).toBeCloseTo(1 / ((2 * Math.PI * 1000) ** 2 * 20e-6), 12);
    fireEvent.change(from, { target: { value: 'ripple' } });
    fireEvent.change(screen.getByLabelText(/Ripple target/), { target: { value: '2' } });
    // 400 V, 1050 Hz carrier, 2 A peak-to-peak: L = 400/(2·1050·2) (two-level worst case).
    const rippled = onChange.mock.lastCall?.[0] as { filterL: number };
    expect(rippled.filterL).toBeCloseTo(400 / (2 * 1050 * 2), 12);
    fireEvent.change(screen.getByLabelText(/Ripple target/), { target: { value: '0' } });
    expect(screen.getByLabelText(/Ripple target/)).toHaveAccessibleDescription(
      'Ripple target must be above 0 A peak-to-peak (entered 0 A peak-to-peak)',
    );
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

  it("shows the other sequence's stored choice it keeps, and keeps a clamping the user picks (issue 10)", () => {
    const onChange = vi.fn();
    const { unmount } = renderForm(
      {
        ...defaultDraft(),
        method: 'space-vector',
        sequence: 'seven-segment',
        clamping: 'dpwm3',
        keepClamping: true,
      },
      { onChange },
    );
    expect(screen.getByTestId('kept-sequence-option')).toHaveTextContent(
      /Zero-vector clamping .* is kept with the design; only the five-segment sequence uses it/,
    );
    fireEvent.change(screen.getByLabelText(/Zero split/), { target: { value: '0.25' } });
    expect(onChange).toHaveBeenLastCalledWith({ zeroSplit: 0.25, keepZeroSplit: true });
    unmount();
    renderForm(
      { ...defaultDraft(), method: 'space-vector', sequence: 'five-segment' },
      { onChange },
    );
    expect(screen.queryByTestId('kept-sequence-option')).toBeNull();
    fireEvent.change(screen.getByRole('combobox', { name: 'Zero-vector clamping' }), {
      target: { value: 'dpwm0' },
    });
    expect(onChange).toHaveBeenLastCalledWith({ clamping: 'dpwm0', keepClamping: true });
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
      'multilevel-carrier',
      'multilevel-space-vector',
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
      {
        filterResonance: {
          name: 'LC filter resonance',
          frequency: 795.77,
          carrierRatio: null,
          controlBandwidthRatio: null,
          distances: null,
        },
      },
    );
    expect(screen.getByLabelText(/Damping C/)).toHaveValue('20');
    expect(screen.getByTestId('filter-resonance')).toHaveTextContent(
      'LC filter resonance 795.8 Hz',
    );
  });

  it('names a grid design’s resonance beside the filter as the LCL’s, with its distances', () => {
    // Invented values: L1 2 mH, C 10 µF, L2 0.5 mH with the grid's 0.2 mH, 10 kHz carrier, 1 kHz
    // control bandwidth: (1/2π)·√((L1 + L2')/(L1·L2'·C)) = 2210 Hz (Liserre, Blaabjerg and
    // Hansen, 2005), 10 kHz/2210 Hz = 4.524, 2210 Hz/1000 Hz = 2.21 (hand-worked).
    const report = analyseDesign(
      {
        vdc: 700,
        fundamentalFrequency: 50,
        carrierFrequency: 10_000,
        modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
        filter: { l: 2e-3, c: 10e-6, rDamping: 2 },
        grid: { lineVoltage: 400, r: 0.05, l: 0.2e-3, l2: 0.5e-3, controlBandwidth: 1000 },
      },
      { points: 256 },
    );
    renderForm({ ...defaultDraft(), filterOn: true }, { filterResonance: designResonance(report) });
    expect(screen.getByTestId('filter-resonance')).toHaveTextContent(
      'LCL resonance 2210 Hz (carrier 4.524× above it; 2.21× the control bandwidth)',
    );
  });
});
