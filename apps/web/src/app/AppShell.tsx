import { Suspense } from 'react';
import { Navigate, NavLink, Outlet, useLocation } from 'react-router-dom';
import { paths } from '../config/paths';
import { Button } from '../components/ui/Button';
import { CautionBanner } from '../components/ui/Caution';
import { ErrorState, Loading } from '../components/ui/QueryState';
import { roleAtLeast, useLogout, useMe } from '../lib/api';
import { useSessionToken } from './useSession';

const NAV = [
  { to: paths.studies.getHref(), label: 'Studies' },
  { to: paths.compare.getHref(), label: 'Compare' },
  { to: paths.sweeps.getHref(), label: 'Index sweeps' },
  { to: paths.elimination.getHref(), label: 'Harmonic elimination' },
  { to: paths.spaceVector.getHref(), label: 'Space vector' },
  { to: paths.firmware.getHref(), label: 'Controller tables' },
  { to: paths.captures.getHref(), label: 'Bench captures' },
  { to: paths.team.getHref(), label: 'Team', minRole: 'engineer' as const },
];

/** Signed-in layout: top bar with navigation, role, sign-out, and the hazard caution. */
export function AppShell() {
  const token = useSessionToken();
  const location = useLocation();
  const me = useMe(Boolean(token));
  const logout = useLogout();
  if (!token)
    return <Navigate to={paths.signIn.getHref(location.pathname + location.search)} replace />;

  return (
    <div className="flex min-h-full flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-panel focus:p-2"
      >
        Skip to content
      </a>
      <header className="no-print bg-ink text-paper">
        <div className="mx-auto flex max-w-[1500px] flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
          <NavLink
            to={paths.studies.getHref()}
            className="flex items-center gap-2 font-semibold tracking-wide"
          >
            <img src="/favicon.svg" alt="" className="h-7 w-7" />
            Pulsewright
          </NavLink>
          <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1 text-sm">
            {NAV.filter((item) => !item.minRole || roleAtLeast(me.data?.role, item.minRole)).map(
              (item) => (
                <NavLink
                  key={item.to}
                  to={item.to}
                  className={({ isActive }) =>
                    `rounded px-2 py-1 ${isActive ? 'bg-signal text-ink' : 'text-paper/85 hover:bg-ink-soft'}`
                  }
                >
                  {item.label}
                </NavLink>
              ),
            )}
          </nav>
          <div className="flex items-center gap-3 text-sm">
            {me.data ? (
              <span data-testid="who" className="text-paper/85">
                {me.data.user.name} · {me.data.team.name}{' '}
                <span
                  className="ml-1 rounded bg-paper/15 px-1.5 py-0.5 text-xs uppercase tracking-wide"
                  data-testid="role"
                >
                  {me.data.role}
                </span>
              </span>
            ) : null}
            <Button variant="secondary" onClick={() => logout.mutate()} busy={logout.isPending}>
              Sign out
            </Button>
          </div>
        </div>
      </header>
      <div className="no-print">
        <CautionBanner compact />
      </div>
      <main id="main" className="mx-auto w-full max-w-[1500px] flex-1 px-4 py-5">
        {me.isError ? <ErrorState error={me.error} onRetry={() => me.refetch()} /> : null}
        <Suspense fallback={<Loading />}>
          <Outlet />
        </Suspense>
      </main>
      <footer className="no-print border-t border-rule px-4 py-3 text-center text-xs text-ink-soft">
        Pulsewright · predictions are idealised; confirm on the bench.{' '}
        <NavLink className="underline" to={paths.cautions.getHref()}>
          Cautions
        </NavLink>{' '}
        ·{' '}
        <a className="underline" href="/api/docs">
          API documentation
        </a>
      </footer>
    </div>
  );
}
