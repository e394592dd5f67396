import { vi } from 'vitest';

/** A file the page saved through lib/download: its name, type and text. */
export interface SavedFile {
  file: string;
  type: string;
  text: string;
}

/**
 * Catches the next file the page saves through lib/download (an object URL clicked as a link)
 * instead of saving it; `saved()` reads it back. Restore with `vi.restoreAllMocks()`.
 */
export function catchDownloads(): { saved: () => Promise<SavedFile> } {
  let blob: Blob | undefined;
  let file = '';
  vi.spyOn(URL, 'createObjectURL').mockImplementation((object) => {
    blob = object as Blob;
    return 'blob:test';
  });
  vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => undefined);
  vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (
    this: HTMLAnchorElement,
  ) {
    file = this.download;
  });
  return {
    saved: () =>
      new Promise<SavedFile>((resolve, reject) => {
        if (!blob) {
          reject(new Error('nothing was saved'));
          return;
        }
        const type = blob.type;
        const reader = new FileReader();
        reader.onload = () => resolve({ file, type, text: reader.result as string });
        reader.readAsText(blob);
      }),
  };
}
