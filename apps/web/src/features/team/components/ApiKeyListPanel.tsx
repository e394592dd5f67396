import { useState } from 'react';
import { Button } from '../../../components/ui/Button';
import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { errorMessage, useApiKeys, useRevokeApiKey, type ApiKey } from '../../../lib/api';
import { formatDate } from '../../../lib/format';

/** The keys the caller may see (their own; an admin's, the team's), each revocable after a confirmation. */
export function ApiKeyListPanel({ onRevoked }: { onRevoked: (id: string) => void }) {
  const keys = useApiKeys();
  const revoke = useRevokeApiKey();
  const [confirming, setConfirming] = useState<string | null>(null);
  const revokeKey = (key: ApiKey) => {
    setConfirming(null);
    revoke.mutate(key.id, { onSuccess: () => onRevoked(key.id) });
  };
  return (
    <Panel title="Keys">
      <QueryView query={keys} empty="No API keys yet.">
        {(list) => (
          <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2">
            <thead className="text-left text-xs text-ink-soft uppercase">
              <tr>
                <th scope="col">Name</th>
                <th scope="col">Starts</th>
                <th scope="col">Role</th>
                <th scope="col">Owner</th>
                <th scope="col">Last used</th>
                <th scope="col">State</th>
                <th scope="col">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {list.map((k) => (
                <tr key={k.id} className="border-t border-rule/60" data-key-name={k.name}>
                  <td className="py-1">{k.name}</td>
                  <td className="num py-1 text-xs">{k.prefix}…</td>
                  <td className="py-1">{k.role}</td>
                  <td className="py-1 text-xs">{k.userEmail}</td>
                  <td className="py-1 text-xs">
                    {k.lastUsedAt ? formatDate(k.lastUsedAt) : 'never'}
                  </td>
                  <td className="py-1 text-xs">
                    {k.revokedAt ? `revoked ${formatDate(k.revokedAt)}` : 'active'}
                  </td>
                  <td className="py-1 text-right">
                    {k.revokedAt ? null : confirming === k.id ? (
                      <span className="inline-flex items-center gap-2" role="group">
                        <span className="text-xs">Scripts using it stop working.</span>
                        <Button
                          variant="danger"
                          onClick={() => revokeKey(k)}
                          aria-label={`Confirm revoking ${k.name}`}
                        >
                          Revoke for good
                        </Button>
                        <Button variant="ghost" onClick={() => setConfirming(null)}>
                          Keep
                        </Button>
                      </span>
                    ) : (
                      <Button
                        variant="danger"
                        busy={revoke.isPending && revoke.variables === k.id}
                        onClick={() => setConfirming(k.id)}
                        aria-label={`Revoke ${k.name}`}
                      >
                        Revoke
                      </Button>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
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
