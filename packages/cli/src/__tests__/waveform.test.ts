import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { designModulation, modulationVoltages, type InverterDesign } from '@pulsewright/modulation';
import { example, runCli, viaJson } from './runCli.js';

const drive = JSON.parse(readFileSync(example('drive.json'), 'utf8')) as InverterDesign;

describe('pulsewright waveform', () => {
  it('gives every named voltage of the design as the library builds it', async () => {
    const run = await runCli(['waveform', example('drive.json'), '--json']);
    expect(run.code, run.stderr).toBe(0);
    const voltages = modulationVoltages(designModulation(drive));
    expect(JSON.parse(run.stdout)).toEqual(
      viaJson({
        fundamentalFrequency: 50,
        voltages: [...voltages.phases, ...voltages.legs, ...voltages.lines],
      }),
    );
  });

  it("lists every edge as CSV with units in the header, the time being the angle's share of the period", async () => {
    const run = await runCli(['waveform', example('drive.json'), '--csv']);
    expect(run.code, run.stderr).toBe(0);
    const rows = run.stdout.trimEnd().split('\r\n');
    expect(rows[0]).toBe('voltage,edge,angle_rad,time_s,level_V');
    const line = modulationVoltages(designModulation(drive)).lines[0];
    const lineRows = rows.slice(1).filter((r) => r.startsWith('line a−b,'));
    expect(lineRows).toHaveLength(line?.waveform.edges.length ?? -1);
    lineRows.forEach((row, i) => {
      const [, edge, angle, time, level] = row.split(',').map(Number);
      expect(edge).toBe(i);
      expect(angle).toBe(line?.waveform.edges[i]);
      expect(level).toBe(line?.waveform.levels[i]);
      // One period is 1/50 s: t = θ/2π · 20 ms, to double rounding.
      expect(Math.abs((time as number) - ((angle as number) / (2 * Math.PI)) * 0.02)).toBeLessThan(
        1e-18,
      );
    });
  });
});
