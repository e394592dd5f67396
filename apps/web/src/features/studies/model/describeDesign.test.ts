import type { InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { designRows } from './describeDesign';

const drive: InverterDesign = {
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 4950,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'dpwm1' },
  load: { r: 12, l: 0.004 },
};

describe('designRows: the printed design', () => {
  it('states the switching device the losses come from, in the units its fields show', () => {
    const rows = Object.fromEntries(
      designRows({
        ...drive,
        device: {
          kind: 'igbt',
          vce0: 0.8,
          rce: 0.012,
          vf0: 0.9,
          rf: 0.01,
          eon: 0.0021,
          eoff: 0.0018,
          err: 0.0009,
          referenceVoltage: 400,
          referenceCurrent: 50,
        },
      }),
    );
    expect(rows['Switching device']).toBe(
      'IGBT with diode: Vce0 0.8 V, rce 12 mΩ, Vf0 0.9 V, rf 10 mΩ; Eon 2.1 mJ, Eoff 1.8 mJ, Err 0.9 mJ at 400 V, 50 A',
    );
    const mosfet = Object.fromEntries(
      designRows({
        ...drive,
        device: {
          kind: 'mosfet',
          rdsOn: 0.025,
          eon: 0.0004,
          eoff: 0.0003,
          err: 0.0001,
          referenceVoltage: 400,
          referenceCurrent: 30,
        },
      }),
    );
    expect(mosfet['Switching device']).toBe(
      'MOSFET: RDS(on) 25 mΩ; Eon 0.4 mJ, Eoff 0.3 mJ, Err 0.1 mJ at 400 V, 30 A',
    );
    expect(Object.fromEntries(designRows(drive))['Switching device']).toBeUndefined();
  });
});
