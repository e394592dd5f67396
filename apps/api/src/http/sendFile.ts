import type { Response } from 'express';

/** A file a route answers as a download: its media type, the name offered, and its text. */
export interface DownloadFile {
  contentType: string;
  fileName: string;
  body: string;
}

/** Answers `file` with status 200 as an attachment named `file.fileName`. */
export function sendFile(res: Response, file: DownloadFile): void {
  res
    .status(200)
    .type(file.contentType)
    .setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`)
    .send(file.body);
}
