import { useMutation, useQueryClient } from '@tanstack/react-query';
import { harmonics, sheWaveform, labelHarmonics, thd, type SheSweepOptions, type SheSweepResult } from '@pulsewright/modulation';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { Schema } from '@pulsewright/client';
import { api, unwrap } from '../../../lib/api';

export type SheSweepInput = Omit<SheSweepOptions, 'onProgress'>;

export interface SweepState {
  running: boolean;
  progress: number;
  result: SheSweepResult | null;
  error: { message: string; field?: string } | null;
}

/** Runs sheSweep in a Web Worker (the solver can take seconds) with progress. */
export function useSheSweep() {
  const worker = useRef<Worker | null>(null);
  const [state, setState] = useState<SweepState>({ running: false, progress: 0, result: null, error: null });
  useEffect(() => () => worker.current?.terminate(), []);
  const run = useCallback((input: SheSweepInput) => {
    worker.current?.terminate();
    const next = new Worker(new URL('./sheWorker.ts', import.meta.url), { type: 'module' });
    worker.current = next;
    setState({ running: true, progress: 0, result: null, error: null });
    next.onmessage = (event: MessageEvent<{ type: string; fraction?: number; result?: SheSweepResult; message?: string; field?: string }>) => {
      const data = event.data;
      if (data.type === 'progress') setState((s) => ({ ...s, progress: data.fraction ?? s.progress }));
      else if (data.type === 'done') setState({ running: false, progress: 1, result: data.result ?? null, error: null });
      else setState({ running: false, progress: 0, result: null, error: { message: data.message ?? 'The sweep failed.', ...(data.field ? { field: data.field } : {}) } });
    };
    next.postMessage(input);
  }, []);
  return { ...state, run };
}

/** The spectrum of one solved point (quarter-wave angles), for the preview of a picked point. */
export function pointSpectrum(kind: SheSweepInput['kind'], vdc: number, angles: number[], maxOrder = 49) {
  const waveform = sheWaveform(angles, { kind, vdc });
  const spectrum = harmonics(waveform, maxOrder);
  return { spectrum: labelHarmonics(spectrum, 1), thd: thd(spectrum) };
}

export async function saveSheStudy(body: Schema<'StudyCreate'>) {
  return unwrap(await api.POST('/api/v1/studies', { body }));
}
export async function getEliminationProjects() {
  return unwrap(await api.GET('/api/v1/projects'));
}
export function useSaveSheStudy() {
  const client = useQueryClient();
  return useMutation({ mutationFn: saveSheStudy, onSuccess: () => client.invalidateQueries({ queryKey: ['studies'] }) });
}
