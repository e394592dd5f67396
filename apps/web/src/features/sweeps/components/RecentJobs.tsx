import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { formatDate } from '../../../lib/format';
import { useJobs } from '../../../lib/api';

/** The service's recent jobs with their status and progress; picking one shows it. */
export function RecentJobs({ onPick }: { onPick: (jobId: string) => void }) {
  const jobs = useJobs();
  return (
    <Panel title="Recent jobs">
      <QueryView query={jobs} empty="No jobs yet.">
        {(list) => (
          <ul className="text-sm">
            {list.map((j) => (
              <li key={j.id} className="flex justify-between border-t border-rule/60 py-1">
                <button
                  type="button"
                  className="underline-offset-2 hover:underline"
                  onClick={() => onPick(j.id)}
                >
                  {j.kind} · {formatDate(j.createdAt)}
                </button>
                <span className="num text-xs">
                  {j.status} {Math.round(j.progress * 100)} %
                </span>
              </li>
            ))}
          </ul>
        )}
      </QueryView>
    </Panel>
  );
}
