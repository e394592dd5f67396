import type { BodyOf, QueryOf } from './client';

/**
 * Every query key of the dashboard, built in one place. Keys are arrays from the general to the
 * particular (`['studies', 'one', id]`), so invalidating a prefix (`queryKeys.studies.all`)
 * refreshes everything under it; two screens that read the same endpoint with the same
 * parameters share one cache entry because they build the key here.
 */
export const queryKeys = {
  /** Who is signed in; the token is part of the key so a new sign-in never sees the old answer. */
  me: (token: string | null) => ['me', token] as const,
  projects: {
    all: ['projects'] as const,
    list: (q: string) => ['projects', 'list', q] as const,
  },
  studies: {
    all: ['studies'] as const,
    lists: ['studies', 'list'] as const,
    list: (projectId: string, q: string) => ['studies', 'list', projectId, q] as const,
    one: (id: string) => ['studies', 'one', id] as const,
    revisions: (id: string) => ['studies', 'revisions', id] as const,
    /** Every report of one study (any options): a save of the study refetches them. */
    reports: (id: string) => ['studies', 'report', id] as const,
    report: (id: string, options: QueryOf<'getStudyReport'>) =>
      ['studies', 'report', id, options] as const,
  },
  designs: {
    /** The report of a design that is not saved, by the whole request body. */
    report: (body: BodyOf<'analyseDesign'>) => ['designs', 'report', body] as const,
  },
  jobs: {
    all: ['jobs'] as const,
    list: ['jobs', 'list'] as const,
    one: (id: string) => ['jobs', 'one', id] as const,
  },
  captures: {
    all: ['captures'] as const,
    list: ['captures', 'list'] as const,
    one: (id: string) => ['captures', 'one', id] as const,
    spectrum: (id: string, window: string, maxOrder: number) =>
      ['captures', 'spectrum', id, window, maxOrder] as const,
    comparison: (id: string, studyId: string, window: string, maxOrder: number | undefined) =>
      ['captures', 'comparison', id, studyId, window, maxOrder] as const,
  },
  team: {
    all: ['team'] as const,
    members: ['team', 'members'] as const,
    invitations: ['team', 'invitations'] as const,
    apiKeys: ['team', 'api-keys'] as const,
    audit: ['team', 'audit'] as const,
    outbox: ['team', 'outbox'] as const,
  },
} as const;
