import { Panel } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import { maSweepResultOf, type Job } from '../../../lib/api';
import { ProgressBar } from './ProgressBar';
import { SweepCharts } from './SweepCharts';

/** One sweep job: its progress, its error if it failed, and the charts of its result once it has one. */
export function SweepJob({ job, error }: { job: Job | undefined; error: unknown }) {
  if (error) return <ErrorState error={error} />;
  if (!job) return <ProgressBar value={0} label="Queued" />;
  const result = maSweepResultOf(job);
  return (
    <div className="flex flex-col gap-4">
      <Panel title="Job">
        <ProgressBar
          value={job.progress}
          label={
            job.status === 'succeeded'
              ? 'Sweep finished'
              : job.status === 'failed'
                ? 'Sweep failed'
                : `Sweep ${job.status}`
          }
        />
        {job.error ? (
          <p role="alert" className="mt-2 text-sm text-bad">
            {job.error}
          </p>
        ) : null}
        {job.status === 'succeeded' ? (
          <p className="mt-2 text-sm text-good" data-testid="sweep-done">
            Finished: {result?.ma.length ?? 0} points.
          </p>
        ) : null}
      </Panel>
      {result ? <SweepCharts result={result} /> : null}
    </div>
  );
}
