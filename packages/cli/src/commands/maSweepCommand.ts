import { Command, Option } from 'commander';
import {
  assertNumberInRange,
  CARRIER_METHODS,
  DESIGN_BOUNDS,
  designModulation,
  MAX_HARMONIC_ORDER,
  modulationPhaseCount,
  modulationVoltages,
  sweepModulationIndex,
  type DesignModulation,
  type InverterDesign,
  type ModulationIndexSweep,
  type ModulationIndexSweepOptions,
  type NamedVoltage,
  type Waveform,
} from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { callLibrary } from '../input/callLibrary.js';
import { addDesignOptions } from '../input/designInput.js';
import { parseNumberList } from '../input/parseValue.js';
import type { CliIo } from '../output/CliIo.js';
import { formatNumber, formatPercent } from '../output/formatNumber.js';
import { formatTable } from '../output/formatTable.js';
import { createProgress } from '../output/progress.js';
import { toCsv } from '../output/toCsv.js';
import { toJson } from '../output/toJson.js';
import { writeOutput } from '../output/writeOutput.js';
import { readCheckedDesign } from './analyseDesignInput.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';

export const SWEEP_VOLTAGES = ['bridge', 'line'] as const;
type SweepVoltage = (typeof SWEEP_VOLTAGES)[number];

/** An ma sweep as the command returns it: the library's series and the voltage they are of. */
export interface MaSweepOutput extends ModulationIndexSweep {
  /** The voltage analysed, as the library names it (`bridge output`, `line a−b`, …). */
  voltage: string;
}

type SweepFlags = Record<string, unknown> & OutputFlags & { voltage: SweepVoltage };

/**
 * The function from ma to the analysed voltage of a design: the design with its modulation
 * index replaced (space vector's `m` dropped in favour of `ma`), built by the library's
 * designModulation and modulationVoltages.
 */
export function designWaveformAt(
  design: InverterDesign,
  voltage: SweepVoltage,
): { name: string; at: (ma: number) => Waveform } {
  const pick = (ma: number): NamedVoltage => {
    const { m: _m, ...rest } = design.modulation as DesignModulation & { m?: number };
    const modulation = { ...rest, ma } as DesignModulation;
    const voltages = modulationVoltages(designModulation({ ...design, modulation }));
    return (voltage === 'line' ? voltages.lines[0] : voltages.phases[0]) as NamedVoltage;
  };
  const probe = design.modulation as { ma?: number; m?: number };
  return { name: pick(probe.ma ?? 0.5).name, at: (ma) => pick(ma).waveform };
}

/** `pulsewright ma-sweep`: fundamental, THD, WTHD and chosen orders across the modulation index. */
export function maSweepCommand(io: CliIo): Command {
  const command = new Command('ma-sweep').description(
    'fundamental, THD and WTHD (exact, whole waveform) and chosen harmonic orders across a range of modulation index',
  );
  addDesignOptions(command);
  command.addOption(
    numberOption('--from <ma>', 'first modulation index (default 0.05)').helpGroup('Sweep:'),
  );
  command.addOption(
    numberOption('--to <ma>', 'last modulation index (default 1.3)').helpGroup('Sweep:'),
  );
  command.addOption(
    numberOption('--points <count>', 'evenly spaced points, 2..1000 (default 100)').helpGroup(
      'Sweep:',
    ),
  );
  command.addOption(
    new Option('--orders <orders>', 'harmonic orders whose amplitude to list, comma-separated')
      .argParser(parseNumberList)
      .helpGroup('Sweep:'),
  );
  command.addOption(
    new Option(
      '--voltage <voltage>',
      'bridge (across phase a of the load) or line (a−b, three-phase)',
    )
      .choices(SWEEP_VOLTAGES)
      .default('bridge')
      .helpGroup('Sweep:'),
  );
  addOutputOptions(command, { csv: true, progress: true });
  command.action(async (file: string | undefined, flags: SweepFlags) => {
    const { design, input } = readCheckedDesign(file, flags);
    const method = design.modulation.method;
    if (!CARRIER_METHODS.includes(method)) {
      throw new InputError(
        'design.modulation.method',
        `design.modulation.method must be one of ${CARRIER_METHODS.map((m) => `'${m}'`).join(', ')} for an ma sweep (a stored pattern has no modulation index); got ${JSON.stringify(method)}`,
      );
    }
    if (flags.voltage === 'line' && modulationPhaseCount(design.modulation) !== 3) {
      throw new InputError(
        '--voltage',
        `--voltage must be 'bridge' for method '${method}' (a single-phase bridge has no line-to-line voltage); got "line"`,
      );
    }
    const notes = new Map([
      ...input.notes,
      ['from', 'option --from'],
      ['to', 'option --to'],
      ['points', 'option --points'],
      ['orders', 'option --orders'],
    ]);
    const range = { from: (flags.from ?? 0.05) as number, to: (flags.to ?? 1.3) as number };
    // The sweep stays inside the range a design may hold, so every point is a design the API would take.
    for (const [field, value] of Object.entries(range)) {
      callLibrary(() => assertNumberInRange(field, value, DESIGN_BOUNDS['modulation.ma']), {
        notes,
      });
    }
    const { name, at } = callLibrary(() => designWaveformAt(design, flags.voltage), {
      prefix: 'design.',
      notes,
    });
    const progress = await createProgress('ma sweep', io, flags.progress !== false);
    const options: ModulationIndexSweepOptions = {
      ...range,
      ...(flags.points === undefined ? {} : { points: flags.points as number }),
      maxOrder: MAX_HARMONIC_ORDER,
      orders: (flags.orders as number[] | undefined) ?? [],
      onProgress: progress.update,
    };
    let sweep: ModulationIndexSweep;
    try {
      sweep = callLibrary(() => sweepModulationIndex(at, options), {
        rename: { ma: 'design.modulation.ma' },
        notes,
      });
    } finally {
      progress.stop();
    }
    const result: MaSweepOutput = { voltage: name, ...sweep };
    writeOutput(
      flags.json === true
        ? toJson(result)
        : flags.csv === true
          ? sweepCsv(result)
          : sweepText(result, design),
      flags.output,
      io,
    );
  });
  return command;
}

function sweepText(result: MaSweepOutput, design: InverterDesign): string {
  const head = `${result.voltage}: ${design.modulation.method}, ma ${formatNumber(result.ma[0])} to ${formatNumber(result.ma[result.ma.length - 1])}, ${result.ma.length} points (THD and WTHD exact over the whole waveform)\n\n`;
  const headers = [
    'ma',
    'fundamental (V peak)',
    'THD (%)',
    'WTHD (%)',
    ...result.harmonics.map((h) => `order ${h.order} (V peak)`),
  ];
  const rows = result.ma.map((ma, i) => [
    formatNumber(ma),
    formatNumber(result.fundamental[i]),
    formatPercent(result.thd[i]),
    formatPercent(result.wthd[i]),
    ...result.harmonics.map((h) => formatNumber(h.amplitude[i])),
  ]);
  return head + formatTable(headers, rows);
}

function sweepCsv(result: MaSweepOutput): string {
  return toCsv([
    [
      'ma',
      'fundamental_V_peak',
      'thd_ratio',
      'wthd_ratio',
      ...result.harmonics.map((h) => `order${h.order}_V_peak`),
    ],
    ...result.ma.map((ma, i) => [
      ma,
      result.fundamental[i] ?? null,
      result.thd[i] ?? null,
      result.wthd[i] ?? null,
      ...result.harmonics.map((h) => h.amplitude[i] ?? null),
    ]),
  ]);
}
