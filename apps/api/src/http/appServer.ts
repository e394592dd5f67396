import { createServer, IncomingMessage, ServerResponse, type Server } from 'node:http';
import type { Express } from 'express';

/** What {@link useOwnPrototypes} gives the app: node:http's classes whose instances Express takes as they are. */
export interface AppMessageClasses {
  IncomingMessage: typeof IncomingMessage;
  ServerResponse: typeof ServerResponse;
}

/**
 * Copies onto `target` every own property of `prototype` and of the objects below it in its
 * chain, down to and without `base`, the nearest last (so it wins, as in the chain); the
 * `constructor` stays `target`'s.
 */
function flattenOnto(target: object, prototype: object, base: object): void {
  const chain: object[] = [];
  for (let link: object | null = prototype; link !== null && link !== base;) {
    chain.push(link);
    link = Object.getPrototypeOf(link) as object | null;
  }
  if (chain.length === 0 || Object.getPrototypeOf(chain[chain.length - 1]) !== base)
    throw new Error('the app prototype does not extend the node:http class it should');
  for (const link of chain.reverse())
    for (const key of Reflect.ownKeys(link)) {
      if (key === 'constructor') continue;
      Object.defineProperty(target, key, Object.getOwnPropertyDescriptor(link, key)!);
    }
}

/**
 * Gives `app` request and response prototypes that are node:http's own classes, extended: a
 * subclass of `IncomingMessage` and one of `ServerResponse` carrying everything of Express's
 * `app.request` and `app.response` (its methods, getters and `app`). `app.request` and
 * `app.response` become those subclasses' prototypes.
 *
 * Why: Express gives every request and response its prototypes with `Object.setPrototypeOf` as it
 * takes them (`app.handle`), after node:http has built and filled them in. Changing an object's
 * prototype is slow in V8 and slows later code that touches the object (MDN,
 * `Object.setPrototypeOf`, "Warning"). A server made by {@link appServer} builds its requests
 * and responses from these subclasses (node:http's documented `IncomingMessage` and
 * `ServerResponse` options), so Express's call finds the prototype already in place and changes
 * nothing. `POST /api/v1/spectra` at 50 connections: 6.99 → 6.51 M instructions an answer
 * (callgrind) and about a third less CPU time an answer (docs/robustness.md, throughput, seventh
 * pass). A plain `http.createServer(app)` (supertest's) still works: Express changes the
 * prototypes there as before, to the same subclasses' prototypes.
 */
export function useOwnPrototypes(app: Express): AppMessageClasses {
  class AppRequest extends IncomingMessage {}
  class AppResponse extends ServerResponse {}
  const express = app as unknown as { request: object; response: object };
  flattenOnto(AppRequest.prototype, express.request, IncomingMessage.prototype);
  flattenOnto(AppResponse.prototype, express.response, ServerResponse.prototype);
  express.request = AppRequest.prototype;
  express.response = AppResponse.prototype;
  return {
    IncomingMessage: AppRequest,
    ServerResponse: AppResponse as unknown as typeof ServerResponse,
  };
}

/** A node:http server (not listening) for `app`, whose requests and responses are built from `classes`. */
export function appServer(app: Express, classes: AppMessageClasses): Server {
  return createServer(classes, app);
}
