import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { useOutbox } from '../../../lib/api';
import { formatDate } from '../../../lib/format';

/** The team's last 50 e-mails as the service wrote them (the local outbox in development; admins). */
export function OutboxPanel() {
  const outbox = useOutbox();
  return (
    <Panel title="Mail outbox">
      <QueryView query={outbox} empty="No e-mail written yet.">
        {(list) => (
          <ul className="flex flex-col gap-3 text-sm">
            {list.map((m) => (
              <li key={m.id} className="rounded border border-rule p-2">
                <p className="font-medium">{m.subject}</p>
                <p className="text-xs text-ink-soft">
                  to {m.to} · {m.status} · {formatDate(m.createdAt)}
                </p>
                <pre className="num mt-1 whitespace-pre-wrap text-xs">{m.text}</pre>
              </li>
            ))}
          </ul>
        )}
      </QueryView>
    </Panel>
  );
}
