import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { designRows } from '../../model/describeDesign';
import { COLUMNS } from '../compareColumns';

const npc: InverterDesign = {
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 1050,
  modulation: {
    method: 'multilevel-carrier',
    topology: 'npc',
    levels: 3,
    carriers: 'pd',
    phaseCount: 3,
    ma: 0.9,
  },
  load: { r: 10, l: 0.01 },
};

const method = COLUMNS.find((c) => c.heading === 'Method');
const deviceSwitching = COLUMNS.find((c) => c.heading === 'Device switching (Hz)');

describe('multilevel designs in Compare and the printed design', () => {
  it('names the bridge of a multilevel study beside a two-level one', () => {
    if (!method || !deviceSwitching) throw new Error('Compare has Method and Device switching');
    const multilevel = analyseDesign(npc);
    const twoLevel = analyseDesign({ ...npc, modulation: { method: 'three-phase', ma: 0.9 } });
    expect(method.cell(multilevel, undefined as never)).toBe(
      'Three-level neutral-point-clamped (NPC), 3 levels',
    );
    expect(method.title?.(multilevel, undefined as never)).toBe(
      'Multilevel carrier (level- or phase-shifted); Level-shifted, phase disposition (PD)',
    );
    expect(method.cell(twoLevel, undefined as never)).toBe(twoLevel.methodLabel);
    // Both have a device switching frequency, the figure Compare sets equal.
    expect(deviceSwitching.value?.(multilevel, undefined as never)).toBe(
      multilevel.multilevel?.averageDeviceFrequency,
    );
    expect(deviceSwitching.value?.(twoLevel, undefined as never)).toBeGreaterThan(0);
  });

  it('lists the multilevel options in the printed design, defaults written out', () => {
    const rows = Object.fromEntries(designRows(npc));
    expect(rows).toMatchObject({
      Topology: 'Three-level neutral-point-clamped (NPC)',
      Levels: '3',
      Carriers: 'Level-shifted, phase disposition (PD)',
      Phases: '3',
      'Zero sequence': 'None (sine references, SPWM)',
    });
    const sv = Object.fromEntries(
      designRows({
        ...npc,
        modulation: { method: 'multilevel-space-vector', topology: 't-type', ma: 0.9 },
      }),
    );
    expect(sv).toMatchObject({ Topology: 'Three-level T-type', 'Small-vector split': '0.5' });
  });
});
