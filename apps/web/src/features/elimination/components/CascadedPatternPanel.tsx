import { useState } from 'react';
import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { WaveformChart } from '../../../components/charts/WaveformChart';
import { Button } from '../../../components/ui/Button';
import { NumberField, TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import {
  fieldErrorOf,
  useSolveCascadedPattern,
  type CascadedPatternSolution,
} from '../../../lib/api';
import { formatNumber, formatPercent } from '../../../lib/format';
import {
  cascadedSolveRequestOf,
  DEFAULT_CASCADED_FORM,
  type CascadedForm,
} from '../model/cascadedForm';

/**
 * Per-cell patterns of a cascaded H-bridge string: the service solves one unipolar pattern per
 * cell jointly (every cell's angles at once) so that the string's fundamental is the one asked
 * and the chosen orders vanish from the string's output; the panel lists each cell's angles and
 * draws the string's waveform and exact spectrum.
 */
export function CascadedPatternPanel() {
  const [form, setForm] = useState<CascadedForm>(DEFAULT_CASCADED_FORM);
  const solve = useSolveCascadedPattern();
  const set =
    <K extends keyof CascadedForm>(key: K) =>
    (value: CascadedForm[K]) =>
      setForm({ ...form, [key]: value });
  const fieldError = (...fields: string[]) =>
    fields.map((f) => fieldErrorOf(solve.error, f)).find((m) => m !== undefined);
  return (
    <Panel title="Per-cell patterns of a cascaded string">
      <form
        aria-label="Per-cell patterns"
        className="grid gap-3 sm:grid-cols-3"
        noValidate
        onSubmit={(event) => {
          event.preventDefault();
          solve.mutate(cascadedSolveRequestOf(form));
        }}
      >
        <NumberField
          label="Cells"
          value={form.cells}
          onChange={set('cells')}
          hint="1 to 16, each unipolar"
          error={fieldError('cells')}
        />
        <NumberField
          label="Cell source"
          unit="V"
          value={form.vdc}
          onChange={set('vdc')}
          error={fieldError('vdc')}
        />
        <NumberField
          label="Angles per cell"
          value={form.count}
          onChange={set('count')}
          hint="cells × angles ≤ 64"
          error={fieldError('count', 'starts')}
        />
        <TextField
          label="Orders to eliminate"
          value={form.eliminate}
          onChange={(e) => set('eliminate')(e.target.value)}
          hint={`odd orders ≥ 3, cells × angles − 1 = ${form.cells * form.count - 1} of them`}
          error={fieldError('eliminate', 'eliminate.length')}
        />
        <NumberField
          label="ma"
          value={form.ma}
          onChange={set('ma')}
          hint="V1/(cells·vdc), below 4/π"
          error={fieldError('fundamental')}
        />
        <div className="flex items-end">
          <Button type="submit" busy={solve.isPending}>
            Solve the cells
          </Button>
        </div>
      </form>
      {solve.isError &&
      !fieldError(
        'cells',
        'vdc',
        'count',
        'starts',
        'eliminate',
        'eliminate.length',
        'fundamental',
      ) ? (
        <div className="mt-3">
          <ErrorState error={solve.error} />
        </div>
      ) : null}
      {solve.data ? <CascadedSolution solution={solve.data} /> : null}
    </Panel>
  );
}

/** The solve's outcome: each cell's angles, the string's (or one cell's) waveform, the string's spectrum. */
function CascadedSolution({ solution }: { solution: CascadedPatternSolution }) {
  const count = solution.patterns[0]?.angles.length ?? 0;
  // The string's output, or one cell's, level by level (index into [output, ...cells]).
  const voltages = [solution.output, ...solution.cells];
  const [shown, setShown] = useState(0);
  const voltage = voltages[shown] ?? solution.output;
  return (
    <div className="mt-4 flex flex-col gap-4">
      <p className="text-sm" role="status">
        {solution.converged ? 'Solved. ' : 'No solution. '}
        {solution.message} Fundamental {formatNumber(solution.fundamental)} V · THD{' '}
        {formatPercent(solution.spectrum.thd)} · WTHD {formatPercent(solution.spectrum.wthd)} (whole
        waveform).
      </p>
      <table className="num text-sm" aria-label="Angles of each cell">
        <thead>
          <tr className="text-left text-xs text-ink-soft">
            <th className="pr-4">cell</th>
            {Array.from({ length: count }, (_, k) => (
              <th key={k} className="pr-4">{`α${k + 1} (°)`}</th>
            ))}
          </tr>
        </thead>
        <tbody>
          {solution.patterns.map((cell, c) => (
            <tr key={c}>
              <td className="pr-4">{`cell ${c + 1} (${cell.kind})`}</td>
              {cell.angles.map((a, k) => (
                <td key={k} className="pr-4">
                  {formatNumber((a * 180) / Math.PI)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <WaveformChart
        title="Cascaded string over one period"
        fileName="cascaded-string-waveform"
        output={voltage.waveform}
        outputName={voltage.name}
        controls={
          <select
            aria-label="Voltage shown"
            className="rounded border border-rule bg-panel px-1.5 py-0.5 text-xs"
            value={shown}
            onChange={(e) => setShown(Number(e.target.value))}
          >
            {voltages.map((v, i) => (
              <option key={v.name} value={i}>
                {v.name}
              </option>
            ))}
          </select>
        }
      />
      <SpectrumChart
        series={[
          {
            name: solution.output.name,
            color: 'var(--color-ink)',
            harmonics: solution.spectrum.harmonics,
          },
        ]}
        title="Spectrum of the string output"
        fileName="cascaded-string-spectrum"
        labelThreshold={2}
      />
    </div>
  );
}
