import { Router } from 'express';
import type { ApiRequest } from '../http/apiRequest.js';
import { principalOf } from '../auth/authorize.js';
import { badRequest } from '../http/errors.js';
import { escapeFormulaCells } from '../services/captureCsv.js';
import type { Services } from '../services/index.js';

interface UploadedFile {
  fieldname: string;
  originalname: string;
  mimetype: string;
  buffer: Buffer;
}

/** Bench captures: upload (multipart, parsed by the validator's multer), read, analyse, compare. */
export function captureRoutes(services: Services): Router {
  const router = Router();
  const { captures } = services;

  router.post('/api/v1/captures', async (req: ApiRequest<'uploadCapture'>, res) => {
    const files = ((req as unknown as { files?: UploadedFile[] }).files ?? []).filter(
      (f) => f.fieldname === 'file',
    );
    const file = files[0];
    if (!file || files.length !== 1) {
      throw badRequest('Send exactly one file in the multipart field "file".', [
        { path: 'file', message: 'file is required (one CSV file)' },
      ]);
    }
    const fields = { name: req.body.name, projectId: req.body.projectId };
    res.status(201).json(await captures.upload(principalOf(req), file, fields));
  });
  router.get('/api/v1/captures', async (req: ApiRequest<'listCaptures'>, res) => {
    res.json(
      await captures.list(
        principalOf(req).teamId,
        typeof req.query.projectId === 'string' ? req.query.projectId : undefined,
      ),
    );
  });
  router.get('/api/v1/captures/:id', async (req: ApiRequest<'getCapture'>, res) => {
    res.json(await captures.get(principalOf(req).teamId, req.params.id));
  });
  router.get('/api/v1/captures/:id/file', async (req: ApiRequest<'downloadCaptureFile'>, res) => {
    const row = await captures.find(principalOf(req).teamId, req.params.id);
    // Uploads with formula cells are refused, but a file stored before that check is escaped
    // (cells beginning with = + - @ get a leading ') rather than sent as it was.
    const original = Buffer.isBuffer(row.original)
      ? row.original
      : Buffer.from(String(row.original));
    const text = original.toString('utf8');
    const safe = escapeFormulaCells(text);
    res
      .type('text/csv; charset=utf-8')
      .setHeader('Content-Disposition', `attachment; filename="${row.fileName}"`)
      .setHeader('X-Content-Type-Options', 'nosniff')
      .send(safe === text ? original : Buffer.from(safe, 'utf8'));
  });
  router.post('/api/v1/captures/:id/spectrum', async (req: ApiRequest<'analyseCapture'>, res) => {
    const {
      window = 'hann',
      fundamentalFrequency,
      maxOrder = 50,
      column = 'voltage',
    } = req.body ?? {};
    res.json(
      await captures.analyse(principalOf(req).teamId, req.params.id, {
        window,
        fundamentalFrequency,
        maxOrder,
        column,
      }),
    );
  });
  router.post('/api/v1/captures/:id/comparison', async (req: ApiRequest<'compareCapture'>, res) => {
    const { studyId, window = 'hann', fundamentalFrequency, maxOrder } = req.body;
    res.json(
      await captures.compare(principalOf(req).teamId, req.params.id, studyId, {
        window,
        fundamentalFrequency,
        maxOrder,
      }),
    );
  });
  return router;
}
