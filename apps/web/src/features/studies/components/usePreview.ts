import { useMemo } from 'react';
import { timed } from '../../../lib/measure';
import { computePreview, type PreviewOutcome } from '../model/computePreview';
import type { StudyDraft } from '../model/studyDraft';

/** The library's live preview of a draft, recomputed on every change, with its cost in ms. */
export function usePreview(draft: StudyDraft): PreviewOutcome & { milliseconds: number } {
  return useMemo(() => {
    const { value, milliseconds } = timed(() => computePreview(draft));
    return { ...value, milliseconds };
  }, [draft]);
}
