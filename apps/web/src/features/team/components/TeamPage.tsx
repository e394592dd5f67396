import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { errorMessage, fieldErrorOf } from '../../../lib/api';
import { formatDate } from '../../../lib/format';
import { roleAtLeast, useMe } from '../../../lib/me';
import {
  useApiKeys,
  useAuditEvents,
  useCreateApiKey,
  useCreateInvitation,
  useInvitations,
  useMembers,
  useOutbox,
  useRemoveMember,
  useRevokeApiKey,
  useRevokeInvitation,
  useUpdateMember,
  type Role,
} from '../api/team';

const ROLE_OPTIONS: { value: Role; label: string }[] = [
  { value: 'viewer', label: 'Viewer (read, compute)' },
  { value: 'engineer', label: 'Engineer (also edit, upload)' },
  { value: 'admin', label: 'Admin (also team, keys, audit)' },
];

type Tab = 'keys' | 'members' | 'invitations' | 'audit' | 'outbox';

/** Team administration: API keys for engineers; members, invitations, audit log and outbox for admins. */
export function TeamPage() {
  const me = useMe();
  const isAdmin = roleAtLeast(me.data?.role, 'admin');
  const tabs: { id: Tab; label: string }[] = [
    { id: 'keys', label: 'API keys' },
    ...(isAdmin
      ? ([
          { id: 'members', label: 'Members' },
          { id: 'invitations', label: 'Invitations' },
          { id: 'audit', label: 'Audit log' },
          { id: 'outbox', label: 'Mail outbox' },
        ] as { id: Tab; label: string }[])
      : []),
  ];
  const [tab, setTab] = useState<Tab>('keys');
  return (
    <div>
      <PageHeader
        title="Team"
        subtitle={me.data ? `${me.data.team.name} · you are ${me.data.role}` : undefined}
      />
      <div
        role="tablist"
        aria-label="Team sections"
        className="mb-4 flex flex-wrap gap-1 border-b border-rule"
      >
        {tabs.map((t) => (
          <button
            key={t.id}
            role="tab"
            type="button"
            id={`tab-${t.id}`}
            aria-selected={tab === t.id}
            aria-controls={`panel-${t.id}`}
            onClick={() => setTab(t.id)}
            className={`-mb-px rounded-t px-3 py-1.5 text-sm ${tab === t.id ? 'border border-b-panel border-rule bg-panel font-medium' : 'text-ink-soft hover:text-ink'}`}
          >
            {t.label}
          </button>
        ))}
      </div>
      <div role="tabpanel" id={`panel-${tab}`} aria-labelledby={`tab-${tab}`}>
        {tab === 'keys' ? <ApiKeys myRole={me.data?.role ?? 'viewer'} /> : null}
        {tab === 'members' && isAdmin ? <Members myId={me.data?.user.id} /> : null}
        {tab === 'invitations' && isAdmin ? <Invitations /> : null}
        {tab === 'audit' && isAdmin ? <AuditLog /> : null}
        {tab === 'outbox' && isAdmin ? <Outbox /> : null}
      </div>
    </div>
  );
}

function ApiKeys({ myRole }: { myRole: Role }) {
  const keys = useApiKeys(true);
  const create = useCreateApiKey();
  const revoke = useRevokeApiKey();
  const [name, setName] = useState('');
  const [role, setRole] = useState<Role>('viewer');
  const [copied, setCopied] = useState(false);
  const allowed = ROLE_OPTIONS.filter((r) => roleAtLeast(myRole, r.value));
  const submit = (event: FormEvent) => {
    event.preventDefault();
    setCopied(false);
    create.mutate({ name, role }, { onSuccess: () => setName('') });
  };
  return (
    <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
      <Panel title="New API key">
        <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
          <TextField
            label="Key name"
            value={name}
            onChange={(e) => setName(e.target.value)}
            error={fieldErrorOf(create.error, 'name')}
            hint="What the key is for, e.g. the build server"
          />
          <SelectField
            label="Role"
            value={role}
            onChange={(e) => setRole(e.target.value as Role)}
            options={allowed}
            error={fieldErrorOf(create.error, 'role')}
            hint="Up to your own role"
          />
          {create.isError &&
          !fieldErrorOf(create.error, 'name') &&
          !fieldErrorOf(create.error, 'role') ? (
            <p role="alert" className="text-sm text-bad">
              {errorMessage(create.error)}
            </p>
          ) : null}
          <Button type="submit" busy={create.isPending}>
            Create key
          </Button>
        </form>
        {create.data ? (
          <div
            className="mt-4 rounded-md border border-signal bg-signal-soft p-3 text-sm"
            role="status"
          >
            <p className="font-medium">Copy the key now: it is not shown again.</p>
            <code
              className="num mt-2 block break-all rounded bg-panel p-2 text-xs"
              data-testid="new-key"
            >
              {create.data.key}
            </code>
            <Button
              variant="secondary"
              className="mt-2"
              onClick={() => {
                navigator.clipboard?.writeText(create.data.key).then(
                  () => setCopied(true),
                  () => setCopied(false),
                );
              }}
            >
              {copied ? 'Copied' : 'Copy key'}
            </Button>
          </div>
        ) : null}
      </Panel>
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
                      {!k.revokedAt ? (
                        <Button
                          variant="danger"
                          busy={revoke.isPending && revoke.variables === k.id}
                          onClick={() => revoke.mutate(k.id)}
                          aria-label={`Revoke ${k.name}`}
                        >
                          Revoke
                        </Button>
                      ) : null}
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
    </div>
  );
}

function Members({ myId }: { myId: string | undefined }) {
  const members = useMembers(true);
  const update = useUpdateMember();
  const remove = useRemoveMember();
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
                      onChange={(e) =>
                        update.mutate({ id: m.user.id, role: e.target.value as Role })
                      }
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

function Invitations() {
  const invitations = useInvitations(true);
  const create = useCreateInvitation();
  const revoke = useRevokeInvitation();
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('engineer');
  return (
    <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
      <Panel title="Invite">
        <form
          className="flex flex-col gap-3"
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            create.mutate({ email, role }, { onSuccess: () => setEmail('') });
          }}
        >
          <TextField
            label="E-mail"
            type="email"
            value={email}
            onChange={(e) => setEmail(e.target.value)}
            error={fieldErrorOf(create.error, 'email')}
          />
          <SelectField
            label="Role"
            value={role}
            onChange={(e) => setRole(e.target.value as Role)}
            options={ROLE_OPTIONS}
            error={fieldErrorOf(create.error, 'role')}
          />
          {create.isError && !fieldErrorOf(create.error, 'email') ? (
            <p role="alert" className="text-sm text-bad">
              {errorMessage(create.error)}
            </p>
          ) : null}
          {create.isSuccess ? (
            <p role="status" className="text-sm text-good">
              Invitation sent to {create.data.email}.
            </p>
          ) : null}
          <Button type="submit" busy={create.isPending}>
            Send invitation
          </Button>
        </form>
      </Panel>
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
      </Panel>
    </div>
  );
}

function AuditLog() {
  const events = useAuditEvents(true);
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

function Outbox() {
  const outbox = useOutbox(true);
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
