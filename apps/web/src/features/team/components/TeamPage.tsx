import { useState } from 'react';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState, Loading } from '../../../components/ui/QueryState';
import { roleAtLeast, useCreateApiKey, useMe, type Me } from '../../../lib/api';
import { ApiKeyListPanel } from './ApiKeyListPanel';
import { AuditLogPanel } from './AuditLogPanel';
import { InvitationListPanel } from './InvitationListPanel';
import { InvitePanel } from './InvitePanel';
import { MembersPanel } from './MembersPanel';
import { NewApiKeyPanel } from './NewApiKeyPanel';
import { OutboxPanel } from './OutboxPanel';

type Tab = 'keys' | 'members' | 'invitations' | 'audit' | 'outbox';

const ENGINEER_TABS: { id: Tab; label: string }[] = [{ id: 'keys', label: 'API keys' }];
const ADMIN_TABS: { id: Tab; label: string }[] = [
  ...ENGINEER_TABS,
  { id: 'members', label: 'Members' },
  { id: 'invitations', label: 'Invitations' },
  { id: 'audit', label: 'Audit log' },
  { id: 'outbox', label: 'Mail outbox' },
];

/**
 * Team administration: API keys for engineers; members, invitations, audit log and outbox for
 * admins. A viewer (who reaches it only by its URL) is told what the page needs instead of being
 * shown forms the service would refuse.
 */
export function TeamPage() {
  const me = useMe();
  return (
    <div>
      <PageHeader
        title="Team"
        subtitle={me.data ? `${me.data.team.name} · you are ${me.data.role}` : undefined}
      />
      {me.isPending ? (
        <Loading />
      ) : me.isError ? (
        <ErrorState error={me.error} onRetry={() => me.refetch()} />
      ) : roleAtLeast(me.data.role, 'engineer') ? (
        <TeamTabs me={me.data} />
      ) : (
        <Panel>
          <p className="text-sm" data-testid="team-viewer">
            API keys and the team's settings need the engineer role; you are a viewer, who can read
            the team's studies and compute with them. An admin of {me.data.team.name} can change
            your role.
          </p>
        </Panel>
      )}
    </div>
  );
}

function TeamTabs({ me }: { me: Me }) {
  const isAdmin = roleAtLeast(me.role, 'admin');
  const tabs = isAdmin ? ADMIN_TABS : ENGINEER_TABS;
  const [tab, setTab] = useState<Tab>('keys');
  return (
    <>
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
        {tab === 'keys' ? <ApiKeysTab me={me} /> : null}
        {tab === 'members' && isAdmin ? <MembersPanel myId={me.user.id} /> : null}
        {tab === 'invitations' && isAdmin ? (
          <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
            <InvitePanel />
            <InvitationListPanel />
          </div>
        ) : null}
        {tab === 'audit' && isAdmin ? <AuditLogPanel /> : null}
        {tab === 'outbox' && isAdmin ? <OutboxPanel /> : null}
      </div>
    </>
  );
}

function ApiKeysTab({ me }: { me: Me }) {
  const create = useCreateApiKey();
  return (
    <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
      <NewApiKeyPanel myRole={me.role} create={create} />
      {/* Revoking the key just made takes its secret off the screen as well. */}
      <ApiKeyListPanel
        onRevoked={(id) => {
          if (create.data?.id === id) create.reset();
        }}
      />
    </div>
  );
}
