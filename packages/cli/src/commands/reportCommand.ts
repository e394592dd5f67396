import { Command } from 'commander';
import { addDesignOptions } from '../input/designInput.js';
import type { CliIo } from '../output/CliIo.js';
import { formatReport } from '../output/formatReport.js';
import { toJson } from '../output/toJson.js';
import { writeOutput } from '../output/writeOutput.js';
import { analyseDesignInput } from './analyseDesignInput.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';

/** Adds `--max-order`, `--points` and `--bus-voltage`, the options of analyseDesign. */
export function addReportOptions(command: Command, withSeries = true): Command {
  command.addOption(
    numberOption(
      '--max-order <order>',
      'highest order of the spectra, 50..5000 (default: past the third carrier group)',
    ),
  );
  if (withSeries)
    command.addOption(
      numberOption(
        '--points <count>',
        'samples per period of the time series, 64..20000 (default 1200)',
      ),
    );
  command.addOption(
    numberOption(
      '--bus-voltage <volts>',
      'bus voltage at the point of coupling for the limit check, V rms line to line',
    ),
  );
  return command;
}

/** `pulsewright report`: the design report (analyseDesign), as text or the whole report as JSON. */
export function reportCommand(io: CliIo): Command {
  const command = new Command('report').description(
    'the design report: voltages, THD and WTHD, currents, load power, DC link, common mode, filter, limit check',
  );
  addDesignOptions(command);
  addReportOptions(command);
  addOutputOptions(command);
  command.action((file: string | undefined, flags: Record<string, unknown> & OutputFlags) => {
    const { design, report } = analyseDesignInput(file, flags);
    writeOutput(
      flags.json === true ? toJson(report) : formatReport(report, design),
      flags.output,
      io,
    );
  });
  return command;
}
