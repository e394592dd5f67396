import { readFileSync } from 'node:fs';
import { Command } from 'commander';
import { angleTableCommand } from './commands/angleTableCommand.js';
import { maSweepCommand } from './commands/maSweepCommand.js';
import { multilevelTimerTableCommand } from './commands/multilevelTimerTableCommand.js';
import { optimalPatternCommand } from './commands/optimalPatternCommand.js';
import { reportCommand } from './commands/reportCommand.js';
import { sheCommand } from './commands/sheCommand.js';
import { spectrumCommand } from './commands/spectrumCommand.js';
import { timerTableCommand } from './commands/timerTableCommand.js';
import { netlistCommand } from './commands/netlistCommand.js';
import { waveformCommand } from './commands/waveformCommand.js';
import type { CliIo } from './output/CliIo.js';

/** This package's version, from its package.json (dist/ and src/ sit one level below it). */
export function cliVersion(): string {
  const text = readFileSync(new URL('../package.json', import.meta.url), 'utf8');
  return (JSON.parse(text) as { version: string }).version;
}

/**
 * The `pulsewright` program: one subcommand per job, every one running the library in this
 * process (no service, no network). Commander writes help and usage errors through `io`, and
 * throws instead of exiting so the caller sets the exit status.
 */
export function createProgram(io: CliIo): Command {
  const program = new Command('pulsewright')
    .description(
      'Pulsewright on the command line: design reports, exact spectra, timer tables, SHE and optimal-pattern tables, angle tables for controllers, ma sweeps.\n' +
        'Runs @pulsewright/modulation directly: no service, no network; the same input gives the same bytes.\n' +
        'Exit status: 0 done, 1 failure (e.g. no solution found), 2 bad input (the message names the field and its range).',
    )
    .version(cliVersion(), '-V, --version')
    .showHelpAfterError('(run with --help for the options)')
    .configureOutput({
      writeOut: (text) => void io.stdout.write(text),
      writeErr: (text) => void io.stderr.write(text),
    })
    .exitOverride();
  for (const command of [
    reportCommand,
    spectrumCommand,
    timerTableCommand,
    multilevelTimerTableCommand,
    sheCommand,
    optimalPatternCommand,
    angleTableCommand,
    maSweepCommand,
    waveformCommand,
    netlistCommand,
  ]) {
    program.addCommand(
      command(io).exitOverride().showHelpAfterError('(run with --help for the options)'),
    );
  }
  return program;
}
