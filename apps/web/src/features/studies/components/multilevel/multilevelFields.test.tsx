import { MULTILEVEL_CARRIERS_BY_TOPOLOGY, MULTILEVEL_TOPOLOGIES } from '@pulsewright/modulation';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { defaultDraft, designOf, draftOf, type StudyDraft } from '../../model/studyDraft';
import { StudyForm } from '../StudyForm';

const multilevelDraft = (patch: Partial<StudyDraft['multilevel']> = {}): StudyDraft => {
  const draft = defaultDraft('p');
  return { ...draft, method: 'multilevel-carrier', multilevel: { ...draft.multilevel, ...patch } };
};

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

const optionValues = (label: string) =>
  within(screen.getByLabelText(label))
    .getAllByRole('option')
    .map((o) => (o as HTMLOptionElement).value);

describe('the multilevel fields of the study form', () => {
  it.each(MULTILEVEL_TOPOLOGIES)(
    'offers only the carrier arrangements the library accepts for %s',
    (topology) => {
      const carriers = MULTILEVEL_CARRIERS_BY_TOPOLOGY[topology];
      renderForm(multilevelDraft({ topology, carriers: carriers[0] }));
      expect(optionValues('Carriers')).toEqual([...carriers]);
    },
  );

  it('moves to an accepted arrangement and level count when the topology changes', () => {
    const onChange = vi.fn();
    renderForm(multilevelDraft({ topology: 'npc', carriers: 'pod', levels: 3 }), { onChange });
    fireEvent.change(screen.getByLabelText('Topology'), {
      target: { value: 'flying-capacitor' },
    });
    // Flying capacitors take phase-shifted carriers only; 3 levels are within their 3..9.
    expect(onChange).toHaveBeenLastCalledWith({
      multilevel: expect.objectContaining({
        topology: 'flying-capacitor',
        carriers: 'phase-shifted',
        levels: 3,
      }) as unknown,
    });
  });

  it('keeps the arrangement a new topology accepts and brings levels out of its range back to its lowest', () => {
    const onChange = vi.fn();
    renderForm(multilevelDraft({ topology: 'cascaded-h-bridge', carriers: 'pd', levels: 11 }), {
      onChange,
    });
    fireEvent.change(screen.getByLabelText('Topology'), { target: { value: 't-type' } });
    expect(onChange).toHaveBeenLastCalledWith({
      multilevel: expect.objectContaining({
        topology: 't-type',
        carriers: 'pd',
        levels: 3,
      }) as unknown,
    });
  });

  it('asks for levels only where the topology has a choice, with the cells as a hint', () => {
    const { unmount } = renderForm(multilevelDraft({ topology: 'npc' }));
    expect(screen.queryByLabelText('Levels')).toBeNull();
    unmount();
    renderForm(
      multilevelDraft({ topology: 'cascaded-h-bridge', carriers: 'phase-shifted', levels: 7 }),
    );
    expect(screen.getByLabelText('Levels')).toHaveAccessibleDescription(
      'odd, a whole number from 3 to 17; 3 H-bridge cells a phase, (levels − 1)/2',
    );
  });

  it('refuses levels outside the topology range at the field, in its words', () => {
    renderForm(
      multilevelDraft({ topology: 'flying-capacitor', carriers: 'phase-shifted', levels: 12 }),
    );
    expect(screen.getByLabelText('Levels')).toHaveAccessibleDescription(
      'Levels must be a whole number from 3 to 9 (entered 12)',
    );
  });

  it("shows the library's refusal of a field beside it (an even cascaded level count)", () => {
    renderForm(
      multilevelDraft({ topology: 'cascaded-h-bridge', carriers: 'phase-shifted', levels: 6 }),
      {
        previewErrors: [
          { field: 'modulation.levels', message: 'modulation.levels must be odd; got 6' },
        ],
      },
    );
    expect(screen.getByLabelText('Levels')).toHaveAccessibleDescription(
      'modulation.levels must be odd; got 6',
    );
    // Claimed by the field, so not listed again above the form.
    expect(document.querySelector('ul[role="alert"]')).toBeNull();
  });

  it('takes the zero sequence away from a single-phase bridge', () => {
    const onChange = vi.fn();
    renderForm(multilevelDraft({ zeroSequence: 'min-max' }), { onChange });
    expect(screen.getByLabelText('Zero sequence')).toHaveValue('min-max');
    fireEvent.change(screen.getByLabelText('Phases'), { target: { value: '1' } });
    expect(onChange).toHaveBeenLastCalledWith({
      multilevel: expect.objectContaining({ phaseCount: 1, zeroSequence: 'none' }) as unknown,
    });
  });

  it('gives the three-level space vector its own topologies (NPC, T-type) and the small-vector split', () => {
    const onChange = vi.fn();
    const draft = { ...defaultDraft('p'), method: 'multilevel-space-vector' as const };
    renderForm(draft, { onChange });
    expect(optionValues('Topology')).toEqual(['npc', 't-type']);
    const split = screen.getByLabelText('Small-vector split');
    expect(split).toHaveAccessibleDescription(
      "share of the redundant small vector's time on its P-type form, from 0 to 1; 0.5 splits it equally",
    );
    fireEvent.change(split, { target: { value: '0.25' } });
    expect(onChange).toHaveBeenLastCalledWith({
      multilevel: expect.objectContaining({ smallVectorSplit: 0.25 }) as unknown,
    });
    expect(
      designOf({ ...draft, multilevel: { ...draft.multilevel, smallVectorSplit: 0.25 } })
        .modulation,
    ).toEqual({
      method: 'multilevel-space-vector',
      topology: 'npc',
      smallVectorSplit: 0.25,
      ma: draft.ma,
      sampling: draft.spaceVectorSampling,
    });
  });

  it('refuses a split outside [0, 1] at the field', () => {
    const draft = { ...defaultDraft('p'), method: 'multilevel-space-vector' as const };
    renderForm({ ...draft, multilevel: { ...draft.multilevel, smallVectorSplit: 1.5 } });
    expect(screen.getByLabelText('Small-vector split')).toHaveAccessibleDescription(
      'Small-vector split must be from 0 to 1 (entered 1.5)',
    );
  });

  it('round-trips a stored multilevel design through the editor', () => {
    const draft = multilevelDraft({
      topology: 'cascaded-h-bridge',
      levels: 7,
      carriers: 'phase-shifted',
      phaseCount: 3,
      zeroSequence: 'third-harmonic',
    });
    const design = designOf({ ...draft, ma: 0.95, sampling: 'regular-symmetric' });
    expect(design.modulation).toEqual({
      method: 'multilevel-carrier',
      topology: 'cascaded-h-bridge',
      levels: 7,
      carriers: 'phase-shifted',
      phaseCount: 3,
      zeroSequence: 'third-harmonic',
      ma: 0.95,
      sampling: 'regular-symmetric',
      carrierPhase: 0,
    });
    expect(designOf(draftOf(design, { name: 'x', projectId: 'p' }))).toEqual(design);
  });
});
