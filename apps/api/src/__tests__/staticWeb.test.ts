import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testApp, type TestApp } from './helpers.js';

describe('dashboard files', () => {
  let t: TestApp;
  beforeAll(async () => {
    const web = mkdtempSync(path.join(tmpdir(), 'pulsewright-web-'));
    mkdirSync(path.join(web, 'assets'));
    writeFileSync(path.join(web, 'index.html'), '<!doctype html><title>dashboard shell</title>');
    writeFileSync(path.join(web, 'assets', 'app.js'), 'console.log("app")');
    t = await testApp({ webDist: web, seedDemo: false });
  });
  afterAll(async () => t.dispose());

  it('serves files, falls back to index.html for client routes, and keeps /api answers as problems', async () => {
    expect((await request(t.app).get('/')).text).toContain('dashboard shell');
    expect((await request(t.app).get('/studies/123/revisions')).text).toContain('dashboard shell');
    const asset = await request(t.app).get('/assets/app.js');
    expect(asset.headers['content-type']).toMatch(/javascript/);
    const api = await request(t.app).get('/api/v1/unknown');
    expect(api.status).toBe(404);
    expect(api.headers['content-type']).toMatch(/problem\+json/);
  });
});
