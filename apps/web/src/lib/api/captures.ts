import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Problem, Schema } from '@pulsewright/client';
import { apiPaths } from '../../config/paths';
import { session } from '../session';
import { ApiError } from './ApiError';
import { api, unwrap } from './client';
import { queryKeys } from './queryKeys';

export type Capture = Schema<'Capture'>;
export type CaptureWithSeries = Schema<'CaptureWithSeries'>;
export type CaptureSpectrum = Schema<'CaptureSpectrum'>;
export type CaptureComparison = Schema<'CaptureComparison'>;
/** The FFT windows the service offers for a capture (from the API document). */
export type FftWindow = NonNullable<Schema<'CaptureAnalysisRequest'>['window']>;

/** The highest order a capture's spectrum is read to unless a screen asks for more (the API's default). */
const CAPTURE_MAX_ORDER = 50;

export async function getCaptures(): Promise<Capture[]> {
  return unwrap(await api.GET('/api/v1/captures'));
}
export const capturesQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.captures.list, queryFn: getCaptures });
export function useCaptures() {
  return useQuery(capturesQueryOptions());
}

export async function getCapture(id: string): Promise<CaptureWithSeries> {
  return unwrap(await api.GET('/api/v1/captures/{id}', { params: { path: { id } } }));
}
/** A capture with its samples; an upload never changes, so it is never stale. */
export const captureQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.captures.one(id),
    queryFn: () => getCapture(id),
    staleTime: Infinity,
  });
export function useCapture(id: string | null) {
  return useQuery({ ...captureQueryOptions(id ?? ''), enabled: Boolean(id) });
}

export interface UploadInput {
  file: File;
  name?: string;
  projectId?: string;
  /** Fraction of the bytes sent, 0..1. */
  onProgress?: (fraction: number) => void;
}

/**
 * Uploads a capture as multipart form data with XMLHttpRequest, whose upload events give the
 * progress bar (fetch has no upload progress in most browsers). Same path and auth as the client.
 */
export function uploadCapture({
  file,
  name,
  projectId,
  onProgress,
}: UploadInput): Promise<Capture> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append('file', file);
    if (name) form.append('name', name);
    if (projectId) form.append('projectId', projectId);
    const request = new XMLHttpRequest();
    request.open('POST', apiPaths.captures);
    const token = session.getToken();
    if (token) request.setRequestHeader('Authorization', `Bearer ${token}`);
    request.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress?.(event.loaded / event.total);
    };
    request.onload = () => {
      let body: unknown = undefined;
      try {
        body = JSON.parse(request.responseText);
      } catch {
        body = undefined;
      }
      if (request.status >= 200 && request.status < 300) {
        onProgress?.(1);
        resolve(body as Capture);
      } else {
        if (request.status === 401) session.setToken(null);
        reject(new ApiError(request.status, body as Problem | undefined));
      }
    };
    request.onerror = () =>
      reject(new Error('The upload failed: the service could not be reached.'));
    request.send(form);
  });
}

export function useUploadCapture() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: uploadCapture,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.captures.all }),
  });
}

export async function getCaptureSpectrum(
  id: string,
  window: FftWindow,
  maxOrder = CAPTURE_MAX_ORDER,
): Promise<CaptureSpectrum> {
  return unwrap(
    await api.POST('/api/v1/captures/{id}/spectrum', {
      params: { path: { id } },
      body: { window, maxOrder },
    }),
  );
}
/** The windowed FFT the service computes; a read (POST only for its options), so a query keyed by the window. */
export const captureSpectrumQueryOptions = (
  id: string,
  window: FftWindow,
  maxOrder = CAPTURE_MAX_ORDER,
) =>
  queryOptions({
    queryKey: queryKeys.captures.spectrum(id, window, maxOrder),
    queryFn: () => getCaptureSpectrum(id, window, maxOrder),
    staleTime: Infinity,
  });
export function useCaptureSpectrum(id: string, window: FftWindow) {
  return useQuery(captureSpectrumQueryOptions(id, window));
}

/** Without `maxOrder` the service compares up to the study's third carrier group and its sidebands. */
export async function getCaptureComparison(
  id: string,
  studyId: string,
  window: FftWindow,
  maxOrder?: number,
): Promise<CaptureComparison> {
  return unwrap(
    await api.POST('/api/v1/captures/{id}/comparison', {
      params: { path: { id } },
      body: { studyId, window, ...(maxOrder === undefined ? {} : { maxOrder }) },
    }),
  );
}
/** A capture against a study's prediction, order by order (the study may change, so not kept forever). */
export const captureComparisonQueryOptions = (
  id: string,
  studyId: string,
  window: FftWindow,
  maxOrder?: number,
) =>
  queryOptions({
    queryKey: queryKeys.captures.comparison(id, studyId, window, maxOrder),
    queryFn: () => getCaptureComparison(id, studyId, window, maxOrder),
  });
export function useCaptureComparison(id: string, studyId: string | null, window: FftWindow) {
  return useQuery({
    ...captureComparisonQueryOptions(id, studyId ?? '', window),
    enabled: Boolean(studyId),
  });
}
