import { Command } from 'commander';
import { designModulation, modulationVoltages, type NamedVoltage } from '@pulsewright/modulation';
import { callLibrary } from '../input/callLibrary.js';
import { addDesignOptions } from '../input/designInput.js';
import type { CliIo } from '../output/CliIo.js';
import { formatNumber } from '../output/formatNumber.js';
import { formatTable } from '../output/formatTable.js';
import { toCsv } from '../output/toCsv.js';
import { toJson } from '../output/toJson.js';
import { writeOutput } from '../output/writeOutput.js';
import { readCheckedDesign } from './analyseDesignInput.js';
import { addOutputOptions, type OutputFlags } from './commonOptions.js';

/** The voltages of a design over one period, as the command returns them. */
export interface WaveformOutput {
  /** Hertz: the period the angles span is 1/fundamentalFrequency. */
  fundamentalFrequency: number;
  /** Every output voltage of the bridge, named by the library (phases, then legs and lines for three-phase). */
  voltages: NamedVoltage[];
}

/**
 * `pulsewright waveform`: the exact switching waveforms of a design (the library's
 * modulationVoltages of designModulation): each voltage's edges and levels over one period.
 */
export function waveformCommand(io: CliIo): Command {
  const command = new Command('waveform').description(
    'the exact output voltages of a design over one period: switching angles (and times) and the level held from each',
  );
  addDesignOptions(command);
  addOutputOptions(command, { csv: true });
  command.action((file: string | undefined, flags: Record<string, unknown> & OutputFlags) => {
    const { design, input } = readCheckedDesign(file, flags);
    const voltages = callLibrary(() => modulationVoltages(designModulation(design)), {
      prefix: 'design.',
      notes: input.notes,
    });
    const result: WaveformOutput = {
      fundamentalFrequency: design.fundamentalFrequency,
      voltages: [...voltages.phases, ...voltages.legs, ...voltages.lines],
    };
    const text =
      flags.json === true
        ? toJson(result)
        : flags.csv === true
          ? waveformCsv(result)
          : waveformText(result);
    writeOutput(text, flags.output, io);
  });
  return command;
}

/** One row per edge of every voltage: the level (volts) held from that angle (radians) and time (seconds) to the next edge. */
function waveformCsv(result: WaveformOutput): string {
  const period = 1 / result.fundamentalFrequency;
  return toCsv([
    ['voltage', 'edge', 'angle_rad', 'time_s', 'level_V'],
    ...result.voltages.flatMap((v) =>
      v.waveform.edges.map((angle, i) => [
        v.name,
        i,
        angle,
        (angle / (2 * Math.PI)) * period,
        v.waveform.levels[i] ?? null,
      ]),
    ),
  ]);
}

function waveformText(result: WaveformOutput): string {
  const rows = result.voltages.map((v) => {
    const levels = [...new Set(v.waveform.levels)].sort((a, b) => a - b);
    return [v.name, String(v.waveform.edges.length), levels.map((l) => formatNumber(l)).join(', ')];
  });
  return (
    `one period of ${formatNumber(1 / result.fundamentalFrequency)} s (${formatNumber(result.fundamentalFrequency)} Hz); --csv or --json lists every edge\n\n` +
    formatTable(['voltage', 'edges per period', 'levels (V)'], rows)
  );
}
