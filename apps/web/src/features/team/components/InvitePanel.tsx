import { useState } from 'react';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { errorMessage, fieldErrorOf, useCreateInvitation, type Role } from '../../../lib/api';
import { ROLE_OPTIONS } from './roleOptions';

/** Invites someone by e-mail with a role (admins); the service mails the link. */
export function InvitePanel() {
  const create = useCreateInvitation();
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('engineer');
  const emailError = fieldErrorOf(create.error, 'email');
  const roleError = fieldErrorOf(create.error, 'role');
  return (
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
          error={emailError}
        />
        <SelectField
          label="Role"
          value={role}
          onValueChange={setRole}
          options={ROLE_OPTIONS}
          error={roleError}
        />
        {create.isError && !emailError && !roleError ? (
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
  );
}
