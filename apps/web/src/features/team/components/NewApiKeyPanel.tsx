import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import {
  errorMessage,
  fieldErrorOf,
  roleAtLeast,
  type Role,
  type useCreateApiKey,
} from '../../../lib/api';
import { ROLE_OPTIONS } from './roleOptions';

/** Makes an API key with a role up to the caller's own, and shows its secret once. */
export function NewApiKeyPanel({
  myRole,
  create,
}: {
  myRole: Role;
  /** The key mutation, shared with the list so revoking the new key hides its secret. */
  create: ReturnType<typeof useCreateApiKey>;
}) {
  const [name, setName] = useState('');
  const [role, setRole] = useState<Role>('viewer');
  const [copied, setCopied] = useState(false);
  const allowed = ROLE_OPTIONS.filter((r) => roleAtLeast(myRole, r.value));
  const submit = (event: FormEvent) => {
    event.preventDefault();
    setCopied(false);
    create.mutate({ name, role }, { onSuccess: () => setName('') });
  };
  const nameError = fieldErrorOf(create.error, 'name');
  const roleError = fieldErrorOf(create.error, 'role');
  return (
    <Panel title="New API key">
      <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
        <TextField
          label="Key name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={nameError}
          hint="What the key is for, e.g. the build server"
        />
        <SelectField
          label="Role"
          value={role}
          onValueChange={setRole}
          options={allowed}
          error={roleError}
          hint="Up to your own role"
        />
        {create.isError && !nameError && !roleError ? (
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
  );
}
