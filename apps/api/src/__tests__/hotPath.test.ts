import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HttpError } from '../http/errors.js';
import { finiteResult } from '../services/library.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/**
 * Issue 11's throughput pass (docs/robustness.md, throughput): each shortcut on the path of a
 * compute answer keeps what it replaced. Non-finite numbers: IEEE 754 (NaN and ±∞), which
 * `JSON.stringify` writes as `null` (ECMA-262, SerializeJSONProperty), so they must not reach it.
 */
describe('finiteResult: NaN and ±∞ refused with the field and the place, finite results passed on', () => {
  const refusal = (result: unknown): HttpError => {
    try {
      finiteResult('modulation', result);
    } catch (error) {
      if (error instanceof HttpError) return error;
      throw error;
    }
    throw new Error('finiteResult accepted a non-finite result');
  };

  it('passes a finite result on unchanged (the same object)', () => {
    const result = {
      name: 'bridge output',
      harmonics: [
        { order: 0, amplitude: 0, phase: 0 },
        { order: 1, amplitude: -1e308, phase: Math.PI },
      ],
      thd: 0.5,
      nested: [[1, 2], { deep: [Number.MIN_VALUE] }],
      nothing: null,
    };
    expect(finiteResult('modulation', result)).toBe(result);
    expect(finiteResult('modulation', 3)).toBe(3);
    expect(finiteResult('modulation', 'text')).toBe('text');
  });

  it.each([
    [
      'NaN in an array element’s field',
      { harmonics: [{ amplitude: 1 }, { amplitude: NaN }] },
      'harmonics[1].amplitude',
    ],
    ['+∞ at the top', { thd: Infinity }, 'thd'],
    ['−∞ in a nested array', { traces: [{ values: [0, 1, -Infinity] }] }, 'traces[0].values[2]'],
    ['NaN as an array element', { series: [1, NaN] }, 'series[1]'],
  ])('refuses %s with a 400 naming the field and where', (_what, result, where) => {
    const error = refusal(result);
    expect(error.status).toBe(400);
    expect(error.message).toContain(
      `modulation holds values so extreme that ${where} is not a finite number`,
    );
    expect(error.errors).toEqual([{ path: 'modulation', message: error.message }]);
  });

  it('refuses a non-finite result that is a bare number', () => {
    expect(refusal(NaN).status).toBe(400);
  });

  it('ignores inherited enumerable numbers, which JSON.stringify does not write', () => {
    const result = Object.create({ inherited: NaN, deeper: { x: Infinity } }) as Record<
      string,
      unknown
    >;
    result.own = 1;
    expect(JSON.stringify(result)).toBe('{"own":1}');
    expect(finiteResult('modulation', result)).toBe(result);
  });
});

const SPECTRUM = {
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9, mf: 21, vdc: 400 },
  maxOrder: 1050,
};

describe('the hot path of a compute answer, against the same service with response validation on', () => {
  let plain: TestApp;
  let checked: TestApp;
  let plainToken: string;
  let checkedToken: string;

  beforeAll(async () => {
    // Response validation off, as in production; on, as in development and the other suites
    // (answers then go through Express's res.json, wrapped by the validator).
    plain = await testApp({ validateResponses: false });
    checked = await testApp({ validateResponses: true });
    plainToken = await signIn(plain.app, DEMO.viewer);
    checkedToken = await signIn(checked.app, DEMO.viewer);
  });
  afterAll(async () => {
    await plain.dispose();
    await checked.dispose();
  });

  it('answers POST /spectra with the same status, headers and bytes as res.json does', async () => {
    const a = await request(plain.app)
      .post('/api/v1/spectra')
      .set('authorization', `Bearer ${plainToken}`)
      .send(SPECTRUM);
    const b = await request(checked.app)
      .post('/api/v1/spectra')
      .set('authorization', `Bearer ${checkedToken}`)
      .send(SPECTRUM);
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    expect(a.text).toBe(b.text);
    expect(a.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(Number(a.headers['content-length'])).toBe(Buffer.byteLength(a.text));
    const { date: _a, ...headersA } = a.headers as Record<string, string>;
    const { date: _b, ...headersB } = b.headers as Record<string, string>;
    expect(headersA).toEqual(headersB);
    expect((a.body as { harmonics: unknown[] }).harmonics).toHaveLength(1051);
  });

  it('answers the CSV form and a refused request as before', async () => {
    const csv = await request(plain.app)
      .post('/api/v1/spectra?format=csv')
      .set('authorization', `Bearer ${plainToken}`)
      .send(SPECTRUM);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toBe('text/csv; charset=utf-8');
    const refused = await request(plain.app)
      .post('/api/v1/spectra')
      .set('authorization', `Bearer ${plainToken}`)
      .send({ ...SPECTRUM, maxOrder: -1 });
    expect(refused.status).toBe(400);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
  });
});
