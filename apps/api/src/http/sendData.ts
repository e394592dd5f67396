import type { Request, Response } from 'express';
import { sendFile } from './sendFile.js';
import { sendJson } from './sendJson.js';

/**
 * Answers a compute result as JSON (`sendJson`), or, with `?format=csv` (the `DataFormat` parameter of the
 * OpenAPI document, checked by the validator), as the CSV `toCsv` makes of it, with the file
 * name the route's last path segment gives (`spectra.csv`, `waveforms.csv`, `spectrum.csv`).
 */
export function sendData<T>(
  req: Pick<Request, 'path' | 'method'> & { query: { format?: unknown } },
  res: Response,
  result: T,
  toCsv: (result: T) => string,
): void {
  if (req.query.format !== 'csv') {
    sendJson(req, res, result);
    return;
  }
  const name = req.path.split('/').filter(Boolean).at(-1) ?? 'data';
  sendFile(res, {
    contentType: 'text/csv; charset=utf-8',
    fileName: `${name}.csv`,
    body: toCsv(result),
  });
}
