import { useState } from 'react';
import {
  optimalSweepResultOf,
  sheSweepResultOf,
  useCreateOptimalSweep,
  useCreateSheSweep,
  useJob,
} from '../../../lib/api';
import {
  angleCountOf,
  maScaleOf,
  ordersOf,
  solvedPatternOf,
  type EliminationForm,
  type SolvedPattern,
} from '../model/eliminationForm';

/** One solved point of a finished sweep, with its ma. */
export interface SweepPoint {
  fundamental: number;
  ma: number;
  angles: number[];
  /** The optimal pattern's objective (ratio); null for an elimination pattern. */
  objective: number | null;
  /** False where a fresh search took over (the angles may jump there). */
  continued: boolean;
}

/**
 * Starts the sweep the form asks for (a SHE job or an optimal-pattern job on the service), watches
 * it, and gives its converged points with their ma and the pattern they were solved for.
 */
export function useEliminationSweep() {
  const startShe = useCreateSheSweep();
  const startOptimal = useCreateOptimalSweep();
  const [jobId, setJobId] = useState<string | null>(null);
  const [solved, setSolved] = useState<SolvedPattern | null>(null);
  const job = useJob(jobId);
  const start = solved?.type === 'optimal' ? startOptimal : startShe;
  const running =
    startShe.isPending ||
    startOptimal.isPending ||
    job.data?.status === 'queued' ||
    job.data?.status === 'running';

  const run = (form: EliminationForm) => {
    const count = angleCountOf(form);
    const pattern = solvedPatternOf(form);
    const scale = maScaleOf(pattern, count);
    const fundamental = { from: form.from * scale, to: form.to * scale, points: form.points };
    const onSuccess = (created: { id: string }) => {
      setJobId(created.id);
      setSolved(pattern);
    };
    setSolved(pattern);
    setJobId(null);
    if (form.type === 'she') {
      startShe.mutate(
        {
          kind: form.kind,
          vdc: form.vdc,
          count,
          eliminate: ordersOf(form),
          fundamental,
          ...(pattern.cellVoltages === undefined ? {} : { cellVoltages: pattern.cellVoltages }),
        },
        { onSuccess },
      );
    } else {
      startOptimal.mutate(
        {
          kind: form.kind,
          vdc: form.vdc,
          count,
          objective: form.objective,
          maxOrder: form.maxOrder,
          fundamental,
        },
        { onSuccess },
      );
    }
  };

  const she = sheSweepResultOf(job.data);
  const optimal = optimalSweepResultOf(job.data);
  const scale = solved ? maScaleOf(solved, solved.count) : 1;
  const points: SweepPoint[] | null = she
    ? she.points
        .filter((p) => p.converged)
        .map((p, i) => ({ ...p, ma: p.fundamental / scale, objective: null, continued: i > 0 }))
    : optimal
      ? optimal.points
          .filter((p) => p.converged)
          .map((p) => ({ ...p, ma: p.fundamental / scale, objective: p.objective }))
      : null;
  const solvedFraction = she?.solvedFraction ?? optimal?.solvedFraction ?? null;
  return { run, start, job, running, points, solvedFraction, solved };
}
