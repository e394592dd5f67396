import { useMemo } from 'react';
import { computePreview, type PreviewOutcome } from '../model/computePreview';
import type { StudyDraft } from '../model/studyDraft';

/** The library's live preview of a draft, recomputed on every change, with its cost in ms. */
export function usePreview(draft: StudyDraft): PreviewOutcome & { milliseconds: number } {
  return useMemo(() => {
    const start = performance.now();
    const outcome = computePreview(draft);
    return { ...outcome, milliseconds: performance.now() - start };
  }, [draft]);
}
