/** Every URL of the dashboard, in one place (bulletproof-react's paths.ts). */
export const paths = {
  signIn: {
    path: '/sign-in',
    getHref: (redirectTo?: string) =>
      `/sign-in${redirectTo ? `?redirectTo=${encodeURIComponent(redirectTo)}` : ''}`,
  },
  // The service e-mails links to these two paths (apps/api/src/services/team.ts).
  acceptInvitation: { path: '/accept-invitation', getHref: () => '/accept-invitation' },
  resetPassword: { path: '/reset-password', getHref: () => '/reset-password' },
  studies: { path: '/studies', getHref: () => '/studies' },
  newStudy: {
    path: '/studies/new',
    getHref: (projectId?: string) => `/studies/new${projectId ? `?projectId=${projectId}` : ''}`,
  },
  study: { path: '/studies/:studyId', getHref: (id: string) => `/studies/${id}` },
  studyReport: {
    path: '/studies/:studyId/report',
    getHref: (id: string) => `/studies/${id}/report`,
  },
  compare: {
    path: '/compare',
    getHref: (ids: string[] = []) => `/compare${ids.length ? `?ids=${ids.join(',')}` : ''}`,
  },
  sweeps: { path: '/sweeps', getHref: () => '/sweeps' },
  elimination: { path: '/elimination', getHref: () => '/elimination' },
  spaceVector: { path: '/space-vector', getHref: () => '/space-vector' },
  firmware: { path: '/controller-tables', getHref: () => '/controller-tables' },
  captures: { path: '/captures', getHref: () => '/captures' },
  team: { path: '/team', getHref: () => '/team' },
  cautions: { path: '/cautions', getHref: () => '/cautions' },
} as const;

/** Server paths the dashboard calls outside the typed client (multipart upload with progress). */
export const apiPaths = {
  captures: '/api/v1/captures',
} as const;
