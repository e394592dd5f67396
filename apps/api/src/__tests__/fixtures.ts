import request from 'supertest';
import type { PulsewrightApp } from '../app.js';
import type { RoleRequirement } from '../openapi.js';

/** A modulation every compute route accepts. */
export const SINE_TRIANGLE = {
  method: 'sine-triangle',
  scheme: 'bipolar',
  ma: 0.8,
  mf: 21,
  vdc: 400,
} as const;
export const THREE_PHASE = {
  method: 'three-phase',
  ma: 0.9,
  mf: 15,
  vdc: 650,
  zeroSequence: 'third-harmonic',
} as const;

/** The designs of those modulations at 50 Hz (carrier = mf × 50 Hz), as studies store them. */
export const SINE_TRIANGLE_DESIGN = {
  vdc: 400,
  fundamentalFrequency: 50,
  carrierFrequency: 1050,
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
} as const;
export const THREE_PHASE_DESIGN = {
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 750,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'third-harmonic' },
} as const;
/** A design with its modulation index changed. */
export const withMa = <D extends { modulation: object }>(design: D, ma: number): D => ({
  ...design,
  modulation: { ...design.modulation, ma },
});

/** A small valid capture: two 50 Hz periods at 5 kS/s of an invented sine plus a square part. */
export function captureCsv(rows = 200, sampleRate = 5000): string {
  const lines = ['time,voltage,current'];
  for (let k = 0; k < rows; k++) {
    const t = k / sampleRate;
    const v = 300 * Math.sin(2 * Math.PI * 50 * t) + (k % 10 < 5 ? 20 : -20);
    lines.push(`${t.toFixed(6)},${v.toFixed(3)},${(v / 30).toFixed(4)}`);
  }
  return `${lines.join('\n')}\n`;
}

export interface RequestSpec {
  path: string;
  body?: unknown;
  query?: Record<string, string | number>;
  upload?: { field: string; content: string | Buffer; fileName: string };
}

export interface Ids {
  projectId: string;
  studyId: string;
  captureId: string;
  jobId: string;
}

/** Ids of things made by the engineer before the table runs. */
export async function makeIds(app: PulsewrightApp, engineerToken: string): Promise<Ids> {
  const auth = { Authorization: `Bearer ${engineerToken}` };
  const project = await request(app)
    .post('/api/v1/projects')
    .set(auth)
    .send({ name: 'Role table project' });
  const study = await request(app)
    .post('/api/v1/studies')
    .set(auth)
    .send({ projectId: project.body.id, name: 'Role table study', design: SINE_TRIANGLE_DESIGN });
  const capture = await request(app)
    .post('/api/v1/captures')
    .set(auth)
    .attach('file', Buffer.from(captureCsv()), 'roles.csv');
  const job = await request(app)
    .post('/api/v1/jobs/ma-sweeps')
    .set(auth)
    .send({ modulation: SINE_TRIANGLE, ma: { from: 0.2, to: 1, points: 5 }, maxOrder: 50 });
  for (const r of [project, study, capture, job]) {
    if (r.status >= 300) throw new Error(`setup failed: ${r.status} ${JSON.stringify(r.body)}`);
  }
  return {
    projectId: project.body.id,
    studyId: study.body.id,
    captureId: capture.body.id,
    jobId: job.body.id,
  };
}

/** What each operation needs to succeed; `make` may create fresh things (keys, members). */
export type Fixture = (context: {
  app: PulsewrightApp;
  ids: Ids;
  tokens: Record<'viewer' | 'engineer' | 'admin', string>;
  fresh: () => Promise<{
    userId: string;
    keyId: string;
    invitationId: string;
    invitationToken: string;
    resetToken: string;
  }>;
}) => Promise<RequestSpec> | RequestSpec;

export const FIXTURES: Record<string, Fixture> = {
  getHealth: () => ({ path: '/api/health' }),
  login: () => ({
    path: '/api/v1/auth/login',
    body: { email: 'viewer@kestrel.example', password: 'test-demo-password' },
  }),
  logout: () => ({ path: '/api/v1/auth/logout' }),
  requestPasswordReset: () => ({
    path: '/api/v1/auth/password-reset',
    body: { email: 'nobody@kestrel.example' },
  }),
  confirmPasswordReset: async ({ fresh }) => ({
    path: '/api/v1/auth/password-reset/confirm',
    body: { token: (await fresh()).resetToken, password: 'a-new-long-password' },
  }),
  getMe: () => ({ path: '/api/v1/me' }),
  listApiKeys: () => ({ path: '/api/v1/api-keys' }),
  createApiKey: () => ({ path: '/api/v1/api-keys', body: { name: 'table key', role: 'viewer' } }),
  revokeApiKey: async ({ fresh }) => ({ path: `/api/v1/api-keys/${(await fresh()).keyId}` }),
  listMembers: () => ({ path: '/api/v1/members' }),
  updateMember: async ({ fresh }) => ({
    path: `/api/v1/members/${(await fresh()).userId}`,
    body: { role: 'engineer' },
  }),
  removeMember: async ({ fresh }) => ({ path: `/api/v1/members/${(await fresh()).userId}` }),
  listInvitations: () => ({ path: '/api/v1/invitations' }),
  createInvitation: () => ({
    path: '/api/v1/invitations',
    body: { email: `new${Math.random().toString(36).slice(2)}@kestrel.example`, role: 'viewer' },
  }),
  acceptInvitation: async ({ fresh }) => ({
    path: '/api/v1/invitations/accept',
    body: {
      token: (await fresh()).invitationToken,
      name: 'New Member',
      password: 'a-long-password-1',
    },
  }),
  revokeInvitation: async ({ fresh }) => ({
    path: `/api/v1/invitations/${(await fresh()).invitationId}`,
  }),
  listAuditEvents: () => ({ path: '/api/v1/audit-events', query: { limit: 5 } }),
  listOutbox: () => ({ path: '/api/v1/outbox' }),
  computeSpectrum: () => ({
    path: '/api/v1/spectra',
    body: { modulation: SINE_TRIANGLE, maxOrder: 50 },
  }),
  computeWaveform: () => ({ path: '/api/v1/waveforms', body: { modulation: THREE_PHASE } }),
  analyseDesign: () => ({
    path: '/api/v1/designs/report',
    body: { design: { ...SINE_TRIANGLE_DESIGN, load: { r: 10, l: 0.02 } }, points: 64 },
  }),
  analyseAsynchronousSpectra: () => ({
    path: '/api/v1/designs/asynchronous-spectra',
    body: { design: { ...SINE_TRIANGLE_DESIGN, carrierFrequency: 1075 }, maxOrder: 30 },
  }),
  computeLoadCurrent: () => ({
    path: '/api/v1/load-current',
    body: { design: { ...SINE_TRIANGLE_DESIGN, load: { r: 10, l: 0.02 } }, points: 64 },
  }),
  computeLcFilter: () => ({
    path: '/api/v1/filters/lc',
    body: {
      design: { ...SINE_TRIANGLE_DESIGN, filter: { l: 0.001, c: 0.00001, rDamping: 2 } },
      points: 64,
    },
  }),
  designLclFilter: () => ({
    path: '/api/v1/filters/lcl-design',
    body: {
      power: 10_000,
      lineVoltage: 400,
      gridFrequency: 50,
      switchingFrequency: 10_000,
      vdc: 700,
    },
  }),
  computeSpaceVector: () => ({ path: '/api/v1/space-vector', body: { m: 0.7, theta: 1.2 } }),
  computeLossSweep: () => ({
    path: '/api/v1/losses/power-factor-sweeps',
    body: {
      device: {
        kind: 'mosfet',
        rdsOn: 0.02,
        eon: 4e-4,
        eoff: 3e-4,
        err: 5e-5,
        referenceVoltage: 800,
        referenceCurrent: 50,
      },
      vdc: 650,
      ma: 0.9,
      peakCurrent: 20,
      switchingFrequency: 5000,
      points: 5,
      zeroSequences: ['none', 'dpwm1'],
    },
  }),
  computeTimerTable: () => ({
    path: '/api/v1/timer-tables',
    query: { format: 'csv' },
    body: {
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
      fundamentalFrequency: 50,
      carrierFrequency: 5000,
      timerClock: 16000000,
    },
  }),
  computeMultilevelTimerTable: () => ({
    path: '/api/v1/multilevel-timer-tables',
    query: { format: 'c-header' },
    body: {
      modulation: { topology: 'npc', levels: 3, carriers: 'pd', phaseCount: 3, ma: 0.9, vdc: 800 },
      fundamentalFrequency: 50,
      carrierFrequency: 5000,
      timerClock: 16000000,
    },
  }),
  computeNetlist: () => ({
    path: '/api/v1/netlists',
    body: {
      timerTable: {
        modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
        fundamentalFrequency: 50,
        carrierFrequency: 5000,
        timerClock: 16000000,
      },
      riseTime: 5e-8,
      periods: 2,
    },
  }),
  checkHarmonicLimits: () => ({
    path: '/api/v1/harmonic-limits/check',
    body: { design: SINE_TRIANGLE_DESIGN, busVoltage: 230 },
  }),
  listJobs: () => ({ path: '/api/v1/jobs' }),
  createMaSweep: () => ({
    path: '/api/v1/jobs/ma-sweeps',
    body: { modulation: SINE_TRIANGLE, ma: { from: 0.2, to: 1, points: 3 }, maxOrder: 30 },
  }),
  createSheSweep: () => ({
    path: '/api/v1/jobs/she-sweeps',
    body: {
      kind: 'bipolar',
      vdc: 100,
      count: 3,
      eliminate: [3, 5],
      fundamental: { from: 30, to: 60, points: 3 },
    },
  }),
  createOptimalSweep: () => ({
    path: '/api/v1/jobs/optimal-sweeps',
    body: {
      kind: 'bipolar',
      vdc: 100,
      count: 2,
      maxOrder: 19,
      fundamental: { from: 40, to: 60, points: 3 },
    },
  }),
  computeAngleTable: () => ({
    path: '/api/v1/angle-tables',
    query: { format: 'csv' },
    body: {
      pattern: {
        method: 'selective-harmonic-elimination',
        kind: 'bipolar',
        vdc: 100,
        eliminate: [5],
      },
      ma: { from: 0.3, to: 0.6 },
      rows: 3,
      timerClock: 16000000,
      fundamentalFrequency: 50,
    },
  }),
  computePatternCompareEvents: () => ({
    path: '/api/v1/pattern-compare-events',
    body: {
      pattern: { kind: 'bipolar', vdc: 100, angles: [0.3, 0.6] },
      fundamentalFrequency: 50,
      timerClock: 16000000,
      deadTime: 1e-6,
    },
  }),
  solveCascadedPattern: () => ({
    path: '/api/v1/cascaded-patterns/solve',
    body: { cells: 2, vdc: 100, count: 1, eliminate: [3], fundamental: 200 },
  }),
  computeCascadedPattern: () => ({
    path: '/api/v1/cascaded-patterns/waveform',
    body: { cells: [{ kind: 'unipolar', vdc: 100, angles: [0.4] }], maxOrder: 20 },
  }),
  getJob: ({ ids }) => ({ path: `/api/v1/jobs/${ids.jobId}` }),
  listProjects: () => ({ path: '/api/v1/projects', query: { q: 'pump' } }),
  createProject: () => ({ path: '/api/v1/projects', body: { name: 'Table project' } }),
  getProject: ({ ids }) => ({ path: `/api/v1/projects/${ids.projectId}` }),
  updateProject: ({ ids }) => ({
    path: `/api/v1/projects/${ids.projectId}`,
    body: { description: 'changed by the role table' },
  }),
  listStudies: ({ ids }) => ({ path: '/api/v1/studies', query: { projectId: ids.projectId } }),
  createStudy: ({ ids }) => ({
    path: '/api/v1/studies',
    body: { projectId: ids.projectId, name: 'Table study', design: THREE_PHASE_DESIGN },
  }),
  getStudy: ({ ids }) => ({ path: `/api/v1/studies/${ids.studyId}` }),
  updateStudy: async ({ app, ids, tokens }) => {
    const current = await request(app)
      .get(`/api/v1/studies/${ids.studyId}`)
      .set('Authorization', `Bearer ${tokens.viewer}`);
    return {
      path: `/api/v1/studies/${ids.studyId}`,
      body: {
        baseRevision: current.body.revision,
        name: 'Role table study',
        design: withMa(SINE_TRIANGLE_DESIGN, 0.7),
      },
    };
  },
  duplicateStudy: ({ ids }) => ({ path: `/api/v1/studies/${ids.studyId}/duplicate`, body: {} }),
  shareStudyReport: ({ ids }) => ({
    path: `/api/v1/studies/${ids.studyId}/share`,
    body: { email: 'reviewer@kestrel.example' },
  }),
  listStudyRevisions: ({ ids }) => ({ path: `/api/v1/studies/${ids.studyId}/revisions` }),
  restoreStudyRevision: async ({ app, ids, tokens }) => {
    const current = await request(app)
      .get(`/api/v1/studies/${ids.studyId}`)
      .set('Authorization', `Bearer ${tokens.viewer}`);
    return {
      path: `/api/v1/studies/${ids.studyId}/revisions/1/restore`,
      body: { baseRevision: current.body.revision },
    };
  },
  getStudySpectrum: ({ ids }) => ({
    path: `/api/v1/studies/${ids.studyId}/spectrum`,
    query: { maxOrder: 30 },
  }),
  getStudyRecord: ({ ids }) => ({ path: `/api/v1/studies/${ids.studyId}/record` }),
  importStudyRecord: ({ ids }) => ({
    path: `/api/v1/projects/${ids.projectId}/study-records`,
    body: {
      format: 'pulsewright-study-record',
      formatVersion: 1,
      name: 'Imported record',
      note: '',
      design: SINE_TRIANGLE_DESIGN,
    },
  }),
  getStudyReport: ({ ids }) => ({
    path: `/api/v1/studies/${ids.studyId}/report`,
    query: { maxOrder: 60, points: 64 },
  }),
  listCaptures: () => ({ path: '/api/v1/captures' }),
  uploadCapture: () => ({
    path: '/api/v1/captures',
    upload: { field: 'file', content: captureCsv(), fileName: 'table.csv' },
  }),
  getCapture: ({ ids }) => ({ path: `/api/v1/captures/${ids.captureId}` }),
  analyseCapture: ({ ids }) => ({
    path: `/api/v1/captures/${ids.captureId}/spectrum`,
    body: { maxOrder: 10, fundamentalFrequency: 50 },
  }),
  compareCapture: ({ ids }) => ({
    path: `/api/v1/captures/${ids.captureId}/comparison`,
    body: { studyId: ids.studyId, maxOrder: 10, fundamentalFrequency: 50 },
  }),
  downloadCaptureFile: ({ ids }) => ({ path: `/api/v1/captures/${ids.captureId}/file` }),
};

export const ROLE_ORDER: readonly RoleRequirement[] = ['public', 'viewer', 'engineer', 'admin'];

/** Sends a fixture's request with the method of the operation and an optional token. */
export function send(
  app: PulsewrightApp,
  method: string,
  spec: RequestSpec,
  token?: string,
): request.Test {
  let test = (request(app) as unknown as Record<string, (path: string) => request.Test>)[method]!(
    spec.path,
  );
  if (token) test = test.set('Authorization', `Bearer ${token}`);
  if (spec.query) test = test.query(spec.query);
  if (spec.upload)
    return test.attach(spec.upload.field, Buffer.from(spec.upload.content), spec.upload.fileName);
  if (spec.body !== undefined) return test.send(spec.body as object);
  return test;
}

/** A space-vector modulation (seven segments, symmetric regular sampling, linear range). */
export const SPACE_VECTOR = {
  method: 'space-vector',
  m: 0.8,
  vdc: 600,
  frequencyRatio: 201,
} as const;
/** Its design at 50 Hz (switching periods at 201 × 50 Hz). */
export const SPACE_VECTOR_DESIGN = {
  vdc: 600,
  fundamentalFrequency: 50,
  carrierFrequency: 10_050,
  modulation: { method: 'space-vector', m: 0.8 },
} as const;
