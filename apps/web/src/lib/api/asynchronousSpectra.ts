import { useMutation } from '@tanstack/react-query';
import type { components } from '@pulsewright/client';
import { api, unwrap, type BodyOf } from './client';

/** What POST /designs/asynchronous-spectra takes: a carrier design and the highest order. */
export type AsynchronousSpectraRequest = BodyOf<'analyseAsynchronousSpectra'>;
/** Its answer: p, q, the carrier analysed and its error (Hz), the spectra over q periods. */
export type AsynchronousSpectra = components['schemas']['AsynchronousDesignSpectra'];

/**
 * The spectra of a design whose carrier need not be a whole multiple of the fundamental, from
 * the service (the library's asynchronousDesignSpectra).
 */
export function useAsynchronousSpectra() {
  return useMutation({
    mutationFn: async (body: AsynchronousSpectraRequest): Promise<AsynchronousSpectra> =>
      unwrap(await api.POST('/api/v1/designs/asynchronous-spectra', { body })),
  });
}
