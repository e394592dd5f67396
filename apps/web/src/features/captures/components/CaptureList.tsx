import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { formatDate, formatNumber } from '../../../lib/format';
import { useCaptures } from '../../../lib/api';

/** The uploaded captures, newest as the service lists them; picking one shows its analysis. */
export function CaptureList({
  selected,
  onSelect,
}: {
  selected: string | null;
  onSelect: (id: string) => void;
}) {
  const captures = useCaptures();
  return (
    <Panel title="Captures">
      <QueryView query={captures} empty="No captures uploaded yet.">
        {(list) => (
          <ul className="flex flex-col gap-1 text-sm">
            {list.map((c) => (
              <li key={c.id}>
                <button
                  type="button"
                  aria-pressed={selected === c.id}
                  className={`w-full rounded px-2 py-1 text-left ${selected === c.id ? 'bg-signal-soft' : 'hover:bg-paper'}`}
                  onClick={() => onSelect(c.id)}
                >
                  <span className="font-medium">{c.name}</span>
                  <span className="block text-xs text-ink-soft">
                    {c.rows} rows · {formatNumber(c.sampleRate)} S/s · {formatDate(c.createdAt)}
                  </span>
                </button>
              </li>
            ))}
          </ul>
        )}
      </QueryView>
    </Panel>
  );
}
