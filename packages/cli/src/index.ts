/**
 * @pulsewright/cli: the `pulsewright` command line over @pulsewright/modulation. The bin runs
 * {@link main}; the program and the renderers are exported for tools that embed the command.
 */
export { main } from './main.js';
export { createProgram, cliVersion } from './program.js';
export {
  EXIT_OK,
  EXIT_FAILURE,
  EXIT_BAD_INPUT,
  InputError,
  FailureError,
  exitCodeOf,
} from './errors.js';
export type { CliIo, OutputStream } from './output/CliIo.js';
export { renderTimerTable, TIMER_FORMATS, type TimerFormat } from './commands/timerTableCommand.js';
export { timerOptionsFromDesign, type DesignTimerFields } from './timer/timerOptionsFromDesign.js';
