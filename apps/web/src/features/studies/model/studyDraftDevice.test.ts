import { EXAMPLE_IGBT, type InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { defaultDraft, designOf, draftOf } from './studyDraft';

const design: InverterDesign = {
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 2550,
  modulation: {
    method: 'three-phase',
    ma: 0.9,
    zeroSequence: 'dpwm1',
    sampling: 'natural',
    carrierPhase: 0,
  },
  filter: null,
  load: { r: 8, l: 0.01 },
  device: {
    kind: 'mosfet',
    rdsOn: 0.02,
    eon: 1e-4,
    eoff: 2e-4,
    err: 1e-5,
    referenceVoltage: 800,
    referenceCurrent: 50,
  },
};

describe('the study draft’s switching device', () => {
  it('a new study has none; choosing a kind puts its values in the design', () => {
    const draft = defaultDraft('p');
    expect(designOf(draft).device).toBeUndefined();
    expect(designOf({ ...draft, deviceKind: 'igbt' }).device).toEqual(EXAMPLE_IGBT);
  });

  it('a stored device comes back unchanged, and the other kind keeps its values', () => {
    const draft = draftOf(design, { name: 'Drive', projectId: 'p' });
    expect(draft.deviceKind).toBe('mosfet');
    expect(designOf(draft).device).toEqual(design.device);
    expect(draft.igbt).toEqual(EXAMPLE_IGBT);
  });
});
