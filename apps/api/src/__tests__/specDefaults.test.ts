import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadOpenApiDocument, resolveRef } from '../openapi.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import { SINE_TRIANGLE } from './fixtures.js';

/** The `default` the document gives `property` of the schema `name`. */
function documentDefault(name: string, property: string): unknown {
  const document = loadOpenApiDocument();
  const schema = document.components?.schemas?.[name] as
    { properties?: Record<string, unknown> } | undefined;
  const field = resolveRef(document, schema?.properties?.[property] as Record<string, unknown>);
  return field?.default;
}

describe('defaults live in the OpenAPI document and the validator applies them', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
  });
  afterAll(async () => t.dispose());

  it('a spectrum without maxOrder has the orders 0..the documented default', async () => {
    const maxOrder = documentDefault('SpectrumRequest', 'maxOrder');
    expect(typeof maxOrder).toBe('number');
    const res = await request(t.app)
      .post('/api/v1/spectra')
      .set(auth)
      .send({ modulation: SINE_TRIANGLE });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.harmonics).toHaveLength((maxOrder as number) + 1);
  });

  it('an ma sweep without maxOrder is stored with the documented default', async () => {
    const maxOrder = documentDefault('MaSweepRequest', 'maxOrder');
    expect(typeof maxOrder).toBe('number');
    const res = await request(t.app)
      .post('/api/v1/jobs/ma-sweeps')
      .set(auth)
      .send({ modulation: SINE_TRIANGLE, ma: { from: 0.2, to: 0.8, points: 3 } });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const job = await t.app.services.models.Job.findByPk(res.body.id as string);
    expect((job?.input as { maxOrder?: number } | undefined)?.maxOrder).toBe(maxOrder);
  });
});
