import { Button } from '../../../components/ui/Button';
import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { errorMessage, useInvitations, useRevokeInvitation } from '../../../lib/api';
import { formatDate } from '../../../lib/format';

/** The team's invitations (admins); an open one can be withdrawn. */
export function InvitationListPanel() {
  const invitations = useInvitations();
  const revoke = useRevokeInvitation();
  return (
    <Panel title="Invitations">
      <QueryView query={invitations} empty="No invitations yet.">
        {(list) => (
          <ul className="text-sm">
            {list.map((i) => (
              <li
                key={i.id}
                className="flex items-center justify-between border-t border-rule/60 py-1"
              >
                <span>
                  {i.email} · {i.role} ·{' '}
                  <span className="text-xs">
                    {i.status}, expires {formatDate(i.expiresAt)}
                  </span>
                </span>
                {i.status === 'open' ? (
                  <Button variant="ghost" onClick={() => revoke.mutate(i.id)}>
                    Withdraw
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        )}
      </QueryView>
      {revoke.isError ? (
        <p role="alert" className="mt-2 text-sm text-bad">
          {errorMessage(revoke.error)}
        </p>
      ) : null}
    </Panel>
  );
}
