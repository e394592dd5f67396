import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { errorMessage, fieldErrorOf, useLogin } from '../../../lib/api';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { CautionBanner } from '../../../components/ui/Caution';

export function AuthLayout({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div className="flex min-h-full flex-col">
      <CautionBanner />
      <main className="flex flex-1 items-center justify-center p-6">
        <div className="w-full max-w-sm rounded-xl border border-rule bg-panel p-6 shadow-md">
          <div className="mb-5 flex items-center gap-2">
            <img src="/favicon.svg" alt="" className="h-8 w-8" />
            <div>
              <p className="text-lg font-semibold">Pulsewright</p>
              <p className="text-xs text-ink-soft">Modulation design workbench</p>
            </div>
          </div>
          <h1 className="mb-4 text-xl font-semibold">{title}</h1>
          {children}
        </div>
      </main>
    </div>
  );
}

export function SignInPage() {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const login = useLogin();
  const navigate = useNavigate();
  const [params] = useSearchParams();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    login.mutate(
      { email, password },
      {
        onSuccess: () =>
          navigate(params.get('redirectTo') || paths.studies.getHref(), { replace: true }),
      },
    );
  };

  const general =
    login.isError && !fieldErrorOf(login.error, 'email') && !fieldErrorOf(login.error, 'password');
  return (
    <AuthLayout title="Sign in">
      <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
        <TextField
          label="E-mail"
          type="email"
          autoComplete="username"
          required
          value={email}
          onChange={(e) => setEmail(e.target.value)}
          error={fieldErrorOf(login.error, 'email')}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          required
          value={password}
          onChange={(e) => setPassword(e.target.value)}
          error={fieldErrorOf(login.error, 'password')}
        />
        {general ? (
          <p role="alert" className="text-sm text-bad">
            {errorMessage(login.error)}
          </p>
        ) : null}
        <Button type="submit" busy={login.isPending}>
          Sign in
        </Button>
        <div className="flex justify-between text-xs">
          <Link className="underline" to={paths.resetPassword.getHref()}>
            Forgot the password?
          </Link>
          <Link className="underline" to={paths.acceptInvitation.getHref()}>
            Have an invitation?
          </Link>
        </div>
      </form>
    </AuthLayout>
  );
}
