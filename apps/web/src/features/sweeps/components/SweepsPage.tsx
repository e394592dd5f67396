import { useState } from 'react';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { useJob } from '../../../lib/api';
import { LossSweepPanel } from './LossSweepPanel';
import { RecentJobs } from './RecentJobs';
import { SweepForm } from './SweepForm';
import { SweepJob } from './SweepJob';

/** Start a sweep of the modulation index on the service and watch it to the end. */
export function SweepsPage() {
  const [jobId, setJobId] = useState<string | null>(null);
  const job = useJob(jobId);

  return (
    <div>
      <PageHeader
        title="Index sweeps"
        subtitle="THD, WTHD and harmonic amplitudes of carrier PWM across a range of the modulation index, computed as a job on the service."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <SweepForm onStarted={setJobId} />
        <div className="flex min-w-0 flex-col gap-4">
          {jobId ? (
            <SweepJob job={job.data} error={job.error} />
          ) : (
            <Panel>
              <p className="text-sm text-ink-soft">Run a sweep to see THD and WTHD against ma.</p>
            </Panel>
          )}
          <RecentJobs onPick={setJobId} />
        </div>
      </div>
      <div className="mt-6">
        <LossSweepPanel />
      </div>
    </div>
  );
}
