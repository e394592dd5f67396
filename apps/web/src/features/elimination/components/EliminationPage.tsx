import { useState } from 'react';
import { AngleTablePanel } from '../../../components/patterns/AngleTablePanel';
import { PageHeader } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import { DEFAULT_ELIMINATION_FORM, tablePatternOf } from '../model/eliminationForm';
import { CascadedPatternPanel } from './CascadedPatternPanel';
import { EliminationForm } from './EliminationForm';
import { EliminationResult } from './EliminationResult';
import { useEliminationSweep } from './useEliminationSweep';

/**
 * Programmed patterns: eliminate chosen orders (SHE) or minimise a distortion with N angles
 * (optimal patterns). The service follows one branch (or one family of optima) across ma as a
 * job; the page draws it, saves a picked point as a study, and builds an angle table from it.
 */
export function EliminationPage() {
  const [form, setForm] = useState(DEFAULT_ELIMINATION_FORM);
  const sweep = useEliminationSweep();
  const [picked, setPicked] = useState<number | null>(null);
  const pickedPoint = picked === null ? undefined : sweep.points?.[picked];
  return (
    <div>
      <PageHeader
        title="Harmonic elimination"
        subtitle="Quarter-wave symmetric patterns whose first-quarter angles either null chosen odd harmonics or minimise the distortion for a number of angles, at each ma; the service follows one branch across ma as a job, and the angle table turns it into what a controller interpolates."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <EliminationForm
          form={form}
          onChange={setForm}
          onSubmit={() => {
            setPicked(null);
            sweep.run(form);
          }}
          running={sweep.running}
          error={sweep.start.error}
          job={sweep.job.data}
        />
        <div className="flex min-w-0 flex-col gap-4">
          {sweep.start.isError ? <ErrorState error={sweep.start.error} /> : null}
          {sweep.job.isError ? <ErrorState error={sweep.job.error} /> : null}
          {sweep.job.data?.error ? <ErrorState error={new Error(sweep.job.data.error)} /> : null}
          {sweep.points && sweep.solved ? (
            <EliminationResult
              pattern={sweep.solved}
              points={sweep.points}
              solvedFraction={sweep.solvedFraction ?? 0}
              picked={picked}
              onPick={setPicked}
            />
          ) : null}
          <AngleTablePanel
            pattern={sweep.points && sweep.solved ? tablePatternOf(sweep.solved) : null}
            angles={pickedPoint?.angles}
            initialRange={{ from: form.from, to: form.to }}
          />
          <CascadedPatternPanel />
        </div>
      </div>
    </div>
  );
}
