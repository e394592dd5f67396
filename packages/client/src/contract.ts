/**
 * Compile-time checks of the paths docs/architecture.md promises to scripts. The build fails when the
 * OpenAPI document drops or reshapes one of them, before any caller notices at run time.
 */
import type { paths } from './schema.js';

type JsonBody<P extends keyof paths, M extends keyof paths[P]> = paths[P][M] extends {
  requestBody?: { content: { 'application/json': infer B } };
}
  ? B
  : never;
type JsonAnswer<
  P extends keyof paths,
  M extends keyof paths[P],
  S extends number,
> = paths[P][M] extends {
  responses: { [K in S]: { content: { 'application/json': infer B } } };
}
  ? B
  : never;

const login: JsonBody<'/api/v1/auth/login', 'post'> = { email: 'a@b.example', password: 'x' };
const token: JsonAnswer<'/api/v1/auth/login', 'post', 200>['token'] = '';
const key: JsonBody<'/api/v1/api-keys', 'post'> = { name: 'ci', role: 'viewer' };
const keyAnswer: Pick<JsonAnswer<'/api/v1/api-keys', 'post', 201>, 'id' | 'key'> = {
  id: '',
  key: '',
};
const spectrum: JsonBody<'/api/v1/spectra', 'post'> = {
  modulation: {
    method: 'sine-triangle',
    scheme: 'bipolar',
    ma: 0.8,
    mf: 21,
    vdc: 400,
    sampling: 'natural',
    carrierPhase: 0,
  },
  maxOrder: 50,
};
const spectrumAnswer: Pick<
  JsonAnswer<'/api/v1/spectra', 'post', 200>,
  'harmonics' | 'thd' | 'wthd'
> = {
  harmonics: [{ order: 1, amplitude: 0, phase: 0 }],
  thd: 0,
  wthd: 0,
};
const design: JsonBody<'/api/v1/designs/report', 'post'>['design'] = {
  vdc: 400,
  fundamentalFrequency: 50,
  carrierFrequency: 1050,
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
  load: { r: 10, l: 0.02 },
  filter: null,
};
const studyCreate: JsonBody<'/api/v1/studies', 'post'> = { projectId: '', name: 'x', design };
const reportFigures: Pick<
  JsonAnswer<'/api/v1/studies/{id}/report', 'get', 200>['bridge'],
  'thd' | 'wthd' | 'exact'
> = {
  thd: 0,
  wthd: 0,
  exact: true,
};
type Exists = [
  paths['/api/health']['get'],
  paths['/api/v1/me']['get'],
  paths['/api/v1/api-keys/{id}']['delete'],
  paths['/api/v1/projects']['get'],
  paths['/api/v1/studies']['post'],
  paths['/api/v1/captures']['post'],
  paths['/api/v1/jobs/{id}']['get'],
  paths['/api/v1/studies/{id}/report']['get'],
];

/** Compiles only while every path of `Exists` is in the document. */
const exists: Exists | null = null;

/** Referenced so the checks above are not unused. */
export const contractChecks: readonly unknown[] = [
  login,
  token,
  key,
  keyAnswer,
  spectrum,
  spectrumAnswer,
  studyCreate,
  reportFigures,
  exists,
];
