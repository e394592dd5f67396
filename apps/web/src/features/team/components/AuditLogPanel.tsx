import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { useAuditEvents } from '../../../lib/api';
import { formatDate } from '../../../lib/format';

/** The team's last 100 audit events, newest first (admins). */
export function AuditLogPanel() {
  const events = useAuditEvents();
  return (
    <Panel title="Audit log">
      <QueryView query={events} empty="Nothing recorded yet.">
        {(list) => (
          <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2">
            <thead className="text-left text-xs text-ink-soft uppercase">
              <tr>
                <th scope="col">When</th>
                <th scope="col">Who</th>
                <th scope="col">Action</th>
                <th scope="col">Subject</th>
              </tr>
            </thead>
            <tbody>
              {list.map((e) => (
                <tr key={e.id} className="border-t border-rule/60">
                  <td className="py-1 text-xs">{formatDate(e.createdAt)}</td>
                  <td className="py-1 text-xs">{e.actorEmail ?? 'system'}</td>
                  <td className="num py-1 text-xs">{e.action}</td>
                  <td className="py-1 text-xs">
                    {e.subjectType}
                    {e.subjectId ? ` ${e.subjectId.slice(0, 8)}` : ''}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </QueryView>
    </Panel>
  );
}
