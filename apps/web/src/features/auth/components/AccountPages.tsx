import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { paths } from '../../../config/paths';
import {
  errorMessage,
  fieldErrorOf,
  useAcceptInvitation,
  useConfirmPasswordReset,
  useRequestPasswordReset,
} from '../../../lib/api';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { AuthLayout } from './SignInPage';

function GeneralError({ error, fields }: { error: unknown; fields: string[] }) {
  if (!error || fields.some((f) => fieldErrorOf(error, f))) return null;
  return (
    <p role="alert" className="text-sm text-bad">
      {errorMessage(error)}
    </p>
  );
}

export function AcceptInvitationPage() {
  const [params] = useSearchParams();
  const [token, setToken] = useState(params.get('token') ?? '');
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  const submit = (event: FormEvent) => {
    event.preventDefault();
    accept.mutate(
      { token, name, password },
      { onSuccess: () => navigate(paths.studies.getHref(), { replace: true }) },
    );
  };
  return (
    <AuthLayout title="Join your team">
      <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
        <TextField
          label="Invitation code"
          value={token}
          onChange={(e) => setToken(e.target.value)}
          error={fieldErrorOf(accept.error, 'token')}
          hint="From the invitation e-mail"
        />
        <TextField
          label="Your name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={fieldErrorOf(accept.error, 'name')}
        />
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          value={password}
          onChange={(e) => setPassword(e.target.value)}
          error={fieldErrorOf(accept.error, 'password')}
          hint="At least 10 characters"
        />
        <GeneralError error={accept.error} fields={['token', 'name', 'password']} />
        <Button type="submit" busy={accept.isPending}>
          Join
        </Button>
        <Link className="text-xs underline" to={paths.signIn.getHref()}>
          Back to sign-in
        </Link>
      </form>
    </AuthLayout>
  );
}

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const request = useRequestPasswordReset();
  const confirm = useConfirmPasswordReset();
  if (token) {
    return (
      <AuthLayout title="Choose a new password">
        {confirm.isSuccess ? (
          <p className="text-sm">
            Password changed.{' '}
            <Link className="underline" to={paths.signIn.getHref()}>
              Sign in
            </Link>
          </p>
        ) : (
          <form
            className="flex flex-col gap-3"
            noValidate
            onSubmit={(e) => {
              e.preventDefault();
              confirm.mutate({ token, password });
            }}
          >
            <TextField
              label="New password"
              type="password"
              autoComplete="new-password"
              value={password}
              onChange={(e) => setPassword(e.target.value)}
              error={fieldErrorOf(confirm.error, 'password')}
              hint="At least 10 characters"
            />
            <GeneralError error={confirm.error} fields={['password']} />
            <Button type="submit" busy={confirm.isPending}>
              Set password
            </Button>
          </form>
        )}
      </AuthLayout>
    );
  }
  return (
    <AuthLayout title="Reset the password">
      {request.isSuccess ? (
        <p className="text-sm">If the address belongs to a member, a reset link is on its way.</p>
      ) : (
        <form
          className="flex flex-col gap-3"
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            request.mutate({ email });
          }}
        >
          <TextField
            label="E-mail"
            type="email"
            value={email}
            onChange={(e) => setEmail(e.target.value)}
            error={fieldErrorOf(request.error, 'email')}
          />
          <GeneralError error={request.error} fields={['email']} />
          <Button type="submit" busy={request.isPending}>
            Send the link
          </Button>
        </form>
      )}
      <Link className="mt-3 block text-xs underline" to={paths.signIn.getHref()}>
        Back to sign-in
      </Link>
    </AuthLayout>
  );
}
