import { Router } from 'express';
import type { ApiRequest } from '../http/apiRequest.js';
import { sendFile } from '../http/sendFile.js';
import { principalOf } from '../auth/authorize.js';
import type { Services } from '../services/index.js';
import {
  assertRecordVersion,
  importRecord,
  studyRecordOf,
  type StudyRecord,
} from '../services/studyRecords.js';

/** A file name made of a study's name: letters, digits, `-` and `_` only. */
const fileNameOf = (name: string): string =>
  name.replace(/[^A-Za-z0-9_-]+/g, '-').replace(/^-+|-+$/g, '') || 'study';

/**
 * Exports for other tools and installations: a timer table's switching pattern as a SPICE
 * netlist, and study records (export and import). CSV variants of spectra and waveforms are
 * `?format=csv` on their own routes.
 */
export function exportRoutes(services: Services, options: { version: string }): Router {
  const router = Router();
  const { compute, studies } = services;

  router.post('/api/v1/netlists', async (req: ApiRequest<'computeNetlist'>, res) => {
    const file = await compute.netlist(req.body);
    sendFile(res, file);
  });
  router.get('/api/v1/studies/:id/record', async (req: ApiRequest<'getStudyRecord'>, res) => {
    const study = await studies.get(principalOf(req).teamId, req.params.id);
    res
      .setHeader(
        'Content-Disposition',
        `attachment; filename="${fileNameOf(study.name)}.study.json"`,
      )
      .json(studyRecordOf(study, options.version));
  });
  router.post(
    '/api/v1/projects/:id/study-records',
    async (req: ApiRequest<'importStudyRecord'>, res) => {
      const record = req.body as StudyRecord;
      assertRecordVersion(record);
      await compute.assertDesign(record.design);
      res.status(201).json(await importRecord(studies, principalOf(req), req.params.id, record));
    },
  );
  return router;
}
