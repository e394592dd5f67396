import { describe, expect, it } from 'vitest';
import { createPulsewrightClient } from '../index.js';

describe('createPulsewrightClient', () => {
  it('sends the bearer token and the typed body to the right URL', async () => {
    const seen: Request[] = [];
    const fakeFetch = async (input: Request) => {
      seen.push(input);
      return new Response(
        JSON.stringify({ name: 'bridge output', harmonics: [], thd: 0, wthd: 0, spectrumThd: 0 }),
        {
          status: 200,
          headers: { 'Content-Type': 'application/json' },
        },
      );
    };
    const api = createPulsewrightClient({
      baseUrl: 'http://pulsewright.test',
      token: 'pwk_abc',
      fetch: fakeFetch as typeof fetch,
    });
    const { data, error } = await api.POST('/api/v1/spectra', {
      body: {
        modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.9, mf: 15, vdc: 360 },
        maxOrder: 40,
      },
    });
    expect(error).toBeUndefined();
    // The route answers CSV with ?format=csv; without it the body is the JSON result.
    expect(typeof data === 'string' ? undefined : data?.thd).toBe(0);
    expect(seen).toHaveLength(1);
    const request = seen[0] as Request;
    expect(request.url).toBe('http://pulsewright.test/api/v1/spectra');
    expect(request.method).toBe('POST');
    expect(request.headers.get('Authorization')).toBe('Bearer pwk_abc');
    expect(JSON.parse(await request.text())).toMatchObject({
      maxOrder: 40,
      modulation: { mf: 15 },
    });
  });

  it('asks a token function before every request and omits the header without a token', async () => {
    const headers: (string | null)[] = [];
    const fakeFetch = async (input: Request) => {
      headers.push(input.headers.get('Authorization'));
      return new Response('{"status":"ok","version":"x","database":"sqlite"}', {
        headers: { 'Content-Type': 'application/json' },
      });
    };
    let current: string | null = null;
    const api = createPulsewrightClient({
      baseUrl: 'http://pulsewright.test',
      token: () => current,
      fetch: fakeFetch as typeof fetch,
    });
    await api.GET('/api/health');
    current = 'pws_1';
    await api.GET('/api/health');
    expect(headers).toEqual([null, 'Bearer pws_1']);
  });
});
