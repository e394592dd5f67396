import { Router } from 'express';
import { principalOf } from '../auth/authorize.js';
import { intQuery } from '../http/query.js';
import {
  checkDesignLimits,
  computeFilter,
  computeLoadCurrent,
  computeSpaceVector,
  computeSpectrum,
  computeTimerTable,
  designReport,
  modulationOutput,
  type TimerFormat,
} from '../services/compute.js';
import type { Services } from '../services/index.js';
import { maSweepWork, sheSweepWork } from '../services/sweeps.js';

/** Compute routes: validate (done by the OpenAPI validator), call the library, respond. */
export function computeRoutes(services: Services): Router {
  const router = Router();
  const { jobs } = services;

  router.post('/api/v1/spectra', (req, res) => {
    res.json(computeSpectrum(req.body.modulation, req.body.maxOrder ?? 100, req.body.output));
  });
  router.post('/api/v1/waveforms', (req, res) => {
    res.json(modulationOutput(req.body.modulation, req.body.output));
  });
  router.post('/api/v1/designs/report', (req, res) => {
    const { design, ...options } = req.body;
    res.json(designReport(design, options));
  });
  router.post('/api/v1/load-current', (req, res) => {
    res.json(computeLoadCurrent(req.body.design, req.body.points));
  });
  router.post('/api/v1/filters/lc', (req, res) => {
    const { design, ...options } = req.body;
    res.json(computeFilter(design, options));
  });
  router.post('/api/v1/space-vector', (req, res) => {
    const { m, theta, ...options } = req.body;
    res.json(computeSpaceVector(m, theta, options));
  });
  router.post('/api/v1/timer-tables', (req, res) => {
    const { prefix, ...options } = req.body;
    const format = (typeof req.query.format === 'string' ? req.query.format : 'json') as TimerFormat;
    const file = computeTimerTable(options, format, prefix);
    res
      .status(200)
      .type(file.contentType)
      .setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`)
      .send(file.body);
  });
  router.post('/api/v1/harmonic-limits/check', (req, res) => {
    res.json(checkDesignLimits(req.body.design, req.body.busVoltage));
  });

  router.get('/api/v1/jobs', async (req, res) => {
    res.json(await jobs.list(principalOf(req).teamId, intQuery(req, 'limit', 50), intQuery(req, 'offset', 0)));
  });
  router.post('/api/v1/jobs/ma-sweeps', async (req, res) => {
    const input = { ...req.body, maxOrder: req.body.maxOrder ?? 100 };
    res.status(202).json(await jobs.start(principalOf(req), 'ma-sweep', input, maSweepWork(input)));
  });
  router.post('/api/v1/jobs/she-sweeps', async (req, res) => {
    res.status(202).json(await jobs.start(principalOf(req), 'she-sweep', req.body, sheSweepWork(req.body)));
  });
  router.get('/api/v1/jobs/:id', async (req, res) => {
    res.json(await jobs.get(principalOf(req).teamId, req.params.id));
  });
  return router;
}
