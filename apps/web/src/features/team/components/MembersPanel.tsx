import { Button } from '../../../components/ui/Button';
import { optionValue } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import {
  errorMessage,
  useMembers,
  useRemoveMember,
  useUpdateMember,
  type Member,
} from '../../../lib/api';
import { formatDate } from '../../../lib/format';
import { ROLE_OPTIONS } from './roleOptions';

/** The team's members (admins): change a role, remove someone other than yourself after a confirmation. */
export function MembersPanel({ myId }: { myId: string | undefined }) {
  const members = useMembers();
  const update = useUpdateMember();
  const remove = useRemoveMember();
  const changeRole = (member: Member, value: string) => {
    const role = optionValue(ROLE_OPTIONS, value);
    if (role) update.mutate({ id: member.user.id, role });
  };
  return (
    <Panel title="Members">
      <QueryView query={members} empty="No members.">
        {(list) => (
          <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2">
            <thead className="text-left text-xs text-ink-soft uppercase">
              <tr>
                <th scope="col">Name</th>
                <th scope="col">E-mail</th>
                <th scope="col">Role</th>
                <th scope="col">Joined</th>
                <th scope="col">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {list.map((m) => (
                <tr key={m.user.id} className="border-t border-rule/60">
                  <td className="py-1">{m.user.name}</td>
                  <td className="py-1 text-xs">{m.user.email}</td>
                  <td className="py-1">
                    <label className="sr-only" htmlFor={`role-${m.user.id}`}>
                      Role of {m.user.name}
                    </label>
                    <select
                      id={`role-${m.user.id}`}
                      value={m.role}
                      className="rounded border border-rule bg-panel px-1 py-0.5"
                      onChange={(e) => changeRole(m, e.target.value)}
                    >
                      {ROLE_OPTIONS.map((r) => (
                        <option key={r.value} value={r.value}>
                          {r.value}
                        </option>
                      ))}
                    </select>
                  </td>
                  <td className="py-1 text-xs">{formatDate(m.joinedAt)}</td>
                  <td className="py-1 text-right">
                    {m.user.id !== myId ? (
                      <Button
                        variant="ghost"
                        onClick={() => {
                          if (window.confirm(`Remove ${m.user.name} from the team?`))
                            remove.mutate(m.user.id);
                        }}
                      >
                        Remove
                      </Button>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </QueryView>
      {update.isError ? (
        <p role="alert" className="mt-2 text-sm text-bad">
          {errorMessage(update.error)}
        </p>
      ) : null}
      {remove.isError ? (
        <p role="alert" className="mt-2 text-sm text-bad">
          {errorMessage(remove.error)}
        </p>
      ) : null}
    </Panel>
  );
}
