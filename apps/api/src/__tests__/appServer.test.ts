import { createServer, IncomingMessage, ServerResponse, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { appServer, useOwnPrototypes } from '../http/appServer.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/** Starts `server` on a free loopback port and gives its base URL. */
async function listening(server: Server): Promise<string> {
  server.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  return `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
}

/** Closes `server`, connections kept alive by fetch included. */
async function closed(server: Server): Promise<void> {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
}

describe("the app's own request and response prototypes", () => {
  it("carry Express's methods, getters and app, on subclasses of node:http's classes", () => {
    const app = express();
    const plainRequest = app.request;
    const classes = useOwnPrototypes(app);
    expect(Object.getPrototypeOf(app.request)).toBe(IncomingMessage.prototype);
    expect(Object.getPrototypeOf(app.response)).toBe(ServerResponse.prototype);
    expect(app.request).toBe(classes.IncomingMessage.prototype);
    expect(app.response).toBe(classes.ServerResponse.prototype);
    expect(app.request.app).toBe(app);
    expect(app.response.app).toBe(app);
    // Methods and getters (Express 5 defines query, path, hostname... with defineGetter) are
    // Express's own, copied as they are.
    const own = (from: object, name: string) => Object.getOwnPropertyDescriptor(from, name);
    for (const name of ['get', 'header', 'accepts', 'is', 'range', 'query', 'path', 'hostname'])
      expect(own(app.request, name), name).toEqual(own(express.request, name));
    for (const name of ['json', 'send', 'status', 'set', 'sendFile', 'redirect'])
      expect(own(app.response, name), name).toEqual(own(express.response, name));
    expect(typeof own(app.request, 'query')?.get).toBe('function');
    expect(plainRequest === app.request).toBe(false);
  });

  it("spares every request Express's prototype change when served by the app's own server, not by a plain one", async () => {
    const app = express();
    const classes = useOwnPrototypes(app);
    app.get('/hello', (req, res) => {
      res.json({ path: req.path, query: req.query, app: req.app === app });
    });
    // Real prototype changes of node:http messages (Object.setPrototypeOf to another prototype).
    const changes: string[] = [];
    const setPrototypeOf = Object.setPrototypeOf;
    const spy = vi.spyOn(Object, 'setPrototypeOf').mockImplementation((target, prototype) => {
      if (
        (target instanceof IncomingMessage || target instanceof ServerResponse) &&
        Object.getPrototypeOf(target) !== prototype
      )
        changes.push(target.constructor.name);
      return setPrototypeOf(target, prototype);
    });
    try {
      const own = appServer(app, classes);
      const ownAnswer = await fetch(`${await listening(own)}/hello?x=1`);
      await closed(own);
      expect(changes).toEqual([]);
      const plain = createServer(app);
      const plainAnswer = await fetch(`${await listening(plain)}/hello?x=1`);
      await closed(plain);
      expect(changes).toEqual(['IncomingMessage', 'ServerResponse']);
      const body = { path: '/hello', query: { x: '1' }, app: true };
      expect(await ownAnswer.json()).toEqual(body);
      expect(await plainAnswer.json()).toEqual(body);
    } finally {
      spy.mockRestore();
    }
  });
});

describe("the service on its own server and on a plain one (supertest's)", () => {
  let t: TestApp;
  let server: Server;
  let base: string;
  let token: string;

  beforeAll(async () => {
    t = await testApp();
    server = t.app.httpServer();
    base = await listening(server);
    token = await signIn(t.app, DEMO.viewer);
  });
  afterAll(async () => {
    await closed(server);
    await t.dispose();
  });

  /** Status, headers (less Date) and body of one call, on the app's server and through supertest. */
  const both = async (path: string, body: unknown) => {
    const own = await fetch(`${base}${path}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
      body: JSON.stringify(body),
    });
    const plain = await request(t.app)
      .post(path)
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);
    const headers = (entries: Iterable<[string, string]>) =>
      Object.fromEntries(
        [...entries].filter(([name]) => !['date', 'connection', 'keep-alive'].includes(name)),
      );
    return {
      own: { status: own.status, headers: headers(own.headers), text: await own.text() },
      plain: {
        status: plain.status,
        headers: headers(Object.entries(plain.headers as Record<string, string>)),
        text: plain.text,
      },
    };
  };

  it('answers a spectrum, a refused body and an unknown route the same way', async () => {
    const modulation = { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9, mf: 21, vdc: 400 };
    for (const [path, body, status] of [
      ['/api/v1/spectra', { modulation, maxOrder: 200 }, 200],
      ['/api/v1/spectra', { modulation: { ...modulation, ma: 9 } }, 400],
      ['/api/v1/nowhere', {}, 404],
    ] as const) {
      const { own, plain } = await both(path, body);
      expect(own.status, path).toBe(status);
      expect(own).toEqual(plain);
    }
  });
});
