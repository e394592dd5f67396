import { Command, Option } from 'commander';
import { assertNumberInRange } from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { callLibrary } from '../input/callLibrary.js';
import { formatNetlist, sourceOf, type PwlSource } from '../netlist/formatNetlist.js';
import { pwlPoints } from '../netlist/pwlPoints.js';
import { switchWaveforms } from '../netlist/switchWaveforms.js';
import type { CliIo } from '../output/CliIo.js';
import { toJson } from '../output/toJson.js';
import { writeOutput } from '../output/writeOutput.js';
import { addTimerOptions, readTimerTable, type TimerInputFlags } from '../timer/readTimerTable.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';

/** Most (time, value) points a netlist may hold: keeps the file to tens of megabytes at most. */
export const MAX_NETLIST_POINTS = 2_000_000;

type NetlistFlags = TimerInputFlags & OutputFlags & { quiet?: boolean };

/**
 * `pulsewright netlist`: the switching pattern of a timer table as SPICE piecewise-linear voltage
 * sources, one per switch's gate and one per leg, over whole fundamental periods.
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
    const riseTime = flags.riseTime as number;
    const fallTime = (flags.fallTime ?? flags.riseTime) as number;
    const notes = new Map([
      ['riseTime', 'option --rise-time'],
      ['fallTime', 'option --fall-time'],
      ['periods', 'option --periods'],
      ['gateVoltage', 'option --gate-voltage'],
      ['currentAngle', 'option --current-angle'],
    ]);
    const check = (
      field: string,
      value: unknown,
      bounds: Parameters<typeof assertNumberInRange>[2],
    ) => callLibrary(() => assertNumberInRange(field, value, bounds), { notes });
    const period = 1 / table.realisedFundamentalFrequency;
    check('riseTime', riseTime, { min: 0, minExclusive: true, max: period });
    check('fallTime', fallTime, { min: 0, minExclusive: true, max: period });
    check('periods', flags.periods, { min: 1, max: 1000, integer: true });
    check('gateVoltage', flags.gateVoltage, { min: 0, minExclusive: true, max: 1000 });
    check('currentAngle', flags.currentAngle, { min: -2 * Math.PI, max: 2 * Math.PI });
    const periods = flags.periods as number;
    const gateVoltage = flags.gateVoltage as number;
    const currentAngle = flags.currentAngle as number;
    const { gates, legs } = callLibrary(() => switchWaveforms(table, currentAngle), { notes });
    const edges = [...gates, ...legs].reduce((sum, s) => sum + s.waveform.edges.length, 0);
    if (2 * edges * periods > MAX_NETLIST_POINTS) {
      const most = Math.max(1, Math.floor(MAX_NETLIST_POINTS / (2 * edges)));
      throw new InputError(
        '--periods',
        `--periods must be ≤ ${most} for this table (${edges} edges a period, at most ${MAX_NETLIST_POINTS} points); got ${periods}`,
      );
    }
    const options = { period, periods, riseTime, fallTime };
    const sources: PwlSource[] = [
      ...gates.map((g) =>
        sourceOf(
          g,
          pwlPoints(
            { edges: g.waveform.edges, levels: g.waveform.levels.map((v) => v * gateVoltage) },
            options,
          ),
        ),
      ),
      ...legs.map((l) => sourceOf(l, pwlPoints(l.waveform, options))),
    ];
    const text =
      flags.json === true
        ? toJson({ period, periods, riseTime, fallTime, gateVoltage, currentAngle, sources })
        : formatNetlist(sources, { table, riseTime, fallTime, periods, gateVoltage, currentAngle });
    writeOutput(text, flags.output, io);
    if (flags.quiet !== true) {
      for (const message of messages) io.stderr.write(`pulsewright: note: ${message}\n`);
      for (const warning of table.warnings)
        io.stderr.write(`pulsewright: warning: ${warning.field}: ${warning.message}\n`);
    }
  });
  return command;
}
