import { Router } from 'express';
import type { ApiRequest } from '../http/apiRequest.js';
import { sendFile } from '../http/sendFile.js';
import { principalOf } from '../auth/authorize.js';
import type { Services } from '../services/index.js';
import { optimalSweepPlan } from '../services/optimalSweepJobs.js';
import { patternEventsRequest } from '../services/studyPatternEvents.js';

/**
 * Programmed patterns to firmware (issue 17): the optimal-pattern sweep job beside the SHE
 * sweep, angle tables for controllers (JSON, CSV or a C header) and a stored pattern's compare
 * events (inline angles, or a saved pattern study read with the caller's team scope); per-cell
 * patterns of a cascaded H-bridge string, solved jointly or drawn from given angles (issue 13).
 * Validation is the OpenAPI validator's; the work is the compute or job service's.
 */
export function patternRoutes(services: Services): Router {
  const router = Router();
  const { compute, jobs, studies } = services;
  router.post('/api/v1/jobs/optimal-sweeps', async (req: ApiRequest<'createOptimalSweep'>, res) => {
    res.status(202).json(await jobs.start(principalOf(req), req.body, optimalSweepPlan(req.body)));
  });
  router.post('/api/v1/angle-tables', async (req: ApiRequest<'computeAngleTable'>, res) => {
    const format = req.query.format ?? 'json';
    const file = await compute.angleTable(req.body, format);
    sendFile(res, file);
  });
  router.post(
    '/api/v1/pattern-compare-events',
    async (req: ApiRequest<'computePatternCompareEvents'>, res) => {
      const { teamId } = principalOf(req);
      const request = await patternEventsRequest(req.body, (id) => studies.get(teamId, id));
      res.json(await compute.patternEvents(request));
    },
  );
  router.post(
    '/api/v1/cascaded-patterns/solve',
    async (req: ApiRequest<'solveCascadedPattern', 'starts' | 'maxOrder'>, res) => {
      res.json(await compute.cascadedSolve(req.body));
    },
  );
  router.post(
    '/api/v1/cascaded-patterns/waveform',
    async (req: ApiRequest<'computeCascadedPattern', 'maxOrder'>, res) => {
      res.json(await compute.cascadedPattern(req.body));
    },
  );
  return router;
}
