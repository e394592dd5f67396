import { Router } from 'express';
import type { ApiRequest } from '../http/apiRequest.js';
import { intQuery, numberQuery, optionalIntQuery } from '../http/query.js';
import { principalOf } from '../auth/authorize.js';
import { sendData } from '../http/sendData.js';
import { reportSpectraCsv, spectrumCsv } from '../services/csvExports.js';
import type { Services } from '../services/index.js';

/** Projects and studies (every study edit is a new revision). */
export function studyRoutes(services: Services): Router {
  const router = Router();
  const { projects, studies, compute } = services;
  const text = (value: unknown): string | undefined =>
    typeof value === 'string' ? value : undefined;

  router.get('/api/v1/projects', async (req: ApiRequest<'listProjects'>, res) => {
    res.json(await projects.list(principalOf(req).teamId, text(req.query.q)));
  });
  router.post('/api/v1/projects', async (req: ApiRequest<'createProject'>, res) => {
    res.status(201).json(await projects.create(principalOf(req), req.body));
  });
  router.get('/api/v1/projects/:id', async (req, res) => {
    res.json(await projects.get(principalOf(req).teamId, req.params.id));
  });
  router.patch('/api/v1/projects/:id', async (req: ApiRequest<'updateProject'>, res) => {
    res.json(await projects.update(principalOf(req), req.params.id, req.body));
  });

  router.get('/api/v1/studies', async (req: ApiRequest<'listStudies'>, res) => {
    res.json(
      await studies.list(principalOf(req).teamId, {
        projectId: text(req.query.projectId),
        q: text(req.query.q),
        limit: intQuery(req, 'limit', 50),
        offset: intQuery(req, 'offset', 0),
      }),
    );
  });
  router.post('/api/v1/studies', async (req: ApiRequest<'createStudy'>, res) => {
    const { projectId, ...content } = req.body;
    await compute.assertDesign(content.design);
    res.status(201).json(await studies.create(principalOf(req), projectId, content));
  });
  router.get('/api/v1/studies/:id', async (req, res) => {
    res.json(await studies.get(principalOf(req).teamId, req.params.id));
  });
  router.put('/api/v1/studies/:id', async (req: ApiRequest<'updateStudy'>, res) => {
    const { baseRevision, ...content } = req.body;
    await compute.assertDesign(content.design);
    res.json(await studies.update(principalOf(req), req.params.id, baseRevision, content));
  });
  router.post('/api/v1/studies/:id/duplicate', async (req: ApiRequest<'duplicateStudy'>, res) => {
    res
      .status(201)
      .json(await studies.duplicate(principalOf(req), req.params.id, text(req.body?.name)));
  });
  router.get('/api/v1/studies/:id/revisions', async (req, res) => {
    res.json(await studies.revisions(principalOf(req).teamId, req.params.id));
  });
  router.post(
    '/api/v1/studies/:id/revisions/:revision/restore',
    async (req: ApiRequest<'restoreStudyRevision'>, res) => {
      res.json(
        await studies.restore(
          principalOf(req),
          req.params.id,
          Number(req.params.revision),
          req.body.baseRevision,
        ),
      );
    },
  );
  router.get('/api/v1/studies/:id/spectrum', async (req, res) => {
    const study = await studies.get(principalOf(req).teamId, req.params.id);
    const result = await compute.designSpectrum(study.design, intQuery(req, 'maxOrder', 100));
    sendData(req, res, result, spectrumCsv);
  });
  router.get('/api/v1/studies/:id/report', async (req, res) => {
    const maxOrder = optionalIntQuery(req, 'maxOrder', 100);
    const points = optionalIntQuery(req, 'points', 1200);
    const busVoltage = numberQuery(req, 'busVoltage');
    const study = await studies.get(principalOf(req).teamId, req.params.id);
    const report = await compute.report(study.design, {
      ...(maxOrder !== undefined ? { maxOrder } : {}),
      ...(points !== undefined ? { points } : {}),
      ...(busVoltage !== undefined ? { busVoltage } : {}),
    });
    sendData(req, res, report, reportSpectraCsv);
  });
  return router;
}
