// The dashboard's server state: one module per resource of the API, each with its fetchers,
// one query-options factory per endpoint (keys from queryKeys.ts) and the hooks screens use.
export * from './ApiError';
export * from './auth';
export * from './captures';
export * from './client';
export * from './designs';
export * from './jobs';
export * from './me';
export * from './patterns';
export * from './projects';
export * from './queryKeys';
export * from './studies';
export * from './studyRecords';
export * from './team';
