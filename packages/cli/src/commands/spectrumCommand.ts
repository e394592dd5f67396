import { Command, Option } from 'commander';
import type { DesignReport, VoltageFigures } from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { addDesignOptions } from '../input/designInput.js';
import type { CliIo } from '../output/CliIo.js';
import { formatSpectrum } from '../output/formatSpectrum.js';
import { toCsv } from '../output/toCsv.js';
import { toJson } from '../output/toJson.js';
import { writeOutput } from '../output/writeOutput.js';
import { analyseDesignInput } from './analyseDesignInput.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';

/** The voltages the spectrum command can show, as the design report names them. */
export const SPECTRUM_VOLTAGES = ['bridge', 'line', 'output'] as const;
export type SpectrumVoltage = (typeof SPECTRUM_VOLTAGES)[number];

/**
 * The figures of the chosen voltage from the design report: `bridge` (the bridge voltage across
 * phase a of the load), `line` (line a−b, three-phase only) or `output` (the filter's output).
 * @throws InputError naming `--voltage` when the design has no such voltage
 */
export function chosenVoltage(report: DesignReport, voltage: SpectrumVoltage): VoltageFigures {
  if (voltage === 'line') {
    if (report.lineToLine === null)
      throw new InputError(
        '--voltage',
        `--voltage must be 'bridge' or 'output' for method '${report.method}' (a single-phase bridge has no line-to-line voltage); got "line"`,
      );
    return report.lineToLine;
  }
  if (voltage === 'output') {
    if (report.output === null)
      throw new InputError(
        '--voltage',
        "--voltage must be 'bridge' or 'line' for a design without a filter (give filter.l and filter.c for an output voltage); got \"output\"",
      );
    const { series: _series, ...figures } = report.output;
    return figures;
  }
  return report.bridge;
}

/** `pulsewright spectrum`: the exact spectrum of a design's voltage, THD and WTHD. */
export function spectrumCommand(io: CliIo): Command {
  const command = new Command('spectrum').description(
    "exact spectrum of a design's voltage (from the switching angles), with THD and WTHD over the whole waveform",
  );
  addDesignOptions(command);
  command.addOption(
    numberOption(
      '--max-order <order>',
      'highest order, 50..5000 (default: past the third carrier group)',
    ),
  );
  command.addOption(
    new Option(
      '--voltage <voltage>',
      'which voltage: bridge (across phase a of the load), line (a−b, three-phase), output (after the filter)',
    )
      .choices(SPECTRUM_VOLTAGES)
      .default('bridge'),
  );
  command.addOption(
    new Option(
      '--all',
      'list every order in the table, not only those above 0.1 % of the fundamental',
    ).helpGroup('Output:'),
  );
  addOutputOptions(command, { csv: true });
  command.action(
    (
      file: string | undefined,
      flags: Record<string, unknown> & OutputFlags & { voltage: SpectrumVoltage; all?: boolean },
    ) => {
      // The series are not shown here: the fewest samples keep the analysis to the spectrum's cost.
      const { report } = analyseDesignInput(file, { ...flags, points: 64 });
      const figures = chosenVoltage(report, flags.voltage);
      let text: string;
      if (flags.json === true) text = toJson(figures);
      else if (flags.csv === true) text = spectrumCsv(figures);
      else text = formatSpectrum(report, figures, flags.all === true);
      writeOutput(text, flags.output, io);
    },
  );
  return command;
}

function spectrumCsv(figures: VoltageFigures): string {
  return toCsv([
    ['order', 'label', 'amplitude_V_peak', 'phase_rad', 'percent_of_fundamental'],
    ...figures.spectrum.map((h) => [
      h.order,
      h.label,
      h.amplitude,
      h.phase,
      figures.fundamental > 0 ? (100 * h.amplitude) / figures.fundamental : null,
    ]),
  ]);
}
