import { lazy } from 'react';
import { createBrowserRouter, Navigate, RouterProvider } from 'react-router-dom';
import { paths } from '../config/paths';
import { AcceptInvitationPage, ResetPasswordPage } from '../features/auth/components/AccountPages';
import { SignInPage } from '../features/auth/components/SignInPage';
import { AppShell } from './AppShell';
import { CautionsPage } from './CautionsPage';

// Feature screens load on demand so the sign-in page stays light (d3 and the library come later).
const named = <K extends string>(loader: () => Promise<Record<K, React.ComponentType>>, name: K) =>
  lazy(async () => ({ default: (await loader())[name] }));

const StudiesPage = named(
  () => import('../features/studies/components/StudiesPage'),
  'StudiesPage',
);
const StudyEditorPage = named(
  () => import('../features/studies/components/StudyEditorPage'),
  'StudyEditorPage',
);
const StudyReportPage = named(
  () => import('../features/studies/components/StudyReportPage'),
  'StudyReportPage',
);
const ComparePage = named(
  () => import('../features/studies/components/ComparePage'),
  'ComparePage',
);
const SweepsPage = named(() => import('../features/sweeps/components/SweepsPage'), 'SweepsPage');
const EliminationPage = named(
  () => import('../features/elimination/components/EliminationPage'),
  'EliminationPage',
);
const SpaceVectorPage = named(
  () => import('../features/space-vector/components/SpaceVectorPage'),
  'SpaceVectorPage',
);
const FirmwarePage = named(
  () => import('../features/firmware/components/FirmwarePage'),
  'FirmwarePage',
);
const CapturesPage = named(
  () => import('../features/captures/components/CapturesPage'),
  'CapturesPage',
);
const TeamPage = named(() => import('../features/team/components/TeamPage'), 'TeamPage');

const router = createBrowserRouter([
  { path: paths.signIn.path, element: <SignInPage /> },
  { path: paths.acceptInvitation.path, element: <AcceptInvitationPage /> },
  { path: paths.resetPassword.path, element: <ResetPasswordPage /> },
  {
    path: paths.cautions.path,
    element: (
      <div className="mx-auto max-w-3xl p-6">
        <CautionsPage />
      </div>
    ),
  },
  {
    path: '/',
    element: <AppShell />,
    children: [
      { index: true, element: <Navigate to={paths.studies.getHref()} replace /> },
      { path: paths.studies.path, element: <StudiesPage /> },
      { path: paths.newStudy.path, element: <StudyEditorPage /> },
      { path: paths.study.path, element: <StudyEditorPage /> },
      { path: paths.studyReport.path, element: <StudyReportPage /> },
      { path: paths.compare.path, element: <ComparePage /> },
      { path: paths.sweeps.path, element: <SweepsPage /> },
      { path: paths.elimination.path, element: <EliminationPage /> },
      { path: paths.spaceVector.path, element: <SpaceVectorPage /> },
      { path: paths.firmware.path, element: <FirmwarePage /> },
      { path: paths.captures.path, element: <CapturesPage /> },
      { path: paths.team.path, element: <TeamPage /> },
      {
        path: '*',
        element: (
          <p className="text-sm">
            No page here.{' '}
            <a className="underline" href={paths.studies.getHref()}>
              Go to the studies
            </a>
            .
          </p>
        ),
      },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
