import { Command, Option } from 'commander';
import {
  spiceNetlistSources,
  timerTableToSpiceNetlist,
  type SpiceNetlistOptions,
} from '@pulsewright/modulation';
import { callLibrary } from '../input/callLibrary.js';
import type { CliIo } from '../output/CliIo.js';
import { toJson } from '../output/toJson.js';
import { writeOutput } from '../output/writeOutput.js';
import { addTimerOptions, readTimerTable, type TimerInputFlags } from '../timer/readTimerTable.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';

type NetlistFlags = TimerInputFlags & OutputFlags & { quiet?: boolean };

/**
 * `pulsewright netlist`: the switching pattern of a timer table as SPICE piecewise-linear voltage
 * sources, one per switch's gate and one per leg, over whole fundamental periods: the library's
 * `timerTableToSpiceNetlist` (or, with --json, its `spiceNetlistSources`).
 */
export function netlistCommand(io: CliIo): Command {
  const command = new Command('netlist').description(
    "the switching pattern as a SPICE netlist of piecewise-linear sources: each switch's gate and each leg's voltage, with ramp times and the timer table's dead time",
  );
  addTimerOptions(command);
  command.addOption(
    numberOption('--rise-time <seconds>', 'time each rising edge takes, seconds')
      .default(1e-7)
      .helpGroup('Netlist:'),
  );
  command.addOption(
    numberOption(
      '--fall-time <seconds>',
      'time each falling edge takes (default: the rise time)',
    ).helpGroup('Netlist:'),
  );
  command.addOption(
    numberOption('--periods <count>', 'whole fundamental periods to write, 1..1000')
      .default(1)
      .helpGroup('Netlist:'),
  );
  command.addOption(
    numberOption('--gate-voltage <volts>', 'gate signal level while a switch is on (off is 0 V)')
      .default(1)
      .helpGroup('Netlist:'),
  );
  command.addOption(
    numberOption(
      '--current-angle <radians>',
      'phase of the load current behind sin θ on leg a, for the leg voltages during dead time',
    )
      .default(0)
      .helpGroup('Netlist:'),
  );
  command.addOption(
    new Option('-q, --quiet', "do not print the table's warnings on standard error").helpGroup(
      'Output:',
    ),
  );
  addOutputOptions(command);
  command.addHelpText(
    'after',
    '\nThe input is that of timer-table: a design with the timer options, or a timer-table request file.',
  );
  command.action((file: string | undefined, flags: NetlistFlags) => {
    const { table, messages } = readTimerTable(file, flags);
    // The library checks each option (kind and range) and names it; the notes say which flag set it.
    const options = {
      riseTime: flags.riseTime,
      fallTime: flags.fallTime ?? flags.riseTime,
      periods: flags.periods,
      gateVoltage: flags.gateVoltage,
      currentAngle: flags.currentAngle,
    } as SpiceNetlistOptions;
    const notes = new Map([
      ['riseTime', 'option --rise-time'],
      ['fallTime', 'option --fall-time'],
      ['periods', 'option --periods'],
      ['gateVoltage', 'option --gate-voltage'],
      ['currentAngle', 'option --current-angle'],
    ]);
    const text = callLibrary(
      () => {
        if (flags.json !== true) return timerTableToSpiceNetlist(table, options);
        const { table: _table, ...sources } = spiceNetlistSources(table, options);
        return toJson(sources);
      },
      { notes },
    );
    writeOutput(text, flags.output, io);
    if (flags.quiet !== true) {
      for (const message of messages) io.stderr.write(`pulsewright: note: ${message}\n`);
      for (const warning of table.warnings)
        io.stderr.write(`pulsewright: warning: ${warning.field}: ${warning.message}\n`);
    }
  });
  return command;
}
