import type { StudyReport } from '../../../../lib/api';
import { StackedStepChart, type StepRow } from '../../../../components/charts/StackedStepChart';

type Multilevel = NonNullable<StudyReport['multilevel']>;

/** The distinct values a piecewise-constant period takes, ascending (a cell's grid lines). */
function heldValues(levels: readonly number[]): number[] {
  return [...new Set(levels)].sort((a, b) => a - b);
}

/**
 * The rows of the level-by-level chart: every leg's (string's) output with the levels the report
 * lists for it, then leg a's cells as the report gives them (a cascaded cell's output in volts, a
 * flying-capacitor commutation cell's upper switch as 0/1).
 */
export function multilevelRows(multilevel: Multilevel): StepRow[] {
  const cellUnit = multilevel.topology === 'cascaded-h-bridge' ? 'V' : '';
  return [
    ...multilevel.legs.map((leg) => ({
      name: leg.name,
      waveform: leg.waveform,
      levels: leg.levels,
      unit: 'V',
    })),
    ...multilevel.cells.map((cell) => ({
      name:
        multilevel.topology === 'flying-capacitor'
          ? `leg a, ${cell.name} upper switch`
          : `string a, ${cell.name}`,
      waveform: cell.waveform,
      levels: heldValues(cell.waveform.levels),
      unit: cellUnit,
      tone: 'secondary' as const,
    })),
  ];
}

/** Each leg's output level by level, and leg a's cells stacked below (the report's `multilevel`). */
export function MultilevelLevelChart({
  multilevel,
  fileStem,
}: {
  multilevel: Multilevel;
  fileStem: string;
}) {
  return (
    <StackedStepChart
      title={`Levels, ${multilevel.topologyLabel}, ${multilevel.levels} levels`}
      fileName={`${fileStem}-levels`}
      rows={multilevelRows(multilevel)}
    />
  );
}
