import { Router } from 'express';
import type { ApiRequest } from '../http/apiRequest.js';
import { sendFile } from '../http/sendFile.js';
import { principalOf } from '../auth/authorize.js';
import { intQuery } from '../http/query.js';
import { sendData } from '../http/sendData.js';
import { sendJsonBytes } from '../http/sendJson.js';
import { spectrumCsv, waveformCsv } from '../services/csvExports.js';
import type { TimerFormat } from '../services/cost.js';
import type { Services } from '../services/index.js';
import { maSweepPlan, sheSweepPlan } from '../services/sweepJobs.js';

/**
 * Compute routes: validate (done by the OpenAPI validator), hand the work to the compute service
 * (cost checked, then run on this thread or in the worker pool) or the job service, respond.
 */
export function computeRoutes(services: Services): Router {
  const router = Router();
  const { compute, jobs } = services;

  router.post('/api/v1/spectra', async (req: ApiRequest<'computeSpectrum', 'maxOrder'>, res) => {
    // maxOrder's default (100) is the document's; the validator has filled it in.
    const result = await compute.spectrum(req.body.modulation, req.body.maxOrder, req.body.output);
    sendData(req, res, result, spectrumCsv);
  });
  router.post('/api/v1/waveforms', async (req: ApiRequest<'computeWaveform'>, res) => {
    sendData(req, res, await compute.waveform(req.body.modulation, req.body.output), waveformCsv);
  });
  router.post('/api/v1/designs/report', async (req: ApiRequest<'analyseDesign'>, res) => {
    const { design, ...options } = req.body;
    // Megabytes of report: serialised and encoded in the worker, so the request thread only
    // writes its bytes.
    await sendJsonBytes(
      req,
      res,
      () => compute.reportJson(design, options),
      () => compute.report(design, options),
    );
  });
  router.post(
    '/api/v1/designs/asynchronous-spectra',
    async (req: ApiRequest<'analyseAsynchronousSpectra', 'maxOrder'>, res) => {
      // maxOrder's default (50) is the document's; the validator has filled it in.
      res.json(await compute.asynchronousSpectra(req.body.design, req.body.maxOrder));
    },
  );
  router.post('/api/v1/load-current', async (req: ApiRequest<'computeLoadCurrent'>, res) => {
    res.json(await compute.loadCurrent(req.body.design, req.body.points));
  });
  router.post('/api/v1/filters/lc', async (req: ApiRequest<'computeLcFilter'>, res) => {
    const { design, ...options } = req.body;
    res.json(await compute.filter(design, options));
  });
  router.post('/api/v1/filters/lcl-design', (req: ApiRequest<'designLclFilter'>, res) => {
    res.json(compute.lclDesign(req.body));
  });
  router.post('/api/v1/space-vector', (req: ApiRequest<'computeSpaceVector'>, res) => {
    const { m, theta, ...options } = req.body;
    res.json(compute.spaceVector(m, theta, options));
  });
  router.post('/api/v1/timer-tables', async (req: ApiRequest<'computeTimerTable'>, res) => {
    const { prefix, ...options } = req.body;
    const format: TimerFormat = req.query.format ?? 'json';
    const file = await compute.timerTable(options, format, prefix);
    sendFile(res, file);
  });
  router.post(
    '/api/v1/multilevel-timer-tables',
    async (req: ApiRequest<'computeMultilevelTimerTable'>, res) => {
      const { prefix, ...options } = req.body;
      const format: TimerFormat = req.query.format ?? 'json';
      sendFile(res, await compute.multilevelTimerTable(options, format, prefix));
    },
  );
  router.post(
    '/api/v1/losses/power-factor-sweeps',
    async (req: ApiRequest<'computeLossSweep'>, res) => {
      res.json(await compute.lossSweep(req.body));
    },
  );
  router.post(
    '/api/v1/harmonic-limits/check',
    async (req: ApiRequest<'checkHarmonicLimits'>, res) => {
      res.json(await compute.harmonicLimits(req.body.design, req.body.busVoltage));
    },
  );

  router.get('/api/v1/jobs', async (req: ApiRequest<'listJobs'>, res) => {
    res.json(
      await jobs.list(
        principalOf(req).teamId,
        intQuery(req, 'limit', 50),
        intQuery(req, 'offset', 0),
      ),
    );
  });
  router.post(
    '/api/v1/jobs/ma-sweeps',
    async (req: ApiRequest<'createMaSweep', 'maxOrder'>, res) => {
      res.status(202).json(await jobs.start(principalOf(req), req.body, maSweepPlan(req.body)));
    },
  );
  router.post('/api/v1/jobs/she-sweeps', async (req: ApiRequest<'createSheSweep'>, res) => {
    res.status(202).json(await jobs.start(principalOf(req), req.body, sheSweepPlan(req.body)));
  });
  router.get('/api/v1/jobs/:id', async (req: ApiRequest<'getJob'>, res) => {
    res.json(await jobs.get(principalOf(req).teamId, req.params.id));
  });
  return router;
}
