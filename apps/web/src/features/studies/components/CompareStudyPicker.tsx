import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { useStudies } from '../../../lib/api';

/** The list of stored studies, each with a checkbox that adds it to or drops it from the comparison. */
export function CompareStudyPicker({
  ids,
  onToggle,
}: {
  ids: readonly string[];
  onToggle: (id: string) => void;
}) {
  const all = useStudies();
  return (
    <Panel title="Studies">
      <QueryView query={all} empty="No studies to compare yet.">
        {(list) => (
          <ul className="flex flex-col gap-1 text-sm">
            {list.map((s) => (
              <li key={s.id}>
                <label className="flex items-center gap-2">
                  <input
                    type="checkbox"
                    className="accent-signal"
                    checked={ids.includes(s.id)}
                    onChange={() => onToggle(s.id)}
                  />
                  {s.name}
                </label>
              </li>
            ))}
          </ul>
        )}
      </QueryView>
    </Panel>
  );
}
